package org.specimenledger.audit;

import java.util.HexFormat;
import java.util.List;
import org.specimenledger.shared.RecordNotFound;
import org.specimenledger.shared.RuleViolation;
import org.springframework.stereotype.Service;
import org.springframework.transaction.annotation.Transactional;

/** Inclusion and consistency proofs from the stored Merkle tree, tied to signed checkpoints where they exist. */
@Service
public class LedgerProofs {

    private static final HexFormat HEX = HexFormat.of();

    private final LedgerTree tree;
    private final Checkpoints checkpoints;

    LedgerProofs(LedgerTree tree, Checkpoints checkpoints) {
        this.tree = tree;
        this.checkpoints = checkpoints;
    }

    /**
     * The audit path of event {@code seq}: in the tree of {@code treeSize} events when given, otherwise
     * in the latest checkpoint that covers the event (or the current tree when none covers it yet).
     *
     * @throws RecordNotFound for an event that does not exist
     * @throws RuleViolation  ({@code treeSize}) for a size below {@code seq} or beyond the current tree
     */
    @Transactional(readOnly = true)
    public InclusionProof inclusion(long seq, Long treeSize) {
        long size = tree.size();
        if (seq < 1 || seq > size) {
            throw new RecordNotFound("ledger event", seq);
        }
        CheckpointView checkpoint;
        long n;
        if (treeSize != null) {
            if (treeSize < seq || treeSize > size) {
                throw new RuleViolation("treeSize", "treeSize must be between the event's sequence number " + seq
                        + " and the current tree size " + size + ", was " + treeSize);
            }
            n = treeSize;
            checkpoint = checkpoints.latestOfSize(n).orElse(null);
        } else {
            checkpoint = checkpoints.latestCovering(seq).orElse(null);
            n = checkpoint != null ? checkpoint.treeSize() : size;
        }
        long index = seq - 1;
        return new InclusionProof(seq, index, n, HEX.formatHex(tree.leaf(index)), HEX.formatHex(tree.root(n)),
                hex(tree.inclusionPath(index, n)), checkpoint);
    }

    /**
     * The consistency proof from the tree of {@code from} events to the tree of {@code to} events.
     *
     * @throws RuleViolation ({@code from} or {@code to}) unless 0 ≤ from ≤ to ≤ current tree size
     */
    @Transactional(readOnly = true)
    public ConsistencyProof consistency(long from, long to) {
        long size = tree.size();
        if (to < 0 || to > size) {
            throw new RuleViolation("to", "to must be between 0 and the current tree size " + size + ", was " + to);
        }
        if (from < 0 || from > to) {
            throw new RuleViolation("from", "from must be between 0 and to (" + to + "), was " + from);
        }
        return new ConsistencyProof(from, to, HEX.formatHex(tree.root(from)), HEX.formatHex(tree.root(to)),
                hex(tree.consistencyProof(from, to)), checkpoints.latestOfSize(from).orElse(null),
                checkpoints.latestOfSize(to).orElse(null));
    }

    private static List<String> hex(List<byte[]> hashes) {
        return hashes.stream().map(HEX::formatHex).toList();
    }
}
