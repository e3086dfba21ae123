package org.specimenledger.analysis;

/** Yielding behaviour found on a tensile curve. */
public enum Yielding {
    /** Smooth elastic–plastic transition; proof strengths Rp describe the yield. */
    CONTINUOUS,
    /**
     * A yield point: a maximum followed by a force drop per the digitised-data rule (ISO 6892-1
     * Annex A [M]); ReH, ReL and Ae apply.
     */
    DISCONTINUOUS,
    /** Fracture before 0.2 % plastic extension (brittle): no yield strength can be found. */
    NONE
}
