package org.specimenledger.analysis.conformity;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.Set;
import org.junit.jupiter.api.Nested;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.specimenledger.analysis.PropertyStatus;

/**
 * Worked cases in the style of ILAC-G8:09/2019: values at, just inside and just outside a limit, with
 * and without a guard band, for lower, upper and two-sided limits. The zone boundaries are those of
 * ILAC-G8:09/2019 §4.2.1 (simple acceptance, binary statement) and §4.2.3 (guard band w = U, non-binary
 * statement), as drawn in its decision-rule diagrams [M: section and figure numbers from memory; the
 * zones themselves are as restated in DOMAIN.md "Certificates"]. Limits and values are invented.
 */
class ConformityCheckTest {

    private static final Requirement REH_MIN_355 = Requirement.atLeast("ReH", "355", "MPa");
    private static final Requirement Z_MAX_20 = Requirement.atMost("Z", "20", "%");
    private static final Requirement RM_470_630 = Requirement.between("Rm", "470", "630", "MPa");

    private static ConformityDecision simple(Requirement r, MeasuredResult m) {
        return new ConformityCheck(DecisionRule.simpleAcceptance()).decide(r, m);
    }

    private static ConformityDecision guarded(Requirement r, MeasuredResult m) {
        return new ConformityCheck(DecisionRule.guardBanded()).decide(r, m);
    }

    @Nested
    class SimpleAcceptance {

        /** ILAC-G8:09/2019 §4.2.1 [M]: binary statement, acceptance zone up to and including the limit. */
        @ParameterizedTest(name = "ReH {0} against ≥ 355 → {1}")
        @CsvSource({"356, PASS", "355, PASS", "354, FAIL", "355.0, PASS", "354.9, FAIL"})
        void lowerLimit(String reported, Verdict expected) {
            MeasuredResult m = MeasuredResult.determined("ReH", Double.parseDouble(reported), reported, null);
            assertThat(simple(REH_MIN_355, m).verdict()).isEqualTo(expected);
        }

        @ParameterizedTest(name = "Z {0} against ≤ 20 → {1}")
        @CsvSource({"19, PASS", "20, PASS", "20.1, FAIL", "21, FAIL"})
        void upperLimit(String reported, Verdict expected) {
            MeasuredResult m = MeasuredResult.determined("Z", Double.parseDouble(reported), reported, null);
            assertThat(simple(Z_MAX_20, m).verdict()).isEqualTo(expected);
        }

        @ParameterizedTest(name = "Rm {0} against 470 … 630 → {1}")
        @CsvSource({"469, FAIL", "470, PASS", "550, PASS", "630, PASS", "631, FAIL"})
        void twoSided(String reported, Verdict expected) {
            MeasuredResult m = MeasuredResult.determined("Rm", Double.parseDouble(reported), reported, null);
            assertThat(simple(RM_470_630, m).verdict()).isEqualTo(expected);
        }

        /** Rounding interplay [CP]: 354.6 MPa is reported as 355 and passes "≥ 355" on the reported value. */
        @Test
        void reportedRoundedValueAtTheLimitPasses() {
            MeasuredResult m = MeasuredResult.determined("ReH", 354.6, "355", null);
            ConformityDecision d = simple(REH_MIN_355, m);
            assertThat(d.verdict()).isEqualTo(Verdict.PASS);
            assertThat(d.reason()).isEqualTo("ReH 355, meets minimum 355");
            assertThat(d.ruleStatement()).startsWith("Simple acceptance (ILAC-G8:09/2019, 4.2.1)")
                    .contains("reported value, rounded as printed");
        }

        /** The same result fails when the full-precision value is compared. */
        @Test
        void fullPrecisionOptionComparesTheUnroundedValue() {
            MeasuredResult m = MeasuredResult.determined("ReH", 354.6, "355", null);
            ConformityDecision d = new ConformityCheck(DecisionRule.simpleAcceptanceOnFullPrecision())
                    .decide(REH_MIN_355, m);
            assertThat(d.verdict()).isEqualTo(Verdict.FAIL);
            assertThat(d.ruleStatement()).contains("full precision");
        }

        /** Simple acceptance ignores U even when it is known. */
        @Test
        void ignoresUncertainty() {
            MeasuredResult m = MeasuredResult.determined("ReH", 356, "356", "7");
            assertThat(simple(REH_MIN_355, m).verdict()).isEqualTo(Verdict.PASS);
        }
    }

    @Nested
    class GuardBanded {

        /**
         * ILAC-G8:09/2019 §4.2.3 [M]: w = U = 7 MPa, L = 355: ≥ 362 pass; [355, 362) conditional pass;
         * (348, 355) conditional fail; ≤ 348 fail.
         */
        @ParameterizedTest(name = "ReH {0} against ≥ 355 with U 7 → {1}")
        @CsvSource({"370, PASS", "362, PASS", "361.9, CONDITIONAL_PASS", "355, CONDITIONAL_PASS",
                "354.9, CONDITIONAL_FAIL", "348.1, CONDITIONAL_FAIL", "348, FAIL", "340, FAIL"})
        void lowerLimit(String reported, Verdict expected) {
            MeasuredResult m = MeasuredResult.determined("ReH", Double.parseDouble(reported), reported, "7");
            assertThat(guarded(REH_MIN_355, m).verdict()).isEqualTo(expected);
        }

        /** Mirror for an upper limit M = 20 %, U = 1.5 %: ≤ 18.5 pass; (18.5, 20] conditional pass; (20, 21.5) conditional fail; ≥ 21.5 fail. */
        @ParameterizedTest(name = "Z {0} against ≤ 20 with U 1.5 → {1}")
        @CsvSource({"18, PASS", "18.5, PASS", "18.6, CONDITIONAL_PASS", "20, CONDITIONAL_PASS",
                "20.1, CONDITIONAL_FAIL", "21.4, CONDITIONAL_FAIL", "21.5, FAIL", "25, FAIL"})
        void upperLimit(String reported, Verdict expected) {
            MeasuredResult m = MeasuredResult.determined("Z", Double.parseDouble(reported), reported, "1.5");
            assertThat(guarded(Z_MAX_20, m).verdict()).isEqualTo(expected);
        }

        /** Two-sided 470 … 630 with U = 10: each side as above, the worse outcome wins. */
        @ParameterizedTest(name = "Rm {0} against 470 … 630 with U 10 → {1}")
        @CsvSource({"550, PASS", "480, PASS", "479, CONDITIONAL_PASS", "470, CONDITIONAL_PASS",
                "465, CONDITIONAL_FAIL", "460, FAIL", "620, PASS", "621, CONDITIONAL_PASS", "635, CONDITIONAL_FAIL",
                "640, FAIL"})
        void twoSided(String reported, Verdict expected) {
            MeasuredResult m = MeasuredResult.determined("Rm", Double.parseDouble(reported), reported, "10");
            assertThat(guarded(RM_470_630, m).verdict()).isEqualTo(expected);
        }

        /** A band narrower than 2U: 470 … 480 with U = 10 can only be a conditional outcome. */
        @Test
        void narrowTwoSidedBandTakesTheWorseSide() {
            Requirement narrow = Requirement.between("Rm", "470", "480", "MPa");
            MeasuredResult m = MeasuredResult.determined("Rm", 475, "475", "10");
            assertThat(guarded(narrow, m).verdict()).isEqualTo(Verdict.CONDITIONAL_PASS);
            MeasuredResult above = MeasuredResult.determined("Rm", 485, "485", "10");
            assertThat(guarded(narrow, above).verdict()).isEqualTo(Verdict.CONDITIONAL_FAIL);
        }

        @Test
        void withoutUncertaintyIsNotDecidable() {
            MeasuredResult m = MeasuredResult.determined("ReH", 400, "400", null);
            ConformityDecision d = guarded(REH_MIN_355, m);
            assertThat(d.verdict()).isEqualTo(Verdict.NOT_DECIDABLE);
            assertThat(d.verdict().isPass()).isFalse();
            assertThat(d.reason()).contains("expanded uncertainty U", "not estimated");
            assertThat(d.ruleStatement()).startsWith("Guard-banded acceptance (ILAC-G8:09/2019, 4.2.3)");
        }

        @Test
        void reasonNamesTheGuardBand() {
            MeasuredResult m = MeasuredResult.determined("ReH", 358, "358", "7");
            assertThat(guarded(REH_MIN_355, m).reason())
                    .isEqualTo("ReH 358, meets minimum 355 by less than U (guard band U = 7)");
        }
    }

    @Nested
    class NeverAPass {

        @Test
        void requiredButNotDeterminable() {
            ConformityDecision d = simple(REH_MIN_355, MeasuredResult.missing("ReH", PropertyStatus.NOT_DETERMINABLE));
            assertThat(d.verdict()).isEqualTo(Verdict.NOT_DETERMINED);
            assertThat(d.reason()).isEqualTo("ReH is required (≥ 355 MPa) but was not determinable");
        }

        @Test
        void requiredButNotApplicable() {
            ConformityDecision d = guarded(REH_MIN_355, MeasuredResult.missing("ReH", PropertyStatus.NOT_APPLICABLE));
            assertThat(d.verdict()).isEqualTo(Verdict.NOT_DETERMINED);
            assertThat(d.reason()).contains("not applicable");
        }

        @Test
        void blockingFlagGivesFlagged() {
            MeasuredResult m = MeasuredResult.determined("ReH", 400, "400", "7").withFlag("extensometer-slip")
                    .withFlag("note");
            ConformityCheck check = new ConformityCheck(DecisionRule.simpleAcceptance(), Set.of("extensometer-slip"));
            ConformityDecision d = check.decide(REH_MIN_355, m);
            assertThat(d.verdict()).isEqualTo(Verdict.FLAGGED);
            assertThat(d.reason()).contains("extensometer-slip").doesNotContain("note");
        }

        @Test
        void nonBlockingFlagDoesNotStopTheDecision() {
            MeasuredResult m = MeasuredResult.determined("ReH", 400, "400", "7").withFlag("note");
            ConformityCheck check = new ConformityCheck(DecisionRule.simpleAcceptance(), Set.of("extensometer-slip"));
            assertThat(check.decide(REH_MIN_355, m).verdict()).isEqualTo(Verdict.PASS);
        }
    }

    @Test
    void rejectsMismatchedPropertyAndEmptyRequirement() {
        assertThatThrownBy(() -> simple(REH_MIN_355, MeasuredResult.determined("Rm", 500, "500", null)))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("ReH").hasMessageContaining("Rm");
        assertThatThrownBy(() -> new Requirement("Rm", java.util.Optional.empty(), java.util.Optional.empty(), "MPa"))
                .hasMessageContaining("neither a minimum nor a maximum");
        assertThatThrownBy(() -> Requirement.between("Rm", "630", "470", "MPa")).hasMessageContaining("exceeds");
        assertThatThrownBy(() -> MeasuredResult.determined("Rm", 500, "500", "-1")).hasMessageContaining("negative");
    }

    @Test
    void printsRequirementsAndVerdicts() {
        assertThat(REH_MIN_355.printable()).isEqualTo("≥ 355 MPa");
        assertThat(Z_MAX_20.printable()).isEqualTo("≤ 20 %");
        assertThat(RM_470_630.printable()).isEqualTo("470 … 630 MPa");
        assertThat(Verdict.CONDITIONAL_PASS.printable()).isEqualTo("conditional pass");
        assertThat(Verdict.CONDITIONAL_PASS.isPass()).isTrue();
        assertThat(Verdict.CONDITIONAL_FAIL.isPass()).isFalse();
    }
}
