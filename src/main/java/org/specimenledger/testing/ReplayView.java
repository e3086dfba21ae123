package org.specimenledger.testing;

import java.time.Instant;
import java.util.List;
import java.util.UUID;

/**
 * The answer of a replay: whether recomputing the stored analysis from the stored raw bytes and stored
 * parameters with the running software gave every value bit for bit, and if not, where it differs.
 *
 * @param identical       true when every compared value (reader output, results with evidence, flags,
 *                        parameters, method version) is the same
 * @param inputSha256     the stored fingerprint of the raw curve
 * @param inputFingerprintMatches whether the stored bytes still hash to it
 * @param stored          the software that made the stored analysis
 * @param replayed        the software that replayed it
 * @param comparedValues  how many leaf values were compared
 * @param differenceCount how many differ; {@code differences} lists at most the first 200
 * @param failure         why the recomputation could not run (the reader or engine refused), or null
 */
public record ReplayView(UUID analysisId, UUID testRunId, boolean identical, String inputSha256,
        boolean inputFingerprintMatches, Software stored, Software replayed, long comparedValues, int differenceCount,
        List<Difference> differences, String failure, Instant replayedAt, String replayedBy) {

    /** Which software computed: application version, source commit and engine method version. */
    public record Software(String version, String commit, String methodVersion) {
    }

    /** One value that differs: JSON Pointer into {input, results, flags, parameters}, stored and replayed values. */
    public record Difference(String pointer, Object stored, Object replayed) {
    }
}
