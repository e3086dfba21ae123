package org.specimenledger.testing;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.math.BigDecimal;
import java.util.List;
import org.apache.commons.math3.stat.descriptive.DescriptiveStatistics;
import org.junit.jupiter.api.Test;
import tools.jackson.databind.JsonNode;

/**
 * u(S0) from the specimen's own readings (GUM JCGM 100:2008 4.2.3 type A, F.2.2.1 resolution as type B [S]),
 * checked against Apache Commons Math's sample standard deviation, and carried into U(Rm) on a real analysis.
 */
class CrossSectionUncertaintyTest extends TestRunTesting {

    private static List<BigDecimal> mm(String... values) {
        return java.util.Arrays.stream(values).map(BigDecimal::new).toList();
    }

    @Test
    void typeAIsTheStandardDeviationOfTheMeanAndTypeBTheResolutionOverTwoRootThree() {
        DimensionUncertainty.Estimate e = DimensionUncertainty.of(mm("10.00", "10.01", "10.00", "9.99", "10.02"));
        DescriptiveStatistics oracle = new DescriptiveStatistics(new double[] {10.00, 10.01, 10.00, 9.99, 10.02});
        assertThat(e.meanMm()).isCloseTo(oracle.getMean(), within(1e-12));
        assertThat(e.typeAMm()).isCloseTo(oracle.getStandardDeviation() / Math.sqrt(5), within(1e-12));
        assertThat(e.resolutionMm()).isEqualTo(0.01);
        assertThat(e.typeBMm()).isCloseTo(0.01 / (2 * Math.sqrt(3)), within(1e-15));
        assertThat(e.standardMm()).isCloseTo(Math.hypot(e.typeAMm(), e.typeBMm()), within(1e-15));

        DimensionUncertainty.Estimate single = DimensionUncertainty.of(mm("12.50"));
        assertThat(single.typeAMm()).as("one reading tells nothing of the spread").isZero();
        assertThat(single.standardMm()).isCloseTo(0.01 / (2 * Math.sqrt(3)), within(1e-15));
        assertThat(DimensionUncertainty.of(mm("3.0", "3.05")).resolutionMm()).as("the finest digit written")
                .isEqualTo(0.01);
        assertThat(DimensionUncertainty.of(List.of())).isNull();
    }

    @Test
    void theAnalysisTakesUOfTheDiameterFromTheReadingsAndCarriesItIntoTheUncertaintyOfRm() {
        TestRunFixtures.Bench b = bench(); // round bar, d read 10.00, 10.01, 10.00 mm; 100 kN range class 0.5
        JsonNode a = uploaded(register(b), TestRunFixtures.curve(b)).get("analysis");
        DimensionUncertainty.Estimate d = DimensionUncertainty.of(mm("10.00", "10.01", "10.00"));
        JsonNode p = a.get("parameters");
        assertThat(p.get("uncertainty.crossSection").asString()).isEqualTo("ROUND");
        assertThat(p.get("uncertainty.uFirstDimensionMm").asDouble()).isCloseTo(d.standardMm(), within(1e-15));
        assertThat(p.get("uncertainty.firstDimensionMm").asDouble()).isCloseTo(10.0033333, within(1e-6));

        JsonNode rm = a.get("results").get("properties").get("Rm");
        // GUM combination in quadrature: force class 0.5 as a rectangular half-width [CP], u(S0)/S0 = 2·u(d)/d
        double rel = Math.hypot(0.5 / 100 / Math.sqrt(3), 2 * d.standardMm() / d.meanMm());
        assertThat(rm.get("expandedUncertainty").asDouble()).isCloseTo(2 * rm.get("value").asDouble() * rel,
                within(1e-9));
    }
}
