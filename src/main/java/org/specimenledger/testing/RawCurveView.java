package org.specimenledger.testing;

import java.time.Instant;
import java.util.UUID;

/**
 * A stored raw curve file's description as the API returns it and the ledger records it.
 *
 * @param duplicateOfTestRunId the other test run whose curve has the same bytes, when the upload confirmed that
 */
public record RawCurveView(UUID id, UUID testRunId, String sha256, long sizeBytes, String mediaType,
        String originalName, int points, UUID duplicateOfTestRunId, String duplicateReason, Instant receivedAt,
        String receivedBy) {

    static RawCurveView of(CurveFile f) {
        return new RawCurveView(f.id(), f.testRunId(), f.sha256(), f.sizeBytes(), f.mediaType(), f.originalName(),
                f.points(), f.duplicateOfTestRunId(), f.duplicateReason(), f.receivedAt(), f.receivedBy());
    }
}
