package org.specimenledger.equipment;

import java.time.LocalDate;
import java.time.Period;
import java.util.Comparator;
import java.util.List;
import java.util.Optional;

/**
 * Which calibration governs a day, and whether the instrument was calibrated on it. Pure: the caller
 * passes the day, the instrument's records and its retirement date.
 *
 * <p>The governing record for day D is the newest standing (not withdrawn) calibration made on or
 * before D — newest by calibration date, then by when it was recorded. A newer calibration supersedes
 * an older one even when the older one's due date is later (the newer certificate describes the
 * instrument as it now is). It is valid on D when D is on or before its due date. An instrument retired
 * on or before D is not valid whatever its calibration. (Laboratory common practice; ISO/IEC 17025
 * 6.4 asks that equipment be calibrated when it is used, without fixing these details.)
 */
final class CalibrationTimeline {

    private static final Comparator<CalibrationView> NEWEST_LAST = Comparator
            .comparing(CalibrationView::calibratedOn)
            .thenComparing(CalibrationView::recordedAt)
            .thenComparing(c -> c.id().toString());

    private CalibrationTimeline() {
    }

    /** The calibration standing of an instrument on {@code date}. */
    static CalibrationOnDate on(LocalDate date, List<CalibrationView> calibrations, LocalDate retiredOn) {
        Optional<CalibrationView> governing = governing(date, calibrations);
        CalibrationView calibration = governing.orElse(null);
        if (retiredOn != null && !date.isBefore(retiredOn)) {
            return new CalibrationOnDate(date, false, calibration, "instrument retired on " + retiredOn);
        }
        if (calibration == null) {
            return calibrations.stream()
                    .filter(c -> c.withdrawn() && !c.calibratedOn().isAfter(date))
                    .max(NEWEST_LAST)
                    .map(w -> new CalibrationOnDate(date, false, null, "withdrawn: calibration "
                            + w.certificateReference() + " of " + w.calibratedOn() + " was withdrawn ("
                            + w.withdrawalReason() + ") and no other calibration was made on or before " + date))
                    .orElseGet(() -> new CalibrationOnDate(date, false, null,
                            "no calibration on or before " + date));
        }
        if (date.isAfter(calibration.dueOn())) {
            return new CalibrationOnDate(date, false, calibration,
                    "calibration " + calibration.certificateReference() + " expired on " + calibration.dueOn());
        }
        return new CalibrationOnDate(date, true, calibration, null);
    }

    /**
     * The standing on {@code today}: retired, none, expired, due soon (due date within
     * {@code dueSoonWithin} from today, the due date itself included) or valid.
     */
    static CalibrationStatus status(LocalDate today, List<CalibrationView> calibrations, LocalDate retiredOn,
            Period dueSoonWithin) {
        if (retiredOn != null && !today.isBefore(retiredOn)) {
            return CalibrationStatus.RETIRED;
        }
        Optional<CalibrationView> governing = governing(today, calibrations);
        if (governing.isEmpty()) {
            return CalibrationStatus.NONE;
        }
        LocalDate due = governing.get().dueOn();
        if (today.isAfter(due)) {
            return CalibrationStatus.EXPIRED;
        }
        return today.plus(dueSoonWithin).isBefore(due) ? CalibrationStatus.VALID : CalibrationStatus.DUE_SOON;
    }

    static Optional<CalibrationView> governing(LocalDate date, List<CalibrationView> calibrations) {
        return calibrations.stream()
                .filter(c -> !c.withdrawn() && !c.calibratedOn().isAfter(date))
                .max(NEWEST_LAST);
    }
}
