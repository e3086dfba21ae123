package org.specimenledger.testing;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.stream.Collectors;

/**
 * A result set as CSV (RFC 4180: comma-separated, CRLF line ends, fields with a comma, quote or line end
 * quoted with inner quotes doubled), one row per test run. The header names each property with its unit,
 * e.g. {@code Rp0.2 [MPa]}; property cells hold the reported (rounded) value, empty when not determined.
 *
 * <p>Text cells are neutralised against formula injection: a spreadsheet opening the file runs a cell starting
 * with {@code = + - @}, tab or carriage return as a formula (OWASP's guidance on CSV injection [CP]), and some
 * also one starting with a line feed, with those signs after leading spaces, or with their full-width forms
 * (U+FF1D, U+FF0B, U+FF0D, U+FF20) [CP]. Such a cell gets a leading apostrophe. The specimen mark is typed by a
 * person; the other text columns are written by the service (identifiers, dates, codes, the software version)
 * and pass through the same rule, so no column depends on where its text came from. Number cells are left
 * alone: a negative value is a number, and an apostrophe would turn it into text. The stored data is unchanged.
 */
final class ResultTable {

    private static final List<String> FIXED = List.of("specimen", "test run", "test date", "standard", "mode",
            "validity", "analysis", "software version", "method version", "input SHA-256");

    private ResultTable() {
    }

    static String csv(List<ResultRow> rows) {
        Map<String, String> units = new LinkedHashMap<>();
        for (ResultRow r : rows) {
            r.properties().forEach((symbol, v) -> units.putIfAbsent(symbol, v.unit()));
        }
        StringBuilder out = new StringBuilder();
        List<String> header = new ArrayList<>(FIXED);
        units.forEach((symbol, unit) -> header.add(symbol + " [" + unit + "]"));
        header.add("cycles");
        header.add("flags");
        line(out, header);
        for (ResultRow r : rows) {
            List<String> cells = new ArrayList<>(List.of(r.labIdentifier(), r.testRunId().toString(),
                    r.testDate().toString(), r.standard().name(), r.mode().name(), r.validity().name(),
                    r.analysisId().toString(), r.softwareVersion(), r.methodVersion(), r.inputSha256()));
            cells.replaceAll(ResultTable::typedText);
            for (String symbol : units.keySet()) {
                ResultRow.Value v = r.properties().get(symbol);
                cells.add(v == null || v.reported() == null ? "" : v.reported());
            }
            cells.add(r.cycles() == null ? "" : r.cycles().toString());
            cells.add(typedText(r.flags().stream().map(ResultFlag::code).distinct().collect(Collectors.joining(" "))));
            line(out, cells);
        }
        return out.toString();
    }

    private static void line(StringBuilder out, List<String> cells) {
        for (int i = 0; i < cells.size(); i++) {
            if (i > 0) {
                out.append(',');
            }
            out.append(field(cells.get(i)));
        }
        out.append("\r\n");
    }

    /** A text as a cell that no spreadsheet evaluates. */
    static String typedText(String s) {
        if (s == null || s.isEmpty()) {
            return s;
        }
        char first = s.charAt(0);
        if (first == '\t' || first == '\r' || first == '\n') {
            return "'" + s;
        }
        String rest = s.stripLeading();
        if (rest.isEmpty()) {
            return s;
        }
        int c = rest.codePointAt(0);
        boolean formula = c == '=' || c == '+' || c == '-' || c == '@' || c == 0xFF1D || c == 0xFF0B || c == 0xFF0D
                || c == 0xFF20;
        return formula ? "'" + s : s;
    }

    static String field(String s) {
        if (s == null) {
            return "";
        }
        if (s.indexOf(',') >= 0 || s.indexOf('"') >= 0 || s.indexOf('\n') >= 0 || s.indexOf('\r') >= 0) {
            return '"' + s.replace("\"", "\"\"") + '"';
        }
        return s;
    }
}
