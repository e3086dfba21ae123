package org.specimenledger.testing;

import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.specimenledger.analysis.AnalysisWarning;
import org.specimenledger.analysis.ControlRateCheck;
import org.specimenledger.analysis.ControlRateRule;
import org.specimenledger.analysis.CyclicResult;
import org.specimenledger.analysis.LoadingCycle;
import org.specimenledger.analysis.PropertyResult;
import org.specimenledger.analysis.StrainRateCheck;
import org.specimenledger.analysis.StrainRatePhase;
import org.specimenledger.analysis.TensileResult;

/**
 * The checks shown with the results of an analysis, from the run's registered conditions, the geometry and
 * calibrations used and the engine's result. Pure and deterministic, so a replay recomputes the same flags.
 */
final class ResultFlags {

    private ResultFlags() {
    }

    static List<ResultFlag> of(StandardRequirements table, RunConditions run, GeometryUsed geometry,
            List<CalibrationUsed> calibrations, TensileResult tensile, CyclicResult cyclic,
            List<ControlRateCheck> controlRates) {
        List<ResultFlag> flags = new ArrayList<>();
        if (run.overrideReason() != null) {
            flags.add(new ResultFlag(ResultFlag.CALIBRATION_OVERRIDE, "the calibration gate refused this run and "
                    + run.overrideBy() + " accepted it: " + run.overrideReason(), null));
        } else {
            for (CalibrationUsed c : calibrations) {
                if (!c.validOnTestDate()) {
                    // the run passed the gate at registration; the register has changed since (e.g. a withdrawal)
                    flags.add(new ResultFlag(ResultFlag.CALIBRATION_NO_LONGER_VALID, c.role().title() + " "
                            + c.assetId() + " is no longer calibrated for the test date: " + c.reason(), null));
                }
            }
        }
        StandardRequirements.Requirement req = table.of(run.standard());
        if (table.temperatureOutside(run.standard(), run.temperatureC())) {
            flags.add(new ResultFlag(ResultFlag.TEMPERATURE_OUTSIDE_RANGE, "test temperature "
                    + run.temperatureC().toPlainString() + " °C is outside " + req.minTemperatureC().toPlainString()
                    + "–" + req.maxTemperatureC().toPlainString() + " °C (" + req.source() + ")", null));
        }
        if (tensile != null) {
            tensileFlags(run, geometry, tensile, flags);
            controlRateFlags(controlRates, tensile, flags);
            forceRange(calibrations, tensile.property("Fm").isDetermined() ? tensile.property("Fm").value()
                    : Double.NaN, flags);
        }
        if (cyclic != null) {
            double peak = cyclic.cycles().stream().mapToDouble(LoadingCycle::peakForceN).filter(Double::isFinite)
                    .max().orElse(Double.NaN);
            forceRange(calibrations, peak, flags);
        }
        return List.copyOf(flags);
    }

    private static void tensileFlags(RunConditions run, GeometryUsed geometry, TensileResult r,
            List<ResultFlag> flags) {
        if (StandardRequirements.strainRateRangesApply(run.standard(), run.method())) {
            for (StrainRateCheck s : r.strainRates()) {
                if (Boolean.FALSE.equals(s.withinRange())) {
                    flags.add(new ResultFlag(ResultFlag.STRAIN_RATE_OUTSIDE_RANGE, s.phase() + " strain rate "
                            + number(s.measuredPerS()) + " s⁻¹ is outside " + number(s.lowerPerS()) + "–"
                            + number(s.upperPerS()) + " s⁻¹ (ISO 6892-1 method A range about "
                            + number(s.nominalPerS()) + " s⁻¹ [M])", propertiesOf(s.phase(), r)));
                }
            }
        }
        if ("OUTSIDE_MIDDLE_THIRD".equals(geometry.fractureZone())) {
            String where = geometry.fractureDistanceMm() == null ? ""
                    : " (" + geometry.fractureDistanceMm().toPlainString() + " mm from the nearest gauge mark, L0/3 = "
                            + geometry.l0Mm().divide(BigDecimal.valueOf(3), 2, java.math.RoundingMode.HALF_EVEN)
                                    .toPlainString() + " mm)";
            flags.add(new ResultFlag(ResultFlag.FRACTURE_OUTSIDE_VALID_ZONE, "fracture outside the middle third of"
                    + " the gauge length" + where + "; A counts only if it meets the specified minimum"
                    + " (ISO 6892-1 [S]; ASTM E8: report the location [S])", List.of("A")));
        }
        recordFlags(r, flags);
        PropertyResult a = r.property("A");
        if (a.isDetermined() && a.reason() != null && a.reason().startsWith("from extensometer")) {
            flags.add(new ResultFlag(ResultFlag.ELONGATION_FROM_EXTENSOMETER, "A was taken from the extensometer"
                    + " record (elastic part removed), not from the broken pieces; Lu was not measured",
                    List.of("A")));
        }
    }

    /**
     * How the record was read (toe, crosshead, loop) and what its data quality warrants, from the engine's
     * warnings, each with the properties it concerns.
     */
    private static void recordFlags(TensileResult r, List<ResultFlag> flags) {
        List<String> strainBased = new ArrayList<>();
        List<String> fromCrosshead = new ArrayList<>();
        r.properties().forEach((symbol, p) -> {
            if (symbol.startsWith("Rp") || symbol.startsWith("Rt") || List.of("Ae", "Agt", "Ag", "At", "A").contains(symbol)) {
                strainBased.add(symbol);
            }
            if (p.isDetermined() && p.evidence().containsKey("extensionSource")) {
                fromCrosshead.add(symbol);
            }
        });
        for (AnalysisWarning w : r.warnings()) {
            switch (w.code()) {
                case "TOE_COMPENSATED" -> flags.add(new ResultFlag(ResultFlag.TOE_COMPENSATED, w.message()
                        + " (toe compensation, ASTM E8/E8M [S]; ISO 6892-1 origin correction [M])", strainBased));
                case "EXTENSOMETER_REMOVED" -> flags.add(new ResultFlag(ResultFlag.EXTENSION_FROM_CROSSHEAD,
                        w.message() + "; values from the crosshead carry its lower accuracy", fromCrosshead));
                case "CROSSHEAD_ONLY" -> {
                    List<String> all = new ArrayList<>(strainBased);
                    all.add(0, "E");
                    flags.add(new ResultFlag(ResultFlag.CROSSHEAD_ONLY, w.message() + "; E is "
                            + (r.property("E").isDetermined() ? "the apparent slope of crosshead data"
                                    : "not determinable from crosshead data"), all));
                }
                case "UNLOAD_RELOAD_LOOP" -> {
                    List<String> slope = new ArrayList<>();
                    slope.add("E");
                    r.properties().keySet().stream().filter(k -> k.startsWith("Rp")).forEach(slope::add);
                    flags.add(new ResultFlag(ResultFlag.UNLOAD_RELOAD_LOOP, w.message(), slope));
                }
                default -> {
                    if (ResultFlag.DATA_QUALITY.contains(w.code())) {
                        flags.add(new ResultFlag(w.code(), w.message(), qualityProperties(w.code())));
                    }
                }
            }
        }
    }

    private static List<String> qualityProperties(String code) {
        return switch (code) {
            case "FORCE_CLIPPED" -> List.of("Fm", "Rm");
            case "YIELD_DROP_UNDER_SAMPLED" -> List.of("ReH");
            case "EXTENSOMETER_FROZEN" -> List.of("Agt", "Ag", "At", "A");
            default -> null;
        };
    }

    /**
     * A method B or ASTM rate outside its range. For ASTM, up to yield either the rate of stressing or the
     * rate of straining may be the controlled one, so that phase is flagged only when neither is in range.
     */
    private static void controlRateFlags(List<ControlRateCheck> checks, TensileResult r, List<ResultFlag> flags) {
        boolean astmYieldMet = checks.stream().anyMatch(c -> c.rule().name().startsWith("ASTM")
                && c.rule().phase() == StrainRatePhase.ELASTIC && Boolean.TRUE.equals(c.withinRange()));
        for (ControlRateCheck c : checks) {
            if (!Boolean.FALSE.equals(c.withinRange())) {
                continue;
            }
            if (astmYieldMet && c.rule().name().startsWith("ASTM") && c.rule().phase() == StrainRatePhase.ELASTIC) {
                continue;
            }
            String code = c.rule().quantity() == ControlRateRule.Quantity.STRESS_RATE
                    ? ResultFlag.STRESS_RATE_OUTSIDE_RANGE : ResultFlag.STRAIN_RATE_OUTSIDE_RANGE;
            String unit = c.rule().quantity().unit();
            flags.add(new ResultFlag(code, c.rule().name() + ": " + (c.rule().quantity()
                    == ControlRateRule.Quantity.STRESS_RATE ? "stress rate " : "strain rate ") + number(c.measured())
                    + " " + unit + " is outside " + number(c.rule().lower()) + "–" + number(c.rule().upper()) + " "
                    + unit + " (" + c.rule().source() + ")", propertiesOf(c.rule().phase(), r)));
        }
    }

    private static void forceRange(List<CalibrationUsed> calibrations, double maxForceN, List<ResultFlag> flags) {
        if (!Double.isFinite(maxForceN)) {
            return;
        }
        for (CalibrationUsed c : calibrations) {
            if (c.role() != InstrumentRole.FORCE_TRANSDUCER || c.rangeN() == null) {
                continue;
            }
            if (maxForceN > c.rangeN().doubleValue()) {
                flags.add(new ResultFlag(ResultFlag.FORCE_OUTSIDE_CALIBRATED_RANGE, "maximum force "
                        + number(maxForceN) + " N exceeds the " + c.rangeN().toPlainString() + " N range used", null));
            } else if (c.rangeLowerLimitN() != null && maxForceN < c.rangeLowerLimitN().doubleValue()) {
                flags.add(new ResultFlag(ResultFlag.FORCE_OUTSIDE_CALIBRATED_RANGE, "maximum force "
                        + number(maxForceN) + " N is below " + c.rangeLowerLimitN().toPlainString()
                        + " N, where the verified part of the " + c.rangeN().toPlainString()
                        + " N range begins (ISO 7500-1 [M])", null));
            }
        }
    }

    /** Which properties a phase's rate governs [M: ISO 6892-1 method A, DOMAIN.md]. */
    private static List<String> propertiesOf(StrainRatePhase phase, TensileResult r) {
        List<String> out = new ArrayList<>();
        switch (phase) {
            case ELASTIC -> {
                out.add("ReH");
                r.properties().keySet().stream().filter(k -> k.startsWith("Rp") || k.startsWith("Rt")).forEach(out::add);
            }
            case YIELD -> out.addAll(List.of("ReL", "Ae"));
            case HARDENING -> out.addAll(List.of("Rm", "Agt", "Ag", "A", "Z"));
            default -> throw new IllegalStateException("unknown phase " + phase);
        }
        return out;
    }

    private static String number(double v) {
        return String.format(Locale.ROOT, "%.4g", v);
    }
}
