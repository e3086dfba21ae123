package org.specimenledger.benchmarks;

import java.util.Random;
import org.specimenledger.analysis.TensileSpecimen;

/**
 * Large invented tensile records for {@link AnalysisBenchmark}: explicit closed-form stress(strain)
 * curves sampled uniformly in strain, with fixed-seed noise and a fracture drop at the end.
 */
final class AnalysisBenchmarkCurves {

    static final TensileSpecimen SPECIMEN = new TensileSpecimen(100, 50, 50, null, null);

    private AnalysisBenchmarkCurves() {
    }

    /** Force, extension and time arrays of n points. */
    static double[][] curve(String kind, int n) {
        double[] f = new double[n];
        double[] x = new double[n];
        double[] t = new double[n];
        double eMax = 0.25;
        int drop = 5;
        Random noise = new Random(1);
        for (int i = 0; i < n - drop; i++) {
            double e = eMax * i / (n - drop - 1);
            double stress = "discontinuous".equals(kind) ? discontinuous(e) : continuous(e);
            f[i] = stress * SPECIMEN.s0Mm2() + 10 * noise.nextGaussian();
            x[i] = e * SPECIMEN.leMm() + 0.0001 * noise.nextGaussian();
            t[i] = e / 0.00025;
        }
        for (int k = 0; k < drop; k++) {
            int i = n - drop + k;
            f[i] = f[n - drop - 1] * (1 - 0.99 * (k + 1) / drop);
            x[i] = x[n - drop - 1];
            t[i] = t[n - drop - 1] + (k + 1) * 1e-4;
        }
        return new double[][] {f, x, t};
    }

    /** Elastic to 380 MPa, drop to 340, plateau 355 ± 1.5, hardening from 2 % strain, necking after 15 %. */
    private static double discontinuous(double e) {
        double modulus = 205_000;
        double eH = 380 / modulus;
        double eDrop = eH + 0.0001;
        double e1 = eDrop + 0.0008;
        double eL = e1 + 0.016;
        if (e <= eH) {
            return modulus * e;
        }
        if (e <= eDrop) {
            return 380 - 40 * (e - eH) / (eDrop - eH);
        }
        if (e <= e1) {
            return 340 + 15 * 0.5 * (1 - Math.cos(Math.PI * (e - eDrop) / (e1 - eDrop)));
        }
        if (e <= eL) {
            return 355 + 1.5 * Math.sin(2 * Math.PI * (e - e1) / 0.002);
        }
        return 355 + 150 * (1 - Math.exp(-(e - eL) / 0.05)) - 2000 * Math.pow(Math.max(0, e - 0.15), 2);
    }

    /** Smooth elastic–plastic curve (no strictly linear part; for timing only), maximum near 20 % strain. */
    private static double continuous(double e) {
        double hardening = 520 * Math.tanh(200_000 * e / 520) + 900 * e;
        return hardening - 22_500 * Math.pow(Math.max(0, e - 0.18), 2);
    }
}
