package org.specimenledger.equipment;

import java.time.LocalDate;

/**
 * Whether an instrument was calibrated on {@code date}: {@code calibration} is the record that governs
 * that date (the newest standing calibration made on or before it), or null when there is none;
 * {@code reason} says why not when {@code valid} is false, and is null when valid.
 */
public record CalibrationOnDate(LocalDate date, boolean valid, CalibrationView calibration, String reason) {
}
