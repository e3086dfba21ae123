package org.specimenledger.analysis;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.Random;
import org.apache.commons.math3.analysis.integration.SimpsonIntegrator;
import org.apache.commons.math3.analysis.interpolation.SplineInterpolator;
import org.apache.commons.math3.analysis.polynomials.PolynomialFunction;
import org.apache.commons.math3.analysis.polynomials.PolynomialSplineFunction;
import org.junit.jupiter.api.Test;

/**
 * Loading–unloading cycles with polynomial branches whose areas are known in closed form [CP: exact
 * integrals of polynomials; DOMAIN.md "Energy" for the definitions]: loading F = a·x + b·x² from 0
 * to X, unloading F = c·x³ back to 0 with c = F(X)/X³. Loading energy aX²/2 + bX³/3, returned cX⁴/4.
 * Oracles: the closed form; Apache Commons Math {@code SimpsonIntegrator} (exact for cubics) and the
 * exact integral of a {@code SplineInterpolator} spline through the samples [reference library].
 */
class CyclicAnalysisTest {

    private static final double A = 20;
    private static final double B = 5;
    private static final int STEPS = 2000;

    private static double peakForce(double x) {
        return A * x + B * x * x;
    }

    /** Two cycles, to 10 mm and to 15 mm, each branch in STEPS equal extension steps. */
    private static double[][] twoCycles() {
        double[] peaks = {10, 15};
        int n = 1 + peaks.length * 2 * STEPS;
        double[] f = new double[n];
        double[] x = new double[n];
        int i = 1;
        for (double peak : peaks) {
            double c = peakForce(peak) / (peak * peak * peak);
            for (int k = 1; k <= STEPS; k++, i++) {
                x[i] = peak * k / STEPS;
                f[i] = peakForce(x[i]);
            }
            for (int k = STEPS - 1; k >= 0; k--, i++) {
                x[i] = peak * k / STEPS;
                f[i] = c * x[i] * x[i] * x[i];
            }
        }
        return new double[][] {f, x};
    }

    @Test
    void energiesMatchClosedFormAndExactTrapezoidError() {
        double[][] r = twoCycles();
        CyclicResult result = CyclicAnalysis.analyse(r[0], r[1], CyclicParameters.defaults());

        assertThat(result.cycles()).hasSize(2);
        double[] peaks = {10, 15};
        for (int k = 0; k < 2; k++) {
            LoadingCycle cycle = result.cycles().get(k);
            double xm = peaks[k];
            double c = peakForce(xm) / (xm * xm * xm);
            double h = xm / STEPS;
            double load = A * xm * xm / 2 + B * xm * xm * xm / 3;
            double ret = c * Math.pow(xm, 4) / 4;
            // Euler–Maclaurin: for a polynomial of degree ≤ 3 the composite trapezoidal rule exceeds
            // the integral by exactly h²/12·(F'(end) − F'(start)); what remains is rounding (1e-12).
            double loadTrapezoid = load + h * h / 12 * ((A + 2 * B * xm) - A);
            double retTrapezoid = ret + h * h / 12 * (3 * c * xm * xm);
            assertThat(cycle.loadingEnergyJ()).isCloseTo(loadTrapezoid / 1000, within(load / 1000 * 1e-12));
            assertThat(cycle.returnedEnergyJ()).isCloseTo(retTrapezoid / 1000, within(ret / 1000 * 1e-12));
            // Against the closed form itself the trapezoid error bound is h²/12·|ΔF'| (< 1e-6 relative).
            assertThat(cycle.loadingEnergyJ()).isCloseTo(load / 1000, within(load / 1000 * 1e-6));
            assertThat(cycle.hysteresisEnergyJ()).isCloseTo((load - ret) / 1000, within(load / 1000 * 2e-6));
            assertThat(cycle.lossRatioPercent()).isCloseTo(100 * (load - ret) / load, within(1e-4));
            // Residual extension where c·x³ = 1 % of F(X): x = X·0.01^(1/3); chord error between samples
            // spaced h is below 3·c·x·h²/(8·3c·x²)·… ≈ 1e-6 mm — bound 1e-5 mm.
            assertThat(cycle.residualExtensionMm()).isCloseTo(xm * Math.cbrt(0.01), within(1e-5));
            assertThat(cycle.residualAtZeroForce()).isTrue();
            assertThat(cycle.peakForceN()).isEqualTo(peakForce(xm));
        }
        // Cycle 1 worked numbers: 2.6667 J in, 1.75 J back, 34.375 % lost.
        assertThat(result.cycles().get(0).lossRatioPercent()).isCloseTo(34.375, within(1e-4));
    }

    @Test
    void closedFormAgreesWithCommonsMathIntegrators() {
        double xm = 10;
        double c = peakForce(xm) / (xm * xm * xm);
        SimpsonIntegrator simpson = new SimpsonIntegrator();
        double load = simpson.integrate(1000, x -> A * x + B * x * x, 0, xm);
        double ret = simpson.integrate(1000, x -> c * x * x * x, 0, xm);
        assertThat(load).isCloseTo(A * xm * xm / 2 + B * xm * xm * xm / 3, within(1e-9));
        assertThat(ret).isCloseTo(c * Math.pow(xm, 4) / 4, within(1e-9));

        // An interpolating spline through the engine's own samples, integrated exactly piece by piece,
        // must agree with the engine's trapezoid sum within the trapezoid error (h²/12·ΔF' ≈ 2e-4 N·mm)
        // plus the spline's end effects; bound 1e-6 relative.
        double[][] r = twoCycles();
        LoadingCycle first = CyclicAnalysis.analyse(r[0], r[1], CyclicParameters.defaults()).cycles().get(0);
        double[] xs = java.util.Arrays.copyOfRange(r[1], 0, STEPS + 1);
        double[] fs = java.util.Arrays.copyOfRange(r[0], 0, STEPS + 1);
        assertThat(first.loadingEnergyJ() * 1000).isCloseTo(splineArea(xs, fs), within(load * 1e-6));
    }

    private static double splineArea(double[] x, double[] y) {
        PolynomialSplineFunction s = new SplineInterpolator().interpolate(x, y);
        double[] knots = s.getKnots();
        double sum = 0;
        PolynomialFunction[] pieces = s.getPolynomials();
        for (int i = 0; i < pieces.length; i++) {
            // Each piece is expressed in (x − knot[i]).
            PolynomialFunction anti = new PolynomialFunction(antiderivative(pieces[i].getCoefficients()));
            sum += anti.value(knots[i + 1] - knots[i]);
        }
        return sum;
    }

    private static double[] antiderivative(double[] c) {
        double[] a = new double[c.length + 1];
        for (int i = 0; i < c.length; i++) {
            a[i + 1] = c[i] / (i + 1);
        }
        return a;
    }

    @Test
    void noiseDoesNotCreateFalseTurningPoints() {
        // Extension noise 0.01 mm against a hysteresis of 2 % × 15 mm = 0.3 mm.
        double[][] r = twoCycles();
        Random random = new Random(5);
        double[] x = r[1].clone();
        for (int i = 0; i < x.length; i++) {
            x[i] += 0.01 * random.nextGaussian();
        }
        CyclicResult result = CyclicAnalysis.analyse(r[0], x, CyclicParameters.defaults());
        assertThat(result.cycles()).hasSize(2);
        assertThat(result.turningPoints()).hasSize(5);
        assertThat(result.cycles().get(1).peakIndex()).isBetween(3 * STEPS - 20, 3 * STEPS + 20);
    }

    @Test
    void recordEndingWhileLoadingWarnsOfIncompleteCycle() {
        double[][] r = twoCycles();
        int n = 3 * STEPS - 100;
        CyclicResult result = CyclicAnalysis.analyse(java.util.Arrays.copyOf(r[0], n), java.util.Arrays.copyOf(r[1], n),
                CyclicParameters.defaults());
        assertThat(result.cycles()).hasSize(1);
        assertThat(result.warnings()).extracting(AnalysisWarning::code).containsExactly("INCOMPLETE_LAST_CYCLE");
    }

    @Test
    void rejectsConstantExtensionAndNaN() {
        assertThatThrownBy(() -> CyclicAnalysis.analyse(new double[20], new double[20], CyclicParameters.defaults()))
                .isInstanceOf(AnalysisRejected.class).hasMessageStartingWith("extension does not vary");
        double[] f = new double[20];
        f[3] = Double.NaN;
        assertThatThrownBy(() -> CyclicAnalysis.analyse(f, new double[20], CyclicParameters.defaults()))
                .hasMessage("forceN[3] is NaN; every force must be finite");
    }

    @Test
    void parametersRoundTrip() {
        CyclicParameters p = new CyclicParameters(3, 0.5, 20);
        assertThat(CyclicParameters.fromMap(p.asMap())).isEqualTo(p);
    }
}
