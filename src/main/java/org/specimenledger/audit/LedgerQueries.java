package org.specimenledger.audit;

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
        StringBuilder sql = new StringBuilder("""
                SELECT seq, occurred_at, actor, actor_role, action, entity_type, entity_id, reason,
                       before_state::text AS before_state, after_state::text AS after_state,
                       previous_hash, hash, canonical
                  FROM audit_event WHERE seq > ?""");
        List<Object> params = new ArrayList<>();
        params.add(afterSeq);
        if (entityType != null && !entityType.isBlank()) {
            sql.append(" AND entity_type = ?");
            params.add(entityType);
        }
        if (entityId != null && !entityId.isBlank()) {
            sql.append(" AND entity_id = ?");
            params.add(entityId);
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

    private JsonNode node(String text) {
        return text == null ? null : json.readTree(text);
    }
}
