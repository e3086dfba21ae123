package org.specimenledger.audit;

import java.util.List;

/**
 * Proof that one event is in the ledger's Merkle tree of {@code treeSize} events (RFC 6962 §2.1.1;
 * check it with {@link MerkleTree#verifyInclusion} or any RFC 9162 §2.1.3.2 verifier). All hashes are
 * lower-case hex.
 *
 * @param seq        the event
 * @param leafIndex  its leaf: {@code seq − 1}
 * @param leafHash   SHA-256(0x00 ‖ canonical text of the event, UTF-8)
 * @param rootHash   the root of the tree of {@code treeSize} leaves, from the stored tree
 * @param auditPath  sibling hashes from the leaf up to the root's child
 * @param checkpoint the signed checkpoint of this tree size, or null when no checkpoint covers the event yet
 *                   (then the proof is against the current tree)
 */
public record InclusionProof(long seq, long leafIndex, long treeSize, String leafHash, String rootHash,
        List<String> auditPath, CheckpointView checkpoint) {
}
