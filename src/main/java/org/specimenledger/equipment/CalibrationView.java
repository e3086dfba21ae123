package org.specimenledger.equipment;

import java.math.BigDecimal;
import java.time.Instant;
import java.time.LocalDate;
import java.util.List;
import java.util.UUID;

/**
 * A calibration record as the API returns it and as the ledger records it. {@code accuracyClass} is the
 * class of an extensometer or testing machine; {@code rangeClasses} the per-range classes of a force
 * transducer. A withdrawn record carries {@code withdrawnAt} and {@code withdrawalReason}.
 */
public record CalibrationView(UUID id, UUID equipmentId, LocalDate calibratedOn, LocalDate dueOn,
        String calibratingBody, String certificateReference, String accuracyClass, List<RangeClassView> rangeClasses,
        Instant recordedAt, Instant withdrawnAt, String withdrawalReason) {

    /** The ISO 7500-1 class obtained by the range whose upper limit is {@code rangeN} newtons. */
    public record RangeClassView(BigDecimal rangeN, String accuracyClass) {
    }

    /** Whether the record was taken out of force. */
    public boolean withdrawn() {
        return withdrawnAt != null;
    }

    static CalibrationView of(Calibration c) {
        return new CalibrationView(c.id(), c.instrumentId(), c.calibratedOn(), c.dueOn(), c.calibratingBody(),
                c.certificateReference(), c.accuracyClass(),
                c.rangeClasses().stream().map(r -> new RangeClassView(r.rangeN(), r.accuracyClass())).toList(),
                c.recordedAt(), c.withdrawnAt(), c.withdrawalReason());
    }
}
