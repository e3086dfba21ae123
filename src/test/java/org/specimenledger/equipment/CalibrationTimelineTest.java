package org.specimenledger.equipment;

import static org.assertj.core.api.Assertions.assertThat;
import static org.specimenledger.equipment.EquipmentFixtures.calibration;
import static org.specimenledger.equipment.EquipmentFixtures.withdrawn;

import java.time.Instant;
import java.time.LocalDate;
import java.time.Period;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * The date logic of "was this instrument calibrated on day D". The rule itself (newest standing record
 * made on or before D governs; valid through its due date; retirement ends validity) is laboratory
 * common practice, as set out in the equipment brief — no standard fixes it in these words.
 */
class CalibrationTimelineTest {

    private static final LocalDate CALIBRATED = LocalDate.of(2025, 3, 10);
    private static final LocalDate DUE = LocalDate.of(2026, 3, 9);
    private static final Instant RECORDED = Instant.parse("2025-03-12T09:00:00Z");
    private static final CalibrationView ONE = calibration("CERT-1", CALIBRATED, DUE, RECORDED);

    @Test
    void validOnTheCalibrationDateItself() {
        CalibrationOnDate r = CalibrationTimeline.on(CALIBRATED, List.of(ONE), null);
        assertThat(r.valid()).isTrue();
        assertThat(r.calibration()).isEqualTo(ONE);
        assertThat(r.reason()).isNull();
    }

    @Test
    void notValidTheDayBeforeTheFirstCalibration() {
        CalibrationOnDate r = CalibrationTimeline.on(CALIBRATED.minusDays(1), List.of(ONE), null);
        assertThat(r.valid()).isFalse();
        assertThat(r.calibration()).isNull();
        assertThat(r.reason()).isEqualTo("no calibration on or before 2025-03-09");
    }

    @Test
    void validOnTheDueDate() {
        assertThat(CalibrationTimeline.on(DUE, List.of(ONE), null).valid()).isTrue();
    }

    @Test
    void expiredTheDayAfterTheDueDate() {
        CalibrationOnDate r = CalibrationTimeline.on(DUE.plusDays(1), List.of(ONE), null);
        assertThat(r.valid()).isFalse();
        assertThat(r.calibration()).isEqualTo(ONE);
        assertThat(r.reason()).isEqualTo("calibration CERT-1 expired on 2026-03-09");
    }

    @Test
    void ofTwoOverlappingCalibrationsTheNewerGoverns() {
        // the newer certificate (made 2025-09-01) describes the instrument from then on, even though the
        // older one would run longer
        CalibrationView shortNewer = calibration("CERT-2", LocalDate.of(2025, 9, 1), LocalDate.of(2025, 12, 31),
                RECORDED.plusSeconds(86_400 * 200L));
        List<CalibrationView> both = List.of(shortNewer, ONE);
        assertThat(CalibrationTimeline.on(LocalDate.of(2025, 8, 31), both, null).calibration()).isEqualTo(ONE);
        assertThat(CalibrationTimeline.on(LocalDate.of(2025, 9, 1), both, null).calibration()).isEqualTo(shortNewer);
        CalibrationOnDate january = CalibrationTimeline.on(LocalDate.of(2026, 1, 1), both, null);
        assertThat(january.valid()).isFalse();
        assertThat(january.calibration()).isEqualTo(shortNewer);
        assertThat(january.reason()).isEqualTo("calibration CERT-2 expired on 2025-12-31");
    }

    @Test
    void twoCalibrationsOnTheSameDayTheLaterRecordedGoverns() {
        CalibrationView again = calibration("CERT-1b", CALIBRATED, DUE.minusDays(100), RECORDED.plusSeconds(5));
        assertThat(CalibrationTimeline.on(CALIBRATED, List.of(again, ONE), null).calibration()).isEqualTo(again);
    }

    @Test
    void aWithdrawnNewestRecordLeavesTheOlderOneGoverning() {
        CalibrationView newer = withdrawn(calibration("CERT-3", LocalDate.of(2025, 9, 1), LocalDate.of(2026, 8, 31),
                RECORDED.plusSeconds(86_400 * 200L)), "wrong instrument on the certificate");
        CalibrationOnDate r = CalibrationTimeline.on(LocalDate.of(2025, 10, 1), List.of(ONE, newer), null);
        assertThat(r.valid()).isTrue();
        assertThat(r.calibration()).isEqualTo(ONE);
        // after the older one's due date, the withdrawn record does not rescue the instrument
        CalibrationOnDate later = CalibrationTimeline.on(DUE.plusDays(1), List.of(ONE, newer), null);
        assertThat(later.valid()).isFalse();
        assertThat(later.reason()).isEqualTo("calibration CERT-1 expired on 2026-03-09");
    }

    @Test
    void onlyAWithdrawnRecordSaysSo() {
        CalibrationView only = withdrawn(ONE, "due date typed wrongly");
        CalibrationOnDate r = CalibrationTimeline.on(CALIBRATED.plusDays(1), List.of(only), null);
        assertThat(r.valid()).isFalse();
        assertThat(r.calibration()).isNull();
        assertThat(r.reason()).startsWith("withdrawn: calibration CERT-1").contains("due date typed wrongly");
    }

    @Test
    void retiredFromItsRetirementDateOn() {
        LocalDate retired = LocalDate.of(2025, 6, 1);
        assertThat(CalibrationTimeline.on(retired.minusDays(1), List.of(ONE), retired).valid()).isTrue();
        CalibrationOnDate r = CalibrationTimeline.on(retired, List.of(ONE), retired);
        assertThat(r.valid()).isFalse();
        assertThat(r.reason()).isEqualTo("instrument retired on 2025-06-01");
        assertThat(r.calibration()).isEqualTo(ONE);
    }

    @Test
    void statusOnEachDay() {
        Period thirtyDays = Period.ofDays(30);
        List<CalibrationView> one = List.of(ONE);
        assertThat(CalibrationTimeline.status(CALIBRATED.minusDays(1), one, null, thirtyDays))
                .isEqualTo(CalibrationStatus.NONE);
        assertThat(CalibrationTimeline.status(CALIBRATED, one, null, thirtyDays)).isEqualTo(CalibrationStatus.VALID);
        assertThat(CalibrationTimeline.status(DUE.minusDays(31), one, null, thirtyDays))
                .isEqualTo(CalibrationStatus.VALID);
        assertThat(CalibrationTimeline.status(DUE.minusDays(30), one, null, thirtyDays))
                .isEqualTo(CalibrationStatus.DUE_SOON);
        assertThat(CalibrationTimeline.status(DUE, one, null, thirtyDays)).isEqualTo(CalibrationStatus.DUE_SOON);
        assertThat(CalibrationTimeline.status(DUE.plusDays(1), one, null, thirtyDays))
                .isEqualTo(CalibrationStatus.EXPIRED);
        assertThat(CalibrationTimeline.status(DUE, one, DUE, thirtyDays)).isEqualTo(CalibrationStatus.RETIRED);
        assertThat(CalibrationTimeline.status(CALIBRATED, List.of(), null, thirtyDays))
                .isEqualTo(CalibrationStatus.NONE);
        assertThat(CalibrationTimeline.status(CALIBRATED, List.of(withdrawn(ONE, "x")), null, thirtyDays))
                .isEqualTo(CalibrationStatus.NONE);
    }
}
