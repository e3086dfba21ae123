package org.specimenledger.audit;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.nio.charset.StandardCharsets;
import java.security.MessageDigest;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HexFormat;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * The Merkle tree against RFC 6962 §2.1. The oracle is {@link Rfc}, written in this test straight from
 * the RFC's recursive definitions (MTH, PATH, PROOF, SUBPROOF over lists of byte strings, §2.1,
 * §2.1.1, §2.1.2), sharing no code with {@link MerkleTree}.
 */
class MerkleTreeTest {

    private static final HexFormat HEX = HexFormat.of();

    /** Empty tree: SHA-256 of the empty string (RFC 6962 §2.1; DOMAIN.md [S, RFC 6962 construction, recomputed]). */
    @Test
    void emptyTreeHashesToSha256OfNothing() {
        assertThat(HEX.formatHex(MerkleTree.emptyRoot()))
                .isEqualTo("e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855");
        assertThat(HEX.formatHex(MerkleTree.root(MerkleTree.of(List.of()), 0)))
                .isEqualTo("e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855");
    }

    /** Leaves "0","1","2" (DOMAIN.md [S, RFC 6962 construction, recomputed]). */
    @Test
    void threeLeavesGiveThePublishedRoot() {
        List<byte[]> leaves = leaves("0", "1", "2");
        String expected = "725d5230db68f557470dc35f1d8865813acd7ebb07ad152774141decbae71327";
        assertThat(HEX.formatHex(MerkleTree.root(MerkleTree.of(leaves), 3))).isEqualTo(expected);
        assertThat(HEX.formatHex(Rfc.mth(data("0", "1", "2")))).isEqualTo(expected);
        MerkleTree.Frontier frontier = new MerkleTree.Frontier();
        leaves.forEach(frontier::append);
        assertThat(HEX.formatHex(frontier.root())).isEqualTo(expected);
    }

    @Test
    void rootsEqualTheRfcRecursionForEverySizeUpTo64() {
        List<byte[]> data = numbered(64);
        List<byte[]> leaves = data.stream().map(MerkleTree::leafHash).toList();
        MerkleTree.Subtrees tree = MerkleTree.of(leaves);
        MerkleTree.Frontier frontier = new MerkleTree.Frontier();
        for (int n = 0; n <= 64; n++) {
            byte[] expected = Rfc.mth(data.subList(0, n));
            assertThat(MerkleTree.root(tree, n)).as("n=%d", n).isEqualTo(expected);
            assertThat(frontier.root()).as("frontier n=%d", n).isEqualTo(expected);
            if (n < 64) {
                frontier.append(leaves.get(n));
            }
        }
    }

    @Test
    void inclusionPathsEqualTheRfcAndVerifyForEveryLeafOfEverySizeUpTo40() {
        List<byte[]> data = numbered(40);
        List<byte[]> leaves = data.stream().map(MerkleTree::leafHash).toList();
        MerkleTree.Subtrees tree = MerkleTree.of(leaves);
        for (int n = 1; n <= 40; n++) {
            byte[] root = Rfc.mth(data.subList(0, n));
            for (int m = 0; m < n; m++) {
                List<byte[]> path = MerkleTree.inclusionPath(tree, m, n);
                assertThat(path).as("PATH(%d, D[%d])", m, n).containsExactlyElementsOf(Rfc.path(m, data.subList(0, n)));
                assertThat(MerkleTree.verifyInclusion(m, n, leaves.get(m), path, root)).as("m=%d n=%d", m, n).isTrue();
                // a wrong leaf, index or a cut path must fail (a wrong size alone may not: the signed
                // checkpoint binds the size to the root, RFC 9162 §2.1.3.2 checks the path against both)
                assertThat(MerkleTree.verifyInclusion(m, n, leaves.get((m + 1) % 40), path, root)).isFalse();
                if (n > 1) {
                    assertThat(MerkleTree.verifyInclusion((m + 1) % n, n, leaves.get(m), path, root)).isFalse();
                    assertThat(MerkleTree.verifyInclusion(m, n, leaves.get(m), path.subList(1, path.size()), root))
                            .isFalse();
                }
            }
        }
    }

    @Test
    void consistencyProofsEqualTheRfcAndVerifyForEveryPairUpTo40() {
        List<byte[]> data = numbered(40);
        List<byte[]> leaves = data.stream().map(MerkleTree::leafHash).toList();
        MerkleTree.Subtrees tree = MerkleTree.of(leaves);
        for (int n = 0; n <= 40; n++) {
            byte[] newRoot = Rfc.mth(data.subList(0, n));
            for (int m = 0; m <= n; m++) {
                byte[] oldRoot = Rfc.mth(data.subList(0, m));
                List<byte[]> proof = MerkleTree.consistencyProof(tree, m, n);
                List<byte[]> expected = m == 0 ? List.of() : Rfc.proof(m, data.subList(0, n));
                assertThat(proof).as("PROOF(%d, D[%d])", m, n).containsExactlyElementsOf(expected);
                assertThat(MerkleTree.verifyConsistency(m, n, oldRoot, newRoot, proof)).as("m=%d n=%d", m, n)
                        .isTrue();
                if (m > 0 && m < n) {
                    byte[] otherOld = Rfc.mth(data.subList(1, m + 1));
                    assertThat(MerkleTree.verifyConsistency(m, n, otherOld, newRoot, proof)).isFalse();
                    assertThat(MerkleTree.verifyConsistency(m, n, oldRoot, oldRoot, proof)).isFalse();
                    assertThat(MerkleTree.verifyConsistency(m, n, oldRoot, newRoot, proof.subList(0, proof.size() - 1)))
                            .isFalse();
                }
            }
        }
    }

    @Test
    void frontierReportsEachCompletedPerfectSubtreeOnce() {
        List<byte[]> leaves = numbered(13).stream().map(MerkleTree::leafHash).toList();
        MerkleTree.Subtrees full = MerkleTree.of(leaves);
        MerkleTree.Frontier frontier = new MerkleTree.Frontier();
        List<String> seen = new ArrayList<>();
        for (byte[] leaf : leaves) {
            frontier.append(leaf, (level, position, hash) -> {
                seen.add(level + ":" + position);
                assertThat(hash).isEqualTo(full.hash(level, position));
            });
        }
        // 13 leaves, 6 + 3 + 1 complete pairs, quads and the one octet
        assertThat(seen).hasSize(13 + 6 + 3 + 1).doesNotHaveDuplicates();
    }

    @Test
    void refusesIndicesAndSizesOutOfRange() {
        MerkleTree.Subtrees tree = MerkleTree.of(leaves("a", "b"));
        assertThatThrownBy(() -> MerkleTree.inclusionPath(tree, 2, 2)).hasMessageContaining("leaf index 2");
        assertThatThrownBy(() -> MerkleTree.consistencyProof(tree, 3, 2)).hasMessageContaining("from size 3 to 2");
        assertThatThrownBy(() -> MerkleTree.root(tree, -1)).hasMessageContaining("-1");
        assertThat(MerkleTree.verifyInclusion(0, 0, MerkleTree.leafHash(bytes("a")), List.of(), MerkleTree.emptyRoot()))
                .isFalse();
    }

    private static List<byte[]> numbered(int n) {
        List<byte[]> out = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            out.add(bytes("leaf " + i));
        }
        return out;
    }

    private static List<byte[]> data(String... values) {
        return Arrays.stream(values).map(MerkleTreeTest::bytes).toList();
    }

    private static List<byte[]> leaves(String... values) {
        return data(values).stream().map(MerkleTree::leafHash).toList();
    }

    private static byte[] bytes(String s) {
        return s.getBytes(StandardCharsets.UTF_8);
    }

    /** RFC 6962 §2.1, §2.1.1 and §2.1.2, transcribed literally: lists of inputs, recursion, concatenation. */
    static final class Rfc {

        static byte[] sha256(byte[]... parts) {
            try {
                MessageDigest d = MessageDigest.getInstance("SHA-256");
                for (byte[] p : parts) {
                    d.update(p);
                }
                return d.digest();
            } catch (java.security.NoSuchAlgorithmException e) {
                throw new IllegalStateException(e);
            }
        }

        /** k: the largest power of two smaller than n, found by counting up (not by bit tricks). */
        static int k(int n) {
            int k = 1;
            while (k * 2 < n) {
                k *= 2;
            }
            return k;
        }

        /** MTH(D[n]). */
        static byte[] mth(List<byte[]> d) {
            int n = d.size();
            if (n == 0) {
                return sha256();
            }
            if (n == 1) {
                return sha256(new byte[] {0}, d.get(0));
            }
            int k = k(n);
            return sha256(new byte[] {1}, mth(d.subList(0, k)), mth(d.subList(k, n)));
        }

        /** PATH(m, D[n]). */
        static List<byte[]> path(int m, List<byte[]> d) {
            int n = d.size();
            List<byte[]> out = new ArrayList<>();
            if (n == 1) {
                return out;
            }
            int k = k(n);
            if (m < k) {
                out.addAll(path(m, d.subList(0, k)));
                out.add(mth(d.subList(k, n)));
            } else {
                out.addAll(path(m - k, d.subList(k, n)));
                out.add(mth(d.subList(0, k)));
            }
            return out;
        }

        /** PROOF(m, D[n]) = SUBPROOF(m, D[n], true). */
        static List<byte[]> proof(int m, List<byte[]> d) {
            return subproof(m, d, true);
        }

        static List<byte[]> subproof(int m, List<byte[]> d, boolean b) {
            int n = d.size();
            List<byte[]> out = new ArrayList<>();
            if (m == n) {
                if (!b) {
                    out.add(mth(d));
                }
                return out;
            }
            int k = k(n);
            if (m <= k) {
                out.addAll(subproof(m, d.subList(0, k), b));
                out.add(mth(d.subList(k, n)));
            } else {
                out.addAll(subproof(m - k, d.subList(k, n), false));
                out.add(mth(d.subList(0, k)));
            }
            return out;
        }
    }
}
