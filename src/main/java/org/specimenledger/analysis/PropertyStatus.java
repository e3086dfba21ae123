package org.specimenledger.analysis;

/** Whether a tensile property could be found on a curve (DESIGN.md "Results vocabulary"). */
public enum PropertyStatus {
    /** The value was found; {@link PropertyResult#value()} is finite and a reported string exists. */
    DETERMINED,
    /** The property does not exist for this behaviour, e.g. ReH on continuous yielding. */
    NOT_APPLICABLE,
    /** The property exists in principle but this record does not allow it; the reason says why. */
    NOT_DETERMINABLE
}
