package org.specimenledger.testing;

import java.math.BigDecimal;
import java.time.LocalDate;
import java.util.UUID;

/**
 * One instrument of a test run with the calibration that governed it on the test date, as snapshotted
 * into each analysis run (so a certificate shows what was true when the result was computed, even if a
 * record is withdrawn later).
 *
 * @param accuracyClass the class that applies: the force range's ISO 7500-1 class for the transducer, the
 *     ISO 9513 class for the extensometer, the machine's class if it has one
 * @param rangeN        force transducer only: the range used (upper limit, N)
 * @param rangeLowerLimitN force transducer only: where the verified part of that range starts, N
 * @param gaugeLengthMm extensometer only: its gauge length
 * @param validOnTestDate whether the calibration was valid on the test date when the snapshot was taken
 * @param reason        why not, when not valid
 */
public record CalibrationUsed(InstrumentRole role, UUID equipmentId, String assetId, String description,
        UUID calibrationId, String certificateReference, String calibratingBody, LocalDate calibratedOn,
        LocalDate dueOn, String accuracyClass, BigDecimal rangeN, BigDecimal rangeLowerLimitN,
        BigDecimal gaugeLengthMm, boolean validOnTestDate, String reason) {
}
