package org.specimenledger.analysis;

/**
 * The slope mE of the elastic part [S: least squares, ASTM E111 scope; M: ISO 6892-1 window about
 * 10 % to 40 % of Rp0.2 or ReH], found by iteration because the window depends on the result.
 *
 * <p>Only points before the first maximum are used (ReH for discontinuous yielding, else the highest
 * force before fracture). The window is contiguous in index: from the first point whose stress
 * reaches the lower bound to the last point before the stress first exceeds the upper bound.
 *
 * <p>Iteration: for discontinuous yielding the reference ReH is known, so one pass suffices. Otherwise
 * the first window is taken on the peak stress (Rm); each pass computes Rp0.2 with the current slope
 * and takes the next window on it, until the window's point indices repeat (converged) or
 * {@code modulusMaxIterations} is reached. When Rp0.2 is never reached (brittle), the window stays on
 * the peak stress.
 *
 * @param fit the least-squares line of stress (MPa) on strain (fraction), or {@code null} if fewer
 *     than {@code modulusMinimumPoints} points lie in the window
 * @param lowerStress lower window bound, MPa
 * @param upperStress upper window bound, MPa
 * @param reference what the window is a fraction of: "ReH", "Rp0.2" or "Fmax"
 * @param referenceStress its stress, MPa
 * @param iterations passes made
 * @param converged whether the window settled
 * @param strainOrigin e0 = −intercept/slope when origin correction is on, else 0 (fraction)
 * @param windowPoints points found in the last window (reported when too few)
 */
record ElasticSlope(StraightLineFit fit, double lowerStress, double upperStress, String reference,
        double referenceStress, int iterations, boolean converged, double strainOrigin, int windowPoints) {

    /** The 0.2 % offset that drives the window and the yielding classification. */
    static final double CLASSIFICATION_OFFSET = 0.002;

    static ElasticSlope fit(CurveArrays c, int peakIndex, int searchEnd, boolean discontinuous, TensileParameters p) {
        double reference = c.stress[peakIndex];
        String referenceName = discontinuous ? "ReH" : "Fmax";
        int[] previous = null;
        ElasticSlope last = null;
        for (int iteration = 1; iteration <= p.modulusMaxIterations(); iteration++) {
            double lo = p.modulusWindowLowerFraction() * reference;
            double hi = p.modulusWindowUpperFraction() * reference;
            int[] window = window(c.stress, peakIndex, lo, hi);
            int count = window == null ? 0 : window[1] - window[0] + 1;
            if (count < p.modulusMinimumPoints()) {
                return new ElasticSlope(null, lo, hi, referenceName, reference, iteration, false, 0, count);
            }
            boolean converged = previous != null && previous[0] == window[0] && previous[1] == window[1];
            StraightLineFit line = StraightLineFit.of(c.strain, c.stress, window[0], window[1]);
            double origin = p.originCorrection() ? -line.intercept() / line.slope() : 0;
            last = new ElasticSlope(line, lo, hi, referenceName, reference, iteration, converged || discontinuous,
                    origin, count);
            if (discontinuous || converged || !(line.slope() > 0)) {
                return last;
            }
            OffsetIntersection rp = OffsetIntersection.find(c.stress, c.strain, line.slope(), origin,
                    CLASSIFICATION_OFFSET, window[0], searchEnd);
            if (rp == null) {
                return new ElasticSlope(line, lo, hi, referenceName, reference, iteration, true, origin, count);
            }
            previous = window;
            reference = rp.stress();
            referenceName = "Rp0.2";
        }
        return last;
    }

    private static int[] window(double[] stress, int peakIndex, double lo, double hi) {
        int first = -1;
        for (int i = 0; i <= peakIndex; i++) {
            if (stress[i] >= lo) {
                first = i;
                break;
            }
        }
        if (first < 0) {
            return null;
        }
        int last = first - 1;
        for (int i = first; i <= peakIndex && stress[i] <= hi; i++) {
            last = i;
        }
        return last < first ? null : new int[] {first, last};
    }

    /** Slope mE in MPa (stress per unit strain), NaN when not fitted. */
    double slope() {
        return fit == null ? Double.NaN : fit.slope();
    }

    boolean found() {
        return fit != null && fit.slope() > 0;
    }
}
