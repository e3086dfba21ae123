package org.specimenledger.testing;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.specimenledger.analysis.AnalysisWarning;
import org.specimenledger.analysis.CyclicResult;
import org.specimenledger.analysis.LoadingCycle;
import org.specimenledger.analysis.PropertyResult;
import org.specimenledger.analysis.ControlRateCheck;
import org.specimenledger.analysis.StrainRateCheck;
import org.specimenledger.analysis.TensileResult;
import org.specimenledger.curve.RawCurve;

/**
 * Turns the engine's results into plain, ordered JSON-ready maps: the shape the API returns and the
 * analysis records store. A value that was not determined is {@code null}, never NaN (NaN is not JSON).
 */
public final class AnalysisReports {

    private AnalysisReports() {
    }

    /** What was read: fingerprint, size, points and the channels found. */
    public static Map<String, Object> input(RawCurve curve) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("sha256", curve.sha256());
        m.put("bytes", curve.byteCount());
        m.put("points", curve.size());
        m.put("channels", curve.channels().stream().map(c -> Map.of("channel", c.channel().name().toLowerCase(),
                "unit", c.unit(), "column", c.column())).toList());
        m.put("metadata", curve.metadata());
        m.put("readerWarnings", curve.warnings());
        return m;
    }

    public static Map<String, Object> tensile(TensileResult r) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("method", r.methodVersion());
        m.put("mode", "tensile");
        m.put("yielding", r.yielding().name());
        Map<String, Object> properties = new LinkedHashMap<>();
        r.properties().forEach((symbol, p) -> properties.put(symbol, property(p)));
        m.put("properties", properties);
        m.put("strainRates", r.strainRates().stream().map(AnalysisReports::strainRate).toList());
        m.put("warnings", warnings(r.warnings()));
        m.put("parameters", r.parameters().asMap());
        return m;
    }

    public static Map<String, Object> cyclic(CyclicResult r) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("method", r.methodVersion());
        m.put("mode", "cyclic");
        m.put("turningPoints", r.turningPoints());
        List<Map<String, Object>> cycles = new ArrayList<>();
        for (LoadingCycle c : r.cycles()) {
            Map<String, Object> cm = new LinkedHashMap<>();
            cm.put("number", c.number());
            cm.put("startIndex", c.startIndex());
            cm.put("peakIndex", c.peakIndex());
            cm.put("endIndex", c.endIndex());
            cm.put("peakForceN", finite(c.peakForceN()));
            cm.put("peakExtensionMm", finite(c.peakExtensionMm()));
            cm.put("loadingEnergy", finite(c.loadingEnergyJ()));
            cm.put("returnedEnergy", finite(c.returnedEnergyJ()));
            cm.put("hysteresisEnergy", finite(c.hysteresisEnergyJ()));
            cm.put("energyUnit", "J");
            cm.put("lossRatio", finite(c.lossRatioPercent()));
            cm.put("residualExtensionMm", finite(c.residualExtensionMm()));
            cm.put("residualAtZeroForce", c.residualAtZeroForce());
            cycles.add(cm);
        }
        m.put("cycles", cycles);
        m.put("warnings", warnings(r.warnings()));
        m.put("parameters", r.parameters().asMap());
        return m;
    }

    private static Map<String, Object> property(PropertyResult p) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("value", finite(p.value()));
        m.put("unit", p.unit());
        m.put("reported", p.reported());
        m.put("status", p.status().name());
        m.put("reason", p.reason());
        m.put("expandedUncertainty", p.expandedUncertainty() == null ? null : finite(p.expandedUncertainty()));
        m.put("evidence", p.evidence());
        return m;
    }

    private static Map<String, Object> strainRate(StrainRateCheck s) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("phase", s.phase().name());
        m.put("status", s.status().name());
        m.put("measuredPerS", finite(s.measuredPerS()));
        m.put("nominalPerS", finite(s.nominalPerS()));
        m.put("lowerPerS", finite(s.lowerPerS()));
        m.put("upperPerS", finite(s.upperPerS()));
        m.put("withinRange", s.withinRange());
        m.put("firstIndex", s.firstIndex() < 0 ? null : s.firstIndex());
        m.put("lastIndex", s.lastIndex() < 0 ? null : s.lastIndex());
        m.put("reason", s.reason());
        return m;
    }

    /** One method B or ASTM rate check, with its rule, range, unit and source. */
    static Map<String, Object> controlRate(ControlRateCheck c) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("rule", c.rule().name());
        m.put("phase", c.rule().phase().name());
        m.put("quantity", c.rule().quantity().name());
        m.put("unit", c.rule().quantity().unit());
        m.put("status", c.status().name());
        m.put("measured", finite(c.measured()));
        m.put("lower", c.rule().lower());
        m.put("upper", c.rule().upper());
        m.put("withinRange", c.withinRange());
        m.put("firstIndex", c.firstIndex() < 0 ? null : c.firstIndex());
        m.put("lastIndex", c.lastIndex() < 0 ? null : c.lastIndex());
        m.put("source", c.rule().source());
        m.put("reason", c.reason());
        return m;
    }

    private static List<Map<String, String>> warnings(List<AnalysisWarning> warnings) {
        return warnings.stream().map(w -> Map.of("code", w.code(), "message", w.message())).toList();
    }

    private static Double finite(double v) {
        return Double.isFinite(v) ? v : null;
    }
}
