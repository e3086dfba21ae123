package org.specimenledger.audit;

import java.nio.charset.StandardCharsets;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.sql.Connection;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Statement;
import java.time.OffsetDateTime;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.HexFormat;
import javax.sql.DataSource;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.dao.DataAccessResourceFailureException;
import org.springframework.stereotype.Service;
import tools.jackson.core.JacksonException;
import tools.jackson.core.JsonParser;
import tools.jackson.core.JsonToken;
import tools.jackson.databind.DeserializationFeature;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * Recomputes the whole chain from the stored rows, streaming (PostgreSQL streams a result with a fetch
 * size only inside a transaction), so memory stays flat however long the ledger is. Each event, in
 * sequence order, must:
 * <ol>
 * <li>follow the one before without a gap ({@code missing-sequence});</li>
 * <li>hash, as SHA-256 over its canonical text, to its stored hash ({@code hash-mismatch});</li>
 * <li>name its own sequence number and the previous event's hash inside the canonical text
 *     ({@code broken-link}; when an otherwise intact event names a different hash for its predecessor,
 *     it is the predecessor that was rewritten and re-hashed, and the predecessor is named);</li>
 * <li>match the Merkle leaf recorded when it was appended ({@code hash-mismatch});</li>
 * <li>agree, column by column, with its canonical text: plain columns exactly, the {@code jsonb}
 *     before/after values as JSON values with numbers compared by value ({@code column-mismatch}).</li>
 * </ol>
 * Finally the chain head row must name the last event and its hash (a removed or re-hashed last event).
 *
 * <p>Plain JDBC on purpose: the same verifier runs inside the service and over any other DataSource
 * (a restored backup, a benchmark database) without Spring transactions.
 */
@Service
public class ChainVerifier {

    /** Rows per round trip: about 1.6 KB each, so about 1.6 MB per range; 4000 measured slower in a 128 MB heap. */
    private static final int FETCH_SIZE = 1000;
    /** Below this many events one walk is quick enough; above it the chain is cut into parts checked at once. */
    static final long PARALLEL_FROM = 20_000;
    private static final int MAX_PARTS = 4;
    private static final HexFormat HEX = HexFormat.of();
    private static final String[] CANONICAL_KEYS = {"action", "actor", "after", "before", "entityId", "entityType",
        "occurredAt", "previousHash", "reason", "role", "seq"};

    /** Floats as BigDecimal so that no digits are lost before comparing by value. */
    private static final JsonMapper JSON = JsonMapper.builder()
            .enable(DeserializationFeature.USE_BIG_DECIMAL_FOR_FLOATS)
            .build();

    private final DataSource dataSource;
    private final long parallelFrom;
    private final int parts;

    @Autowired
    ChainVerifier(DataSource dataSource) {
        this(dataSource, PARALLEL_FROM, Math.max(1, Math.min(MAX_PARTS, Runtime.getRuntime().availableProcessors())));
    }

    /** @param parts how many ranges a chain of at least {@code parallelFrom} events is cut into */
    ChainVerifier(DataSource dataSource, long parallelFrom, int parts) {
        this.dataSource = dataSource;
        this.parallelFrom = parallelFrom;
        this.parts = parts;
    }

    /** A verifier over any database holding the ledger tables, for use outside the service. */
    public static ChainVerifier over(DataSource dataSource) {
        return new ChainVerifier(dataSource);
    }

    /**
     * Walks the whole chain in one read-only, repeatable-read snapshot. A long chain is cut into
     * consecutive ranges checked at the same time on separate connections that share the snapshot
     * ({@code pg_export_snapshot}), so the database and the hashing run on every core; the ranges'
     * results are then joined in order, with the link across each cut checked, so the answer is the
     * one a single walk would give.
     */
    public ChainVerification verify() {
        List<Connection> opened = new ArrayList<>();
        ExecutorService pool = null;
        try {
            Connection first = begin(opened, null);
            long headSeq;
            String headHash;
            try (Statement s = first.createStatement();
                    ResultSet rs = s.executeQuery("SELECT last_seq, last_hash FROM audit_chain_head WHERE id = 1")) {
                rs.next();
                headSeq = rs.getLong(1);
                headHash = rs.getString(2);
            }
            int parts = headSeq >= parallelFrom ? (int) Math.max(1, Math.min(this.parts, headSeq)) : 1;
            List<Range> ranges = new ArrayList<>();
            for (int i = 0; i < parts; i++) {
                long lo = 1 + headSeq * i / parts;
                long hi = i == parts - 1 ? Long.MAX_VALUE : headSeq * (i + 1) / parts;
                ranges.add(new Range(lo, hi));
            }
            List<Future<Range>> running = new ArrayList<>();
            if (parts > 1) {
                String snapshot;
                try (Statement s = first.createStatement(); ResultSet rs = s.executeQuery("SELECT pg_export_snapshot()")) {
                    rs.next();
                    snapshot = rs.getString(1);
                }
                pool = Executors.newFixedThreadPool(parts - 1, r -> {
                    Thread t = new Thread(r, "ledger-verify");
                    t.setDaemon(true);
                    return t;
                });
                for (Range range : ranges.subList(1, parts)) {
                    Connection c = begin(opened, snapshot);
                    running.add(pool.submit(() -> range.walk(c)));
                }
            }
            ranges.get(0).walk(first);
            for (Future<Range> f : running) {
                f.get();
            }
            return join(ranges, headSeq, headHash);
        } catch (SQLException e) {
            throw new DataAccessResourceFailureException("could not read the ledger to verify it", e);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException("ledger verification interrupted", e);
        } catch (ExecutionException e) {
            throw new DataAccessResourceFailureException("could not read the ledger to verify it", e.getCause());
        } finally {
            if (pool != null) {
                pool.shutdownNow();
            }
            for (Connection c : opened) {
                end(c);
            }
        }
    }

    /** Opens a read-only repeatable-read transaction, on the exported snapshot when one is given. */
    private Connection begin(List<Connection> opened, String snapshot) throws SQLException {
        Connection c = dataSource.getConnection();
        opened.add(c);
        c.setAutoCommit(false);
        c.setTransactionIsolation(Connection.TRANSACTION_REPEATABLE_READ);
        c.setReadOnly(true);
        try (Statement s = c.createStatement()) {
            if (snapshot != null) {
                s.execute("SET TRANSACTION SNAPSHOT '" + snapshot.replace("'", "") + "'");
            }
            // one long scan: compiling it to machine code costs more than it saves
            s.execute("SET LOCAL jit = off");
        }
        return c;
    }

    private static void end(Connection c) {
        try {
            c.rollback();
            c.setReadOnly(false);
            c.setTransactionIsolation(Connection.TRANSACTION_READ_COMMITTED);
            c.setAutoCommit(true);
        } catch (SQLException ignored) {
            // the connection is closed next either way
        } finally {
            try {
                c.close();
            } catch (SQLException ignored) {
                // nothing more to release
            }
        }
    }

    /** The ranges' findings in chain order, as one walk from event 1 to the head would report them. */
    private static ChainVerification join(List<Range> ranges, long headSeq, String headHash) {
        long checked = 0;
        String previousHash = CanonicalEvent.GENESIS_HASH;
        long last = 0;
        for (int i = 0; i < ranges.size(); i++) {
            Range r = ranges.get(i);
            if (r.lo > 1 && r.firstNamedPrevious != null && !r.firstNamedPrevious.equals(previousHash)) {
                return ChainVerification.broken(checked - 1, r.lo - 1, "broken-link", Walk.rehashed(r.lo,
                        r.firstNamedPrevious, previousHash));
            }
            if (r.broken != null) {
                ChainVerification b = r.broken;
                return ChainVerification.broken(checked + b.eventsChecked(), b.firstBrokenSeq(), b.problem(),
                        b.detail());
            }
            if (r.checked > 0) {
                previousHash = r.lastHash;
                last = r.lo + r.checked - 1;
            }
            checked += r.checked;
            if (r.hi != Long.MAX_VALUE && r.checked < r.hi - r.lo + 1) {
                // this range lost events at its end: the gap runs on to the next stored event, if any
                Long next = ranges.subList(i + 1, ranges.size()).stream().map(x -> x.firstSeq)
                        .filter(java.util.Objects::nonNull).findFirst().orElse(null);
                if (next != null) {
                    return ChainVerification.broken(checked, last + 1, "missing-sequence",
                            "expected event " + (last + 1) + " but the next stored event is " + next);
                }
                break;
            }
        }
        if (headSeq > last) {
            return ChainVerification.broken(checked, last + 1, "missing-sequence",
                    "the chain head records " + headSeq + " events but the stored events end at " + last);
        }
        if (headSeq < last) {
            // head and events come from one snapshot, and every append moves the head: an event past the head
            // was written around the ledger
            return ChainVerification.broken(headSeq, headSeq + 1, "broken-link",
                    "event " + (headSeq + 1) + " lies beyond the chain head, which records " + headSeq + " events");
        }
        if (!headHash.equals(previousHash)) {
            return ChainVerification.broken(checked - 1, last, "hash-mismatch",
                    "the chain head records hash " + headHash + " for event " + last + ", which now hashes to "
                            + previousHash);
        }
        return ChainVerification.ok(checked, previousHash);
    }

    /** Consecutive events [lo, hi] and what walking them found. */
    private static final class Range {
        final long lo;
        final long hi;
        long checked;
        String lastHash;
        /** What the range's first event names as its predecessor's hash; checked against the range before. */
        String firstNamedPrevious;
        /** Sequence number of the first stored row in the range, null when it has none. */
        Long firstSeq;
        ChainVerification broken;

        Range(long lo, long hi) {
            this.lo = lo;
            this.hi = hi;
        }

        Range walk(Connection c) throws SQLException {
            Walk walk = new Walk(lo);
            // Leaves come from a second cursor on the same transaction, read alongside in position order: a
            // merge of two index scans, cheaper for the server than one index look-up per event.
            try (PreparedStatement ps = c.prepareStatement("""
                    SELECT e.seq, e.previous_hash, e.hash, e.canonical, e.occurred_at, e.actor, e.actor_role, e.action,
                           e.entity_type, e.entity_id, e.reason, e.before_state::text, e.after_state::text
                      FROM audit_event e
                     WHERE e.seq BETWEEN ? AND ?
                     ORDER BY e.seq""");
                    PreparedStatement leaves = c.prepareStatement("""
                    SELECT position, hash FROM ledger_tree_node
                     WHERE level = 0 AND position BETWEEN ? AND ?
                     ORDER BY position""")) {
                ps.setLong(1, lo);
                ps.setLong(2, hi);
                ps.setFetchSize(FETCH_SIZE);
                leaves.setLong(1, lo - 1);
                leaves.setLong(2, hi == Long.MAX_VALUE ? hi : hi - 1);
                leaves.setFetchSize(FETCH_SIZE * 4);
                try (ResultSet rs = ps.executeQuery(); ResultSet leafRows = leaves.executeQuery()) {
                    Leaves leafCursor = new Leaves(leafRows);
                    while (rs.next() && walk.broken == null) {
                        walk.row(rs, leafCursor);
                    }
                }
            }
            checked = walk.checked;
            lastHash = walk.previousHash;
            firstNamedPrevious = walk.firstNamedPrevious;
            firstSeq = walk.firstSeq;
            broken = walk.broken;
            return this;
        }
    }

    /** The stored leaves in position order, looked up with non-decreasing positions. */
    private static final class Leaves {
        private final ResultSet rows;
        private long position = -1;
        private byte[] hash;
        private boolean done;

        Leaves(ResultSet rows) {
            this.rows = rows;
        }

        /** The leaf at {@code wanted}, or null when none is stored there. */
        byte[] at(long wanted) throws SQLException {
            while (!done && position < wanted) {
                if (rows.next()) {
                    position = rows.getLong(1);
                    hash = rows.getBytes(2);
                } else {
                    done = true;
                }
            }
            return !done && position == wanted ? hash : null;
        }
    }

    /** Checks each row against the one before it; stops at the first break. */
    private static final class Walk {
        private long expectedSeq;
        /** Null at the start of a range after the first: the range before vouches for it, see {@link #join}. */
        private String previousHash;
        private String firstNamedPrevious;
        private Long firstSeq;
        private long checked;
        private ChainVerification broken;
        /** One digest for the whole walk: both hashes of every event are taken over the same UTF-8 bytes. */
        private final MessageDigest digest = sha256();

        Walk(long firstSeq) {
            this.expectedSeq = firstSeq;
            this.previousHash = firstSeq == 1 ? CanonicalEvent.GENESIS_HASH : null;
        }

        static String rehashed(long seq, String namedPrevious, String actualPrevious) {
            return "event " + seq + " was chained to event " + (seq - 1) + " with hash " + namedPrevious
                    + ", but event " + (seq - 1) + " now hashes to " + actualPrevious + ": it was rewritten and re-hashed";
        }

        void row(ResultSet rs, Leaves leaves) throws SQLException {
            long seq = rs.getLong(1);
            String hash = rs.getString(3);
            String canonical = rs.getString(4);
            if (firstSeq == null) {
                firstSeq = seq;
            }
            if (seq != expectedSeq) {
                broken = ChainVerification.broken(checked, expectedSeq, "missing-sequence",
                        "expected event " + expectedSeq + " but the next stored event is " + seq);
                return;
            }
            byte[] canonicalBytes = canonical.getBytes(StandardCharsets.UTF_8);
            digest.reset();
            String recomputed = HEX.formatHex(digest.digest(canonicalBytes));
            if (!recomputed.equals(hash)) {
                broken = ChainVerification.broken(checked, seq, "hash-mismatch",
                        "SHA-256 of event " + seq + " is " + recomputed + ", stored " + hash);
                return;
            }
            JsonNode event;
            try {
                event = JSON.readTree(canonicalBytes);
            } catch (JacksonException e) {
                broken = ChainVerification.broken(checked, seq, "broken-link",
                        "the canonical text of event " + seq + " is not JSON");
                return;
            }
            if (!event.isObject() || event.path("seq").asLong(-1) != seq) {
                broken = ChainVerification.broken(checked, seq, "broken-link",
                        "the canonical text stored at position " + seq + " is that of event " + event.path("seq"));
                return;
            }
            String namedPrevious = text(event.get("previousHash"));
            if (previousHash == null) {
                firstNamedPrevious = namedPrevious;
            } else if (!previousHash.equals(namedPrevious)) {
                if (seq == 1) {
                    broken = ChainVerification.broken(checked, seq, "broken-link",
                            "event 1 names " + namedPrevious + " as previous hash instead of the genesis value");
                } else {
                    // This event is intact (its hash holds) and was chained to a predecessor whose hash was
                    // namedPrevious: the predecessor is no longer that event.
                    broken = ChainVerification.broken(checked - 1, seq - 1, "broken-link",
                            rehashed(seq, namedPrevious, previousHash));
                }
                return;
            }
            byte[] leaf = leaves.at(seq - 1);
            byte[] expectedLeaf = MerkleTree.leafHash(digest, canonicalBytes);
            if (!Arrays.equals(leaf, expectedLeaf)) {
                broken = ChainVerification.broken(checked, seq, "hash-mismatch", leaf == null
                        ? "event " + seq + " has no Merkle leaf"
                        : "event " + seq + " no longer matches the Merkle leaf recorded when it was appended ("
                                + HEX.formatHex(leaf) + ", now " + HEX.formatHex(expectedLeaf) + ")");
                return;
            }
            String column = disagreeingColumn(rs, event);
            if (column != null) {
                broken = ChainVerification.broken(checked, seq, "column-mismatch",
                        "column " + column + " of event " + seq + " does not agree with its canonical text");
                return;
            }
            previousHash = hash;
            expectedSeq++;
            checked++;
        }
    }

    /** The first column that says something other than the canonical text, or null when all agree. */
    private static String disagreeingColumn(ResultSet rs, JsonNode event) throws SQLException {
        if (event.size() != CANONICAL_KEYS.length) {
            return "canonical (it has other fields than the " + CANONICAL_KEYS.length + " of an event)";
        }
        for (String key : CANONICAL_KEYS) {
            if (!event.has(key)) {
                return "canonical (it lacks " + key + ")";
            }
        }
        if (!rs.getString(2).equals(text(event.get("previousHash")))) {
            return "previous_hash";
        }
        OffsetDateTime at = rs.getObject(5, OffsetDateTime.class);
        if (!CanonicalEvent.TIME.format(at).equals(text(event.get("occurredAt")))) {
            return "occurred_at";
        }
        String[][] plain = {{"actor", "actor"}, {"actor_role", "role"}, {"action", "action"},
            {"entity_type", "entityType"}, {"entity_id", "entityId"}, {"reason", "reason"}};
        for (int i = 0; i < plain.length; i++) {
            String value = rs.getString(6 + i);
            JsonNode node = event.get(plain[i][1]);
            boolean same = value == null ? node.isNull() : node.isString() && value.equals(node.stringValue());
            if (!same) {
                return plain[i][0];
            }
        }
        if (!sameJson(rs.getString(12), event.get("before"))) {
            return "before_state";
        }
        if (!sameJson(rs.getString(13), event.get("after"))) {
            return "after_state";
        }
        return null;
    }

    /** A {@code jsonb} column (SQL NULL for no value) against the canonical value (JSON null for none). */
    static boolean sameJson(String column, JsonNode canonical) {
        if (column == null) {
            return canonical.isNull();
        }
        // Streamed against the canonical tree rather than parsed into a second tree: the same comparison as
        // readTree(column).equals(BY_VALUE, canonical), without building a tree per column per event.
        try (JsonParser p = JSON.createParser(column)) {
            return p.nextToken() != null && matches(p, canonical) && p.nextToken() == null;
        } catch (JacksonException e) {
            return false;
        }
    }

    /**
     * Whether the value at the parser's current token equals {@code node}: objects by key (any order, same
     * number of keys), arrays element by element, numbers by value, everything else exactly. On true the
     * parser stands on the value's last token.
     */
    private static boolean matches(JsonParser p, JsonNode node) {
        JsonToken t = p.currentToken();
        switch (t) {
            case START_OBJECT -> {
                if (!node.isObject()) {
                    return false;
                }
                int seen = 0;
                for (String name = p.nextName(); name != null; name = p.nextName()) {
                    JsonNode child = node.get(name);
                    if (child == null || p.nextToken() == null || !matches(p, child)) {
                        return false;
                    }
                    seen++;
                }
                return p.currentToken() == JsonToken.END_OBJECT && seen == node.size();
            }
            case START_ARRAY -> {
                if (!node.isArray()) {
                    return false;
                }
                int i = 0;
                for (JsonToken next = p.nextToken(); next != JsonToken.END_ARRAY; next = p.nextToken()) {
                    if (next == null || i >= node.size() || !matches(p, node.get(i))) {
                        return false;
                    }
                    i++;
                }
                return i == node.size();
            }
            case VALUE_STRING -> {
                return node.isString() && node.stringValue().equals(p.getString());
            }
            case VALUE_NUMBER_INT, VALUE_NUMBER_FLOAT -> {
                return node.isNumber() && p.getDecimalValue().compareTo(node.decimalValue()) == 0;
            }
            case VALUE_TRUE, VALUE_FALSE -> {
                return node.isBoolean() && node.booleanValue() == (t == JsonToken.VALUE_TRUE);
            }
            case VALUE_NULL -> {
                return node.isNull();
            }
            default -> {
                return false;
            }
        }
    }

    private static MessageDigest sha256() {
        try {
            return MessageDigest.getInstance("SHA-256");
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("every JDK has SHA-256", e);
        }
    }

    private static String text(JsonNode node) {
        return node == null || node.isNull() ? null : node.isString() ? node.stringValue() : node.toString();
    }
}
