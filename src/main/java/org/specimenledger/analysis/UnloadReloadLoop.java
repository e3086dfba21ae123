package org.specimenledger.analysis;

/**
 * One unload–reload loop inside a tensile record, as laboratories run it to set the elastic slope when
 * the linear part of the first loading is unclear [M: ISO 6892-1, Rp with an unload–reload loop].
 *
 * <p>Detection [CP]: from the running force maximum u (at least 10 % of the highest force), the force falls to at most
 * (1 − {@code loopMinimumDropPercent}/100)·F(u) while the extension falls below its value at u (a yield
 * drop or a fracture keeps extending; an unloading goes back), and later rises to F(u) again at the
 * rejoin point r. The lowest force between u and r is the turning point m. The first such loop counts.
 * The candidates are found in the pass that also finds the highest force, so a record without a loop
 * costs no extra pass.
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

    /** Candidates kept at once while scanning; noise near zero force is purged as force rises. */
    private static final int CANDIDATES = 4;

    /**
     * One pass over the record that finds the index of its first highest force (which the fracture
     * search needs anyway) and, in the same pass, where unloadings begin; the first unloading from at least
     * 10 % of the highest force that rejoins its starting force before the maximum is the loop.
     */
    static Scan scan(CurveArrays c, TensileParameters p) {
        double keep = 1 - p.loopMinimumDropPercent() / 100;
        double[] f = c.force;
        double[] x = c.extension;
        int[] us = new int[CANDIDATES];
        int[] is = new int[CANDIDATES];
        int kept = 0;
        int u = 0;
        double threshold = keep * f[0];
        for (int i = 1; i < c.n; i++) {
            double fi = f[i];
            if (fi > f[u]) {
                u = i;
                threshold = keep * fi;
            } else if (fi <= threshold && x[i] < x[u] && f[u] > 0 && (kept == 0 || us[kept - 1] != u)) {
                kept = purge(f, us, is, kept, MINIMUM_FORCE_FRACTION * f[u]);
                if (kept < CANDIDATES) {
                    us[kept] = u;
                    is[kept++] = i;
                }
            }
        }
        int iMax = u;
        double floor = MINIMUM_FORCE_FRACTION * f[iMax];
        for (int k = 0; k < kept; k++) {
            if (f[us[k]] < floor) {
                continue;
            }
            UnloadReloadLoop loop = reloaded(c, us[k], is[k], iMax, p);
            if (loop != null) {
                return new Scan(iMax, loop);
            }
        }
        return new Scan(iMax, null);
    }

    /** The index of the first highest force, and the loop or {@code null}. */
    record Scan(int maximumIndex, UnloadReloadLoop loop) {
    }

    private static int purge(double[] f, int[] us, int[] is, int kept, double floor) {
        int w = 0;
        for (int k = 0; k < kept; k++) {
            if (f[us[k]] >= floor) {
                us[w] = us[k];
                is[w++] = is[k];
            }
        }
        return w;
    }

    /** From the unloading at u (seen at i): the lowest force, then the rejoin at or above F(u) by the maximum. */
    private static UnloadReloadLoop reloaded(CurveArrays c, int u, int i, int last, TensileParameters p) {
        double[] f = c.force;
        int m = i;
        for (int j = i + 1; j <= last; j++) {
            if (f[j] < f[m]) {
                m = j;
            }
            if (f[j] >= f[u]) {
                return of(c, u, m, j, p);
            }
        }
        return null; // never reloaded before the maximum
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
