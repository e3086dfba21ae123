package org.specimenledger.reliability;

import java.lang.reflect.ParameterizedType;
import java.lang.reflect.RecordComponent;
import java.lang.reflect.Type;
import java.math.BigDecimal;
import java.math.BigInteger;
import java.time.Instant;
import java.time.LocalDate;
import java.time.OffsetDateTime;
import java.time.ZoneOffset;
import java.util.Collection;
import java.util.Map;
import java.util.UUID;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.node.ArrayNode;
import tools.jackson.databind.node.JsonNodeFactory;
import tools.jackson.databind.node.ObjectNode;

/**
 * A plausible JSON body for a request type, read from its record components, so that an endpoint added
 * by another branch gets a body to mutate without anyone writing one. Ids are random, so the body reaches
 * parsing, validation and the rules, and is then refused for the record it names.
 */
final class RequestShapes {

    private static final JsonNodeFactory NODES = JsonNodeFactory.instance;

    private RequestShapes() {
    }

    static JsonNode skeleton(Type type) {
        return skeleton(type, 0);
    }

    private static JsonNode skeleton(Type type, int depth) {
        Class<?> raw = rawOf(type);
        if (depth > 6) {
            return NODES.nullNode();
        }
        if (raw == String.class) {
            return NODES.stringNode("plain text");
        }
        if (raw == UUID.class) {
            return NODES.stringNode(UUID.randomUUID().toString());
        }
        if (raw == boolean.class || raw == Boolean.class) {
            return NODES.booleanNode(false);
        }
        if (raw == int.class || raw == Integer.class || raw == long.class || raw == Long.class
                || raw == short.class || raw == BigInteger.class) {
            return NODES.numberNode(1);
        }
        if (raw == double.class || raw == Double.class || raw == float.class || raw == Float.class
                || raw == BigDecimal.class) {
            return NODES.numberNode(new BigDecimal("1.5"));
        }
        if (raw == LocalDate.class) {
            return NODES.stringNode(LocalDate.now(ZoneOffset.UTC).toString());
        }
        if (raw == OffsetDateTime.class || raw == Instant.class) {
            return NODES.stringNode(Instant.now().toString());
        }
        if (raw.isEnum()) {
            return NODES.stringNode(raw.getEnumConstants()[0].toString());
        }
        if (Collection.class.isAssignableFrom(raw) || raw.isArray()) {
            ArrayNode a = NODES.arrayNode();
            Type element = raw.isArray() ? raw.getComponentType() : argument(type, 0);
            a.add(skeleton(element, depth + 1));
            return a;
        }
        if (Map.class.isAssignableFrom(raw)) {
            ObjectNode o = NODES.objectNode();
            o.set("key", skeleton(argument(type, 1), depth + 1));
            return o;
        }
        if (raw.isRecord()) {
            ObjectNode o = NODES.objectNode();
            for (RecordComponent c : raw.getRecordComponents()) {
                o.set(c.getName(), skeleton(c.getGenericType(), depth + 1));
            }
            return o;
        }
        return NODES.objectNode();
    }

    private static Class<?> rawOf(Type type) {
        if (type instanceof Class<?> c) {
            return c;
        }
        if (type instanceof ParameterizedType p) {
            return (Class<?>) p.getRawType();
        }
        return Object.class;
    }

    private static Type argument(Type type, int index) {
        if (type instanceof ParameterizedType p && p.getActualTypeArguments().length > index) {
            Type t = p.getActualTypeArguments()[index];
            return t instanceof java.lang.reflect.WildcardType w ? w.getUpperBounds()[0] : t;
        }
        return String.class;
    }
}
