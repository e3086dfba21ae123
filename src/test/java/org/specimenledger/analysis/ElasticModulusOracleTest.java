package org.specimenledger.analysis;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.apache.commons.math3.stat.regression.SimpleRegression;
import org.junit.jupiter.api.Test;

/**
 * The modulus slope against Apache Commons Math {@code SimpleRegression} over the same window
 * [reference library]. Same data, different summation order: relative 1e-9.
 */
class ElasticModulusOracleTest {

    @Test
    void slopeInterceptAndRSquaredMatchSimpleRegression() {
        AnalysisCurves.Curve c = AnalysisCurves.rambergOsgood(200_000, 300, 10, 0.02, 4000).withNoise(3, 20, 0.0002);
        TensileResult r = c.analyse();
        Evidence e = r.property("E").evidence();
        int first = (Integer) e.get("firstIndex");
        int last = (Integer) e.get("lastIndex");

        SimpleRegression oracle = new SimpleRegression(true);
        for (int i = first; i <= last; i++) {
            oracle.addData(c.extension()[i] / c.specimen().leMm(), c.force()[i] / c.specimen().s0Mm2());
        }
        double slope = r.property("E").value();
        assertThat(slope).isCloseTo(oracle.getSlope(), within(Math.abs(oracle.getSlope()) * 1e-9));
        assertThat((Double) e.get("interceptMPa")).isCloseTo(oracle.getIntercept(), within(1e-9 * 300));
        assertThat((Double) e.get("rSquared")).isCloseTo(oracle.getRSquare(), within(1e-9));
        assertThat((Double) e.get("slopeRelativeStandardError"))
                .isCloseTo(oracle.getSlopeStdErr() / oracle.getSlope(), within(1e-9));
        assertThat((Integer) e.get("points")).isEqualTo(last - first + 1);
        assertThat((Boolean) e.get("converged")).isTrue();
        assertThat((String) e.get("reference")).isEqualTo("Rp0.2");
    }

    @Test
    void windowBoundsAreTenToFortyPercentOfProofStrength() {
        TensileResult r = AnalysisCurves.rambergOsgood(200_000, 300, 10, 0.02, 20_000).analyse();
        Evidence e = r.property("E").evidence();
        double rp = r.property("Rp0.2").value();
        assertThat((Double) e.get("lowerStressMPa")).isCloseTo(0.1 * rp, within(1e-9));
        assertThat((Double) e.get("upperStressMPa")).isCloseTo(0.4 * rp, within(1e-9));
        assertThat((Integer) e.get("iterations")).isGreaterThan(1);
    }
}
