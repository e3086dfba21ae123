package org.specimenledger.analysis;

import java.util.ArrayList;
import java.util.List;

/**
 * Splits a loading–unloading record (e.g. an elastomer under repeated stretching) into cycles at the
 * turning points of extension and computes per cycle the loading, returned and hysteresis energy, the
 * loss ratio and the residual extension (definitions on {@link LoadingCycle}).
 *
 * <p>Turning points [CP]: a peak (or valley) is accepted only once the extension has come back from
 * it by the hysteresis h = {@code turningPointHysteresisPercent} % of the record's extension range, so
 * noise does not split cycles. The record is expected to start with loading; if it starts by
 * unloading, the part before the first valley is skipped. A last peak with no unloading after it is
 * reported as a warning, not as a cycle.
 *
 * <p>Deterministic, O(n), no allocation per point.
 */
public final class CyclicAnalysis {

    /** Version of the cyclic method; must change whenever its algorithm or defaults change. */
    public static final String METHOD_VERSION = "cyclic/1.0.0";

    private CyclicAnalysis() {
    }

    /**
     * Analyses a loading–unloading record.
     *
     * @param forceN force in N, finite, at least {@code p.minimumPoints()} points; not modified
     * @param extensionMm extension in mm, finite, same length; not modified
     * @param p parameters
     * @return the cycles found
     * @throws AnalysisRejected on null, unequal or short arrays, non-finite values, or an extension
     *     that does not vary
     */
    public static CyclicResult analyse(double[] forceN, double[] extensionMm, CyclicParameters p) {
        if (p == null) {
            throw new AnalysisRejected("parameters are required");
        }
        CurveArrays.requireSameLength(forceN, extensionMm, null, p.minimumPoints());
        double lo = Double.POSITIVE_INFINITY;
        double hi = Double.NEGATIVE_INFINITY;
        for (int i = 0; i < forceN.length; i++) {
            if (!Double.isFinite(forceN[i])) {
                throw new AnalysisRejected("forceN[" + i + "] is " + forceN[i] + "; every force must be finite");
            }
            if (!Double.isFinite(extensionMm[i])) {
                throw new AnalysisRejected("extensionMm[" + i + "] is " + extensionMm[i] + "; every extension must be finite");
            }
            lo = Math.min(lo, extensionMm[i]);
            hi = Math.max(hi, extensionMm[i]);
        }
        if (!(hi > lo)) {
            throw new AnalysisRejected("extension does not vary (all points at " + lo + " mm): no cycles");
        }
        List<Integer> turns = turningPoints(extensionMm, p.turningPointHysteresisPercent() / 100 * (hi - lo));
        List<LoadingCycle> cycles = new ArrayList<>();
        List<AnalysisWarning> warnings = new ArrayList<>();
        for (int k = 0; k + 1 < turns.size(); k += 2) {
            if (k + 2 >= turns.size()) {
                warnings.add(new AnalysisWarning("INCOMPLETE_LAST_CYCLE", "the record ends while loading after point "
                        + turns.get(k) + "; that loading branch is not reported as a cycle"));
                break;
            }
            cycles.add(cycle(forceN, extensionMm, cycles.size() + 1, turns.get(k), turns.get(k + 1), turns.get(k + 2), p));
        }
        if (cycles.isEmpty()) {
            warnings.add(new AnalysisWarning("NO_COMPLETE_CYCLE", "no loading branch followed by unloading was found"));
        }
        return new CyclicResult(METHOD_VERSION, p, turns, cycles, warnings);
    }

    /** Start (valley), peak, valley, peak, … ; the last entry is a peak when the record ends loading. */
    private static List<Integer> turningPoints(double[] x, double h) {
        List<Integer> turns = new ArrayList<>();
        int min = 0;
        int max = 0;
        int direction = 0;
        for (int i = 1; i < x.length; i++) {
            if (direction >= 0 && x[i] > x[max]) {
                max = i;
            }
            if (direction <= 0 && x[i] < x[min]) {
                min = i;
            }
            if (direction == 0) {
                if (x[i] >= x[min] + h) {
                    direction = 1;
                    turns.add(min);
                    max = i;
                } else if (x[i] <= x[max] - h) {
                    direction = -1; // starts by unloading: skip to the first valley
                    min = i;
                }
            } else if (direction > 0 && x[i] <= x[max] - h) {
                turns.add(max);
                direction = -1;
                min = i;
            } else if (direction < 0 && x[i] >= x[min] + h) {
                turns.add(min);
                direction = 1;
                max = i;
            }
        }
        if (direction > 0 && max > turns.get(turns.size() - 1)) {
            turns.add(max);
        } else if (direction < 0) {
            turns.add(min);
        }
        return turns;
    }

    private static LoadingCycle cycle(double[] f, double[] x, int number, int start, int peak, int end,
            CyclicParameters p) {
        double load = 0;
        for (int i = start + 1; i <= peak; i++) {
            load += 0.5 * (f[i] + f[i - 1]) * (x[i] - x[i - 1]);
        }
        double unload = 0;
        for (int i = peak + 1; i <= end; i++) {
            unload += 0.5 * (f[i] + f[i - 1]) * (x[i] - x[i - 1]);
        }
        double loadJ = load / 1000;
        double returnedJ = -unload / 1000;
        double hysteresisJ = loadJ - returnedJ;
        double loss = loadJ > 0 ? 100 * hysteresisJ / loadJ : Double.NaN;
        double threshold = p.residualForcePercentOfPeak() / 100 * f[peak];
        double residual = x[end];
        boolean atZero = false;
        for (int i = peak + 1; i <= end; i++) {
            if (f[i] <= threshold) {
                double t = f[i - 1] == f[i] ? 0 : (f[i - 1] - threshold) / (f[i - 1] - f[i]);
                residual = x[i - 1] + t * (x[i] - x[i - 1]);
                atZero = true;
                break;
            }
        }
        return new LoadingCycle(number, start, peak, end, f[peak], x[peak], loadJ, returnedJ, hysteresisJ, loss,
                residual, atZero);
    }
}
