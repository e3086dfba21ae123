package org.specimenledger.analysis;

import java.util.ArrayList;
import java.util.List;

/**
 * ReL and the end of yielding (for Ae) on a discontinuous curve.
 *
 * <p>Local minima and maxima after the drop that follows ReH are found with a hysteresis of
 * {@code turningPointHysteresisPercent} % of FeH [CP], so noise does not create extrema. The scan ends
 * at Fm or as soon as the force rises 4× the yield-drop threshold above the highest plateau peak
 * found so far (work hardening has begun) [CP].
 *
 * <p>ReL [S: ISO 6892 definition; M: digitised rule]: the lowest force during yielding ignoring the
 * initial transient, i.e. the lowest of the local minima after the first one; the first minimum
 * counts only when it is the only one.
 *
 * <p>End of yielding [S: ASTM E8 YPE definition]: intersection of the horizontal through the last
 * zero slope (the last local minimum before the rise to Fm) with the tangent to the start of the
 * hardening curve. The tangent is a least-squares line through the hardening points whose stress lies
 * between 1× and 3× the yield-drop threshold above that horizontal [CP]. Ae runs from ReH to there.
 *
 * @param lowIndex ReL point
 * @param transientIndex first local minimum (ignored unless the only one)
 * @param minima number of local minima found
 * @param lastValleyIndex the last zero-slope point
 * @param tangent the hardening tangent, or {@code null} when it cannot be fitted
 * @param endStrain strain at the end of yielding (fraction), NaN when not found
 * @param endIndex last point at or before the end of yielding, −1 when not found
 */
record YieldRange(int lowIndex, int transientIndex, int minima, int lastValleyIndex, StraightLineFit tangent,
        double endStrain, int endIndex) {

    static YieldRange of(CurveArrays c, UpperYieldPoint reh, int fmIndex, TensileParameters p) {
        double[] f = c.force;
        double h = p.turningPointHysteresisPercent() / 100 * f[reh.index()];
        // The extremum scan stops once the force has clearly left the yield range: 4× the yield-drop
        // band above the highest plateau peak recorded so far (the tangent band below reaches 3× above
        // the valley). Without this stop, noise on the flat part near Fm of a densely sampled record
        // creates false valleys there. Peaks, not valleys, are the reference so that the recovery
        // from the transient dip does not end the scan.
        double leave = 4 * p.yieldDropPercent() / 100 * f[reh.index()];
        List<Integer> minima = new ArrayList<>();
        boolean seekingMinimum = true;
        int extreme = reh.dropIndex();
        int highestPeak = -1;
        for (int j = reh.dropIndex(); j <= fmIndex; j++) {
            if (seekingMinimum) {
                if (f[j] < f[extreme]) {
                    extreme = j;
                } else if (f[j] >= f[extreme] + h) {
                    minima.add(extreme);
                    seekingMinimum = false;
                    extreme = j;
                }
            } else if (f[j] > f[extreme]) {
                extreme = j;
            } else if (f[j] <= f[extreme] - h) {
                if (highestPeak < 0 || f[extreme] > f[highestPeak]) {
                    highestPeak = extreme;
                }
                seekingMinimum = true;
                extreme = j;
            }
            if (highestPeak >= 0 && f[j] > f[highestPeak] + leave) {
                break;
            }
        }
        if (minima.isEmpty()) {
            // The force never rose by the hysteresis after the drop: the lowest point is the only minimum.
            minima.add(extreme);
        }
        int low = minima.get(minima.size() > 1 ? 1 : 0);
        for (int k = 2; k < minima.size(); k++) {
            if (f[minima.get(k)] < f[low]) {
                low = minima.get(k);
            }
        }
        int valley = minima.get(minima.size() - 1);
        double level = c.stress[valley];
        double band = p.yieldDropPercent() / 100 * c.stress[reh.index()];
        int first = -1;
        int last = -1;
        for (int j = valley; j <= fmIndex; j++) {
            if (first < 0 && c.stress[j] >= level + band) {
                first = j;
            }
            if (first >= 0) {
                if (c.stress[j] > level + 3 * band) {
                    break;
                }
                last = j;
            }
        }
        StraightLineFit tangent = null;
        double endStrain = Double.NaN;
        int endIndex = -1;
        if (first >= 0 && last - first + 1 >= 3) {
            tangent = StraightLineFit.of(c.strain, c.stress, first, last);
            if (tangent.slope() > 0) {
                endStrain = Math.max(c.strain[valley], (level - tangent.intercept()) / tangent.slope());
                endIndex = valley;
                while (endIndex + 1 <= fmIndex && c.strain[endIndex + 1] <= endStrain) {
                    endIndex++;
                }
            }
        }
        return new YieldRange(low, minima.get(0), minima.size(), valley, tangent, endStrain, endIndex);
    }
}
