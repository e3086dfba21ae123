package org.specimenledger.audit;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.Comparator;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import tools.jackson.databind.DeserializationFeature;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * The streamed comparison of a {@code jsonb} column with the canonical value against the reference it
 * replaced: Jackson's own tree equality with numbers compared by value (jackson-databind
 * {@code JsonNode.equals(Comparator, JsonNode)}), which is the oracle here.
 */
class ChainVerifierJsonTest {

    private static final JsonMapper JSON = JsonMapper.builder()
            .enable(DeserializationFeature.USE_BIG_DECIMAL_FOR_FLOATS).build();
    private static final Comparator<JsonNode> BY_VALUE = (a, b) -> a.isNumber() && b.isNumber()
            ? a.decimalValue().compareTo(b.decimalValue()) : a.equals(b) ? 0 : 1;

    @ParameterizedTest
    @CsvSource(delimiter = '|', value = {
        "{\"a\": 1, \"b\": \"x\"}|{\"b\":\"x\",\"a\":1}",
        "{\"a\": 512.50}|{\"a\":5.125E2}",
        "{\"a\": 512.50}|{\"a\":512.51}",
        "{\"a\": 1}|{\"a\":1,\"b\":null}",
        "{\"a\": 1, \"b\": null}|{\"a\":1}",
        "{\"a\": [1, 2, 4]}|{\"a\":[1,2,3]}",
        "{\"a\": [1, 2]}|{\"a\":[1,2,3]}",
        "{\"a\": [1, 2, 3, 4]}|{\"a\":[1,2,3]}",
        "{\"a\": {\"b\": [true, null, \"s\"]}}|{\"a\":{\"b\":[true,null,\"s\"]}}",
        "{\"a\": {\"b\": [false]}}|{\"a\":{\"b\":[true]}}",
        "{\"a\": \"1\"}|{\"a\":1}",
        "{\"a\": 1}|{\"a\":\"1\"}",
        "{\"a\": {}}|{\"a\":[]}",
        "[]|{}",
        "null|null",
        "\"x\"|\"x\"",
        "{\"a\": 1}|[1]",
        "{\"a\": 1} {\"b\": 2}|{\"a\":1}",
        "{\"a\": |{\"a\":1}",
    })
    void agreesWithTreeEqualityByValue(String column, String canonical) {
        JsonNode expected = JSON.readTree(canonical);
        boolean reference;
        try {
            reference = JSON.readTree(column).equals(BY_VALUE, expected);
        } catch (RuntimeException e) {
            reference = false;
        }
        assertThat(ChainVerifier.sameJson(column, expected)).as(column + " against " + canonical).isEqualTo(reference);
    }
}
