package org.specimenledger.analysis;

import java.util.LinkedHashMap;
import java.util.Map;

/**
 * Settings of a loading–unloading analysis, immutable.
 *
 * @param turningPointHysteresisPercent the extension must reverse by at least this % of the record's
 *     extension range before a turning point is accepted, so noise does not create false turning
 *     points; in (0, 50) (default 2) [CP]
 * @param residualForcePercentOfPeak the unloading branch "returns to zero force" when the force falls
 *     to this % of the cycle's peak force; in [0, 100) (default 1) [CP]
 * @param minimumPoints fewest points a record may have, ≥ 10 (default 10) [CP]
 * @throws AnalysisRejected when a value is out of range
 */
public record CyclicParameters(double turningPointHysteresisPercent, double residualForcePercentOfPeak,
        int minimumPoints) {

    /** Validates ranges. */
    public CyclicParameters {
        if (!(turningPointHysteresisPercent > 0 && turningPointHysteresisPercent < 50)) {
            throw new AnalysisRejected("turningPointHysteresisPercent must be in (0, 50), got " + turningPointHysteresisPercent);
        }
        if (!(residualForcePercentOfPeak >= 0 && residualForcePercentOfPeak < 100)) {
            throw new AnalysisRejected("residualForcePercentOfPeak must be in [0, 100), got " + residualForcePercentOfPeak);
        }
        if (minimumPoints < 10) {
            throw new AnalysisRejected("minimumPoints must be ≥ 10, got " + minimumPoints);
        }
    }

    /**
     * The defaults described on each component.
     *
     * @return default parameters
     */
    public static CyclicParameters defaults() {
        return new CyclicParameters(2, 1, 10);
    }

    /**
     * The parameters as plain data with stable ordered keys (the component names).
     *
     * @return an unmodifiable ordered map
     */
    public Map<String, Object> asMap() {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("turningPointHysteresisPercent", turningPointHysteresisPercent);
        m.put("residualForcePercentOfPeak", residualForcePercentOfPeak);
        m.put("minimumPoints", minimumPoints);
        return java.util.Collections.unmodifiableMap(m);
    }

    /**
     * Rebuilds parameters from {@link #asMap()}; missing keys take their default.
     *
     * @param map stored parameters
     * @return the parameters
     * @throws AnalysisRejected on an unknown key or a non-numeric value
     */
    public static CyclicParameters fromMap(Map<String, Object> map) {
        CyclicParameters d = defaults();
        for (String k : map.keySet()) {
            if (!d.asMap().containsKey(k)) {
                throw new AnalysisRejected("unknown cyclic parameter '" + k + "'");
            }
        }
        return new CyclicParameters(number(map, "turningPointHysteresisPercent", d.turningPointHysteresisPercent),
                number(map, "residualForcePercentOfPeak", d.residualForcePercentOfPeak),
                (int) number(map, "minimumPoints", d.minimumPoints));
    }

    private static double number(Map<String, Object> map, String key, double fallback) {
        Object v = map.get(key);
        if (v == null) {
            return fallback;
        }
        if (!(v instanceof Number)) {
            throw new AnalysisRejected("cyclic parameter " + key + " must be a number, got " + v);
        }
        return ((Number) v).doubleValue();
    }
}
