package org.specimenledger.specimens;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.math.BigDecimal;
import java.math.MathContext;
import org.junit.jupiter.api.Test;

/**
 * L0 = k·√S0 with k = 5.65 or 11.3, the 15 mm minimum for k = 5.65, and the rounding to the nearest
 * 5 mm while the difference is below 10 % of L0 [S: ISO 6892-1 via its national adoption; DOMAIN.md
 * "Test pieces"]. Oracle for k·√S0: BigDecimal.sqrt in 34 digits.
 */
class GaugeLengthTest {

    private static double oracle(double k, double s0) {
        return new BigDecimal(k).multiply(new BigDecimal(s0).sqrt(MathContext.DECIMAL128)).doubleValue();
    }

    @Test
    void tenMillimetreRoundBarGetsFiftyMillimetres() {
        // S0 = 78.5398 → L0 = 5.65·√78.54 = 50.0718 → 50 mm, difference 0.0718 below 5.007 [S: ISO 6892-1 "within 10 %" rule]
        double s0 = Math.PI * 100 / 4;
        GaugeLength l0 = GaugeLength.proportional(GaugeLength.K_SHORT, s0, true);
        assertThat(l0.calculatedMm()).isCloseTo(oracle(5.65, s0), within(1e-12));
        assertThat(l0.calculatedMm()).isCloseTo(50.07, within(0.005));
        assertThat(l0.l0Mm()).isEqualTo(50.0);
        assertThat(l0.rule()).isEqualTo("L0 = 5.65·√S0 = 5.65·√78.5398 = 50.0718 mm, rounded to 50 mm (ISO 6892-1: "
                + "nearest multiple of 5 mm, difference 0.0718213 mm below 10 % of L0 = 5.00718 mm)");
    }

    @Test
    void flatTwelveAndAHalfByThreeGetsThirtyFive() {
        // S0 = 37.5 → L0 = 5.65·√37.5 = 34.60 → 35 mm [S: ISO 6892-1 rounding rule]
        GaugeLength l0 = GaugeLength.proportional(GaugeLength.K_SHORT, 37.5, true);
        assertThat(l0.calculatedMm()).isCloseTo(oracle(5.65, 37.5), within(1e-12));
        assertThat(l0.calculatedMm()).isCloseTo(34.599, within(0.001));
        assertThat(l0.l0Mm()).isEqualTo(35.0);
    }

    @Test
    void shortProportionalBelowFifteenMillimetresIsRefused() {
        // S0 = 5 mm² → 5.65·√5 = 12.63 mm < 15 mm: refused, pointing to k = 11.3 or a fixed L0 [S: ISO 6892-1]
        assertThatThrownBy(() -> GaugeLength.proportional(GaugeLength.K_SHORT, 5.0, true))
                .isInstanceOf(GeometryRefused.class)
                .hasMessageContaining("at least 15 mm")
                .hasMessageContaining("12.6")
                .hasMessageContaining("use k = 11.3 or a fixed")
                .satisfies(e -> assertThat(((GeometryRefused) e).symbol()).isEqualTo("k"));
        // the same piece with k = 11.3: 25.27 → 25 mm (difference 0.27 below 2.53) [S, same rule]
        GaugeLength l0 = GaugeLength.proportional(GaugeLength.K_LONG, 5.0, true);
        assertThat(l0.calculatedMm()).isCloseTo(oracle(11.3, 5.0), within(1e-12));
        assertThat(l0.l0Mm()).isEqualTo(25.0);
    }

    @Test
    void roundingIsNotAppliedWhenTheDifferenceReachesTenPercent() {
        // d = 3.5 mm → S0 = 9.6211, L0 = 17.525; nearest multiple 20 mm differs by 2.475 ≥ 1.7525 → not rounded
        // [S: ISO 6892-1 "less than 10 % of L0"]
        double s0 = Math.PI * 3.5 * 3.5 / 4;
        GaugeLength l0 = GaugeLength.proportional(GaugeLength.K_SHORT, s0, true);
        assertThat(l0.l0Mm()).isEqualTo(l0.calculatedMm());
        assertThat(l0.calculatedMm()).isCloseTo(17.525, within(0.001));
        assertThat(l0.rule()).contains("not rounded").contains("(20 mm)");
    }

    @Test
    void roundingGoesToTheNearestMultipleEvenDownwards() {
        // 5.65·√S0 = 22 mm → 20 mm (difference 2 below 2.2) [S: rounding rule]; S0 chosen as (22/5.65)²
        double s0 = Math.pow(22 / 5.65, 2);
        GaugeLength l0 = GaugeLength.proportional(GaugeLength.K_SHORT, s0, true);
        assertThat(l0.calculatedMm()).isCloseTo(22.0, within(1e-9));
        assertThat(l0.l0Mm()).isEqualTo(20.0);
    }

    @Test
    void roundingCanBeSwitchedOff() {
        GaugeLength l0 = GaugeLength.proportional(GaugeLength.K_SHORT, 37.5, false);
        assertThat(l0.l0Mm()).isEqualTo(l0.calculatedMm());
        assertThat(l0.roundToFiveMm()).isFalse();
        assertThat(l0.rule()).contains("used as calculated");
    }

    @Test
    void onlyTheTwoCoefficientsAreAccepted() {
        assertThatThrownBy(() -> GaugeLength.proportional(4.0, 78.5, true))
                .isInstanceOf(GeometryRefused.class).hasMessageContaining("k must be 5.65 or 11.3");
    }

    @Test
    void fixedGaugeLengthIsUsedAsGiven() {
        // ASTM E8M sheet-type piece: G = 50.0 mm [S]
        GaugeLength l0 = GaugeLength.fixed(50.0);
        assertThat(l0.basis()).isEqualTo(GaugeLength.Basis.FIXED);
        assertThat(l0.l0Mm()).isEqualTo(50.0);
        assertThat(l0.k()).isNull();
        assertThat(l0.rule()).isEqualTo("L0 = 50 mm fixed (non-proportional test piece)");
        assertThatThrownBy(() -> GaugeLength.fixed(-5)).isInstanceOf(GeometryRefused.class);
    }

    @Test
    void parallelLengthShorterThanLZeroPlusHalfDiameterIsAWarningForRoundPieces() {
        // Lc ≥ L0 + d/2 recommended for round pieces [M: ISO 6892-1 round test-piece annex, from memory]
        assertThat(ParallelLength.warnings(SpecimenShape.ROUND, 52, 50, 10.0, 50)).singleElement()
                .asString().contains("L0 + d/2 = 55 mm");
        assertThat(ParallelLength.warnings(SpecimenShape.ROUND, 55, 50, 10.0, 50)).isEmpty();
        assertThat(ParallelLength.warnings(SpecimenShape.FLAT, 52, 50, null, 50)).isEmpty();
        // Le beyond Lc: the extensometer would reach outside the parallel length [CP]
        assertThat(ParallelLength.warnings(SpecimenShape.FLAT, 55, 50, null, 60)).singleElement()
                .asString().contains("Le = 60 mm is longer");
        assertThat(ParallelLength.carriesGaugeLength(49.9, 50)).isFalse();
        assertThat(ParallelLength.carriesGaugeLength(50, 50)).isTrue();
    }
}
