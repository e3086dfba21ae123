package org.specimenledger.audit;

import java.time.Instant;
import java.time.ZoneOffset;
import java.time.format.DateTimeFormatter;
import java.time.temporal.ChronoUnit;
import java.util.Map;
import java.util.TreeMap;
import tools.jackson.databind.json.JsonMapper;

/**
 * The canonical text of an event: a JSON object with its keys in lexicographic order at every level,
 * no insignificant white space, UTF-8, times as {@code yyyy-MM-ddTHH:mm:ss.SSSSSSZ} (microseconds, as
 * PostgreSQL keeps them). The event's hash is SHA-256 over exactly these bytes; the previous event's
 * hash is one of the keys, which is what makes the sequence a chain.
 */
final class CanonicalEvent {

    static final String GENESIS_HASH = "0".repeat(64);
    static final DateTimeFormatter TIME = DateTimeFormatter.ofPattern("uuuu-MM-dd'T'HH:mm:ss.SSSSSS'Z'")
            .withZone(ZoneOffset.UTC);

    /** Fixed settings, separate from the web mapper, so that the canonical form cannot drift with it. */
    private static final JsonMapper MAPPER = JsonMapper.builder().build();

    private CanonicalEvent() {
    }

    static Instant truncate(Instant time) {
        return time.truncatedTo(ChronoUnit.MICROS);
    }

    /** Any value (record, map, list, scalar or null) as plain maps and lists with sorted keys. */
    static Object plain(Object value) {
        if (value == null) {
            return null;
        }
        return sorted(MAPPER.convertValue(value, Object.class));
    }

    static String text(long seq, Instant occurredAt, String actor, String role, String action, String entityType,
            String entityId, String reason, Object plainBefore, Object plainAfter, String previousHash) {
        Map<String, Object> fields = new TreeMap<>();
        fields.put("action", action);
        fields.put("actor", actor);
        fields.put("after", plainAfter);
        fields.put("before", plainBefore);
        fields.put("entityId", entityId);
        fields.put("entityType", entityType);
        fields.put("occurredAt", TIME.format(occurredAt));
        fields.put("previousHash", previousHash);
        fields.put("reason", reason);
        fields.put("role", role);
        fields.put("seq", seq);
        return MAPPER.writeValueAsString(fields);
    }

    /** Whether the canonical text itself names this sequence number and previous hash. */
    static boolean links(String canonical, long seq, String previousHash) {
        try {
            tools.jackson.databind.JsonNode node = MAPPER.readTree(canonical);
            return node.path("seq").asLong(-1) == seq && previousHash.equals(node.path("previousHash").asString(""));
        } catch (tools.jackson.core.JacksonException e) {
            return false;
        }
    }

    static String json(Object plain) {
        return plain == null ? null : MAPPER.writeValueAsString(plain);
    }

    @SuppressWarnings("unchecked")
    private static Object sorted(Object value) {
        if (value instanceof Map<?, ?> map) {
            Map<String, Object> out = new TreeMap<>();
            map.forEach((k, v) -> out.put(String.valueOf(k), sorted(v)));
            return out;
        }
        if (value instanceof java.util.List<?> list) {
            return list.stream().map(CanonicalEvent::sorted).toList();
        }
        return value;
    }
}
