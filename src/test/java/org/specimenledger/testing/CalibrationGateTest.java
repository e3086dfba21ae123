package org.specimenledger.testing;

import static org.assertj.core.api.Assertions.assertThat;

import java.math.BigDecimal;
import java.time.LocalDate;
import java.util.List;
import java.util.UUID;
import org.junit.jupiter.api.Test;

/** The calibration gate and the class table behind it (DOMAIN.md "Equipment and calibration"). */
class CalibrationGateTest {

    private static final LocalDate ON = LocalDate.of(2026, 3, 1);

    private static CalibrationUsed used(InstrumentRole role, String cls, boolean valid) {
        return new CalibrationUsed(role, UUID.randomUUID(), role.name().substring(0, 2) + "-1", "bench instrument",
                UUID.randomUUID(), "CERT-" + role.ordinal(), "Invented Calibration Service", ON.minusMonths(2),
                ON.plusMonths(10), cls, role == InstrumentRole.FORCE_TRANSDUCER ? new BigDecimal("100000") : null,
                role == InstrumentRole.FORCE_TRANSDUCER ? new BigDecimal("20000") : null,
                role == InstrumentRole.EXTENSOMETER ? new BigDecimal("50") : null, valid,
                valid ? null : "calibration CERT-" + role.ordinal() + " expired on " + ON.minusDays(1));
    }

    private static List<CalibrationUsed> bench(String forceClass, String extensometerClass) {
        return List.of(used(InstrumentRole.TESTING_MACHINE, null, true),
                used(InstrumentRole.FORCE_TRANSDUCER, forceClass, true),
                used(InstrumentRole.EXTENSOMETER, extensometerClass, true));
    }

    @Test
    void iso6892NeedsForceClassOneOrBetter() {
        // ISO 6892-1 refers to ISO 7500-1 class 1 [M]
        assertThat(CalibrationGate.check(bench("0.5", "1"), TestStandard.ISO_6892_1, null)).isEmpty();
        assertThat(CalibrationGate.check(bench("1", "1"), TestStandard.ISO_6892_1, null)).isEmpty();
        List<CalibrationGate.Finding> f = CalibrationGate.check(bench("2", "1"), TestStandard.ISO_6892_1, null);
        assertThat(f).singleElement().satisfies(x -> {
            assertThat(x.pointer()).isEqualTo("/forceTransducerId");
            assertThat(x.reason()).contains("class 2").contains("needs class 1 or better").contains("[M]");
        });
    }

    @Test
    void extensometerClassDependsOnWhatIsReported() {
        // ISO 9513 class 1 for ReH, ReL, Rp, Rt, Ae; class 2 for Ag, Agt, A, At (ISO 6892-1) [M]
        assertThat(CalibrationGate.check(bench("1", "2"), TestStandard.ISO_6892_1, null)).hasSize(1);
        assertThat(CalibrationGate.check(bench("1", "2"), TestStandard.ISO_6892_1, List.of("ReL"))).hasSize(1);
        assertThat(CalibrationGate.check(bench("1", "2"), TestStandard.ISO_6892_1, List.of("Rp0.5"))).hasSize(1);
        assertThat(CalibrationGate.check(bench("1", "2"), TestStandard.ISO_6892_1, List.of("A", "Agt", "Rm"))).isEmpty();
        assertThat(CalibrationGate.check(bench("1", "2"), TestStandard.ISO_6892_1, List.of("Rm", "Z"))).isEmpty();
        assertThat(CalibrationGate.check(bench("1", "0.5"), TestStandard.ISO_6892_1, null)).isEmpty();
    }

    @Test
    void astmTakesE4AndE83AsClassOne() {
        // ASTM E4 ±1 % treated as class 1, ASTM E83 treated as class 1 for yield [M]
        assertThat(CalibrationGate.check(bench("2", "1"), TestStandard.ASTM_E8M, null)).hasSize(1);
        assertThat(CalibrationGate.check(bench("1", "2"), TestStandard.ASTM_E8, null)).hasSize(1);
        assertThat(CalibrationGate.check(bench("1", "1"), TestStandard.ASTM_E8, null)).isEmpty();
    }

    @Test
    void elastomersAndOtherProceduresNeedOnlyAValidCalibration() {
        assertThat(CalibrationGate.check(bench("3", "2"), TestStandard.ISO_37, null)).isEmpty();
        assertThat(CalibrationGate.check(bench(null, null), TestStandard.OTHER, null)).isEmpty();
    }

    @Test
    void anExpiredCalibrationFailsWhateverItsClassAndEveryFailureIsListed() {
        List<CalibrationUsed> b = List.of(used(InstrumentRole.TESTING_MACHINE, null, false),
                used(InstrumentRole.FORCE_TRANSDUCER, "2", true), used(InstrumentRole.EXTENSOMETER, "0.5", false));
        List<CalibrationGate.Finding> f = CalibrationGate.check(b, TestStandard.ISO_6892_1, null);
        assertThat(f).extracting(CalibrationGate.Finding::pointer)
                .containsExactly("/machineId", "/forceTransducerId", "/extensometerId");
        assertThat(f.get(0).line()).startsWith("testing machine TE-1: calibration CERT-0 expired on 2026-02-28")
                .contains("governing calibration CERT-0 of 2026-01-01, due 2027-01-01");
        assertThat(CalibrationGate.check(b, TestStandard.OTHER, null)).hasSize(2);
    }

    @Test
    void aRangeWithoutAClassFailsWhereTheStandardSetsOne() {
        assertThat(CalibrationGate.check(bench(null, "1"), TestStandard.ISO_6892_1, null)).singleElement()
                .satisfies(x -> assertThat(x.reason()).contains("gives no class for the 100000 N range used"));
    }

    @Test
    void temperatureRangesPerStandard() {
        // ISO 6892-1 10–35 °C [M]; ASTM E8 10–38 °C [S]; ISO 37 via ISO 23529 23 ± 2 °C [M]; ends are inside
        assertThat(StandardRequirements.DEFAULTS.temperatureOutside(TestStandard.ISO_6892_1, new BigDecimal("35"))).isFalse();
        assertThat(StandardRequirements.DEFAULTS.temperatureOutside(TestStandard.ISO_6892_1, new BigDecimal("35.1"))).isTrue();
        assertThat(StandardRequirements.DEFAULTS.temperatureOutside(TestStandard.ISO_6892_1, new BigDecimal("9.9"))).isTrue();
        assertThat(StandardRequirements.DEFAULTS.temperatureOutside(TestStandard.ASTM_E8, new BigDecimal("38"))).isFalse();
        assertThat(StandardRequirements.DEFAULTS.temperatureOutside(TestStandard.ASTM_E8M, new BigDecimal("38.5"))).isTrue();
        assertThat(StandardRequirements.DEFAULTS.temperatureOutside(TestStandard.ISO_37, new BigDecimal("25.5"))).isTrue();
        assertThat(StandardRequirements.DEFAULTS.temperatureOutside(TestStandard.OTHER, new BigDecimal("-40"))).isFalse();
    }

    @Test
    void theLaboratorysConfiguredValuesReplaceOnlyWhatTheyName() {
        StandardRequirements table = StandardRequirements.DEFAULTS.with(new StandardSettings(java.util.Map.of(
                TestStandard.ISO_6892_1, new StandardSettings.Given("0.5", null, null, null, "30"),
                TestStandard.ISO_37, new StandardSettings.Given("none", null, null, "none", "none")),
                java.util.Map.of("iso-b-yield", new StandardSettings.Range(null, 0.003))));
        assertThat(table.rates().isoBYield().upper()).isEqualTo(0.003);
        assertThat(table.rates().isoBYield().lower()).as("a bound not given keeps its default").isEqualTo(0.00025);
        assertThat(table.rates().isoBYield().source()).startsWith("laboratory configuration over ");
        assertThat(table.rates().isoBHardening()).isEqualTo(org.specimenledger.analysis.StrainRates.ISO_B_HARDENING);
        assertThat(org.assertj.core.api.Assertions.catchThrowable(() -> StandardRequirements.DEFAULTS.with(
                new StandardSettings(null, java.util.Map.of("iso-b-nonsense", new StandardSettings.Range(1.0, 2.0))))))
                .hasMessageContaining("names no rate rule");
        assertThat(CalibrationGate.check(table, bench("1", "1"), TestStandard.ISO_6892_1, null)).singleElement()
                .satisfies(x -> assertThat(x.reason()).contains("needs class 0.5 or better")
                        .contains("laboratory configuration"));
        assertThat(table.temperatureOutside(TestStandard.ISO_6892_1, new BigDecimal("31"))).isTrue();
        assertThat(table.temperatureOutside(TestStandard.ISO_6892_1, new BigDecimal("10"))).isFalse();
        assertThat(table.temperatureOutside(TestStandard.ISO_37, new BigDecimal("40"))).isFalse();
        assertThat(table.of(TestStandard.ASTM_E8)).isEqualTo(StandardRequirements.DEFAULTS.of(TestStandard.ASTM_E8));
        assertThat(StandardRequirements.DEFAULTS.with(new StandardSettings(null, null))).isSameAs(StandardRequirements.DEFAULTS);
    }

    @Test
    void strainRateRangesApplyToIsoMethodAOnly() {
        assertThat(StandardRequirements.strainRateRangesApply(TestStandard.ISO_6892_1, ControlMethod.A1)).isTrue();
        assertThat(StandardRequirements.strainRateRangesApply(TestStandard.ISO_6892_1, ControlMethod.A2)).isTrue();
        assertThat(StandardRequirements.strainRateRangesApply(TestStandard.ISO_6892_1, ControlMethod.B)).isFalse();
        assertThat(StandardRequirements.strainRateRangesApply(TestStandard.ASTM_E8, null)).isFalse();
    }

    @Test
    void classesCompareByTheirNumber() {
        assertThat(StandardRequirements.meets("0.5", "1")).isTrue();
        assertThat(StandardRequirements.meets("1.0", "1")).isTrue();
        assertThat(StandardRequirements.meets("2", "1")).isFalse();
        assertThat(StandardRequirements.meets(null, "1")).isFalse();
        assertThat(StandardRequirements.meets(null, null)).isTrue();
    }
}
