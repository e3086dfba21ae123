package org.specimenledger.audit;

import java.util.ArrayList;
import java.util.Collection;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import org.springframework.jdbc.core.simple.JdbcClient;
import org.springframework.stereotype.Service;
import org.springframework.transaction.annotation.Transactional;

/**
 * What a trace or an audit bundle needs from the ledger about a known set of records: their events (in
 * chain order), the signed checkpoint that covers them, each event's inclusion proof against it, and the
 * public key. The caller decides which records may be shown; this class only reads what it is asked for.
 */
@Service
public class LedgerEvidence {

    private final JdbcClient jdbc;
    private final Checkpoints checkpoints;
    private final LedgerProofs proofs;
    private final LedgerSigningKey key;

    LedgerEvidence(JdbcClient jdbc, Checkpoints checkpoints, LedgerProofs proofs, LedgerSigningKey key) {
        this.jdbc = jdbc;
        this.checkpoints = checkpoints;
        this.proofs = proofs;
        this.key = key;
    }

    /** One record of the ledger: entity type as recorded ({@code specimen}, {@code test-run}...) and id. */
    public record Entity(String type, String id) {
    }

    /**
     * Every event recorded for the given records, by record, each list in chain order. One query per entity
     * type, on the {@code (entity_type, entity_id, seq)} index.
     */
    @Transactional(readOnly = true)
    public Map<Entity, List<LedgerEvent>> eventsOf(Collection<Entity> entities) {
        Map<String, Set<String>> byType = new LinkedHashMap<>();
        for (Entity e : entities) {
            byType.computeIfAbsent(e.type(), t -> new java.util.LinkedHashSet<>()).add(e.id());
        }
        Map<Entity, List<LedgerEvent>> out = new LinkedHashMap<>();
        for (Entity e : entities) {
            out.put(e, new ArrayList<>());
        }
        for (Map.Entry<String, Set<String>> t : byType.entrySet()) {
            jdbc.sql("""
                    SELECT seq, occurred_at, actor, actor_role, action, entity_type, entity_id, reason,
                           previous_hash, hash, canonical
                      FROM audit_event WHERE entity_type = ? AND entity_id = ANY(?) ORDER BY seq""")
                    .params(t.getKey(), t.getValue().toArray(String[]::new))
                    .query((rs, n) -> new LedgerEvent(rs.getLong(1), rs.getTimestamp(2).toInstant(), rs.getString(3),
                            rs.getString(4), rs.getString(5), rs.getString(6), rs.getString(7), rs.getString(8), null,
                            null, rs.getString(9), rs.getString(10), rs.getString(11)))
                    .list()
                    .forEach(ev -> out.get(new Entity(ev.entityType(), ev.entityId())).add(ev));
        }
        return out;
    }

    /** The latest signed checkpoint whose tree contains event {@code seq}, if one has been recorded yet. */
    @Transactional(readOnly = true)
    public Optional<CheckpointView> coveringCheckpoint(long seq) {
        return checkpoints.latestCovering(seq);
    }

    /**
     * A signed checkpoint that covers event {@code seq}: the latest one when it does, otherwise a new one
     * recorded now with {@code reason} (a checkpoint writes no audit event, so this changes no record).
     */
    @Transactional
    public CheckpointView checkpointCovering(long seq, String reason) {
        Optional<CheckpointView> latest = checkpoints.latest();
        if (latest.isPresent() && latest.get().treeSize() >= seq) {
            return latest.get();
        }
        return checkpoints.record(reason);
    }

    /** The audit path of event {@code seq} in the tree of {@code treeSize} events. */
    @Transactional(readOnly = true)
    public InclusionProof inclusion(long seq, long treeSize) {
        return proofs.inclusion(seq, treeSize);
    }

    /** The checkpoint signing key, PEM (X.509 SubjectPublicKeyInfo), as {@code GET /api/v1/ledger/key} gives it. */
    public String publicKeyPem() {
        return key.publicKeyPem();
    }

    /** Lower-case hex SHA-256 of the public key's DER: the {@code keyId} of the checkpoints it signs. */
    public String keyId() {
        return key.keyId();
    }
}
