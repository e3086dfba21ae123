package org.specimenledger.analysis;

import java.util.List;
import java.util.Map;

/**
 * Every setting of a tensile analysis, immutable. Values marked [M] come from memory of the standard
 * (DOMAIN.md) and are configurable for that reason; [CP] are common-practice choices of this engine.
 * Store {@link #asMap()} with each analysis and rebuild with {@link #fromMap(Map)}.
 *
 * @param proofOffsetsPercent plastic-extension offsets for Rp in % of Le, each in (0, 100), distinct
 *     (default [0.2]) [S: ISO 6892-1 Rp]
 * @param totalExtensionsPercent total extensions for Rt in % of Le, each in (0, 100), distinct
 *     (default [0.5]) [S: ISO 6892-1 Rt]
 * @param modulusWindowLowerFraction lower bound of the modulus fit window as a fraction of Rp0.2 (or
 *     ReH), in [0, upper) (default 0.10) [M: ISO 6892-1 regression range]
 * @param modulusWindowUpperFraction upper bound, in (lower, 1) (default 0.40) [M]
 * @param modulusMaxIterations iterations allowed for the window to settle, ≥ 1 (default 20) [CP]
 * @param modulusMinimumPoints fewest points in the window for a slope, ≥ 3 (default 5) [CP]
 * @param modulusMinimumRSquared R² below which a warning is raised, in [0, 1] (default 0.995) [CP]
 * @param originCorrection whether strains are measured from the strain-axis intercept of the elastic
 *     line (removes preload and slack; default true) [M: ISO 6892-1 origin correction]
 * @param yieldDropPercent force drop after a maximum that marks ReH, % of that maximum, &gt; 0
 *     (default 0.5) [M: ISO 6892-1 Annex A]
 * @param yieldHoldStrainPercent strain, in % of Le, the force must then stay below that maximum,
 *     &gt; 0 (default 0.05) [M: ISO 6892-1 Annex A]
 * @param turningPointHysteresisPercent hysteresis for local minima and maxima during yielding, % of
 *     FeH, &gt; 0 (default 0.2) [CP]
 * @param fractureDropPercentOfFmax a sudden drop is a fall of at least this % of Fmax within
 *     {@code fractureDropWindowPoints} points, &gt; 0 (default 25) [CP]
 * @param fractureDropWindowPoints points over which the sudden drop is sought, ≥ 1 (default 5) [CP]
 * @param fractureFallbackPercentOfFmax otherwise fracture is the point before force falls below this
 *     % of Fmax (default 10) [S: ASTM E8 wording; M for ISO]
 * @param flatMaximumTolerancePercent points within this % of Fm form the flat maximum whose middle
 *     gives Ag and Agt, ≥ 0 (default 0.1) [CP; middle of the plateau M]
 * @param minimumPoints fewest points a curve may have, ≥ 10 (default 10) [CP]
 * @param elasticStrainRatesPerS method A nominal rates allowed in the elastic phase, s⁻¹ (default
 *     [0.00025], range 2) [M]
 * @param yieldStrainRatesPerS allowed in the yield phase (default [0.00025, 0.002], range 2 or 3) [M]
 * @param hardeningStrainRatesPerS allowed from yield end to Fm (default [0.0067], range 4) [M]
 * @param strainRateTolerancePercent relative tolerance of each range in % (default 20) [M]
 * @param uncertainty inputs to the uncertainty budget
 * @param rounding rule set for reported strings (default ISO 6892-1)
 * @param machineComplianceMmPerN machine compliance C in mm/N from an equipment setting (crosshead
 *     displacement = specimen extension + C·F, a linear spring in series), ≥ 0, or {@code null} when not
 *     given: then estimated from the elastic part of both channels when the extensometer is removed,
 *     and taken as 0 (with a warning) for a crosshead-only record (default null) [CP]
 * @param modulusFromCrosshead whether a crosshead-only record reports its apparent slope as E; by
 *     default E is not determinable from crosshead data (default false) [CP: ASTM E8 allows crosshead
 *     displacement for offset yield with a stated loss of accuracy, M]
 * @param slopeFromLoop whether the reloading branch of an unload–reload loop sets mE for Rp when the
 *     record holds one (default true) [M: ISO 6892-1, loop when the linear part is unclear]
 * @param loopMinimumDropPercent an unloading counts as a loop when force falls by at least this % of
 *     the force where it began, while extension decreases, and later rises back to it, in (0, 100)
 *     (default 20) [CP]
 * @param extensometerFreezePoints an extensometer reading unchanged over at least this many points
 *     above the fracture threshold force counts as stopped (removed or frozen), ≥ 2 (default 10) [CP]
 * @param yieldDropMinimumPoints fewest points from ReH to the bottom of its force drop for the drop to
 *     count as resolved by the sampling rate, ≥ 1 (default 3) [CP]
 */
public record TensileParameters(List<Double> proofOffsetsPercent, List<Double> totalExtensionsPercent,
        double modulusWindowLowerFraction, double modulusWindowUpperFraction, int modulusMaxIterations,
        int modulusMinimumPoints, double modulusMinimumRSquared, boolean originCorrection, double yieldDropPercent,
        double yieldHoldStrainPercent, double turningPointHysteresisPercent, double fractureDropPercentOfFmax,
        int fractureDropWindowPoints, double fractureFallbackPercentOfFmax, double flatMaximumTolerancePercent,
        int minimumPoints, List<Double> elasticStrainRatesPerS, List<Double> yieldStrainRatesPerS,
        List<Double> hardeningStrainRatesPerS, double strainRateTolerancePercent, UncertaintyInputs uncertainty,
        RoundingRule rounding, Double machineComplianceMmPerN, boolean modulusFromCrosshead, boolean slopeFromLoop,
        double loopMinimumDropPercent, int extensometerFreezePoints, int yieldDropMinimumPoints) {

    private static final TensileParameters DEFAULTS = new TensileParameters(List.of(0.2), List.of(0.5), 0.10, 0.40,
            20, 5, 0.995, true, 0.5, 0.05, 0.2, 25, 5, 10, 0.1, 10, List.of(0.00025), List.of(0.00025, 0.002),
            List.of(0.0067), 20, UncertaintyInputs.defaults(), RoundingRule.ISO_6892_1, null, false, true, 20, 10, 3);

    /** Validates ranges and freezes the lists. */
    public TensileParameters {
        proofOffsetsPercent = percents("proofOffsetsPercent", proofOffsetsPercent);
        totalExtensionsPercent = percents("totalExtensionsPercent", totalExtensionsPercent);
        elasticStrainRatesPerS = rates("elasticStrainRatesPerS", elasticStrainRatesPerS);
        yieldStrainRatesPerS = rates("yieldStrainRatesPerS", yieldStrainRatesPerS);
        hardeningStrainRatesPerS = rates("hardeningStrainRatesPerS", hardeningStrainRatesPerS);
        if (!(modulusWindowLowerFraction >= 0 && modulusWindowLowerFraction < modulusWindowUpperFraction
                && modulusWindowUpperFraction < 1)) {
            throw new AnalysisRejected("modulus window must satisfy 0 ≤ lower < upper < 1, got "
                    + modulusWindowLowerFraction + " to " + modulusWindowUpperFraction);
        }
        atLeast("modulusMaxIterations", modulusMaxIterations, 1);
        atLeast("modulusMinimumPoints", modulusMinimumPoints, 3);
        atLeast("fractureDropWindowPoints", fractureDropWindowPoints, 1);
        atLeast("minimumPoints", minimumPoints, 10);
        if (!(modulusMinimumRSquared >= 0 && modulusMinimumRSquared <= 1)) {
            throw new AnalysisRejected("modulusMinimumRSquared must be in [0, 1], got " + modulusMinimumRSquared);
        }
        positive("yieldDropPercent", yieldDropPercent);
        positive("yieldHoldStrainPercent", yieldHoldStrainPercent);
        positive("turningPointHysteresisPercent", turningPointHysteresisPercent);
        positive("fractureDropPercentOfFmax", fractureDropPercentOfFmax);
        positive("fractureFallbackPercentOfFmax", fractureFallbackPercentOfFmax);
        positive("strainRateTolerancePercent", strainRateTolerancePercent);
        if (!(flatMaximumTolerancePercent >= 0 && flatMaximumTolerancePercent < 100)) {
            throw new AnalysisRejected("flatMaximumTolerancePercent must be in [0, 100), got " + flatMaximumTolerancePercent);
        }
        if (machineComplianceMmPerN != null && !(machineComplianceMmPerN >= 0 && machineComplianceMmPerN < 1)) {
            throw new AnalysisRejected("machineComplianceMmPerN must be in [0, 1) mm/N, got " + machineComplianceMmPerN);
        }
        if (!(loopMinimumDropPercent > 0 && loopMinimumDropPercent < 100)) {
            throw new AnalysisRejected("loopMinimumDropPercent must be in (0, 100), got " + loopMinimumDropPercent);
        }
        atLeast("extensometerFreezePoints", extensometerFreezePoints, 2);
        atLeast("yieldDropMinimumPoints", yieldDropMinimumPoints, 1);
        if (uncertainty == null || rounding == null) {
            throw new AnalysisRejected("uncertainty and rounding are required");
        }
    }

    /**
     * The defaults described on each component.
     *
     * @return the default parameters
     */
    public static TensileParameters defaults() {
        return DEFAULTS;
    }

    /**
     * All parameters as plain data with stable, ordered keys (component names; uncertainty inputs as
     * {@code uncertainty.<name>}; enums by name; lists as lists of Double), for storing as JSON.
     *
     * @return an unmodifiable ordered map
     */
    public Map<String, Object> asMap() {
        return TensileParameterMap.toMap(this);
    }

    /**
     * Rebuilds parameters from {@link #asMap()} output (numbers may come back as any {@link Number}).
     * Missing keys take their default; unknown keys are rejected so a typo is not silently ignored.
     *
     * @param map the stored parameters
     * @return the parameters, equal to the ones that produced the map
     * @throws AnalysisRejected naming an unknown key or a value of the wrong type
     */
    public static TensileParameters fromMap(Map<String, Object> map) {
        return TensileParameterMap.fromMap(map);
    }

    /**
     * The same parameters with other proof offsets.
     *
     * @param offsets offsets in % of Le, e.g. 0.1, 0.2, 1
     * @return new parameters
     */
    public TensileParameters withProofOffsetsPercent(Double... offsets) {
        return toBuilder().proofOffsetsPercent(List.of(offsets)).build();
    }

    /**
     * The same parameters with other total extensions.
     *
     * @param extensions total extensions in % of Le
     * @return new parameters
     */
    public TensileParameters withTotalExtensionsPercent(Double... extensions) {
        return toBuilder().totalExtensionsPercent(List.of(extensions)).build();
    }

    /**
     * The same parameters with another rounding rule.
     *
     * @param rule the rule set
     * @return new parameters
     */
    public TensileParameters withRounding(RoundingRule rule) {
        return toBuilder().rounding(rule).build();
    }

    /**
     * The same parameters with other uncertainty inputs.
     *
     * @param inputs the inputs
     * @return new parameters
     */
    public TensileParameters withUncertainty(UncertaintyInputs inputs) {
        return toBuilder().uncertainty(inputs).build();
    }

    /**
     * A builder starting from these values.
     *
     * @return a builder
     */
    public TensileParametersBuilder toBuilder() {
        return new TensileParametersBuilder(this);
    }

    private static List<Double> percents(String name, List<Double> values) {
        if (values == null) {
            throw new AnalysisRejected(name + " is required");
        }
        List<Double> copy = List.copyOf(values);
        for (Double v : copy) {
            if (!(v > 0 && v < 100)) {
                throw new AnalysisRejected(name + " values must be in (0, 100) %, got " + v);
            }
        }
        if (copy.stream().distinct().count() != copy.size()) {
            throw new AnalysisRejected(name + " must not repeat a value, got " + copy);
        }
        return copy;
    }

    private static List<Double> rates(String name, List<Double> values) {
        if (values == null || values.isEmpty()) {
            throw new AnalysisRejected(name + " needs at least one rate");
        }
        List<Double> copy = List.copyOf(values);
        for (Double v : copy) {
            if (!(v > 0) || v.isInfinite()) {
                throw new AnalysisRejected(name + " values must be positive and finite, got " + v);
            }
        }
        return copy;
    }

    private static void atLeast(String name, int value, int min) {
        if (value < min) {
            throw new AnalysisRejected(name + " must be ≥ " + min + ", got " + value);
        }
    }

    private static void positive(String name, double value) {
        if (!(value > 0) || !Double.isFinite(value)) {
            throw new AnalysisRejected(name + " must be positive and finite, got " + value);
        }
    }
}
