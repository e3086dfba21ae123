package org.specimenledger.analysis;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.List;
import org.apache.commons.math3.stat.regression.SimpleRegression;
import org.junit.jupiter.api.Test;

/**
 * ISO 6892-1 method B and ASTM E8/E8M rate checks over given phases. The stress rate is checked against
 * Apache Commons Math's {@code SimpleRegression} slope of F/S0 on time (the reference library); the ranges
 * are those of {@link StrainRates} with their marks (method B elastic: ISO 6892-1:2009 Table 3 [S]; the
 * others [M]).
 */
class ControlRateChecksTest {

    private static final double S0 = 100; // mm²

    /** 0–100 s at 10 Hz; force rising at the given stress rate with a small periodic ripple. */
    private static double[][] record(double stressRateMPaPerS) {
        int n = 1001;
        double[] t = new double[n];
        double[] f = new double[n];
        for (int i = 0; i < n; i++) {
            t[i] = i * 0.1;
            f[i] = stressRateMPaPerS * S0 * t[i] + 3 * Math.sin(i * 0.7);
        }
        return new double[][] {t, f};
    }

    private static List<StrainRateCheck> phases(double elasticStrainRate, double yieldRate, double hardeningRate) {
        return List.of(
                new StrainRateCheck(StrainRatePhase.ELASTIC, PropertyStatus.DETERMINED, elasticStrainRate, 0.00025,
                        0.0002, 0.0003, true, 0, 1000, null),
                Double.isNaN(yieldRate)
                        ? StrainRateCheck.notAvailable(StrainRatePhase.YIELD, PropertyStatus.NOT_APPLICABLE,
                                "no yield range: continuous yielding")
                        : new StrainRateCheck(StrainRatePhase.YIELD, PropertyStatus.DETERMINED, yieldRate, 0.002,
                                0.0016, 0.0024, true, 0, 1000, null),
                new StrainRateCheck(StrainRatePhase.HARDENING, PropertyStatus.DETERMINED, hardeningRate, 0.0067,
                        0.00536, 0.00804, true, 0, 1000, null));
    }

    @Test
    void methodBElasticStressRateIsTheLeastSquaresSlopeAndTheRangeFollowsTheModulus() {
        double[][] r = record(25);
        SimpleRegression oracle = new SimpleRegression();
        for (int i = 0; i < r[0].length; i++) {
            oracle.addData(r[0][i], r[1][i] / S0);
        }
        List<ControlRateCheck> steel = StrainRates.isoMethodB(r[0], r[1], S0, 205_000, null, phases(0.0001, Double.NaN, 0.005));
        assertThat(steel.get(0).measured()).isCloseTo(oracle.getSlope(), within(1e-9));
        assertThat(steel.get(0).rule()).isEqualTo(StrainRates.ISO_B_ELASTIC_HIGH_MODULUS);
        assertThat(steel.get(0).withinRange()).as("25 MPa/s in 6–60 MPa/s").isTrue();

        List<ControlRateCheck> aluminium = StrainRates.isoMethodB(r[0], r[1], S0, 70_000, null, phases(0.0001, Double.NaN, 0.005));
        assertThat(aluminium.get(0).rule()).isEqualTo(StrainRates.ISO_B_ELASTIC_LOW_MODULUS);
        assertThat(aluminium.get(0).withinRange()).as("25 MPa/s above 2–20 MPa/s").isFalse();

        List<ControlRateCheck> unknownE = StrainRates.isoMethodB(r[0], r[1], S0, Double.NaN, null, phases(0.0001, Double.NaN, 0.005));
        assertThat(unknownE.get(0).status()).isEqualTo(PropertyStatus.NOT_DETERMINABLE);
        assertThat(unknownE.get(0).reason()).contains("E was not determined");
    }

    @Test
    void methodBPlasticRangesUseTheMeasuredStrainRates() {
        double[][] r = record(10);
        List<ControlRateCheck> c = StrainRates.isoMethodB(r[0], r[1], S0, 205_000, null, phases(0.0001, 0.003, 0.009));
        assertThat(c.get(1).rule()).isEqualTo(StrainRates.ISO_B_YIELD);
        assertThat(c.get(1).withinRange()).as("0.003 s⁻¹ above 0.00025–0.0025 s⁻¹ [M]").isFalse();
        assertThat(c.get(2).withinRange()).as("0.009 s⁻¹ above 0.008 s⁻¹ [M]").isFalse();
        List<ControlRateCheck> ok = StrainRates.isoMethodB(r[0], r[1], S0, 205_000, null, phases(0.0001, 0.001, 0.006));
        assertThat(ok).allMatch(k -> Boolean.TRUE.equals(k.withinRange()));
        List<ControlRateCheck> continuous = StrainRates.isoMethodB(r[0], r[1], S0, 205_000, null,
                phases(0.0001, Double.NaN, 0.006));
        assertThat(continuous.get(1).status()).isEqualTo(PropertyStatus.NOT_APPLICABLE);
    }

    @Test
    void astmChecksRateOfStressingAndOfStrainingUpToYieldAndTheRateForTensileStrength() {
        double[][] r = record(25); // 25 MPa/s: above 1.15–11.5 MPa/s [M]
        List<ControlRateCheck> c = StrainRates.astmE8(r[0], r[1], S0, null, phases(0.00025, Double.NaN, 0.004));
        assertThat(c.get(0).withinRange()).isFalse();
        // 0.015 ± 0.006 min⁻¹ = 0.00015–0.00035 s⁻¹ [M]; 0.00025 s⁻¹ is inside
        assertThat(c.get(1).rule().lower()).isCloseTo(0.00015, within(1e-15));
        assertThat(c.get(1).rule().upper()).isCloseTo(0.00035, within(1e-15));
        assertThat(c.get(1).withinRange()).isTrue();
        // 0.05–0.5 min⁻¹ = 0.000833–0.00833 s⁻¹ [M]
        assertThat(c.get(2).withinRange()).isTrue();
        assertThat(StrainRates.astmE8(r[0], r[1], S0, null, phases(0.00025, Double.NaN, 0.01)).get(2).withinRange()).isFalse();
    }

    @Test
    void withoutATimeChannelNothingIsDeterminable() {
        double[][] r = record(10);
        List<ControlRateCheck> c = StrainRates.isoMethodB(null, r[1], S0, 205_000, null, List.of(
                StrainRateCheck.notAvailable(StrainRatePhase.ELASTIC, PropertyStatus.NOT_DETERMINABLE, "no time channel in the record"),
                StrainRateCheck.notAvailable(StrainRatePhase.YIELD, PropertyStatus.NOT_DETERMINABLE, "no time channel in the record"),
                StrainRateCheck.notAvailable(StrainRatePhase.HARDENING, PropertyStatus.NOT_DETERMINABLE, "no time channel in the record")));
        assertThat(c).allMatch(k -> k.status() == PropertyStatus.NOT_DETERMINABLE && k.withinRange() == null);
    }
}
