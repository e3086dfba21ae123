package org.specimenledger.testing;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.specimenledger.analysis.AnalysisRejected;
import org.specimenledger.analysis.ControlRateCheck;
import org.specimenledger.analysis.CrossSectionShape;
import org.specimenledger.analysis.PropertyResult;
import org.specimenledger.analysis.StrainRates;
import org.specimenledger.analysis.CyclicAnalysis;
import org.specimenledger.analysis.CyclicParameters;
import org.specimenledger.analysis.CyclicResult;
import org.specimenledger.analysis.RoundingRule;
import org.specimenledger.analysis.TensileAnalysis;
import org.specimenledger.analysis.TensileParameters;
import org.specimenledger.analysis.TensileResult;
import org.specimenledger.analysis.TensileSpecimen;
import org.specimenledger.analysis.UncertaintyInputs;
import org.specimenledger.curve.RawCurve;
import org.specimenledger.shared.RuleViolation;
import tools.jackson.databind.JsonNode;

/**
 * One computation from a read curve: the engine run with a stored parameter set, and everything an
 * analysis run keeps of it as normalised JSON trees. Both the analysis on upload and the replay go through
 * here, so a replay runs exactly the code path that produced the stored values.
 */
final class AnalysisComputation {

    /**
     * What an analysis stores.
     *
     * @param parameters the complete parameter set as stored (the engine's own {@code asMap()})
     */
    record Outcome(String methodVersion, JsonNode parameters, JsonNode input, JsonNode results, JsonNode flags,
            List<ResultFlag> flagList) {

        /** The tree a replay compares: input, results and flags together. */
        JsonNode comparable() {
            var node = StoredJson.MAPPER.createObjectNode();
            node.set("input", input);
            node.set("results", results);
            node.set("flags", flags);
            return node;
        }
    }

    private AnalysisComputation() {
    }

    /**
     * Runs the engine.
     *
     * @param parameters a complete or partial parameter map of the mode's engine (missing keys take the
     *                   engine's defaults)
     * @throws RuleViolation naming {@code /parameters} when the map is not a valid parameter set
     * @throws org.specimenledger.analysis.AnalysisRejected when the engine cannot work with the arrays or geometry
     */
    static Outcome compute(RawCurve curve, TestMode mode, Map<String, Object> parameters, GeometryUsed geometry,
            RunConditions run, List<CalibrationUsed> calibrations, StandardRequirements table) {
        if (mode == TestMode.CYCLIC) {
            CyclicParameters p = cyclicParameters(parameters);
            CyclicResult r = cyclic(curve, p);
            List<ResultFlag> flags = ResultFlags.of(table, run, geometry, calibrations, null, r, List.of());
            return outcome(r.methodVersion(), p.asMap(), curve, AnalysisReports.cyclic(r), flags);
        }
        TensileParameters p = tensileParameters(parameters);
        TensileResult r = tensile(curve, geometry.tensileSpecimen(), p);
        List<ControlRateCheck> rates = controlRates(run, curve, geometry, r, table.rates());
        List<ResultFlag> flags = ResultFlags.of(table, run, geometry, calibrations, r, null, rates);
        Map<String, Object> results = AnalysisReports.tensile(r);
        if (!rates.isEmpty()) {
            results.put("controlRates", rates.stream().map(AnalysisReports::controlRate).toList());
        }
        return outcome(r.methodVersion(), p.asMap(), curve, results, flags);
    }

    /**
     * The rate checks of ISO 6892-1 method B or ASTM E8/E8M, over the phases the engine found; none for
     * other standards and methods (method A's are the engine's own {@code strainRates}).
     */
    static List<ControlRateCheck> controlRates(RunConditions run, RawCurve curve, GeometryUsed geometry,
            TensileResult r, org.specimenledger.analysis.ControlRateRules rules) {
        double[] time = curve.hasTime() ? curve.timeS() : null;
        double s0 = geometry.s0Mm2().doubleValue();
        if (run.standard() == TestStandard.ISO_6892_1 && run.method() == ControlMethod.B) {
            PropertyResult e = r.property("E");
            return StrainRates.isoMethodB(time, curve.forceN(), s0, e != null && e.isDetermined() ? e.value()
                    : Double.NaN, elasticFit(r), r.strainRates(), rules);
        }
        if (run.standard() == TestStandard.ASTM_E8 || run.standard() == TestStandard.ASTM_E8M) {
            return StrainRates.astmE8(time, curve.forceN(), s0, elasticFit(r), r.strainRates(), rules);
        }
        return List.of();
    }

    /** The modulus fit window [first, last] from E's evidence, or null when E was not determined. */
    private static int[] elasticFit(TensileResult r) {
        PropertyResult e = r.property("E");
        if (e == null || !e.isDetermined() || !(e.evidence().get("firstIndex") instanceof Number first)
                || !(e.evidence().get("lastIndex") instanceof Number last)) {
            return null;
        }
        return new int[] {first.intValue(), last.intValue()};
    }

    /**
     * The tensile engine on every channel of a read curve: the crosshead, when the file has one, continues
     * an extensometer that stops and stands in for a missing one.
     */
    static TensileResult tensile(RawCurve curve, TensileSpecimen specimen, TensileParameters p) {
        return TensileAnalysis.analyse(curve.forceN(), curve.hasExtensometer() ? curve.extensionMm() : null,
                curve.hasTime() ? curve.timeS() : null, curve.hasCrosshead() ? curve.crossheadMm() : null, specimen, p);
    }

    /** The cyclic engine, which needs the extensometer over the whole record. */
    static CyclicResult cyclic(RawCurve curve, CyclicParameters p) {
        if (curve.extensometerPoints() < curve.size()) {
            throw new AnalysisRejected("a cyclic analysis needs the extension channel on every point; this file has "
                    + curve.extensometerPoints() + " of " + curve.size());
        }
        return CyclicAnalysis.analyse(curve.forceN(), curve.extensionMm(), p);
    }

    /**
     * The parameters a run starts with: the engine defaults, with the uncertainty budget taking the force
     * and extensometer classes of the calibrations used (instead of the class 1 the engine assumes), and
     * the ASTM rounding practice for ASTM runs.
     */
    static Map<String, Object> defaults(TestMode mode, TestStandard standard, List<CalibrationUsed> calibrations) {
        return defaults(mode, standard, calibrations, null, null);
    }

    /**
     * As {@link #defaults(TestMode, TestStandard, List)}, with u(S0) from the specimen's own dimension readings
     * (their spread and resolution, {@link DimensionUncertainty}) for round, flat and tube pieces; without
     * readings (an OTHER piece, or none given) no cross-section uncertainty is assumed.
     *
     * @param shape the specimen's shape name (ROUND, FLAT, TUBE, OTHER), or null
     * @param readings the original readings in mm by dimension symbol, or null
     */
    static Map<String, Object> defaults(TestMode mode, TestStandard standard, List<CalibrationUsed> calibrations,
            String shape, Map<String, List<java.math.BigDecimal>> readings) {
        if (mode == TestMode.CYCLIC) {
            return new LinkedHashMap<>(CyclicParameters.defaults().asMap());
        }
        UncertaintyInputs u = UncertaintyInputs.defaults();
        double force = u.forceClassPercent();
        double extensometer = u.extensometerClassPercent();
        double bias = u.extensometerBiasLimitUm();
        for (CalibrationUsed c : calibrations) {
            if (c.accuracyClass() == null) {
                continue;
            }
            double cls = Double.parseDouble(c.accuracyClass());
            if (c.role() == InstrumentRole.FORCE_TRANSDUCER) {
                force = cls; // ISO 7500-1: class k allows ±k % relative accuracy error [M]
            } else if (c.role() == InstrumentRole.EXTENSOMETER) {
                extensometer = cls; // ISO 9513: class k allows ±k % bias or 3k µm, the larger [M]
                bias = 3 * cls;
            }
        }
        UncertaintyInputs inputs = new UncertaintyInputs(force, extensometer, bias, CrossSectionShape.DIRECT, 0, 0, 0,
                0, 0, 0);
        inputs = withCrossSection(inputs, shape, readings);
        TensileParameters p = TensileParameters.defaults().withUncertainty(inputs);
        if (standard == TestStandard.ASTM_E8 || standard == TestStandard.ASTM_E8M) {
            p = p.withRounding(RoundingRule.ASTM_PRACTICE);
        }
        return new LinkedHashMap<>(p.asMap());
    }

    /** The inputs with u of each dimension from its readings, for the shapes whose S0 is computed from them. */
    private static UncertaintyInputs withCrossSection(UncertaintyInputs u, String shape,
            Map<String, List<java.math.BigDecimal>> readings) {
        if (shape == null || readings == null) {
            return u;
        }
        String[] symbols = switch (shape) {
            case "ROUND" -> new String[] {"d", null};
            case "FLAT" -> new String[] {"a", "b"};
            case "TUBE" -> new String[] {"a", "D"};
            default -> null;
        };
        if (symbols == null) {
            return u;
        }
        DimensionUncertainty.Estimate first = DimensionUncertainty.of(readings.get(symbols[0]));
        DimensionUncertainty.Estimate second = symbols[1] == null ? null : DimensionUncertainty.of(readings.get(symbols[1]));
        if (first == null || (symbols[1] != null && second == null)) {
            return u;
        }
        return u.withCrossSection(CrossSectionShape.valueOf(shape), first.meanMm(), first.standardMm(),
                second == null ? 0 : second.meanMm(), second == null ? 0 : second.standardMm());
    }

    /** The defaults with the requested keys replaced; an unknown key is refused when the engine reads it. */
    static Map<String, Object> merged(Map<String, Object> defaults, Map<String, Object> requested) {
        Map<String, Object> out = new LinkedHashMap<>(defaults);
        if (requested != null) {
            out.putAll(requested);
        }
        return out;
    }

    private static Outcome outcome(String methodVersion, Map<String, Object> parameters, RawCurve curve,
            Map<String, Object> results, List<ResultFlag> flags) {
        return new Outcome(methodVersion, StoredJson.tree(parameters), StoredJson.tree(AnalysisReports.input(curve)),
                StoredJson.tree(results), StoredJson.tree(flags), flags);
    }

    private static TensileParameters tensileParameters(Map<String, Object> map) {
        try {
            return TensileParameters.fromMap(map);
        } catch (IllegalArgumentException | ClassCastException e) {
            throw new RuleViolation("/parameters", e.getMessage());
        }
    }

    private static CyclicParameters cyclicParameters(Map<String, Object> map) {
        try {
            return CyclicParameters.fromMap(map);
        } catch (IllegalArgumentException | ClassCastException e) {
            throw new RuleViolation("/parameters", e.getMessage());
        }
    }
}
