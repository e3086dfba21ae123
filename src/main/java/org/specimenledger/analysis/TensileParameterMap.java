package org.specimenledger.analysis;

import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.function.BiConsumer;
import java.util.function.Function;

/** Converts {@link TensileParameters} to and from an ordered map of plain data. */
final class TensileParameterMap {

    private record Key(String name, Function<TensileParameters, Object> get, BiConsumer<TensileParametersBuilder, Object> set) {
    }

    private static final String U = "uncertainty.";
    /** Component names of {@link UncertaintyInputs}, in record order; stored as {@code uncertainty.<name>}. */
    private static final List<String> UNCERTAINTY_KEYS = List.of("forceClassPercent", "extensometerClassPercent",
            "extensometerBiasLimitUm", "crossSection", "firstDimensionMm", "secondDimensionMm", "uFirstDimensionMm",
            "uSecondDimensionMm", "uS0Mm2", "uLeMm");
    private static final int SHAPE_SLOT = 3;
    private static final List<Key> KEYS = List.of(
            new Key("proofOffsetsPercent", TensileParameters::proofOffsetsPercent, (b, v) -> b.proofOffsetsPercent = list("proofOffsetsPercent", v)),
            new Key("totalExtensionsPercent", TensileParameters::totalExtensionsPercent, (b, v) -> b.totalExtensionsPercent = list("totalExtensionsPercent", v)),
            new Key("modulusWindowLowerFraction", TensileParameters::modulusWindowLowerFraction, (b, v) -> b.modulusWindowLowerFraction = num("modulusWindowLowerFraction", v)),
            new Key("modulusWindowUpperFraction", TensileParameters::modulusWindowUpperFraction, (b, v) -> b.modulusWindowUpperFraction = num("modulusWindowUpperFraction", v)),
            new Key("modulusMaxIterations", TensileParameters::modulusMaxIterations, (b, v) -> b.modulusMaxIterations = integer("modulusMaxIterations", v)),
            new Key("modulusMinimumPoints", TensileParameters::modulusMinimumPoints, (b, v) -> b.modulusMinimumPoints = integer("modulusMinimumPoints", v)),
            new Key("modulusMinimumRSquared", TensileParameters::modulusMinimumRSquared, (b, v) -> b.modulusMinimumRSquared = num("modulusMinimumRSquared", v)),
            new Key("originCorrection", TensileParameters::originCorrection, (b, v) -> b.originCorrection = bool("originCorrection", v)),
            new Key("yieldDropPercent", TensileParameters::yieldDropPercent, (b, v) -> b.yieldDropPercent = num("yieldDropPercent", v)),
            new Key("yieldHoldStrainPercent", TensileParameters::yieldHoldStrainPercent, (b, v) -> b.yieldHoldStrainPercent = num("yieldHoldStrainPercent", v)),
            new Key("turningPointHysteresisPercent", TensileParameters::turningPointHysteresisPercent, (b, v) -> b.turningPointHysteresisPercent = num("turningPointHysteresisPercent", v)),
            new Key("fractureDropPercentOfFmax", TensileParameters::fractureDropPercentOfFmax, (b, v) -> b.fractureDropPercentOfFmax = num("fractureDropPercentOfFmax", v)),
            new Key("fractureDropWindowPoints", TensileParameters::fractureDropWindowPoints, (b, v) -> b.fractureDropWindowPoints = integer("fractureDropWindowPoints", v)),
            new Key("fractureFallbackPercentOfFmax", TensileParameters::fractureFallbackPercentOfFmax, (b, v) -> b.fractureFallbackPercentOfFmax = num("fractureFallbackPercentOfFmax", v)),
            new Key("flatMaximumTolerancePercent", TensileParameters::flatMaximumTolerancePercent, (b, v) -> b.flatMaximumTolerancePercent = num("flatMaximumTolerancePercent", v)),
            new Key("minimumPoints", TensileParameters::minimumPoints, (b, v) -> b.minimumPoints = integer("minimumPoints", v)),
            new Key("elasticStrainRatesPerS", TensileParameters::elasticStrainRatesPerS, (b, v) -> b.elasticStrainRatesPerS = list("elasticStrainRatesPerS", v)),
            new Key("yieldStrainRatesPerS", TensileParameters::yieldStrainRatesPerS, (b, v) -> b.yieldStrainRatesPerS = list("yieldStrainRatesPerS", v)),
            new Key("hardeningStrainRatesPerS", TensileParameters::hardeningStrainRatesPerS, (b, v) -> b.hardeningStrainRatesPerS = list("hardeningStrainRatesPerS", v)),
            new Key("strainRateTolerancePercent", TensileParameters::strainRateTolerancePercent, (b, v) -> b.strainRateTolerancePercent = num("strainRateTolerancePercent", v)),
            new Key("rounding", p -> p.rounding().name(), (b, v) -> b.rounding = rule(v)),
            // Added with tensile/1.1.0; a map stored before lacks them and takes the defaults.
            new Key("machineComplianceMmPerN", TensileParameters::machineComplianceMmPerN, (b, v) -> b.machineComplianceMmPerN = v == null ? null : num("machineComplianceMmPerN", v)),
            new Key("modulusFromCrosshead", TensileParameters::modulusFromCrosshead, (b, v) -> b.modulusFromCrosshead = bool("modulusFromCrosshead", v)),
            new Key("slopeFromLoop", TensileParameters::slopeFromLoop, (b, v) -> b.slopeFromLoop = bool("slopeFromLoop", v)),
            new Key("loopMinimumDropPercent", TensileParameters::loopMinimumDropPercent, (b, v) -> b.loopMinimumDropPercent = num("loopMinimumDropPercent", v)),
            new Key("extensometerFreezePoints", TensileParameters::extensometerFreezePoints, (b, v) -> b.extensometerFreezePoints = integer("extensometerFreezePoints", v)),
            new Key("yieldDropMinimumPoints", TensileParameters::yieldDropMinimumPoints, (b, v) -> b.yieldDropMinimumPoints = integer("yieldDropMinimumPoints", v)));

    private TensileParameterMap() {
    }

    static Map<String, Object> toMap(TensileParameters p) {
        Map<String, Object> m = new LinkedHashMap<>();
        for (Key k : KEYS) {
            if (k.name().equals("rounding")) {
                Object[] u = uncertaintySlots(p.uncertainty());
                for (int i = 0; i < UNCERTAINTY_KEYS.size(); i++) {
                    m.put(U + UNCERTAINTY_KEYS.get(i), u[i] instanceof CrossSectionShape ? ((CrossSectionShape) u[i]).name() : u[i]);
                }
            }
            m.put(k.name(), k.get().apply(p));
        }
        return Collections.unmodifiableMap(m);
    }

    static TensileParameters fromMap(Map<String, Object> map) {
        if (map == null) {
            throw new AnalysisRejected("parameter map is required");
        }
        List<String> known = new ArrayList<>(toMap(TensileParameters.defaults()).keySet());
        for (String name : map.keySet()) {
            if (!known.contains(name)) {
                throw new AnalysisRejected("unknown tensile parameter '" + name + "'; known keys are " + known);
            }
        }
        TensileParametersBuilder b = TensileParameters.defaults().toBuilder();
        for (Key k : KEYS) {
            if (map.containsKey(k.name())) {
                k.set().accept(b, map.get(k.name()));
            }
        }
        // The uncertainty inputs are validated together by their record, so they are collected first.
        Object[] u = uncertaintySlots(UncertaintyInputs.defaults());
        for (int i = 0; i < UNCERTAINTY_KEYS.size(); i++) {
            String name = U + UNCERTAINTY_KEYS.get(i);
            if (map.containsKey(name)) {
                u[i] = i == SHAPE_SLOT ? shape(map.get(name)) : num(name, map.get(name));
            }
        }
        b.uncertainty = new UncertaintyInputs((double) u[0], (double) u[1], (double) u[2], (CrossSectionShape) u[3],
                (double) u[4], (double) u[5], (double) u[6], (double) u[7], (double) u[8], (double) u[9]);
        return b.build();
    }

    private static Object[] uncertaintySlots(UncertaintyInputs u) {
        return new Object[] {u.forceClassPercent(), u.extensometerClassPercent(), u.extensometerBiasLimitUm(),
                u.crossSection(), u.firstDimensionMm(), u.secondDimensionMm(), u.uFirstDimensionMm(),
                u.uSecondDimensionMm(), u.uS0Mm2(), u.uLeMm()};
    }

    private static CrossSectionShape shape(Object v) {
        try {
            return CrossSectionShape.valueOf(String.valueOf(v));
        } catch (IllegalArgumentException e) {
            throw new AnalysisRejected("unknown uncertainty.crossSection '" + v + "'");
        }
    }

    private static RoundingRule rule(Object v) {
        try {
            return RoundingRule.valueOf(String.valueOf(v));
        } catch (IllegalArgumentException e) {
            throw new AnalysisRejected("unknown rounding rule '" + v + "'");
        }
    }

    private static double num(String name, Object v) {
        if (!(v instanceof Number)) {
            throw new AnalysisRejected("tensile parameter " + name + " must be a number, got " + v);
        }
        return ((Number) v).doubleValue();
    }

    private static int integer(String name, Object v) {
        double d = num(name, v);
        if (d != Math.rint(d) || Math.abs(d) > Integer.MAX_VALUE) {
            throw new AnalysisRejected("tensile parameter " + name + " must be an integer, got " + v);
        }
        return (int) d;
    }

    private static boolean bool(String name, Object v) {
        if (!(v instanceof Boolean)) {
            throw new AnalysisRejected("tensile parameter " + name + " must be true or false, got " + v);
        }
        return (Boolean) v;
    }

    private static List<Double> list(String name, Object v) {
        if (!(v instanceof List)) {
            throw new AnalysisRejected("tensile parameter " + name + " must be a list of numbers, got " + v);
        }
        List<Double> out = new ArrayList<>();
        for (Object o : (List<?>) v) {
            out.add(num(name, o));
        }
        return out;
    }
}
