package org.specimenledger.analysis.units;

/** One system of units a value can be printed in. */
public enum UnitSystem {
    SI,
    US_CUSTOMARY
}
