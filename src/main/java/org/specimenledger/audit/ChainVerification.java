package org.specimenledger.audit;

/**
 * The outcome of recomputing the chain: valid with the number of events checked, or the first event
 * that does not verify and why.
 *
 * @param firstBrokenSeq null when valid
 * @param problem        {@code hash-mismatch}, {@code broken-link}, {@code missing-sequence} or
 *                       {@code column-mismatch} (see {@link ChainVerifier}); null when valid
 * @param detail         what was found, naming the column for a column mismatch
 */
public record ChainVerification(boolean valid, long eventsChecked, String headHash, Long firstBrokenSeq,
        String problem, String detail) {

    static ChainVerification ok(long checked, String headHash) {
        return new ChainVerification(true, checked, headHash, null, null, null);
    }

    static ChainVerification broken(long checked, long seq, String problem, String detail) {
        return new ChainVerification(false, checked, null, seq, problem, detail);
    }
}
