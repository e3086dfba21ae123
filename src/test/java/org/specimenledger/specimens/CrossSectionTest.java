package org.specimenledger.specimens;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.math.BigDecimal;
import java.math.MathContext;
import java.util.Map;
import org.apache.commons.math3.stat.StatUtils;
import org.junit.jupiter.api.Test;

/**
 * The cross-section formulas of ISO 6892-1 (round π·d²/4, flat a·b, tube π·a·(D − a)) [S: ISO 6892-1 via
 * its national adoption; DOMAIN.md "Test pieces"], applied to the mean of each dimension's readings [CP].
 * Oracles: the closed forms evaluated in BigDecimal with π to 35 digits (exact to far below the
 * tolerance), and Apache Commons Math {@code StatUtils.mean} for the means.
 */
class CrossSectionTest {

    /** π to 35 significant digits, for the BigDecimal oracle. */
    private static final BigDecimal PI = new BigDecimal("3.1415926535897932384626433832795029");
    private static final MathContext MC = MathContext.DECIMAL128;

    private static Map<String, double[]> readings(Object... symbolThenValues) {
        var map = new java.util.LinkedHashMap<String, double[]>();
        for (int i = 0; i < symbolThenValues.length; i += 2) {
            map.put((String) symbolThenValues[i], (double[]) symbolThenValues[i + 1]);
        }
        return map;
    }

    private static double roundOracle(double d) {
        BigDecimal bd = new BigDecimal(d);
        return PI.multiply(bd.multiply(bd, MC), MC).divide(BigDecimal.valueOf(4), MC).doubleValue();
    }

    @Test
    void roundTenMillimetreBarHasPiTimesHundredOverFour() {
        // d = 10 mm → S0 = π·100/4 = 78.539816... mm² [S: ISO 6892-1 round formula; value exact]
        CrossSection s0 = CrossSection.measured(SpecimenShape.ROUND, CrossSection.Stage.ORIGINAL,
                readings("d", new double[] {10.0}));
        assertThat(s0.areaMm2()).isCloseTo(78.5398163397448, within(1e-12));
        assertThat(s0.areaMm2()).isCloseTo(roundOracle(10.0), within(1e-12));
        assertThat(s0.formula()).isEqualTo("S0 = π·d²/4 = 78.5398 mm², d = mean of 1 reading = 10 mm");
    }

    @Test
    void roundAreaUsesTheMeanOfTheReadings() {
        // mean of the readings [CP, DOMAIN.md], oracle Commons Math StatUtils.mean and the BigDecimal closed form
        double[] d = {10.00, 10.01, 10.00};
        CrossSection s0 = CrossSection.measured(SpecimenShape.ROUND, CrossSection.Stage.ORIGINAL, readings("d", d));
        double mean = StatUtils.mean(d);
        assertThat(s0.meansMm().get("d")).isCloseTo(mean, within(1e-14));
        assertThat(s0.areaMm2()).isCloseTo(roundOracle(mean), within(1e-11));
        assertThat(s0.formula()).endsWith("d = mean of 3 readings = 10.0033 mm");
    }

    @Test
    void flatPieceIsThicknessTimesWidth() {
        // 12.5 × 3 mm flat → S0 = a·b = 37.5 mm² [S: ISO 6892-1 rectangular formula; exact]
        CrossSection s0 = CrossSection.measured(SpecimenShape.FLAT, CrossSection.Stage.ORIGINAL,
                readings("a", new double[] {3.0, 3.0}, "b", new double[] {12.5, 12.5, 12.5}));
        assertThat(s0.areaMm2()).isEqualTo(37.5);
        assertThat(s0.meansMm()).containsEntry("a", 3.0).containsEntry("b", 12.5);
        assertThat(s0.formula()).startsWith("S0 = a·b = 37.5 mm²");
    }

    @Test
    void flatAreaWithUnevenReadingsMatchesTheBigDecimalProductOfTheMeans() {
        // a·b of the means [S formula, CP mean]; oracle: exact BigDecimal means and product
        double[] a = {2.98, 3.01, 3.02};
        double[] b = {12.47, 12.52};
        CrossSection s0 = CrossSection.measured(SpecimenShape.FLAT, CrossSection.Stage.ORIGINAL,
                readings("a", a, "b", b));
        BigDecimal meanA = new BigDecimal("9.01").divide(BigDecimal.valueOf(3), MC);
        BigDecimal meanB = new BigDecimal("24.99").divide(BigDecimal.valueOf(2), MC);
        assertThat(s0.areaMm2()).isCloseTo(meanA.multiply(meanB, MC).doubleValue(), within(1e-12));
    }

    @Test
    void tubeTwoByTwentyIsPiTimesTwoTimesEighteen() {
        // a = 2, D = 20 → S0 = π·2·18 = 113.097 mm² [S: ISO 6892-1 tube formula π·a·(D − a)]
        CrossSection s0 = CrossSection.measured(SpecimenShape.TUBE, CrossSection.Stage.ORIGINAL,
                readings("a", new double[] {2.0}, "D", new double[] {20.0}));
        assertThat(s0.areaMm2()).isCloseTo(PI.multiply(BigDecimal.valueOf(36), MC).doubleValue(), within(1e-12));
        assertThat(s0.areaMm2()).isCloseTo(113.097, within(0.0005));
        assertThat(s0.formula()).startsWith("S0 = π·a·(D − a) = 113.097 mm²");
    }

    @Test
    void tubeWallOfHalfTheDiameterOrMoreIsRefused() {
        // a ≥ D/2 is no tube: π·a·(D − a) would describe a solid or impossible section [CP]
        assertThatThrownBy(() -> CrossSection.measured(SpecimenShape.TUBE, CrossSection.Stage.ORIGINAL,
                readings("a", new double[] {10.0}, "D", new double[] {20.0})))
                .isInstanceOf(GeometryRefused.class)
                .hasMessageContaining("must be less than half the outer diameter D")
                .satisfies(e -> assertThat(((GeometryRefused) e).symbol()).isEqualTo("a"));
    }

    @Test
    void negativeReadingIsRefusedNamingItsIndex() {
        assertThatThrownBy(() -> CrossSection.measured(SpecimenShape.ROUND, CrossSection.Stage.ORIGINAL,
                readings("d", new double[] {10.0, -10.0})))
                .isInstanceOf(GeometryRefused.class)
                .hasMessageContaining("reading 1 of d must be a finite positive number")
                .satisfies(e -> {
                    assertThat(((GeometryRefused) e).symbol()).isEqualTo("d");
                    assertThat(((GeometryRefused) e).index()).isEqualTo(1);
                });
        assertThatThrownBy(() -> CrossSection.measured(SpecimenShape.ROUND, CrossSection.Stage.ORIGINAL,
                readings("d", new double[] {Double.NaN})))
                .isInstanceOf(GeometryRefused.class);
        assertThatThrownBy(() -> CrossSection.measured(SpecimenShape.ROUND, CrossSection.Stage.ORIGINAL,
                readings("d", new double[] {Double.POSITIVE_INFINITY})))
                .isInstanceOf(GeometryRefused.class);
    }

    @Test
    void missingOrForeignDimensionIsRefused() {
        assertThatThrownBy(() -> CrossSection.measured(SpecimenShape.FLAT, CrossSection.Stage.ORIGINAL,
                readings("a", new double[] {3.0})))
                .isInstanceOf(GeometryRefused.class).hasMessageContaining("at least one reading of b");
        assertThatThrownBy(() -> CrossSection.measured(SpecimenShape.ROUND, CrossSection.Stage.ORIGINAL,
                readings("d", new double[] {10.0}, "a", new double[] {3.0})))
                .isInstanceOf(GeometryRefused.class).hasMessageContaining("has no dimension a");
    }

    @Test
    void areaTooLargeForADoubleIsRefused() {
        assertThatThrownBy(() -> CrossSection.measured(SpecimenShape.FLAT, CrossSection.Stage.ORIGINAL,
                readings("a", new double[] {1e200}, "b", new double[] {1e200})))
                .isInstanceOf(GeometryRefused.class).hasMessageContaining("finite positive area");
    }

    @Test
    void afterFractureUsesTheSuffixedSymbols() {
        // Su from du like S0 from d [S: ISO 6892-1 symbols du, Su]
        CrossSection su = CrossSection.measured(SpecimenShape.ROUND, CrossSection.Stage.AFTER_FRACTURE,
                readings("du", new double[] {6.0, 6.2}));
        assertThat(su.areaMm2()).isCloseTo(roundOracle(6.1), within(1e-12));
        assertThat(su.formula()).startsWith("Su = π·du²/4 = ");
        assertThat(SpecimenShape.TUBE.dimensions(CrossSection.Stage.AFTER_FRACTURE)).containsExactly("au", "Du");
    }

    @Test
    void givenAreaNeedsItsMethod() {
        CrossSection s0 = CrossSection.given(CrossSection.Stage.ORIGINAL, 20.25, "mass, length and density");
        assertThat(s0.areaMm2()).isEqualTo(20.25);
        assertThat(s0.formula()).isEqualTo("S0 = 20.25 mm² as given, determined by: mass, length and density");
        assertThatThrownBy(() -> CrossSection.given(CrossSection.Stage.ORIGINAL, 20.25, " "))
                .isInstanceOf(GeometryRefused.class).hasMessageContaining("needs the method");
        assertThatThrownBy(() -> CrossSection.given(CrossSection.Stage.ORIGINAL, 0, "x"))
                .isInstanceOf(GeometryRefused.class);
    }

    @Test
    void storedDecimalGivesBackTheIdenticalDouble() {
        // why doubles may be stored as BigDecimal.valueOf(double): the decimal round-trips bit for bit
        double s0 = CrossSection.measured(SpecimenShape.ROUND, CrossSection.Stage.ORIGINAL,
                readings("d", new double[] {10.00, 10.01, 10.00})).areaMm2();
        assertThat(new BigDecimal(BigDecimal.valueOf(s0).toPlainString()).doubleValue()).isEqualTo(s0);
    }
}
