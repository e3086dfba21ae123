package org.specimenledger.testing;

import java.math.BigDecimal;
import java.time.Instant;
import java.time.LocalDate;
import java.util.List;
import java.util.UUID;

/**
 * A test run as the API returns it and the ledger records it.
 *
 * @param calibrations        the calibration records that governed each instrument on the test date (an id is
 *                            null only where none existed and a lab manager accepted the run)
 * @param calibrationOverride null unless a lab manager accepted the run against the calibration gate
 * @param rawCurve            null until the curve is uploaded
 * @param currentAnalysisId   the analysis whose results count; null until the curve is uploaded
 */
public record TestRunView(UUID id, UUID specimenId, UUID machineId, UUID forceTransducerId, BigDecimal forceRangeN,
        UUID extensometerId, CalibrationReferences calibrations, String operator, Instant testedAt, LocalDate testDate,
        BigDecimal temperatureC, TestStandard standard, ControlMethod method, String standardReference,
        BigDecimal nominalStrainRatePerS, BigDecimal nominalStressRateMPaPerS, BigDecimal crossheadSpeedMmPerMin,
        TestMode mode, String remarks, List<String> reportedProperties, Validity validity, String invalidationReason,
        Instant invalidatedAt, String invalidatedBy, CalibrationOverride calibrationOverride, RawCurveView rawCurve,
        UUID currentAnalysisId, Instant createdAt, String createdBy) {

    /** Ids of the governing calibration records of the machine, the transducer and the extensometer. */
    public record CalibrationReferences(UUID machine, UUID forceTransducer, UUID extensometer) {
    }

    /** A lab manager's acceptance of a run the gate refused: who, why, and what the gate had found. */
    public record CalibrationOverride(String reason, String acceptedBy, List<String> findings) {
    }

    static TestRunView of(TestRun r, RawCurveView curve) {
        CalibrationOverride override = r.calibrationOverridden()
                ? new CalibrationOverride(r.calibrationOverrideReason(), r.calibrationOverrideBy(),
                        List.of(r.calibrationOverrideFindings().split("\n")))
                : null;
        return new TestRunView(r.id(), r.specimenId(), r.machineId(), r.forceTransducerId(), r.forceRangeN(),
                r.extensometerId(), new CalibrationReferences(r.machineCalibrationId(), r.transducerCalibrationId(),
                        r.extensometerCalibrationId()),
                r.operator(), r.testedAt(), r.testDate(), r.temperatureC(), r.standard(), r.method(),
                r.standardReference(), r.nominalStrainRatePerS(), r.nominalStressRateMPaPerS(),
                r.crossheadSpeedMmPerMin(), r.mode(), r.remarks(), r.reportedProperties(), r.validity(),
                r.invalidationReason(), r.invalidatedAt(), r.invalidatedBy(), override, curve, r.currentAnalysisId(),
                r.createdAt(), r.createdBy());
    }
}
