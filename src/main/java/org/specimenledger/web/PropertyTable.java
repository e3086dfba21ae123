package org.specimenledger.web;

import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Set;
import org.specimenledger.testing.AnalysisRunView;
import org.specimenledger.testing.ResultFlag;

/**
 * The property table of one analysis as the page shows it: per ISO 6892-1 symbol the reported value
 * (rounded as the analysis stored it), the full value, unit, status, reason and expanded uncertainty;
 * and the run's flags. Cyclic runs list their loops instead.
 */
record PropertyTable(List<Row> rows, List<Cycle> cycles, List<ResultFlag> flags) {

    record Row(String symbol, String reported, String value, String unit, String status, String reason,
            String uncertainty) {
    }

    record Cycle(String number, String loading, String returned, String hysteresis, String lossRatio) {
    }

    /** One symbol in two analyses; {@code differs} when the reported values are not the same. */
    record Pair(String symbol, Row left, Row right) {
        public boolean differs() {
            return !Objects.equals(left == null ? null : left.reported(), right == null ? null : right.reported())
                    || !Objects.equals(left == null ? null : left.status(), right == null ? null : right.status());
        }
    }

    /** One parameter in two analyses. */
    record ParameterPair(String key, String left, String right) {
        public boolean differs() {
            return !Objects.equals(left, right);
        }
    }

    Row row(String symbol) {
        return rows.stream().filter(r -> r.symbol().equals(symbol)).findFirst().orElse(null);
    }

    static PropertyTable of(AnalysisRunView a) {
        List<Row> rows = new ArrayList<>();
        for (Map.Entry<String, Map<String, Object>> e : a.properties().entrySet()) {
            Map<String, Object> p = e.getValue();
            rows.add(new Row(e.getKey(), text(p.get("reported")), text(p.get("value")), text(p.get("unit")),
                    text(p.get("status")), text(p.get("reason")), text(p.get("expandedUncertainty"))));
        }
        List<Cycle> cycles = new ArrayList<>();
        if (a.results().get("cycles") instanceof List<?> list) {
            for (Object o : list) {
                if (o instanceof Map<?, ?> c) {
                    cycles.add(new Cycle(text(c.get("number")), text(c.get("loadingEnergy")),
                            text(c.get("returnedEnergy")), text(c.get("hysteresisEnergy")), text(c.get("lossRatio"))));
                }
            }
        }
        return new PropertyTable(rows, cycles, a.flags() == null ? List.of() : a.flags());
    }

    static List<ParameterPair> parameterPairs(AnalysisRunView a, AnalysisRunView b) {
        Set<String> keys = new LinkedHashSet<>(a.parameters().keySet());
        keys.addAll(b.parameters().keySet());
        return keys.stream().map(k -> new ParameterPair(k, text(a.parameters().get(k)), text(b.parameters().get(k))))
                .toList();
    }

    private static String text(Object o) {
        return o == null ? "" : o.toString();
    }
}
