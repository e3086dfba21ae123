package org.specimenledger.equipment;

import static org.assertj.core.api.Assertions.assertThat;
import static org.specimenledger.equipment.EquipmentFixtures.extensometerCalibration;
import static org.specimenledger.equipment.EquipmentFixtures.loadCellCalibration;
import static org.specimenledger.equipment.EquipmentFixtures.loadCellRanges;
import static org.specimenledger.equipment.EquipmentFixtures.rangeClass;

import java.math.BigDecimal;
import java.time.LocalDate;
import java.time.Period;
import java.util.List;
import java.util.UUID;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.specimenledger.shared.FieldIssue;
import org.specimenledger.shared.RuleViolation;

class CalibrationRulesTest {

    private static final UUID INSTRUMENT = UUID.randomUUID();
    private static final LocalDate TODAY = LocalDate.of(2025, 6, 15);
    /** 12 months: re-verification at most every 12 months [from memory]; ASTM E4 asks for annual verification. */
    private static final Period TWELVE_MONTHS = Period.ofMonths(12);

    private static CalibrationRules.Checked check(InstrumentKind kind, EquipmentRequests.CalibrationRequest r) {
        return CalibrationRules.checked(INSTRUMENT, kind, kind == InstrumentKind.FORCE_TRANSDUCER ? loadCellRanges()
                : List.of(), r, TODAY, TWELVE_MONTHS);
    }

    private static List<FieldIssue> issues(InstrumentKind kind, EquipmentRequests.CalibrationRequest r) {
        try {
            check(kind, r);
        } catch (RuleViolation e) {
            return e.issues();
        }
        throw new AssertionError("expected a rule violation");
    }

    /** ISO 7500-1 force-measuring system classes 0.5, 1, 2, 3 [from memory]. */
    @ParameterizedTest
    @ValueSource(strings = {"0.5", "1", "2", "3"})
    void forceTransducerTakesEachIso7500Class(String cls) {
        CalibrationRules.Checked ok = check(InstrumentKind.FORCE_TRANSDUCER, loadCellCalibration(TODAY,
                TODAY.plusMonths(12), rangeClass("10000", cls), rangeClass("100000", cls)));
        assertThat(ok.rangeClasses()).extracting(RangeClass::accuracyClass).containsExactly(cls, cls);
        assertThat(ok.accuracyClass()).isNull();
    }

    /** 0.2 and 4 are not ISO 7500-1 classes [from memory: the standard names 0.5, 1, 2, 3]. */
    @ParameterizedTest
    @ValueSource(strings = {"0.2", "4", "A", ""})
    void forceTransducerRefusesOtherClasses(String cls) {
        List<FieldIssue> issues = issues(InstrumentKind.FORCE_TRANSDUCER, loadCellCalibration(TODAY,
                TODAY.plusMonths(6), rangeClass("10000", "1"), rangeClass("100000", cls)));
        assertThat(issues).extracting(FieldIssue::pointer).containsExactly("/classes/1/accuracyClass");
        assertThat(issues.get(0).detail()).contains("allowed: 0.5, 1, 2, 3");
    }

    /** ISO 9513 extensometer classes 0.5, 1, 2 [from memory]; class 3 is a force class only. */
    @Test
    void extensometerTakesIso9513ClassesOnly() {
        for (String cls : List.of("0.5", "1", "2")) {
            assertThat(check(InstrumentKind.EXTENSOMETER, extensometerCalibration(TODAY, TODAY.plusMonths(12), cls))
                    .accuracyClass()).isEqualTo(cls);
        }
        List<FieldIssue> issues = issues(InstrumentKind.EXTENSOMETER,
                extensometerCalibration(TODAY, TODAY.plusMonths(12), "3"));
        assertThat(issues).containsExactly(new FieldIssue("/accuracyClass",
                "class '3' is not an ISO 9513 extensometer class; allowed: 0.5, 1, 2"));
    }

    @Test
    void extensometerNeedsItsClass() {
        assertThat(issues(InstrumentKind.EXTENSOMETER, extensometerCalibration(TODAY, TODAY.plusMonths(1), null)))
                .extracting(FieldIssue::pointer).containsExactly("/accuracyClass");
    }

    @Test
    void classIsNormalised() {
        assertThat(check(InstrumentKind.EXTENSOMETER, extensometerCalibration(TODAY, TODAY.plusMonths(1), "1.0"))
                .accuracyClass()).isEqualTo("1");
    }

    @Test
    void testingMachineClassIsOptional() {
        assertThat(check(InstrumentKind.TESTING_MACHINE, extensometerCalibration(TODAY, TODAY.plusMonths(1), null))
                .accuracyClass()).isNull();
        assertThat(check(InstrumentKind.TESTING_MACHINE, extensometerCalibration(TODAY, TODAY.plusMonths(1), "3"))
                .accuracyClass()).isEqualTo("3");
    }

    @Test
    void unknownRangeIsNamedByItsPointer() {
        List<FieldIssue> issues = issues(InstrumentKind.FORCE_TRANSDUCER, loadCellCalibration(TODAY,
                TODAY.plusMonths(6), rangeClass("10000", "1"), rangeClass("100000", "1"), rangeClass("50000", "1")));
        assertThat(issues).containsExactly(new FieldIssue("/classes/2/rangeN",
                "the instrument has no force range of 50000 N; its ranges are 10000 N, 100000 N"));
    }

    @Test
    void everyRangeMustReceiveAClass() {
        List<FieldIssue> issues = issues(InstrumentKind.FORCE_TRANSDUCER, loadCellCalibration(TODAY,
                TODAY.plusMonths(6), rangeClass("10000.0", "1")));
        assertThat(issues).containsExactly(new FieldIssue("/classes",
                "force range 100000 N has no class; every range of the instrument must receive one"));
    }

    @Test
    void aRangeClassedTwiceIsRefused() {
        List<FieldIssue> issues = issues(InstrumentKind.FORCE_TRANSDUCER, loadCellCalibration(TODAY,
                TODAY.plusMonths(6), rangeClass("10000", "1"), rangeClass("100000", "1"), rangeClass("1E4", "2")));
        assertThat(issues).extracting(FieldIssue::pointer).containsExactly("/classes/2/rangeN");
    }

    @Test
    void rangeMatchesWhateverTheTrailingZeros() {
        CalibrationRules.Checked ok = check(InstrumentKind.FORCE_TRANSDUCER, loadCellCalibration(TODAY,
                TODAY.plusMonths(6), rangeClass("10000.00", "1"), rangeClass("100000", "2")));
        // stored with the instrument's own spelling of the range, so the reference to it holds
        assertThat(ok.rangeClasses().get(0).rangeN()).isEqualTo(new BigDecimal("10000"));
    }

    @Test
    void forceTransducerTakesNoSingleClassAndOthersNoRangeClasses() {
        EquipmentRequests.CalibrationRequest both = new EquipmentRequests.CalibrationRequest(TODAY,
                TODAY.plusMonths(6), "body", "ref", "1", List.of(rangeClass("10000", "1")), null);
        assertThat(issues(InstrumentKind.FORCE_TRANSDUCER, both)).extracting(FieldIssue::pointer)
                .containsExactly("/accuracyClass", "/classes");
        assertThat(issues(InstrumentKind.EXTENSOMETER, both)).extracting(FieldIssue::pointer)
                .containsExactly("/classes");
    }

    @Test
    void dueOnOrBeforeCalibrationDateIsRefused() {
        for (LocalDate due : List.of(TODAY, TODAY.minusDays(1))) {
            List<FieldIssue> issues = issues(InstrumentKind.EXTENSOMETER, extensometerCalibration(TODAY, due, "1"));
            assertThat(issues).extracting(FieldIssue::pointer).containsExactly("/dueOn");
            assertThat(issues.get(0).detail()).startsWith("calibration due before calibration date");
        }
    }

    @Test
    void calibrationDateInTheFutureIsRefused() {
        List<FieldIssue> issues = issues(InstrumentKind.EXTENSOMETER,
                extensometerCalibration(TODAY.plusDays(1), TODAY.plusMonths(6), "1"));
        assertThat(issues).containsExactly(new FieldIssue("/calibratedOn",
                "calibration date 2025-06-16 is in the future (today is 2025-06-15)"));
        // today itself is fine
        check(InstrumentKind.EXTENSOMETER, extensometerCalibration(TODAY, TODAY.plusMonths(6), "1"));
    }

    /** Maximum interval 12 months [from memory; ASTM E4 annual]: exactly 12 months passes, one day more does not. */
    @Test
    void intervalLongerThanTheMaximumIsRefused() {
        LocalDate on = LocalDate.of(2025, 1, 31);
        check(InstrumentKind.EXTENSOMETER, extensometerCalibration(on, LocalDate.of(2026, 1, 31), "1"));
        List<FieldIssue> issues = issues(InstrumentKind.EXTENSOMETER,
                extensometerCalibration(on, LocalDate.of(2026, 2, 1), "1"));
        assertThat(issues).extracting(FieldIssue::pointer).containsExactly("/dueOn");
        assertThat(issues.get(0).detail()).contains("exceeds P12M")
                .contains("ledger.equipment.max-calibration-interval");
    }

    @Test
    void allProblemsAreReportedAtOnce() {
        List<FieldIssue> issues = issues(InstrumentKind.FORCE_TRANSDUCER, loadCellCalibration(TODAY.plusDays(3),
                TODAY, rangeClass("5", "9")));
        assertThat(issues).extracting(FieldIssue::pointer).containsExactly("/calibratedOn", "/dueOn",
                "/classes/0/rangeN", "/classes/0/accuracyClass", "/classes", "/classes");
    }
}
