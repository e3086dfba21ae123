package org.specimenledger.audit;

import java.nio.charset.StandardCharsets;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Timestamp;
import java.time.Clock;
import java.time.Duration;
import java.time.Instant;
import java.util.HexFormat;
import java.util.List;
import java.util.Optional;
import org.springframework.jdbc.core.simple.JdbcClient;
import org.springframework.stereotype.Service;
import org.springframework.transaction.annotation.Transactional;

/**
 * Signed checkpoints of the ledger's Merkle tree head, recorded on a schedule
 * ({@link CheckpointSettings}) and on demand. Checkpoints are ledger artefacts, not changes of a record:
 * recording one writes no audit event (it would grow the tree it just signed).
 */
@Service
public class Checkpoints {

    private static final HexFormat HEX = HexFormat.of();

    private final JdbcClient jdbc;
    private final LedgerTree tree;
    private final LedgerSigningKey key;
    private final Clock clock;
    private final CheckpointSettings settings;

    Checkpoints(JdbcClient jdbc, LedgerTree tree, LedgerSigningKey key, Clock clock, CheckpointSettings settings) {
        this.jdbc = jdbc;
        this.tree = tree;
        this.key = key;
        this.clock = clock;
        this.settings = settings;
    }

    /**
     * Signs and stores the current tree head. Joins the caller's transaction when there is one: the
     * certificates feature calls it when it issues a certificate, <em>after</em> recording the issue event
     * and in the same transaction, so the checkpoint covers the issue event and both commit or neither
     * does. It takes the chain-head lock, so the size it signs is exactly the events before it.
     *
     * @param reason why, such as {@code certificate LAB-2031-0042 rev 0 issued}; required
     * @return the stored checkpoint, whose {@code treeSize} is the ledger position of the caller's last event
     */
    @Transactional
    public CheckpointView record(String reason) {
        if (reason == null || reason.isBlank()) {
            throw new IllegalArgumentException("a checkpoint needs a reason");
        }
        long size = jdbc.sql("SELECT last_seq FROM audit_chain_head WHERE id = 1 FOR UPDATE").query(Long.class).single();
        String root = HEX.formatHex(tree.root(size));
        Instant at = CanonicalEvent.truncate(clock.instant());
        byte[] signature = key.sign(CheckpointView.signedText(size, root, at).getBytes(StandardCharsets.UTF_8));
        String keyId = key.keyId();
        long id = jdbc.sql("""
                INSERT INTO ledger_checkpoint (tree_size, root_hash, recorded_at, reason, key_id, signature)
                VALUES (?, ?, ?, ?, ?, ?) RETURNING id""")
                .params(size, root, Timestamp.from(at), reason, keyId, signature)
                .query(Long.class).single();
        return CheckpointView.of(id, size, root, at, reason, keyId, signature);
    }

    /**
     * Records a checkpoint when one is due: the tree grew since the last checkpoint, and either
     * {@code everyEvents} events were added or {@code every} has passed (counted from the first event
     * when there is no checkpoint yet).
     *
     * @return the new checkpoint, or empty when none was due
     */
    @Transactional
    public Optional<CheckpointView> recordIfDue() {
        long size = jdbc.sql("SELECT last_seq FROM audit_chain_head WHERE id = 1").query(Long.class).single();
        Optional<CheckpointView> latest = latest();
        long coveredSize = latest.map(CheckpointView::treeSize).orElse(0L);
        if (size <= coveredSize) {
            return Optional.empty();
        }
        if (size - coveredSize >= settings.everyEvents()) {
            return Optional.of(record("scheduled: " + (size - coveredSize) + " events since the last checkpoint"));
        }
        Instant since = latest.map(CheckpointView::recordedAt).orElseGet(() -> jdbc
                .sql("SELECT occurred_at FROM audit_event WHERE seq = 1").query(Timestamp.class).single().toInstant());
        if (!Duration.between(since, clock.instant()).minus(settings.every()).isNegative()) {
            return Optional.of(record("scheduled: " + settings.every() + " since the last checkpoint"));
        }
        return Optional.empty();
    }

    /** The most recent checkpoint (the largest tree, as checkpoints are taken under the chain-head lock). */
    @Transactional(readOnly = true)
    public Optional<CheckpointView> latest() {
        return jdbc.sql(SELECT + " ORDER BY id DESC LIMIT 1").query(Checkpoints::row).optional();
    }

    /** Checkpoints in the order recorded, after id {@code afterId}. */
    @Transactional(readOnly = true)
    public List<CheckpointView> page(long afterId, int limit) {
        return jdbc.sql(SELECT + " WHERE id > ? ORDER BY id LIMIT ?").params(afterId, limit)
                .query(Checkpoints::row).list();
    }

    /** The most recent checkpoint whose tree contains event {@code seq}. */
    @Transactional(readOnly = true)
    public Optional<CheckpointView> latestCovering(long seq) {
        return jdbc.sql(SELECT + " WHERE tree_size >= ? ORDER BY id DESC LIMIT 1").param(seq)
                .query(Checkpoints::row).optional();
    }

    /** The most recent checkpoint of exactly {@code treeSize} events. */
    @Transactional(readOnly = true)
    public Optional<CheckpointView> latestOfSize(long treeSize) {
        return jdbc.sql(SELECT + " WHERE tree_size = ? ORDER BY id DESC LIMIT 1").param(treeSize)
                .query(Checkpoints::row).optional();
    }

    private static final String SELECT =
            "SELECT id, tree_size, root_hash, recorded_at, reason, key_id, signature FROM ledger_checkpoint";

    static CheckpointView row(ResultSet rs, int n) throws SQLException {
        return CheckpointView.of(rs.getLong(1), rs.getLong(2), rs.getString(3), rs.getTimestamp(4).toInstant(),
                rs.getString(5), rs.getString(6), rs.getBytes(7));
    }
}
