package org.specimenledger.audit;

import java.util.List;

/**
 * Proof that the ledger's tree of {@code toSize} events extends its tree of {@code fromSize} events,
 * i.e. no event up to {@code fromSize} was changed, removed or reordered in between (RFC 6962 §2.1.2;
 * check it with {@link MerkleTree#verifyConsistency} or any RFC 9162 §2.1.4.2 verifier). Hashes are
 * lower-case hex.
 *
 * @param proof          empty when the sizes are equal or {@code fromSize} is 0
 * @param fromCheckpoint the latest signed checkpoint of {@code fromSize} events, or null when there is none
 * @param toCheckpoint   the latest signed checkpoint of {@code toSize} events, or null when there is none
 */
public record ConsistencyProof(long fromSize, long toSize, String fromRoot, String toRoot, List<String> proof,
        CheckpointView fromCheckpoint, CheckpointView toCheckpoint) {
}
