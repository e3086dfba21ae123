package org.specimenledger.specimens;

/**
 * Where the fracture lies between the gauge marks. Inside the middle third means at least L0/3 from the
 * nearest gauge mark, the condition under which ISO 6892-1 takes the elongation as valid without further
 * argument [S: ISO 6892-1 via its national adoption].
 */
public enum FractureZone {
    INSIDE_MIDDLE_THIRD,
    OUTSIDE_MIDDLE_THIRD
}
