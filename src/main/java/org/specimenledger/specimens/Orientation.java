package org.specimenledger.specimens;

/** Direction of the test piece's axis relative to the main working direction of the product. */
public enum Orientation {
    LONGITUDINAL,
    TRANSVERSE,
    OTHER
}
