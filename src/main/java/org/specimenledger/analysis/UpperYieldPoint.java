package org.specimenledger.analysis;

/**
 * The upper yield point by the digitised-data rule [M: ISO 6892-1 Annex A]: a maximum followed by a
 * force drop of at least {@code yieldDropPercent} % of it and then at least
 * {@code yieldHoldStrainPercent} % strain, counted from the point where the drop was reached, without
 * the force exceeding that maximum.
 *
 * <p>One added condition [CP] separates a yield drop from necking after Fm (which also satisfies the
 * rule): before fracture the force must rise again by at least the same drop threshold above its
 * lowest value since the maximum, i.e. work hardening resumes.
 *
 * <p>One pass: the first maximum satisfying the rule is always the running maximum at that point (an
 * earlier higher point would satisfy it first), so only the running maximum is tracked.
 *
 * @param index ReH point (the maximum)
 * @param dropIndex first point at or below the drop threshold
 * @param holdIndex point where the hold strain was reached
 */
record UpperYieldPoint(int index, int dropIndex, int holdIndex) {

    /** Finds the upper yield point within [0, last], or {@code null} for continuous yielding. */
    static UpperYieldPoint find(double[] force, double[] strain, int last, TensileParameters p) {
        return find(force, strain, last, p, null);
    }

    /**
     * As {@link #find(double[], double[], int, TensileParameters)}, with the points of an unload–reload
     * loop left out: its unloading is a force drop by design, not a yield drop.
     */
    static UpperYieldPoint find(double[] force, double[] strain, int last, TensileParameters p, UnloadReloadLoop loop) {
        int skipFrom = loop == null ? Integer.MAX_VALUE : loop.unloadIndex() + 1;
        int skipTo = loop == null ? Integer.MIN_VALUE : loop.rejoinIndex() - 1;
        double dropFraction = p.yieldDropPercent() / 100;
        double hold = p.yieldHoldStrainPercent() / 100;
        int c = 0;
        int drop = -1;
        int held = -1;
        for (int i = 1; i <= last; i++) {
            if (i >= skipFrom && i <= skipTo) {
                continue;
            }
            if (force[i] > force[c]) {
                c = i;
                drop = -1;
            } else if (drop < 0) {
                if (force[i] <= force[c] * (1 - dropFraction)) {
                    drop = i;
                }
            } else if (strain[i] - strain[drop] >= hold) {
                held = i;
                break;
            }
        }
        if (held < 0 || !(force[c] > 0)) {
            return null;
        }
        double rise = dropFraction * force[c];
        double lowest = force[drop];
        for (int j = drop; j <= last; j++) {
            if (j >= skipFrom && j <= skipTo) {
                continue;
            }
            lowest = Math.min(lowest, force[j]);
            if (force[j] - lowest >= rise) {
                return new UpperYieldPoint(c, drop, held);
            }
        }
        return null;
    }
}
