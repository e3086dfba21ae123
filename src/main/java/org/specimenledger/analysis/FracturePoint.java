package org.specimenledger.analysis;

/**
 * The fracture point of a tensile record [S: ASTM E8 wording; the ISO threshold is M]:
 * the point just before the sudden force drop, otherwise the point just before the force falls below
 * a fraction (default 10 %) of Fmax.
 *
 * <p>Sudden drop [CP]: from the highest force on, the first point i from which the force falls by at
 * least {@code fractureDropPercentOfFmax} % of Fmax within {@code fractureDropWindowPoints} points;
 * the fracture point is then the point before the largest single-step fall inside that window, so a
 * fall spread over a few samples is not dated too early.
 *
 * @param index fracture point
 * @param rule "sudden force drop" or "force below x % of Fmax"
 * @param maximumIndex index of the highest force of the record, Fmax
 */
record FracturePoint(int index, String rule, int maximumIndex) {

    /** Locates the fracture, or {@code null} when the record shows none. */
    static FracturePoint locate(double[] force, TensileParameters p) {
        int n = force.length;
        int iMax = 0;
        for (int i = 1; i < n; i++) {
            if (force[i] > force[iMax]) {
                iMax = i;
            }
        }
        return locate(force, p, iMax);
    }

    /** As {@link #locate(double[], TensileParameters)}, with the index of the first highest force known. */
    static FracturePoint locate(double[] force, TensileParameters p, int iMax) {
        int n = force.length;
        double fmax = force[iMax];
        if (!(fmax > 0)) {
            return null;
        }
        double drop = p.fractureDropPercentOfFmax() / 100 * fmax;
        int w = p.fractureDropWindowPoints();
        for (int i = iMax; i < n - 1; i++) {
            int end = Math.min(n - 1, i + w);
            for (int j = i + 1; j <= end; j++) {
                if (force[i] - force[j] >= drop) {
                    int k = i;
                    for (int m = i; m < j; m++) {
                        if (force[m] - force[m + 1] > force[k] - force[k + 1]) {
                            k = m;
                        }
                    }
                    return new FracturePoint(k, "sudden force drop", iMax);
                }
            }
        }
        double floor = p.fractureFallbackPercentOfFmax() / 100 * fmax;
        for (int i = iMax; i < n - 1; i++) {
            if (force[i + 1] < floor) {
                return new FracturePoint(i, "force below " + p.fractureFallbackPercentOfFmax() + " % of Fmax", iMax);
            }
        }
        return null;
    }
}
