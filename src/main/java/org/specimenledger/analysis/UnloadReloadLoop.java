package org.specimenledger.analysis;

/**
 * One unload–reload loop inside a tensile record, as laboratories run it to set the elastic slope when
 * the linear part of the first loading is unclear [M: ISO 6892-1, Rp with an unload–reload loop].
 *
 * <p>Detection [CP]: from the running force maximum u (at least 10 % of the highest force), the force falls to at most
 * (1 − {@code loopMinimumDropPercent}/100)·F(u) while the extension falls below its value at u (a yield
 * drop or a fracture keeps extending; an unloading goes back), and later rises to F(u) again at the
 * rejoin point r. The lowest force between u and r is the turning point m. The first such loop counts;
 * one pass, no allocation.
 *
 * <p>Slope [CP]: least squares of stress on strain over the reloading branch m…r, on the points between
 * 10 % and 90 % of the branch's stress rise, which leaves out the rounded turning ends.
 *
 * @param unloadIndex u, where unloading starts
 * @param turnIndex m, the lowest force of the loop
 * @param rejoinIndex r, first point after m at or above F(u)
 * @param reloading the fit over the reloading branch, or {@code null} when it has too few points
 */
record UnloadReloadLoop(int unloadIndex, int turnIndex, int rejoinIndex, StraightLineFit reloading) {

    private static final double BRANCH_LOWER = 0.10;
    private static final double BRANCH_UPPER = 0.90;

    /**
     * An unloading must start at no less than this fraction of the highest force in the range [CP], so
     * that noise around zero force at the start of a record is never taken for a loop.
     */
    static final double MINIMUM_FORCE_FRACTION = 0.10;

    /** The first loop in [0, last], where last is the highest force of the record, or {@code null}. */
    static UnloadReloadLoop find(CurveArrays c, int last, TensileParameters p) {
        double keep = 1 - p.loopMinimumDropPercent() / 100;
        double[] f = c.force;
        double[] x = c.extension;
        double floor = MINIMUM_FORCE_FRACTION * f[last];
        int u = 0;
        for (int i = 1; i <= last; i++) {
            if (f[i] > f[u]) {
                u = i;
            } else if (f[i] <= keep * f[u] && x[i] < x[u] && f[u] >= floor && f[u] > 0) {
                int m = i;
                for (int j = i + 1; j <= last; j++) {
                    if (f[j] < f[m]) {
                        m = j;
                    }
                    if (f[j] >= f[u]) {
                        return of(c, u, m, j, p);
                    }
                }
                return null; // never reloaded: fracture or end of record
            }
        }
        return null;
    }

    private static UnloadReloadLoop of(CurveArrays c, int u, int m, int r, TensileParameters p) {
        double low = c.stress[m];
        double rise = c.stress[r] - low;
        double from = low + BRANCH_LOWER * rise;
        double to = low + BRANCH_UPPER * rise;
        int first = -1;
        int lastIn = -1;
        for (int i = m; i <= r; i++) {
            if (c.stress[i] >= from && first < 0) {
                first = i;
            }
            if (first >= 0 && c.stress[i] <= to) {
                lastIn = i;
            }
            if (c.stress[i] > to) {
                break;
            }
        }
        boolean enough = first >= 0 && lastIn - first + 1 >= p.modulusMinimumPoints();
        return new UnloadReloadLoop(u, m, r, enough ? StraightLineFit.of(c.strain, c.stress, first, lastIn) : null);
    }

    /** Whether the reloading branch gave a positive slope. */
    boolean sloped() {
        return reloading != null && reloading.slope() > 0;
    }

    /** Evidence for E and the warnings. */
    Evidence.Builder evidence() {
        Evidence.Builder b = Evidence.builder().put("loopUnloadIndex", unloadIndex).put("loopTurnIndex", turnIndex)
                .put("loopRejoinIndex", rejoinIndex);
        if (reloading != null) {
            b.put("reloadingFit", reloading.evidence("slopeMPa", "interceptMPa").build());
        }
        return b;
    }
}
