package org.specimenledger.analysis;

/**
 * Validated input arrays plus the two derived arrays the analysis needs: stress R = F/S0 in MPa
 * (N/mm²) and strain e = ΔL/Le as a fraction. These two double[n] are the only per-point allocations
 * of a tensile analysis. The caller's arrays are read, never modified or kept.
 */
final class CurveArrays {
    final double[] force;
    final double[] extension;
    final double[] time;
    final double[] stress;
    final double[] strain;
    final int n;

    private CurveArrays(double[] force, double[] extension, double[] time, double[] stress, double[] strain) {
        this.force = force;
        this.extension = extension;
        this.time = time;
        this.stress = stress;
        this.strain = strain;
        this.n = force.length;
    }

    static CurveArrays validated(double[] forceN, double[] extensionMm, double[] timeS, TensileSpecimen specimen,
            int minimumPoints) {
        if (specimen == null) {
            throw new AnalysisRejected("specimen is required");
        }
        requireSameLength(forceN, extensionMm, timeS, minimumPoints);
        double[] stress = new double[forceN.length];
        double[] strain = new double[forceN.length];
        double s0 = specimen.s0Mm2();
        double le = specimen.leMm();
        for (int i = 0; i < forceN.length; i++) {
            double f = forceN[i];
            double x = extensionMm[i];
            if (!Double.isFinite(f)) {
                throw new AnalysisRejected("forceN[" + i + "] is " + f + "; every force must be finite");
            }
            if (!Double.isFinite(x)) {
                throw new AnalysisRejected("extensionMm[" + i + "] is " + x + "; every extension must be finite");
            }
            stress[i] = f / s0;
            strain[i] = x / le;
        }
        if (timeS != null) {
            requireTime(timeS);
        }
        return new CurveArrays(forceN, extensionMm, timeS, stress, strain);
    }

    /**
     * Checks array presence, equal lengths and minimum size; shared with the cyclic analysis.
     */
    static void requireSameLength(double[] forceN, double[] extensionMm, double[] timeS, int minimumPoints) {
        if (forceN == null || extensionMm == null) {
            throw new AnalysisRejected("forceN and extensionMm are required");
        }
        if (forceN.length != extensionMm.length) {
            throw new AnalysisRejected("forceN has " + forceN.length + " points but extensionMm has "
                    + extensionMm.length + "; the arrays must have equal length");
        }
        if (timeS != null && timeS.length != forceN.length) {
            throw new AnalysisRejected("timeS has " + timeS.length + " points but forceN has " + forceN.length
                    + "; the arrays must have equal length");
        }
        if (forceN.length < minimumPoints) {
            throw new AnalysisRejected("a curve needs at least " + minimumPoints + " points, got " + forceN.length);
        }
    }

    private static void requireTime(double[] t) {
        for (int i = 0; i < t.length; i++) {
            if (!Double.isFinite(t[i])) {
                throw new AnalysisRejected("timeS[" + i + "] is " + t[i] + "; every time must be finite");
            }
            if (i > 0 && t[i] < t[i - 1]) {
                throw new AnalysisRejected("timeS[" + i + "] = " + t[i] + " s is earlier than timeS[" + (i - 1) + "] = "
                        + t[i - 1] + " s; time must not decrease");
            }
        }
    }

    /** Index of the first highest force in [from, to], both inclusive. */
    int argMaxForce(int from, int to) {
        int best = from;
        for (int i = from + 1; i <= to; i++) {
            if (force[i] > force[best]) {
                best = i;
            }
        }
        return best;
    }
}
