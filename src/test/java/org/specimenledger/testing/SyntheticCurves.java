package org.specimenledger.testing;

import java.nio.charset.StandardCharsets;
import java.util.Locale;

/**
 * Curve files in the service's input format, generated from closed-form material models so that the
 * expected properties are known exactly. Every number here is a model parameter, not a measurement.
 */
public final class SyntheticCurves {

    private SyntheticCurves() {
    }

    /**
     * Ramberg–Osgood ε = σ/E + 0.002·(σ/σ0.2)^n (Ramberg &amp; Osgood 1943, NACA TN 902) up to maxStrain,
     * then a sudden fracture; force in kN, extension in mm over {@code leMm}, time in s at a constant strain
     * rate.
     */
    public static byte[] rambergOsgood(double eMPa, double sigma02, double n, double s0Mm2, double leMm,
            double maxStrain, int points) {
        StringBuilder csv = new StringBuilder("# source: synthetic Ramberg-Osgood model for tests\n");
        csv.append("time [s],force [kN],extension [mm]\n");
        double ratePerS = 0.00025;
        for (int i = 0; i < points; i++) {
            double strain = maxStrain * i / (points - 1);
            double stress = stressAt(strain, eMPa, sigma02, n);
            csv.append(String.format(Locale.ROOT, "%.6f,%.9f,%.9f%n", strain / ratePerS, stress * s0Mm2 / 1000.0,
                    strain * leMm));
        }
        // fracture: the force falls away within two samples
        double last = maxStrain * leMm;
        csv.append(String.format(Locale.ROOT, "%.6f,%.9f,%.9f%n", maxStrain / ratePerS + 1, 0.02 * sigma02 * s0Mm2
                / 1000.0, last + 0.001));
        csv.append(String.format(Locale.ROOT, "%.6f,%.9f,%.9f%n", maxStrain / ratePerS + 2, 0.0, last + 0.002));
        return csv.toString().getBytes(StandardCharsets.UTF_8);
    }

    /**
     * The Ramberg–Osgood record of {@link #rambergOsgood} with a crosshead channel beside the extensometer:
     * crosshead = extension + C·F + 20 mm (the machine as a linear spring in series, textbook model), and the
     * extension cells left empty from the first point beyond {@code removedAtStrain} on (the extensometer
     * taken off).
     */
    public static byte[] rambergOsgoodExtensometerRemoved(double eMPa, double sigma02, double n, double s0Mm2,
            double leMm, double maxStrain, int points, double removedAtStrain, double complianceMmPerN) {
        StringBuilder csv = new StringBuilder("# source: synthetic Ramberg-Osgood model with a crosshead channel\n");
        csv.append("time [s],force [kN],extension [mm],crosshead [mm]\n");
        double ratePerS = 0.00025;
        for (int i = 0; i < points + 2; i++) {
            double strain = i < points ? maxStrain * i / (points - 1) : maxStrain + 0.00002 * (i - points + 1);
            double stress = i < points ? stressAt(strain, eMPa, sigma02, n) : (i == points ? 0.02 * sigma02 : 0);
            double forceN = stress * s0Mm2;
            String extension = strain > removedAtStrain ? "" : String.format(Locale.ROOT, "%.9f", strain * leMm);
            csv.append(String.format(Locale.ROOT, "%.6f,%.9f,%s,%.9f%n", strain / ratePerS + (i < points ? 0 : i),
                    forceN / 1000.0, extension, strain * leMm + complianceMmPerN * forceN + 20));
        }
        return csv.toString().getBytes(StandardCharsets.UTF_8);
    }

    /** Loading–unloading cycles F = k·x (loading) and F = k·x²/xmax (unloading) with known loop areas. */
    public static byte[] triangleCycles(double stiffnessNPerMm, double peakMm, int cycles, int pointsPerBranch) {
        StringBuilder csv = new StringBuilder("force [N],extension [mm]\n");
        for (int c = 0; c < cycles; c++) {
            for (int i = 0; i < pointsPerBranch; i++) {
                double x = peakMm * i / pointsPerBranch;
                csv.append(String.format(Locale.ROOT, "%.9f,%.9f%n", stiffnessNPerMm * x, x));
            }
            for (int i = 0; i < pointsPerBranch; i++) {
                double x = peakMm * (pointsPerBranch - i) / pointsPerBranch;
                csv.append(String.format(Locale.ROOT, "%.9f,%.9f%n", stiffnessNPerMm * x * x / peakMm, x));
            }
        }
        csv.append(String.format(Locale.ROOT, "%.9f,%.9f%n", 0.0, 0.0));
        return csv.toString().getBytes(StandardCharsets.UTF_8);
    }

    /**
     * The same file with a {@code # key: value} metadata line in front, so that two runs of one model give
     * different bytes (a laboratory never stores the same file twice without saying why).
     */
    public static byte[] labelled(String metadata, byte[] curve) {
        byte[] head = ("# " + metadata + "\n").getBytes(StandardCharsets.UTF_8);
        byte[] out = java.util.Arrays.copyOf(head, head.length + curve.length);
        System.arraycopy(curve, 0, out, head.length, curve.length);
        return out;
    }

    /** Inverts the Ramberg–Osgood strain by bisection: the stress whose model strain is {@code strain}. */
    static double stressAt(double strain, double eMPa, double sigma02, double n) {
        double lo = 0;
        double hi = eMPa * strain + 1;
        for (int k = 0; k < 200; k++) {
            double mid = (lo + hi) / 2;
            double e = mid / eMPa + 0.002 * Math.pow(mid / sigma02, n);
            if (e < strain) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        return (lo + hi) / 2;
    }
}
