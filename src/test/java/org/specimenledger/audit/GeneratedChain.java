package org.specimenledger.audit;

import java.io.ByteArrayOutputStream;
import java.math.BigDecimal;
import java.nio.charset.StandardCharsets;
import java.sql.Connection;
import java.sql.SQLException;
import java.sql.Statement;
import java.time.Instant;
import java.util.HexFormat;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;
import java.util.UUID;
import javax.sql.DataSource;
import org.postgresql.PGConnection;
import org.postgresql.copy.CopyIn;

/**
 * Writes a long, valid ledger fast, for benchmarks and migration tests: invented register events
 * (registrations and changes of made-up records) with canonical texts built by {@link CanonicalEvent},
 * the very code {@link Ledger} uses, their SHA-256 chain, and optionally the Merkle tree nodes, loaded
 * with PostgreSQL {@code COPY} in CSV form. Memory stays bounded: rows are streamed in 1 MB batches.
 * The ledger must be empty.
 */
public final class GeneratedChain {

    private static final HexFormat HEX = HexFormat.of();
    private static final int BATCH_BYTES = 1 << 20;
    private static final String[] KINDS = {"heat", "specimen", "equipment", "customer"};
    private static final String[] ACTORS = {"bench-technician", "bench-manager"};

    private GeneratedChain() {
    }

    /**
     * Appends {@code count} events to an empty ledger.
     *
     * @param withTree also write the leaves and subtrees, as {@link Ledger#record} does
     * @return the hash of the last event
     */
    public static String write(DataSource dataSource, int count, boolean withTree) {
        try (Connection events = dataSource.getConnection(); Connection nodes = dataSource.getConnection()) {
            try (Statement s = events.createStatement(); var rs = s.executeQuery("SELECT last_seq FROM audit_chain_head")) {
                rs.next();
                if (rs.getLong(1) != 0) {
                    throw new IllegalStateException("the generated chain needs an empty ledger");
                }
            }
            CopyIn eventCopy = events.unwrap(PGConnection.class).getCopyAPI().copyIn("""
                    COPY audit_event (seq, occurred_at, actor, actor_role, action, entity_type, entity_id, reason,
                                      before_state, after_state, previous_hash, hash, canonical)
                    FROM STDIN (FORMAT csv)""");
            CopyIn nodeCopy = null;
            try {
                ByteArrayOutputStream eventRows = new ByteArrayOutputStream(BATCH_BYTES + 8192);
                ByteArrayOutputStream nodeRows = new ByteArrayOutputStream(BATCH_BYTES + 8192);
                MerkleTree.Frontier frontier = new MerkleTree.Frontier();
                SplittableRandom random = new SplittableRandom(6962);
                Instant start = Instant.parse("2031-03-03T07:00:00Z");
                String previous = CanonicalEvent.GENESIS_HASH;
                for (long seq = 1; seq <= count; seq++) {
                    Instant at = start.plusMillis(seq * 250 + random.nextInt(200)).plusNanos(random.nextInt(1000) * 1000L);
                    Event e = event(seq, at, previous, random);
                    previous = Sha256.hex(e.canonical);
                    csv(eventRows, Long.toString(seq), CanonicalEvent.TIME.format(at), e.actor, e.role, e.action, e.type,
                            e.id, e.reason, CanonicalEvent.json(e.before), CanonicalEvent.json(e.after), e.previousHash,
                            previous, e.canonical);
                    if (withTree) {
                        frontier.append(MerkleTree.leafHash(e.canonical), (level, position, hash) -> csv(nodeRows,
                                Integer.toString(level), Long.toString(position), "\\x" + HEX.formatHex(hash)));
                    }
                    if (eventRows.size() >= BATCH_BYTES) {
                        flush(eventCopy, eventRows);
                    }
                    if (nodeRows.size() >= BATCH_BYTES) {
                        if (nodeCopy == null) {
                            nodeCopy = nodeCopy(nodes);
                        }
                        flush(nodeCopy, nodeRows);
                    }
                }
                flush(eventCopy, eventRows);
                eventCopy.endCopy();
                if (withTree) {
                    if (nodeCopy == null) {
                        nodeCopy = nodeCopy(nodes);
                    }
                    flush(nodeCopy, nodeRows);
                    nodeCopy.endCopy();
                }
                try (var ps = events.prepareStatement("UPDATE audit_chain_head SET last_seq = ?, last_hash = ?")) {
                    ps.setLong(1, count);
                    ps.setString(2, previous);
                    ps.executeUpdate();
                }
                return previous;
            } finally {
                if (eventCopy.isActive()) {
                    eventCopy.cancelCopy();
                }
                if (nodeCopy != null && nodeCopy.isActive()) {
                    nodeCopy.cancelCopy();
                }
            }
        } catch (SQLException e) {
            throw new IllegalStateException("could not write the generated chain", e);
        }
    }

    private static CopyIn nodeCopy(Connection c) throws SQLException {
        return c.unwrap(PGConnection.class).getCopyAPI()
                .copyIn("COPY ledger_tree_node (level, position, hash) FROM STDIN (FORMAT csv)");
    }

    private record Event(String actor, String role, String action, String type, String id, String reason,
            Object before, Object after, String previousHash, String canonical) {
    }

    /** One invented event: three in four register a record, the rest change one with a reason. */
    private static Event event(long seq, Instant at, String previous, SplittableRandom random) {
        String type = KINDS[random.nextInt(KINDS.length)];
        String id = new UUID(random.nextLong(), random.nextLong()).toString();
        int actorIndex = random.nextInt(ACTORS.length);
        String actor = ACTORS[actorIndex];
        String role = actorIndex == 0 ? "TECHNICIAN" : "LAB_MANAGER";
        Map<String, Object> after = view(id, seq, random);
        boolean change = random.nextInt(4) == 0;
        Object plainBefore = change ? CanonicalEvent.plain(view(id, seq - 1, random)) : null;
        Object plainAfter = CanonicalEvent.plain(after);
        String action = type + (change ? ".changed" : ".registered");
        String reason = change ? "remeasured after cleaning, bench item " + seq : null;
        String canonical = CanonicalEvent.text(seq, at, actor, role, action, type, id, reason, plainBefore, plainAfter,
                previous);
        return new Event(actor, role, action, type, id, reason, plainBefore, plainAfter, previous, canonical);
    }

    private static Map<String, Object> view(String id, long seq, SplittableRandom random) {
        Map<String, Object> v = new LinkedHashMap<>();
        v.put("id", id);
        v.put("label", "Bench item " + seq);
        v.put("widthMm", BigDecimal.valueOf(1000 + random.nextInt(9000), 2));
        v.put("thicknessMm", BigDecimal.valueOf(100 + random.nextInt(900), 3));
        v.put("readings", List.of(random.nextInt(100), random.nextInt(100), random.nextInt(100)));
        v.put("remarks", random.nextInt(3) == 0 ? null : "cut from plate edge, \"as rolled\"");
        v.put("version", seq % 7);
        return v;
    }

    /** One CSV row: null as an unquoted empty field, everything else quoted with inner quotes doubled. */
    private static void csv(ByteArrayOutputStream out, String... fields) {
        StringBuilder row = new StringBuilder(512);
        for (int i = 0; i < fields.length; i++) {
            if (i > 0) {
                row.append(',');
            }
            String f = fields[i];
            if (f != null) {
                row.append('"').append(f.replace("\"", "\"\"")).append('"');
            }
        }
        row.append('\n');
        out.writeBytes(row.toString().getBytes(StandardCharsets.UTF_8));
    }

    private static void flush(CopyIn copy, ByteArrayOutputStream rows) throws SQLException {
        if (rows.size() > 0) {
            byte[] bytes = rows.toByteArray();
            copy.writeToCopy(bytes, 0, bytes.length);
            rows.reset();
        }
    }
}
