package org.specimenledger.analysis;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.apache.commons.math3.analysis.UnivariateFunction;
import org.apache.commons.math3.analysis.differentiation.DerivativeStructure;
import org.apache.commons.math3.analysis.differentiation.FiniteDifferencesDifferentiator;
import org.apache.commons.math3.analysis.differentiation.UnivariateDifferentiableFunction;
import org.junit.jupiter.api.Test;

/**
 * Expanded uncertainty (k = 2) by the GUM combination in quadrature [S: GUM; DOMAIN.md
 * "Uncertainty"], recomputed here by hand; sensitivity coefficients of the S0 formula checked against
 * Apache Commons Math numerical differentiation [reference library].
 */
class StrengthUncertaintyTest {

    private final AnalysisCurves.Curve curve = AnalysisCurves.hollomon(800, 0.2, 200_000, 0.0005, 0.35, 20_000);

    @Test
    void tensileStrengthBudgetForRoundBar() {
        // Force class 1 → u = 1 %/√3 (rectangular [CP]); round bar d = 11.284 mm, u(d) = 0.01 mm →
        // u(S0)/S0 = 2·u(d)/d. U = 2·Rm·√(uF² + uS²).
        UncertaintyInputs u = UncertaintyInputs.defaults().withCrossSection(CrossSectionShape.ROUND, 11.284, 0.01, 0, 0);
        TensileResult r = curve.analyse(TensileParameters.defaults().withUncertainty(u));
        double rm = r.property("Rm").value();
        double uF = 0.01 / Math.sqrt(3);
        double uS = 2 * 0.01 / 11.284;
        assertThat(r.property("Rm").expandedUncertainty()).isCloseTo(2 * rm * Math.sqrt(uF * uF + uS * uS), within(1e-12));
        // About 1.2 % of Rm, in line with the typical 2 % quoted for Rm [M, DOMAIN.md].
        assertThat(r.property("Rm").expandedUncertainty() / rm).isBetween(0.01, 0.02);
        assertThat(r.hasWarning("S0_UNCERTAINTY_NOT_GIVEN")).isFalse();
    }

    @Test
    void tubeSensitivityCoefficientsMatchNumericalDerivatives() {
        double a = 2.0;
        double d = 30.0;
        double ua = 0.01;
        double ud = 0.02;
        FiniteDifferencesDifferentiator diff = new FiniteDifferencesDifferentiator(5, 1e-4);
        UnivariateDifferentiableFunction byWall = diff.differentiate((UnivariateFunction) x -> Math.PI * x * (d - x));
        UnivariateDifferentiableFunction byDiameter = diff.differentiate((UnivariateFunction) x -> Math.PI * a * (x - a));
        double ca = byWall.value(new DerivativeStructure(1, 1, 0, a)).getPartialDerivative(1);
        double cd = byDiameter.value(new DerivativeStructure(1, 1, 0, d)).getPartialDerivative(1);
        double s0 = Math.PI * a * (d - a);
        double expected = Math.hypot(ca * ua, cd * ud) / s0;

        UncertaintyInputs u = UncertaintyInputs.defaults().withCrossSection(CrossSectionShape.TUBE, a, ua, d, ud);
        assertThat(u.relativeS0Uncertainty(s0)).isCloseTo(expected, within(1e-9));
    }

    @Test
    void proofStrengthAddsExtensometerTermThroughLocalSlope() {
        TensileParameters p = TensileParameters.defaults();
        TensileResult r = curve.analyse(p);
        PropertyResult rp = r.property("Rp0.2");
        double e = (Double) rp.evidence().get("intersectionStrainPercent") / 100;
        double k = (Double) rp.evidence().get("localSlopeMPa");
        // Class 1: bias limit max(1 % of e·Le, 3 µm) over Le = 50 mm, rectangular.
        double uStrain = Math.max(0.01 * e, 0.003 / 50) / Math.sqrt(3);
        double uForce = rp.value() * 0.01 / Math.sqrt(3);
        assertThat(rp.expandedUncertainty()).isCloseTo(2 * Math.hypot(uForce, k * uStrain), within(1e-9));
        // Local slope at Rp0.2 of Hollomon: dR/de is far below E and positive.
        assertThat(k).isBetween(1_000.0, 50_000.0);
    }
}
