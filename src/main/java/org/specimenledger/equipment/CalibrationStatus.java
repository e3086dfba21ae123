package org.specimenledger.equipment;

/** An instrument's calibration standing on one day. */
public enum CalibrationStatus {
    /** Calibrated, and the due date is further away than the due-soon window. */
    VALID,
    /** Calibrated, but due within the due-soon window ({@code ledger.equipment.due-soon-within}). */
    DUE_SOON,
    /** The governing calibration's due date has passed. */
    EXPIRED,
    /** No standing (non-withdrawn) calibration on or before that day. */
    NONE,
    /** The instrument was retired on or before that day. */
    RETIRED
}
