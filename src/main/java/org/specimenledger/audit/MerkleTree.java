package org.specimenledger.audit;

import java.nio.charset.StandardCharsets;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * The Merkle tree over the ledger, as RFC 6962 §2.1 (and RFC 9162 §2.1) defines it: a leaf is
 * SHA-256(0x00 ‖ data), an inner node SHA-256(0x01 ‖ left ‖ right), and a list of n &gt; 1 leaves is
 * split at k, the largest power of two smaller than n. The tree of no leaves hashes to SHA-256 of
 * nothing. JDK only: the same code serves the service, an outside verifier and the tests.
 *
 * <p>Roots and proofs are computed from {@link Subtrees}: the hashes of <em>perfect, aligned</em>
 * subtrees (2^level leaves starting at a multiple of 2^level). Every node the RFC's recursion meets is
 * either such a subtree or is made from O(log n) of them, so a store that keeps them (the service's
 * {@code ledger_tree_node} table) answers a root or a proof with O(log² n) hash look-ups instead of
 * re-reading every leaf.
 */
public final class MerkleTree {

    /** Length of every hash in bytes (SHA-256). */
    public static final int HASH_BYTES = 32;

    private static final byte LEAF_PREFIX = 0x00;
    private static final byte NODE_PREFIX = 0x01;

    private MerkleTree() {
    }

    /**
     * Hashes of perfect, aligned subtrees of one tree.
     */
    @FunctionalInterface
    public interface Subtrees {
        /**
         * @param level    0 for a leaf; the subtree holds 2^level leaves
         * @param position the subtree's index among those of its level: it covers leaves
         *                 [position·2^level, (position+1)·2^level)
         * @return its 32-byte hash
         */
        byte[] hash(int level, long position);
    }

    /** SHA-256 of the empty string: the root of the tree of no leaves (RFC 6962 §2.1). */
    public static byte[] emptyRoot() {
        return digest().digest();
    }

    /** SHA-256(0x00 ‖ data): the hash of one leaf. */
    public static byte[] leafHash(byte[] data) {
        MessageDigest d = digest();
        d.update(LEAF_PREFIX);
        return d.digest(data);
    }

    /** SHA-256(0x00 ‖ data) on a digest the caller reuses (a long walk hashes millions of leaves). */
    static byte[] leafHash(MessageDigest reused, byte[] data) {
        reused.reset();
        reused.update(LEAF_PREFIX);
        return reused.digest(data);
    }

    /** The leaf hash of one ledger event: over the UTF-8 bytes of its canonical text. */
    public static byte[] leafHash(String canonical) {
        return leafHash(canonical.getBytes(StandardCharsets.UTF_8));
    }

    /** SHA-256(0x01 ‖ left ‖ right): the hash of an inner node. */
    public static byte[] nodeHash(byte[] left, byte[] right) {
        MessageDigest d = digest();
        d.update(NODE_PREFIX);
        d.update(left);
        return d.digest(right);
    }

    /**
     * MTH(D[0:size]), the root of the first {@code size} leaves.
     *
     * @throws IllegalArgumentException when size is negative
     */
    public static byte[] root(Subtrees tree, long size) {
        if (size < 0) {
            throw new IllegalArgumentException("tree size must not be negative, was " + size);
        }
        return size == 0 ? emptyRoot() : range(tree, 0, size);
    }

    /**
     * PATH(index, D[0:size]) of RFC 6962 §2.1.1: the audit path of one leaf, from the leaf's sibling up
     * to the child of the root.
     *
     * @throws IllegalArgumentException unless 0 ≤ index &lt; size
     */
    public static List<byte[]> inclusionPath(Subtrees tree, long index, long size) {
        if (index < 0 || index >= size) {
            throw new IllegalArgumentException("leaf index " + index + " is not in a tree of " + size + " leaves");
        }
        List<byte[]> path = new ArrayList<>();
        path(tree, index, 0, size, path);
        return path;
    }

    /**
     * PROOF(oldSize, D[0:newSize]) of RFC 6962 §2.1.2: the consistency proof between two sizes of the
     * same append-only tree. Empty when oldSize is 0 or equals newSize (nothing to prove).
     *
     * @throws IllegalArgumentException unless 0 ≤ oldSize ≤ newSize
     */
    public static List<byte[]> consistencyProof(Subtrees tree, long oldSize, long newSize) {
        if (oldSize < 0 || oldSize > newSize) {
            throw new IllegalArgumentException("no consistency proof from size " + oldSize + " to " + newSize);
        }
        List<byte[]> proof = new ArrayList<>();
        if (oldSize > 0 && oldSize < newSize) {
            subproof(tree, oldSize, 0, newSize, true, proof);
        }
        return proof;
    }

    /**
     * Checks an audit path as RFC 9162 §2.1.3.2 describes, without any part of the tree.
     *
     * @return whether {@code leafHash} at {@code index} is in the tree of {@code size} leaves with this root
     */
    public static boolean verifyInclusion(long index, long size, byte[] leafHash, List<byte[]> path, byte[] root) {
        if (index < 0 || index >= size) {
            return false;
        }
        long fn = index;
        long sn = size - 1;
        byte[] r = leafHash;
        for (byte[] p : path) {
            if (sn == 0) {
                return false;
            }
            if ((fn & 1) == 1 || fn == sn) {
                r = nodeHash(p, r);
                while ((fn & 1) == 0 && fn != 0) {
                    fn >>= 1;
                    sn >>= 1;
                }
            } else {
                r = nodeHash(r, p);
            }
            fn >>= 1;
            sn >>= 1;
        }
        return sn == 0 && Arrays.equals(r, root);
    }

    /**
     * Checks a consistency proof as RFC 9162 §2.1.4.2 describes: that the tree of {@code newSize} leaves
     * with {@code newRoot} extends the tree of {@code oldSize} leaves with {@code oldRoot}. For equal sizes
     * the proof must be empty and the roots equal; from size 0 the proof must be empty.
     */
    public static boolean verifyConsistency(long oldSize, long newSize, byte[] oldRoot, byte[] newRoot,
            List<byte[]> proof) {
        if (oldSize < 0 || oldSize > newSize) {
            return false;
        }
        if (oldSize == newSize) {
            return proof.isEmpty() && Arrays.equals(oldRoot, newRoot);
        }
        if (oldSize == 0) {
            return proof.isEmpty() && Arrays.equals(oldRoot, emptyRoot());
        }
        if (proof.isEmpty()) {
            return false;
        }
        List<byte[]> path = new ArrayList<>(proof);
        if (Long.bitCount(oldSize) == 1) {
            path.add(0, oldRoot);
        }
        long fn = oldSize - 1;
        long sn = newSize - 1;
        while ((fn & 1) == 1) {
            fn >>= 1;
            sn >>= 1;
        }
        byte[] fr = path.get(0);
        byte[] sr = path.get(0);
        for (byte[] c : path.subList(1, path.size())) {
            if (sn == 0) {
                return false;
            }
            if ((fn & 1) == 1 || fn == sn) {
                fr = nodeHash(c, fr);
                sr = nodeHash(c, sr);
                while ((fn & 1) == 0 && fn != 0) {
                    fn >>= 1;
                    sn >>= 1;
                }
            } else {
                sr = nodeHash(sr, c);
            }
            fn >>= 1;
            sn >>= 1;
        }
        return sn == 0 && Arrays.equals(fr, oldRoot) && Arrays.equals(sr, newRoot);
    }

    /** Every level of a tree held in memory, built in O(n): for small trees, tests and outside checks. */
    public static Subtrees of(List<byte[]> leaves) {
        List<byte[][]> levels = new ArrayList<>();
        byte[][] level = leaves.toArray(new byte[0][]);
        levels.add(level);
        while (level.length > 1) {
            byte[][] up = new byte[level.length / 2][];
            for (int i = 0; i < up.length; i++) {
                up[i] = nodeHash(level[2 * i], level[2 * i + 1]);
            }
            levels.add(up);
            level = up;
        }
        return (lvl, position) -> levels.get(lvl)[Math.toIntExact(position)];
    }

    /** Largest power of two strictly smaller than n (n ≥ 2), the split point of RFC 6962 §2.1. */
    static long split(long n) {
        return Long.highestOneBit(n - 1);
    }

    /** MTH(D[lo:hi]) for a range the RFC recursion produces: its perfect parts are always aligned. */
    private static byte[] range(Subtrees tree, long lo, long hi) {
        long n = hi - lo;
        if (Long.bitCount(n) == 1) {
            int level = Long.numberOfTrailingZeros(n);
            return tree.hash(level, lo >> level);
        }
        long k = split(n);
        return nodeHash(range(tree, lo, lo + k), range(tree, lo + k, hi));
    }

    private static void path(Subtrees tree, long m, long lo, long hi, List<byte[]> out) {
        long n = hi - lo;
        if (n == 1) {
            return;
        }
        long k = split(n);
        if (m < k) {
            path(tree, m, lo, lo + k, out);
            out.add(range(tree, lo + k, hi));
        } else {
            path(tree, m - k, lo + k, hi, out);
            out.add(range(tree, lo, lo + k));
        }
    }

    private static void subproof(Subtrees tree, long m, long lo, long hi, boolean whole, List<byte[]> out) {
        long n = hi - lo;
        if (m == n) {
            if (!whole) {
                out.add(range(tree, lo, hi));
            }
            return;
        }
        long k = split(n);
        if (m <= k) {
            subproof(tree, m, lo, lo + k, whole, out);
            out.add(range(tree, lo + k, hi));
        } else {
            subproof(tree, m - k, lo + k, hi, false, out);
            out.add(range(tree, lo, lo + k));
        }
    }

    private static MessageDigest digest() {
        try {
            return MessageDigest.getInstance("SHA-256");
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("every JDK has SHA-256", e);
        }
    }

    /**
     * The right edge of a growing tree, for appending leaves in order with O(log n) memory: gives the
     * root at any size and reports each perfect, aligned subtree as it is completed (which is what the
     * service stores). Not thread-safe.
     */
    public static final class Frontier {

        /** Receives each completed perfect subtree: its level, position and hash. */
        @FunctionalInterface
        public interface Completed {
            void node(int level, long position, byte[] hash);
        }

        private final byte[][] byLevel = new byte[64][];
        private long size;

        /** Appends the next leaf; {@code completed} sees the leaf itself (level 0) and each node it closes. */
        public void append(byte[] leafHash, Completed completed) {
            long index = size;
            byte[] h = leafHash;
            int level = 0;
            completed.node(0, index, h);
            while (((index >> level) & 1) == 1) {
                h = nodeHash(byLevel[level], h);
                byLevel[level] = null;
                level++;
                completed.node(level, index >> level, h);
            }
            byLevel[level] = h;
            size++;
        }

        public void append(byte[] leafHash) {
            append(leafHash, (l, p, h) -> {
            });
        }

        public long size() {
            return size;
        }

        /** MTH of the leaves appended so far: the perfect subtrees of the right edge, folded right to left. */
        public byte[] root() {
            byte[] r = null;
            for (byte[] h : byLevel) {
                if (h != null) {
                    r = r == null ? h : nodeHash(h, r);
                }
            }
            return r == null ? emptyRoot() : r;
        }
    }
}
