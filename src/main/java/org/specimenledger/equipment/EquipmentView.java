package org.specimenledger.equipment;

import java.math.BigDecimal;
import java.time.Instant;
import java.time.LocalDate;
import java.time.Period;
import java.util.List;
import java.util.UUID;

/**
 * An instrument as the API returns it and as the ledger records it, with its calibration standing on
 * {@code statusOn} (today, by the service clock, when it was made): {@code calibrationStatus} and the
 * calibration that governs that day ({@code currentCalibration}, null when there is none).
 * Kind-specific data not applicable to the kind is null or empty.
 */
public record EquipmentView(UUID id, String assetId, InstrumentKind kind, String description, String maker,
        String model, String serialNumber, String location, List<ForceRangeView> forceRanges,
        BigDecimal gaugeLengthMm, BigDecimal travelMm, List<UUID> builtInTransducerIds, LocalDate retiredOn,
        String retirementReason, Instant createdAt, LocalDate statusOn, CalibrationStatus calibrationStatus,
        CalibrationSummary currentCalibration) {

    /** A force range: upper limit and the lower limit of its verified part, in N. */
    public record ForceRangeView(BigDecimal upperLimitN, BigDecimal lowerLimitN) {
    }

    /** The governing calibration in brief. */
    public record CalibrationSummary(UUID id, String certificateReference, LocalDate calibratedOn, LocalDate dueOn,
            String accuracyClass, List<CalibrationView.RangeClassView> rangeClasses) {

        static CalibrationSummary of(CalibrationView c) {
            return c == null ? null : new CalibrationSummary(c.id(), c.certificateReference(), c.calibratedOn(),
                    c.dueOn(), c.accuracyClass(), c.rangeClasses());
        }
    }

    /** Whether the instrument is retired on {@code date}. */
    public boolean retiredBy(LocalDate date) {
        return retiredOn != null && !date.isBefore(retiredOn);
    }

    static EquipmentView of(Instrument i, List<CalibrationView> calibrations, LocalDate today, Period dueSoonWithin) {
        CalibrationOnDate standing = CalibrationTimeline.on(today, calibrations, i.retiredOn());
        return new EquipmentView(i.id(), i.assetId(), i.kind(), i.description(), i.maker(), i.model(),
                i.serialNumber(), i.location(),
                i.forceRanges().stream().map(r -> new ForceRangeView(r.upperLimitN(), r.lowerLimitN())).toList(),
                i.gaugeLengthMm(), i.travelMm(), i.builtInTransducerIds(), i.retiredOn(), i.retirementReason(),
                i.createdAt(), today,
                CalibrationTimeline.status(today, calibrations, i.retiredOn(), dueSoonWithin),
                CalibrationSummary.of(standing.calibration()));
    }
}
