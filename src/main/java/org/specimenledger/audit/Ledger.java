package org.specimenledger.audit;

import java.time.Clock;
import java.time.Instant;
import java.util.Objects;
import org.springframework.jdbc.core.simple.JdbcClient;
import org.springframework.security.core.Authentication;
import org.springframework.security.core.GrantedAuthority;
import org.springframework.security.core.context.SecurityContextHolder;
import org.springframework.stereotype.Service;
import org.springframework.transaction.annotation.Propagation;
import org.springframework.transaction.annotation.Transactional;

/**
 * Appends audit events. Must be called inside the transaction of the change it records
 * ({@link Propagation#MANDATORY}): if that transaction rolls back, so does the event, and an event
 * exists only for a change that was committed.
 *
 * <p>The chain stays linear under concurrent writers because each append first locks the single
 * chain-head row; the next writer waits until this transaction ends and then sees the new head. So
 * sequence numbers have no gaps (no database sequence is used: a rolled-back transaction would burn a
 * number). The same lock orders the event's leaf in the Merkle tree ({@link LedgerTree}), appended in the
 * same transaction.
 */
@Service
public class Ledger {

    static final String SYSTEM_ACTOR = "system";
    static final String SYSTEM_ROLE = "SYSTEM";

    private final JdbcClient jdbc;
    private final Clock clock;
    private final LedgerTree tree;

    Ledger(JdbcClient jdbc, Clock clock, LedgerTree tree) {
        this.jdbc = jdbc;
        this.clock = clock;
        this.tree = tree;
    }

    /**
     * Records one change by the signed-in user (or {@code system} when none is signed in).
     *
     * @param action     past-tense verb of the change, such as {@code heat.registered}
     * @param entityType the kind of record, such as {@code heat}
     * @param entityId   its identifier
     * @param reason     why; required for changes to existing records, may be null for creation
     * @param before     the record before the change (null for creation), any JSON-serialisable value
     * @param after      the record after the change (null for removal)
     * @return the stored event
     */
    @Transactional(propagation = Propagation.MANDATORY)
    public LedgerEvent record(String action, String entityType, Object entityId, String reason, Object before,
            Object after) {
        Objects.requireNonNull(action, "action");
        Objects.requireNonNull(entityType, "entityType");
        Objects.requireNonNull(entityId, "entityId");
        Authentication auth = SecurityContextHolder.getContext().getAuthentication();
        String actor = auth == null || !auth.isAuthenticated() ? SYSTEM_ACTOR : auth.getName();
        String role = roleOf(auth);

        ChainHead head = jdbc.sql("SELECT last_seq, last_hash FROM audit_chain_head WHERE id = 1 FOR UPDATE")
                .query((rs, n) -> new ChainHead(rs.getLong(1), rs.getString(2)))
                .single();
        long seq = head.lastSeq() + 1;
        Instant at = CanonicalEvent.truncate(clock.instant());
        Object plainBefore = CanonicalEvent.plain(before);
        Object plainAfter = CanonicalEvent.plain(after);
        String id = String.valueOf(entityId);
        String canonical = CanonicalEvent.text(seq, at, actor, role, action, entityType, id, reason,
                plainBefore, plainAfter, head.lastHash());
        String hash = Sha256.hex(canonical);

        jdbc.sql("""
                INSERT INTO audit_event (seq, occurred_at, actor, actor_role, action, entity_type, entity_id, reason,
                                         before_state, after_state, previous_hash, hash, canonical)
                VALUES (?, ?, ?, ?, ?, ?, ?, ?, CAST(? AS jsonb), CAST(? AS jsonb), ?, ?, ?)
                """)
                .params(seq, java.sql.Timestamp.from(at), actor, role, action, entityType, id, reason,
                        CanonicalEvent.json(plainBefore), CanonicalEvent.json(plainAfter), head.lastHash(), hash,
                        canonical)
                .update();
        jdbc.sql("UPDATE audit_chain_head SET last_seq = ?, last_hash = ? WHERE id = 1").params(seq, hash).update();
        // still under the chain-head lock, so leaves are appended in sequence order
        tree.append(seq, canonical);
        return new LedgerEvent(seq, at, actor, role, action, entityType, id, reason, null, null, head.lastHash(),
                hash, canonical);
    }

    private static String roleOf(Authentication auth) {
        if (auth == null) {
            return SYSTEM_ROLE;
        }
        return auth.getAuthorities().stream()
                .map(GrantedAuthority::getAuthority)
                .filter(a -> a != null && a.startsWith("ROLE_"))
                .map(a -> a.substring("ROLE_".length()))
                .findFirst()
                .orElse(SYSTEM_ROLE);
    }

    private record ChainHead(long lastSeq, String lastHash) {
    }
}
