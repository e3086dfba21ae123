package org.specimenledger.audit;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.function.Function;
import javax.sql.DataSource;
import org.springframework.jdbc.core.simple.JdbcClient;
import org.springframework.stereotype.Component;

/**
 * The ledger's Merkle tree as stored in {@code ledger_tree_node}: each event's leaf and every perfect,
 * aligned subtree it completes, written by {@link Ledger#record} in the event's own transaction.
 *
 * <p>Why subtrees rather than streaming the leaves for each root: a root or proof then needs O(log² n)
 * stored hashes (about 400 at a million events, fetched in one query), where streaming would read and
 * hash all n leaves (32 MB at a million) for every checkpoint and every proof request. The price is
 * about two rows per event, and on average one indexed look-up per append (the left sibling of each
 * subtree the new leaf closes).
 */
@Component
class LedgerTree {

    private static final byte[] PLACEHOLDER = new byte[MerkleTree.HASH_BYTES];

    private final JdbcClient jdbc;

    LedgerTree(JdbcClient jdbc) {
        this.jdbc = jdbc;
    }

    /** Over any DataSource (a restored copy, a benchmark database), outside the application. */
    static LedgerTree over(DataSource dataSource) {
        return new LedgerTree(JdbcClient.create(dataSource));
    }

    /** Adds the leaf of event {@code seq} and every subtree it completes; call inside the event's transaction. */
    void append(long seq, String canonical) {
        long index = seq - 1;
        byte[] h = MerkleTree.leafHash(canonical);
        insert(0, index, h);
        for (int level = 0; ((index >> level) & 1) == 1; level++) {
            byte[] left = jdbc.sql("SELECT hash FROM ledger_tree_node WHERE level = ? AND position = ?")
                    .params(level, (index >> level) - 1).query(byte[].class).optional()
                    .orElseThrow(() -> new IllegalStateException("the ledger tree lacks the left sibling of leaf "
                            + index + "; was an event recorded without its leaf?"));
            h = MerkleTree.nodeHash(left, h);
            insert(level + 1, index >> (level + 1), h);
        }
    }

    /** Number of leaves stored, which equals the number of events. */
    long size() {
        return jdbc.sql("SELECT coalesce(max(position) + 1, 0) FROM ledger_tree_node WHERE level = 0")
                .query(Long.class).single();
    }

    byte[] leaf(long index) {
        return jdbc.sql("SELECT hash FROM ledger_tree_node WHERE level = 0 AND position = ?").param(index)
                .query(byte[].class).single();
    }

    byte[] root(long size) {
        return compute(tree -> MerkleTree.root(tree, size));
    }

    List<byte[]> inclusionPath(long index, long size) {
        return compute(tree -> MerkleTree.inclusionPath(tree, index, size));
    }

    List<byte[]> consistencyProof(long oldSize, long newSize) {
        return compute(tree -> MerkleTree.consistencyProof(tree, oldSize, newSize));
    }

    /**
     * Runs a tree computation twice: first over placeholders to learn which subtrees it reads (the RFC's
     * recursion depends on sizes and indices only, never on hash values), then over those subtrees
     * fetched in one query.
     */
    private <T> T compute(Function<MerkleTree.Subtrees, T> computation) {
        Set<Node> needed = new LinkedHashSet<>();
        computation.apply((level, position) -> {
            needed.add(new Node(level, position));
            return PLACEHOLDER;
        });
        Map<Node, byte[]> found = fetch(needed);
        return computation.apply((level, position) -> {
            byte[] hash = found.get(new Node(level, position));
            if (hash == null) {
                throw new IllegalStateException("the ledger tree has no node at level " + level + ", position "
                        + position);
            }
            return hash;
        });
    }

    private Map<Node, byte[]> fetch(Set<Node> nodes) {
        Map<Node, byte[]> found = new HashMap<>();
        if (nodes.isEmpty()) {
            return found;
        }
        List<Node> list = new ArrayList<>(nodes);
        int[] levels = new int[list.size()];
        long[] positions = new long[list.size()];
        for (int i = 0; i < list.size(); i++) {
            levels[i] = list.get(i).level();
            positions[i] = list.get(i).position();
        }
        jdbc.sql("""
                SELECT n.level, n.position, n.hash
                  FROM ledger_tree_node n
                  JOIN unnest(?::int[], ?::bigint[]) AS wanted(level, position)
                    ON n.level = wanted.level AND n.position = wanted.position""")
                .params(levels, positions)
                .query(rs -> {
                    found.put(new Node(rs.getInt(1), rs.getLong(2)), rs.getBytes(3));
                });
        return found;
    }

    private void insert(int level, long position, byte[] hash) {
        jdbc.sql("INSERT INTO ledger_tree_node (level, position, hash) VALUES (?, ?, ?)")
                .params(level, position, hash).update();
    }

    private record Node(int level, long position) {
    }
}
