package org.specimenledger.analysis;

/**
 * Where the curve crosses a line parallel to the elastic line, σ = mE·(e − e0 − offset), by the
 * parallel-line method of ISO 6892-1 Rp [S] (ASTM E8 offset method is the same [S]).
 *
 * <p>The crossing is the first sign change from positive to non-positive of
 * g(i) = σᵢ − mE·(eᵢ − e0 − offset) from the start index on, with linear interpolation between the
 * bracketing points i and i+1: t = g(i)/(g(i) − g(i+1)). The search stops at the first crossing.
 *
 * @param before index i (g &gt; 0)
 * @param after index i+1 (g ≤ 0)
 * @param fraction t in [0, 1)
 * @param strain interpolated strain e at the crossing (fraction, uncorrected)
 * @param stress interpolated stress at the crossing, MPa
 */
record OffsetIntersection(int before, int after, double fraction, double strain, double stress) {

    /**
     * Finds the crossing in [from, to], or {@code null} when the curve never crosses (fracture or end
     * of record before the offset is reached).
     */
    static OffsetIntersection find(double[] stress, double[] strain, double slope, double strainOrigin,
            double offset, int from, int to) {
        boolean positive = false;
        double gPrevious = 0;
        for (int i = from; i <= to; i++) {
            double g = stress[i] - slope * (strain[i] - strainOrigin - offset);
            if (g > 0) {
                positive = true;
            } else if (positive) {
                double t = gPrevious / (gPrevious - g);
                double e = strain[i - 1] + t * (strain[i] - strain[i - 1]);
                double s = stress[i - 1] + t * (stress[i] - stress[i - 1]);
                return new OffsetIntersection(i - 1, i, t, e, s);
            }
            gPrevious = g;
        }
        return null;
    }
}
