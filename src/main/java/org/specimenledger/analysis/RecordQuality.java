package org.specimenledger.analysis;

import java.util.List;
import java.util.Locale;

/**
 * Data-quality checks on a tensile record, each a warning with its evidence in the message. They look
 * only at small parts of the record (the elastic window, the run at the maximum, the yield drop), so
 * they add no pass over a long record; repeated time stamps are counted while time is validated.
 *
 * <ul>
 *   <li>{@code DUPLICATED_TIME_STAMPS} [CP]: a point with the time stamp of the point before means the
 *       logger repeated or lost a sample; rates across it are undefined.</li>
 *   <li>{@code FORCE_RESOLUTION_COARSE}: when the force is visibly quantised in the elastic window
 *       (consecutive equal forces while loading), the smallest non-zero step is the resolution; it must
 *       not exceed half the force class in % of the window's reference force [M: ISO 7500-1 relative
 *       resolution, half the class value, e.g. 0.5 % for class 1].</li>
 *   <li>{@code FORCE_CLIPPED} [CP]: the maximum force repeated unchanged over at least
 *       {@value #CLIPPED_RUN_POINTS} points, after the force rose by at least
 *       {@value #CLIPPED_STEP_PERCENT} % of it over as many points before (a curve still climbing, not the
 *       flat top of a quantised maximum): the transducer or amplifier was at its limit, so Fm and
 *       Rm are lower bounds.</li>
 *   <li>{@code YIELD_DROP_UNDER_SAMPLED} [CP]: fewer than {@code yieldDropMinimumPoints} points from
 *       ReH to the bottom of its drop; the peak most likely fell between samples and ReH is
 *       underestimated. Raise the sampling rate.</li>
 * </ul>
 * An extensometer that stops changing while force continues (clipped or frozen) is found by
 * {@link ExtensionSource}.
 */
final class RecordQuality {

    static final int CLIPPED_RUN_POINTS = 5;
    static final double CLIPPED_STEP_PERCENT = 0.1;

    private RecordQuality() {
    }

    static void check(CurveArrays c, UpperYieldPoint reh, ElasticSlope elastic, int fmIndex, TensileParameters p,
            List<AnalysisWarning> out) {
        if (c.repeatedTimes > 0) {
            out.add(new AnalysisWarning("DUPLICATED_TIME_STAMPS", c.repeatedTimes + (c.repeatedTimes == 1
                    ? " point repeats" : " points repeat") + " the time stamp of the point before, the first at index "
                    + c.firstRepeatedTime + " (" + c.time[c.firstRepeatedTime] + " s); strain rates across them are"
                    + " undefined"));
        }
        if (elastic.found()) {
            forceResolution(c, elastic, p, out);
        }
        clipped(c, fmIndex, out);
        if (reh != null) {
            yieldDrop(c, reh, p, out);
        }
    }

    private static void forceResolution(CurveArrays c, ElasticSlope elastic, TensileParameters p,
            List<AnalysisWarning> out) {
        int first = elastic.fit().firstIndex();
        int last = elastic.fit().lastIndex();
        int flat = 0;
        double step = Double.POSITIVE_INFINITY;
        for (int i = first + 1; i <= last; i++) {
            double d = Math.abs(c.force[i] - c.force[i - 1]);
            if (d == 0) {
                flat++;
            } else if (d < step) {
                step = d;
            }
        }
        if (flat == 0 || !Double.isFinite(step)) {
            return;
        }
        double referenceForce = elastic.referenceStress() * c.force[last] / c.stress[last];
        double relative = 100 * step / referenceForce;
        double limit = p.uncertainty().forceClassPercent() / 2;
        if (relative > limit) {
            out.add(new AnalysisWarning("FORCE_RESOLUTION_COARSE", "the force moves in steps of " + fmt(step) + " N ("
                    + flat + " unchanged readings in the elastic window, points " + first + "–" + last + "), "
                    + fmt(relative) + " % of the " + elastic.reference() + " force " + fmt(referenceForce)
                    + " N; more than " + fmt(limit) + " %, half the force class (ISO 7500-1 relative resolution [M])"));
        }
    }

    private static void clipped(CurveArrays c, int fmIndex, List<AnalysisWarning> out) {
        double top = c.force[fmIndex];
        int end = fmIndex;
        while (end + 1 < c.n && c.force[end + 1] == top) {
            end++;
        }
        int run = end - fmIndex + 1;
        if (run < CLIPPED_RUN_POINTS || fmIndex == 0) {
            return;
        }
        double rise = top - c.force[Math.max(0, fmIndex - run)];
        if (rise >= CLIPPED_STEP_PERCENT / 100 * Math.abs(top)) {
            out.add(new AnalysisWarning("FORCE_CLIPPED", "the force stays at exactly " + fmt(top) + " N for " + run
                    + " points (" + fmIndex + "–" + end + ") after rising by " + fmt(rise) + " N over as many points"
                    + " before; the force channel was probably at its limit, so Fm and Rm are lower bounds"));
        }
    }

    private static void yieldDrop(CurveArrays c, UpperYieldPoint reh, TensileParameters p, List<AnalysisWarning> out) {
        int bottom = reh.index();
        for (int i = reh.index(); i <= reh.holdIndex(); i++) {
            if (c.force[i] < c.force[bottom]) {
                bottom = i;
            }
        }
        int points = bottom - reh.index();
        if (points < p.yieldDropMinimumPoints()) {
            String interval = c.time == null ? "" : "; sampling interval there "
                    + fmt(c.time[bottom] - c.time[reh.index()]) + " s over the drop";
            out.add(new AnalysisWarning("YIELD_DROP_UNDER_SAMPLED", "only " + points + (points == 1 ? " point" : " points")
                    + " from ReH (point " + reh.index() + ") to the bottom of its drop (point " + bottom + "), fewer than "
                    + p.yieldDropMinimumPoints() + "; the peak may lie between samples and ReH be underestimated"
                    + interval));
        }
    }

    private static String fmt(double v) {
        return String.format(Locale.ROOT, "%.4g", v);
    }
}
