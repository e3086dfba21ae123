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
    /** Where the extension came from; the extensometer for the whole record unless set. */
    ExtensionSource source;
    /** Points sharing the time stamp of the point before (counted while validating time). */
    int repeatedTimes;
    /** First point repeating its predecessor's time stamp, or −1. */
    int firstRepeatedTime = -1;

    private CurveArrays(double[] force, double[] extension, double[] time, double[] stress, double[] strain) {
        this.force = force;
        this.extension = extension;
        this.time = time;
        this.stress = stress;
        this.strain = strain;
        this.n = force.length;
    }

    /**
     * Validates a record whose extension may come partly or wholly from the crosshead: extension may be
     * null (crosshead only) or end in NaN (extensometer removed) when a crosshead channel is given; see
     * {@link ExtensionSource}. Without a crosshead every extension must be finite.
     */
    static CurveArrays validated(double[] forceN, double[] extensionMm, double[] timeS, double[] crossheadMm,
            TensileSpecimen specimen, TensileParameters p) {
        if (specimen == null) {
            throw new AnalysisRejected("specimen is required");
        }
        if (forceN == null || extensionMm == null && crossheadMm == null) {
            throw new AnalysisRejected(crossheadMm == null && forceN != null ? "forceN and extensionMm are required"
                    : "forceN and extensionMm (or crossheadMm) are required");
        }
        requireSameLength(forceN, extensionMm != null ? extensionMm : crossheadMm, timeS, p.minimumPoints());
        if (crossheadMm != null) {
            if (crossheadMm.length != forceN.length) {
                throw new AnalysisRejected("crossheadMm has " + crossheadMm.length + " points but forceN has "
                        + forceN.length + "; the arrays must have equal length");
            }
            requireFinite("forceN", forceN, "force");
            requireFinite("crossheadMm", crossheadMm, "crosshead displacement");
            if (extensionMm != null) {
                for (int i = 0; i < extensionMm.length; i++) {
                    if (Double.isInfinite(extensionMm[i])) {
                        throw new AnalysisRejected("extensionMm[" + i + "] is " + extensionMm[i]
                                + "; every extension must be finite (NaN marks a removed extensometer)");
                    }
                }
            }
        }
        int[] repeated = timeS != null ? requireTime(timeS) : new int[] {0, -1};
        ExtensionSource source = ExtensionSource.of(forceN, extensionMm, crossheadMm, specimen, p);
        CurveArrays c = derived(forceN, source.extension(), timeS, specimen);
        c.source = source;
        c.repeatedTimes = repeated[0];
        c.firstRepeatedTime = repeated[1];
        return c;
    }

    /** Stress and strain, in the same pass as the check that force and extension are finite. */
    static CurveArrays derived(double[] forceN, double[] extensionMm, double[] timeS, TensileSpecimen specimen) {
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
        return new CurveArrays(forceN, extensionMm, timeS, stress, strain);
    }

    private static void requireFinite(String name, double[] values, String what) {
        for (int i = 0; i < values.length; i++) {
            if (!Double.isFinite(values[i])) {
                throw new AnalysisRejected(name + "[" + i + "] is " + values[i] + "; every " + what + " must be finite");
            }
        }
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

    /** Checks time and counts repeated stamps: returns {count, first repeating index or −1}. */
    private static int[] requireTime(double[] t) {
        int repeated = 0;
        int first = -1;
        for (int i = 0; i < t.length; i++) {
            if (!Double.isFinite(t[i])) {
                throw new AnalysisRejected("timeS[" + i + "] is " + t[i] + "; every time must be finite");
            }
            if (i > 0 && t[i] < t[i - 1]) {
                throw new AnalysisRejected("timeS[" + i + "] = " + t[i] + " s is earlier than timeS[" + (i - 1) + "] = "
                        + t[i - 1] + " s; time must not decrease");
            }
            if (i > 0 && t[i] == t[i - 1] && repeated++ == 0) {
                first = i;
            }
        }
        return new int[] {repeated, first};
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
