package org.specimenledger.testing;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import tools.jackson.databind.JsonNode;

/** Bit-for-bit comparison of stored and replayed results, and the stored JSON form. */
class ResultComparisonTest {

    private static JsonNode json(String text) {
        return StoredJson.parse(text);
    }

    @Test
    void identicalTreesHaveNoDifferenceAndCountTheirLeaves() {
        JsonNode a = json("{\"Rm\": {\"value\": 474.7201, \"status\": \"DETERMINED\", \"evidence\": {\"i\": [1, 2]}}}");
        ResultComparison.Outcome o = ResultComparison.compare(a, a.deepCopy());
        assertThat(o.identical()).isTrue();
        assertThat(o.comparedValues()).isEqualTo(4);
    }

    @Test
    void oneUlpIsADifference() {
        double v = 474.7201;
        JsonNode stored = StoredJson.tree(Map.of("value", v));
        JsonNode replayed = StoredJson.tree(Map.of("value", Math.nextUp(v)));
        ResultComparison.Outcome o = ResultComparison.compare(stored, replayed);
        assertThat(o.differences()).singleElement().satisfies(d -> {
            assertThat(d.pointer()).isEqualTo("/value");
            assertThat(d.stored().doubleValue()).isEqualTo(v);
        });
        // the classic: 0.1 + 0.2 is not the double nearest to 0.3
        assertThat(ResultComparison.sameLeaf(StoredJson.tree(0.1 + 0.2), StoredJson.tree(0.3))).isFalse();
    }

    @Test
    void jsonbRenderingsOfTheSameDoubleAreTheSameValue() {
        // PostgreSQL numeric keeps the decimal exactly but not its notation: 1.0E7 comes back as 10000000 and
        // 2.5E-4 as 0.00025 (PostgreSQL documentation, numeric input); the double they denote is the same
        assertThat(ResultComparison.sameLeaf(StoredJson.tree(1.0E7), json("10000000"))).isTrue();
        assertThat(ResultComparison.sameLeaf(StoredJson.tree(2.5E-4), json("0.00025"))).isTrue();
        assertThat(ResultComparison.sameLeaf(json("7"), json("7"))).isTrue();
        assertThat(ResultComparison.sameLeaf(json("7"), json("8"))).isFalse();
        assertThat(ResultComparison.sameLeaf(json("\"7\""), json("7"))).isFalse();
    }

    @Test
    void missingKeysAndLongerArraysAreDifferences() {
        ResultComparison.Outcome o = ResultComparison.compare(json("{\"a\": 1, \"b\": [1, 2], \"c/d\": true}"),
                json("{\"a\": 1, \"b\": [1, 2, 3], \"e\": null, \"c/d\": false}"));
        assertThat(o.differences()).extracting(ResultComparison.Difference::pointer)
                .containsExactly("/b/2", "/c~1d", "/e");
    }

    @Test
    void negativeZeroIsStoredAsZeroBecauseNumericHasNone() {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("x", -0.0);
        m.put("list", List.of(-0.0, 1.5));
        assertThat(StoredJson.text(m)).isEqualTo("{\"x\":0.0,\"list\":[0.0,1.5]}");
    }

    @Test
    void csvFieldsAreQuotedOnlyWhenNeeded() {
        // RFC 4180 section 2: fields with commas, quotes or line breaks are enclosed in quotes, inner quotes doubled
        assertThat(ResultTable.field("SP-1")).isEqualTo("SP-1");
        assertThat(ResultTable.field("bar, end A")).isEqualTo("\"bar, end A\"");
        assertThat(ResultTable.field("the \"long\" piece")).isEqualTo("\"the \"\"long\"\" piece\"");
        assertThat(ResultTable.field(null)).isEmpty();
    }
}
