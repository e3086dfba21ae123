package org.specimenledger.testing;

import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Set;
import tools.jackson.databind.JsonNode;

/**
 * Compares a stored result tree with a recomputed one value by value. Two numbers are the same only when
 * they are the same double bit for bit ({@link Double#doubleToRawLongBits}) — or, when both are integers,
 * the same integer. A number stored as {@code 1.0E7} may come back from {@code jsonb} as {@code 10000000},
 * so an integer and a floating-point number are compared as doubles: the decimal text the database keeps
 * is exact, so the double it denotes is exactly the one written. Strings, booleans and nulls compare by
 * equality; objects by their keys (a key on one side only is a difference), arrays by position.
 */
final class ResultComparison {

    /** One value that differs, at a JSON Pointer into the compared tree; a side is null when absent. */
    record Difference(String pointer, JsonNode stored, JsonNode replayed) {
    }

    /** The differences, and how many leaf values were compared. */
    record Outcome(List<Difference> differences, long comparedValues) {

        boolean identical() {
            return differences.isEmpty();
        }
    }

    private final List<Difference> differences = new ArrayList<>();
    private long compared;

    private ResultComparison() {
    }

    static Outcome compare(JsonNode stored, JsonNode replayed) {
        ResultComparison c = new ResultComparison();
        c.walk("", stored, replayed);
        return new Outcome(List.copyOf(c.differences), c.compared);
    }

    private void walk(String pointer, JsonNode a, JsonNode b) {
        if (a == null || b == null || a.isMissingNode() || b.isMissingNode()) {
            compared++;
            differences.add(new Difference(pointer, absentAsNull(a), absentAsNull(b)));
            return;
        }
        if (a.isObject() && b.isObject()) {
            Set<String> names = new LinkedHashSet<>(a.propertyNames());
            names.addAll(b.propertyNames());
            for (String name : names) {
                walk(pointer + "/" + escape(name), a.get(name), b.get(name));
            }
            return;
        }
        if (a.isArray() && b.isArray()) {
            int n = Math.max(a.size(), b.size());
            for (int i = 0; i < n; i++) {
                walk(pointer + "/" + i, i < a.size() ? a.get(i) : null, i < b.size() ? b.get(i) : null);
            }
            return;
        }
        compared++;
        if (!sameLeaf(a, b)) {
            differences.add(new Difference(pointer, a, b));
        }
    }

    static boolean sameLeaf(JsonNode a, JsonNode b) {
        if (a.isNumber() && b.isNumber()) {
            if (a.isIntegralNumber() && b.isIntegralNumber()) {
                return a.bigIntegerValue().equals(b.bigIntegerValue());
            }
            return Double.doubleToRawLongBits(a.doubleValue()) == Double.doubleToRawLongBits(b.doubleValue());
        }
        if (a.isContainer() || b.isContainer()) {
            return false;
        }
        return a.equals(b);
    }

    private static JsonNode absentAsNull(JsonNode n) {
        return n == null || n.isMissingNode() ? null : n;
    }

    /** RFC 6901: "~" becomes "~0" and "/" becomes "~1". */
    private static String escape(String name) {
        return name.replace("~", "~0").replace("/", "~1");
    }
}
