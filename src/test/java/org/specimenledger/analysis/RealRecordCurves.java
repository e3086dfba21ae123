package org.specimenledger.analysis;

import java.util.Arrays;
import java.util.function.DoubleUnaryOperator;

/**
 * Synthetic records shaped like real machine records, each from a closed form: a quadratic toe in front
 * of a Ramberg–Osgood curve, a crosshead channel through a linear spring in series, an extensometer that
 * stops or freezes, and an elastic unload–reload loop.
 */
final class RealRecordCurves {

    private RealRecordCurves() {
    }

    /**
     * Ramberg–Osgood ε = σ/E + 0.002·(σ/σ0.2)^n [Ramberg & Osgood 1943, NACA TN 902] with a quadratic toe
     * of shift a in front: below σ = E·a the recorded strain is 2·√(a·σ/E) (a parabola σ = E·x²/(4a) that
     * meets the elastic line σ = E·(x − a) tangentially at x = 2a), above it the Ramberg–Osgood strain plus
     * a. The elastic line therefore meets zero force at exactly x = a. Sampled uniformly in strain up to
     * eMax + a, then the fracture drop of {@link AnalysisCurves#sampled}.
     */
    static AnalysisCurves.Curve rambergOsgoodWithToe(double e, double sigma02, double n, double a, double eMax,
            int points) {
        DoubleUnaryOperator strainOf = toeStrain(e, sigma02, n, a);
        return AnalysisCurves.sampled(x -> AnalysisCurves.invert(strainOf, x, 0, 10 * sigma02), eMax + a, points, 5,
                AnalysisCurves.FLAT_100, 0.00025);
    }

    static DoubleUnaryOperator toeStrain(double e, double sigma02, double n, double a) {
        return sigma -> {
            double plastic = 0.002 * Math.pow(sigma / sigma02, n);
            return sigma < e * a ? 2 * Math.sqrt(a * sigma / e) + plastic : sigma / e + a + plastic;
        };
    }

    /** Crosshead = specimen extension + C·F + offset: a machine as a linear spring in series [CP, textbook]. */
    static double[] crosshead(AnalysisCurves.Curve c, double complianceMmPerN, double offsetMm) {
        double[] x = new double[c.force().length];
        for (int i = 0; i < x.length; i++) {
            x[i] = c.extension()[i] + complianceMmPerN * c.force()[i] + offsetMm;
        }
        return x;
    }

    /** The extensometer values after the first point beyond the strain given, replaced by NaN (removed). */
    static double[] removedAfter(AnalysisCurves.Curve c, double strain) {
        double[] x = c.extension().clone();
        int k = firstBeyond(c, strain);
        Arrays.fill(x, k, x.length, Double.NaN);
        return x;
    }

    /** The extensometer reading held at its last value after the given strain (frozen). */
    static double[] frozenAfter(AnalysisCurves.Curve c, double strain) {
        double[] x = c.extension().clone();
        int k = firstBeyond(c, strain);
        Arrays.fill(x, k, x.length, x[k - 1]);
        return x;
    }

    static int firstBeyond(AnalysisCurves.Curve c, double strain) {
        double limit = strain * c.specimen().leMm();
        for (int i = 0; i < c.extension().length; i++) {
            if (c.extension()[i] > limit) {
                return i;
            }
        }
        throw new IllegalArgumentException("the record never passes " + strain);
    }

    /**
     * Ramberg–Osgood with a toe (as above), and one elastic unload–reload loop at stress σu: unloading along
     * a line of slope E to σmin, reloading along the same line back to σu, then the curve continues. Steps
     * of the same strain increment as the loading part; time advances uniformly throughout.
     */
    static AnalysisCurves.Curve rambergOsgoodWithLoop(double e, double sigma02, double n, double a, double sigmaU,
            double sigmaMin, double eMax, int points) {
        DoubleUnaryOperator strainOf = toeStrain(e, sigma02, n, a);
        double eU = strainOf.applyAsDouble(sigmaU);
        double de = (eMax + a) / (points - 1);
        int before = (int) Math.floor(eU / de) + 1;
        int branch = (int) Math.ceil((sigmaU - sigmaMin) / e / de);
        int after = points - before;
        int n2 = before + 1 + 2 * branch + after + 5;
        double[] f = new double[n2];
        double[] x = new double[n2];
        double s0 = AnalysisCurves.FLAT_100.s0Mm2();
        double le = AnalysisCurves.FLAT_100.leMm();
        int j = 0;
        for (int i = 0; i < before; i++, j++) {
            double strain = i * de;
            f[j] = AnalysisCurves.invert(strainOf, strain, 0, 10 * sigma02) * s0;
            x[j] = strain * le;
        }
        f[j] = sigmaU * s0;
        x[j] = eU * le;
        j++;
        double drop = sigmaU - sigmaMin;
        for (int k = 1; k <= branch; k++, j++) {
            double stress = sigmaU - drop * k / branch;
            f[j] = stress * s0;
            x[j] = (eU - (sigmaU - stress) / e) * le;
        }
        for (int k = branch - 1; k >= 0; k--, j++) {
            double stress = sigmaU - drop * k / branch;
            f[j] = stress * s0;
            x[j] = (eU - (sigmaU - stress) / e) * le;
        }
        for (int i = before; i < points; i++, j++) {
            double strain = i * de;
            f[j] = AnalysisCurves.invert(strainOf, strain, 0, 10 * sigma02) * s0;
            x[j] = strain * le;
        }
        double fLast = f[j - 1];
        double xLast = x[j - 1];
        for (int k = 1; k <= 5; k++, j++) {
            f[j] = fLast * (1 - 0.99 * k / 5);
            x[j] = xLast + k * de * le * 0.01;
        }
        double[] t = new double[n2];
        for (int i = 0; i < n2; i++) {
            t[i] = i * de / 0.00025;
        }
        return new AnalysisCurves.Curve(f, x, t, AnalysisCurves.FLAT_100);
    }
}
