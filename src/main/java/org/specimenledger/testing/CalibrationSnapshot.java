package org.specimenledger.testing;

import java.math.BigDecimal;
import org.specimenledger.equipment.CalibrationOnDate;
import org.specimenledger.equipment.CalibrationView;
import org.specimenledger.equipment.EquipmentView;

/** Turns what the equipment register says about one instrument on the test date into a {@link CalibrationUsed}. */
final class CalibrationSnapshot {

    private CalibrationSnapshot() {
    }

    /**
     * @param rangeN the force range used (only read for the force transducer)
     */
    static CalibrationUsed of(InstrumentRole role, EquipmentView instrument, CalibrationOnDate on, BigDecimal rangeN) {
        CalibrationView c = on.calibration();
        String cls = c == null ? null : c.accuracyClass();
        BigDecimal range = null;
        BigDecimal lower = null;
        if (role == InstrumentRole.FORCE_TRANSDUCER) {
            range = instrument.forceRanges().stream().map(EquipmentView.ForceRangeView::upperLimitN)
                    .filter(u -> u.compareTo(rangeN) == 0).findFirst().orElse(rangeN);
            lower = instrument.forceRanges().stream().filter(r -> r.upperLimitN().compareTo(rangeN) == 0)
                    .map(EquipmentView.ForceRangeView::lowerLimitN).findFirst().orElse(null);
            cls = c == null ? null : c.rangeClasses().stream().filter(rc -> rc.rangeN().compareTo(rangeN) == 0)
                    .map(CalibrationView.RangeClassView::accuracyClass).findFirst().orElse(null);
        }
        return new CalibrationUsed(role, instrument.id(), instrument.assetId(), instrument.description(),
                c == null ? null : c.id(), c == null ? null : c.certificateReference(),
                c == null ? null : c.calibratingBody(), c == null ? null : c.calibratedOn(),
                c == null ? null : c.dueOn(), cls, range, lower,
                role == InstrumentRole.EXTENSOMETER ? instrument.gaugeLengthMm() : null, on.valid(), on.reason());
    }
}
