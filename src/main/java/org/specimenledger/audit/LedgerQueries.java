package org.specimenledger.audit;

import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import org.springframework.jdbc.core.simple.JdbcClient;
import org.springframework.stereotype.Service;
import org.springframework.transaction.annotation.Transactional;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/** Reads events back, in chain order. */
@Service
public class LedgerQueries {

    private final JdbcClient jdbc;
    private final JsonMapper json = JsonMapper.builder().build();

    LedgerQueries(JdbcClient jdbc) {
        this.jdbc = jdbc;
    }

    @Transactional(readOnly = true)
    public List<LedgerEvent> page(long afterSeq, int limit, String entityType, String entityId) {
        return search(new EventFilter(entityType, entityId, null, null, null, null), afterSeq, limit);
    }

    /**
     * Events matching every given criterion, in chain order, after sequence number {@code afterSeq}.
     * Time runs from {@code from} (inclusive) to {@code to} (exclusive).
     */
    @Transactional(readOnly = true)
    public List<LedgerEvent> search(EventFilter filter, long afterSeq, int limit) {
        StringBuilder sql = new StringBuilder("""
                SELECT seq, occurred_at, actor, actor_role, action, entity_type, entity_id, reason,
                       before_state::text AS before_state, after_state::text AS after_state,
                       previous_hash, hash, canonical
                  FROM audit_event WHERE seq > ?""");
        List<Object> params = new ArrayList<>();
        params.add(afterSeq);
        where(sql, params, "entity_type = ?", filter.entityType());
        where(sql, params, "entity_id = ?", filter.entityId());
        where(sql, params, "actor = ?", filter.actor());
        where(sql, params, "action = ?", filter.action());
        if (filter.from() != null) {
            sql.append(" AND occurred_at >= ?");
            params.add(java.sql.Timestamp.from(filter.from()));
        }
        if (filter.to() != null) {
            sql.append(" AND occurred_at < ?");
            params.add(java.sql.Timestamp.from(filter.to()));
        }
        sql.append(" ORDER BY seq LIMIT ?");
        params.add(limit);
        return jdbc.sql(sql.toString()).params(params).query((rs, n) -> new LedgerEvent(
                rs.getLong("seq"),
                rs.getTimestamp("occurred_at").toInstant(),
                rs.getString("actor"),
                rs.getString("actor_role"),
                rs.getString("action"),
                rs.getString("entity_type"),
                rs.getString("entity_id"),
                rs.getString("reason"),
                node(rs.getString("before_state")),
                node(rs.getString("after_state")),
                rs.getString("previous_hash"),
                rs.getString("hash"),
                rs.getString("canonical"))).list();
    }

    /** Number of events recorded for one record (used by tests and trace views). */
    @Transactional(readOnly = true)
    public long count() {
        return jdbc.sql("SELECT count(*) FROM audit_event").query(Long.class).single();
    }

    private static void where(StringBuilder sql, List<Object> params, String condition, String value) {
        if (value != null && !value.isBlank()) {
            sql.append(" AND ").append(condition);
            params.add(value);
        }
    }

    /** What to search for; null or blank fields are not criteria. */
    public record EventFilter(String entityType, String entityId, String actor, String action, Instant from,
            Instant to) {
    }

    private JsonNode node(String text) {
        return text == null ? null : json.readTree(text);
    }
}
