package org.specimenledger.analysis;

import java.util.Random;
import java.util.function.DoubleUnaryOperator;

/**
 * Synthetic tensile records from closed-form material models, for tests. Each curve is sampled on a
 * uniform extension grid (a machine sampling at constant time steps under constant strain rate), with
 * a time channel at a chosen strain rate, an optional fixed-seed noise, and a sudden fracture drop.
 */
final class AnalysisCurves {

    /** A record plus the test piece it came from. */
    record Curve(double[] force, double[] extension, double[] time, TensileSpecimen specimen) {
        TensileResult analyse(TensileParameters p) {
            return TensileAnalysis.analyse(force, extension, time, specimen, p);
        }

        TensileResult analyse() {
            return analyse(TensileParameters.defaults());
        }

        Curve withNoise(long seed, double forceSigmaN, double extensionSigmaMm) {
            Random r = new Random(seed);
            double[] f = force.clone();
            double[] x = extension.clone();
            for (int i = 0; i < f.length; i++) {
                f[i] += forceSigmaN * r.nextGaussian();
                x[i] += extensionSigmaMm * r.nextGaussian();
            }
            return new Curve(f, x, time, specimen);
        }

        Curve withoutTime() {
            return new Curve(force, extension, null, specimen);
        }
    }

    /** Flat test piece 10 mm × 10 mm (S0 = 100 mm²), Le = L0 = 50 mm. */
    static final TensileSpecimen FLAT_100 = new TensileSpecimen(100, 50, 50, null, null);

    private AnalysisCurves() {
    }

    /**
     * Samples stress(e) at {@code points} uniform strains from 0 to eMax, then appends a fracture:
     * {@code dropPoints} points falling linearly to 1 % of the last force at nearly constant extension.
     */
    static Curve sampled(DoubleUnaryOperator stressOfStrain, double eMax, int points, int dropPoints,
            TensileSpecimen s, double strainRatePerS) {
        int n = points + dropPoints;
        double[] f = new double[n];
        double[] x = new double[n];
        double[] t = new double[n];
        double de = eMax / (points - 1);
        for (int i = 0; i < points; i++) {
            double e = i * de;
            f[i] = stressOfStrain.applyAsDouble(e) * s.s0Mm2();
            x[i] = e * s.leMm();
            t[i] = e / strainRatePerS;
        }
        double fLast = f[points - 1];
        for (int k = 1; k <= dropPoints; k++) {
            int i = points - 1 + k;
            f[i] = fLast * (1 - 0.99 * k / dropPoints);
            x[i] = x[points - 1] + k * de * s.leMm() * 0.01;
            t[i] = t[points - 1] + k * 1e-3;
        }
        return new Curve(f, x, t, s);
    }

    /**
     * Ramberg–Osgood ε = σ/E + 0.002·(σ/σ0.2)^n [Ramberg & Osgood 1943, NACA TN 902], inverted by
     * bisection on a uniform strain grid to eMax, then fracture.
     */
    static Curve rambergOsgood(double e, double sigma02, double n, double eMax, int points) {
        DoubleUnaryOperator strainOf = sigma -> sigma / e + 0.002 * Math.pow(sigma / sigma02, n);
        return sampled(strain -> invert(strainOf, strain, 0, 10 * sigma02), eMax, points, 5, FLAT_100, 0.00025);
    }

    /**
     * Hollomon hardening σ_true = K·ε_p^n after an elastic line [Hollomon 1945], written in engineering
     * terms with constant volume: R = K·max(ε_p, εa)^n·exp(−ε_p), e = exp(ε_p) − 1 + R/E. The plastic
     * part starts at true stress K·εa^n (a short step at constant true stress up to ε_p = εa), so the
     * window for the modulus is purely elastic. Considère: dF = 0 at ε_p = n, so Rm = K·nⁿ·e⁻ⁿ and the
     * plastic engineering strain at Fm is eⁿ − 1 exactly.
     */
    static Curve hollomon(double k, double n, double modulus, double epsA, double eMax, int points) {
        double sigmaA = k * Math.pow(epsA, n);
        double uElastic = sigmaA / modulus;
        DoubleUnaryOperator stressOfU = u -> {
            if (u <= uElastic) {
                return modulus * u;
            }
            double ep = u - uElastic;
            return k * Math.pow(Math.max(ep, epsA), n) * Math.exp(-ep);
        };
        DoubleUnaryOperator strainOfU = u -> u <= uElastic ? u
                : Math.expm1(u - uElastic) + stressOfU.applyAsDouble(u) / modulus;
        return sampled(strain -> stressOfU.applyAsDouble(invert(strainOfU, strain, 0, 1)), eMax, points, 5, FLAT_100,
                0.0067);
    }

    /**
     * Prescribed discontinuous yielding: elastic line to ReH, a linear drop over 0.01 % strain to a
     * transient dip, a half-cosine recovery over 0.08 % strain to a Lüders plateau P + a·sin(2π(e − e1)/λ)
     * ending at eL (where the sine is zero and rising), then hardening P + A·(1 − exp(−(e − eL)/c)) to
     * eMax, then fracture.
     */
    static Curve discontinuous(double modulus, double reh, double dip, double plateau, double amplitude,
            double wavelength, double eL, double a, double c, double eMax, int points) {
        double eH = reh / modulus;
        double eDrop = eH + 0.0001;
        double e1 = eDrop + 0.0008;
        DoubleUnaryOperator stress = e -> {
            if (e <= eH) {
                return modulus * e;
            }
            if (e <= eDrop) {
                return reh + (dip - reh) * (e - eH) / (eDrop - eH);
            }
            if (e <= e1) {
                return dip + (plateau - dip) * 0.5 * (1 - Math.cos(Math.PI * (e - eDrop) / (e1 - eDrop)));
            }
            if (e <= eL) {
                return plateau + amplitude * Math.sin(2 * Math.PI * (e - e1) / wavelength);
            }
            return plateau + a * (1 - Math.exp(-(e - eL) / c)) - 2000 * Math.pow(Math.max(0, e - 0.15), 2);
        };
        return sampled(stress, eMax, points, 5, FLAT_100, 0.00025);
    }

    /** Linear elastic to fracture at eF (brittle): R = E·e, then a sudden drop. */
    static Curve linear(double modulus, double eF, int points) {
        return sampled(e -> modulus * e, eF, points, 3, FLAT_100, 0.00025);
    }

    /** Inverts an increasing function by bisection to full double precision. */
    static double invert(DoubleUnaryOperator f, double y, double lo, double hi) {
        for (int i = 0; i < 200; i++) {
            double mid = 0.5 * (lo + hi);
            if (mid == lo || mid == hi) {
                break;
            }
            if (f.applyAsDouble(mid) < y) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        return 0.5 * (lo + hi);
    }
}
