package org.specimenledger.testing;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import tools.jackson.core.type.TypeReference;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;
import tools.jackson.databind.node.ArrayNode;
import tools.jackson.databind.node.DoubleNode;
import tools.jackson.databind.node.ObjectNode;

/**
 * The JSON of stored analyses: a mapper of its own (so the stored form cannot drift with the web settings)
 * and one normalisation, negative zero written as zero — PostgreSQL's {@code numeric}, which {@code jsonb}
 * uses, has no negative zero, so a value must be stored as the database will give it back. The replay
 * applies the same normalisation to what it recomputes, so the comparison stays exact.
 */
final class StoredJson {

    static final JsonMapper MAPPER = JsonMapper.builder().build();

    private StoredJson() {
    }

    /** Any value as a normalised JSON tree. */
    static JsonNode tree(Object value) {
        return normalised(MAPPER.valueToTree(value));
    }

    static String text(Object value) {
        return MAPPER.writeValueAsString(value instanceof JsonNode n ? n : tree(value));
    }

    static JsonNode parse(String json) {
        return MAPPER.readTree(json);
    }

    static Map<String, Object> map(String json) {
        return MAPPER.readValue(json, new TypeReference<LinkedHashMap<String, Object>>() { });
    }

    static Map<String, Object> map(JsonNode node) {
        return MAPPER.convertValue(node, new TypeReference<LinkedHashMap<String, Object>>() { });
    }

    static <T> T value(String json, Class<T> type) {
        return MAPPER.readValue(json, type);
    }

    static <T> List<T> list(String json, TypeReference<List<T>> type) {
        return MAPPER.readValue(json, type);
    }

    private static JsonNode normalised(JsonNode node) {
        if (node instanceof ObjectNode object) {
            object.propertyNames().forEach(name -> object.set(name, normalised(object.get(name))));
            return object;
        }
        if (node instanceof ArrayNode array) {
            for (int i = 0; i < array.size(); i++) {
                array.set(i, normalised(array.get(i)));
            }
            return array;
        }
        if (node.isFloatingPointNumber() && node.doubleValue() == 0.0) {
            return DoubleNode.valueOf(0.0);
        }
        return node;
    }
}
