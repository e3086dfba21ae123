package org.specimenledger.analysis;

/**
 * Ordinary least-squares straight line y = slope·x + intercept over a contiguous index range, with
 * centred two-pass sums for accuracy (the textbook formulas; checked in tests against Apache Commons
 * Math {@code SimpleRegression}).
 *
 * @param firstIndex first point used
 * @param lastIndex last point used (inclusive)
 * @param points number of points
 * @param slope dy/dx
 * @param intercept y at x = 0
 * @param rSquared coefficient of determination, 1 − SSE/SST (NaN when all y are equal)
 * @param slopeStandardError standard error of the slope, √(SSE/(n − 2)/Sxx) (NaN for n &lt; 3)
 */
record StraightLineFit(int firstIndex, int lastIndex, int points, double slope, double intercept, double rSquared,
        double slopeStandardError) {

    /** Fits y on x over [first, last]; needs at least two points with distinct x, else slope NaN. */
    static StraightLineFit of(double[] x, double[] y, int first, int last) {
        int n = last - first + 1;
        double sx = 0;
        double sy = 0;
        for (int i = first; i <= last; i++) {
            sx += x[i];
            sy += y[i];
        }
        double mx = sx / n;
        double my = sy / n;
        double sxx = 0;
        double sxy = 0;
        double syy = 0;
        for (int i = first; i <= last; i++) {
            double dx = x[i] - mx;
            double dy = y[i] - my;
            sxx += dx * dx;
            sxy += dx * dy;
            syy += dy * dy;
        }
        double slope = sxy / sxx;
        double intercept = my - slope * mx;
        double sse = Math.max(0, syy - slope * sxy);
        double r2 = syy > 0 ? 1 - sse / syy : Double.NaN;
        double se = n > 2 ? Math.sqrt(sse / (n - 2) / sxx) : Double.NaN;
        return new StraightLineFit(first, last, n, slope, intercept, r2, se);
    }

    /** Evidence entries with the given unit suffixes for slope and intercept. */
    Evidence.Builder evidence(String slopeKey, String interceptKey) {
        return Evidence.builder().put("firstIndex", firstIndex).put("lastIndex", lastIndex).put("points", points)
                .put(slopeKey, slope).put(interceptKey, intercept).put("rSquared", rSquared)
                .put("slopeRelativeStandardError", slopeStandardError / Math.abs(slope));
    }
}
