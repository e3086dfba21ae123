package org.specimenledger.testing;

import jakarta.persistence.Column;
import jakarta.persistence.Entity;
import jakarta.persistence.Id;
import jakarta.persistence.Table;
import java.time.Instant;
import java.util.UUID;
import org.hibernate.annotations.Immutable;

/**
 * The description of a raw curve file as received: fingerprint, size, media type, name, who and when.
 * The bytes themselves are behind {@link CurveContentStore}. Written once; the database refuses changes.
 */
@Entity
@Immutable
@Table(name = "raw_curve")
class CurveFile {

    @Id
    private UUID id;

    @Column(name = "test_run_id", nullable = false, updatable = false)
    private UUID testRunId;

    @Column(nullable = false, updatable = false)
    private String sha256;

    @Column(name = "size_bytes", nullable = false, updatable = false)
    private long sizeBytes;

    @Column(name = "media_type", nullable = false, updatable = false)
    private String mediaType;

    @Column(name = "original_name", updatable = false)
    private String originalName;

    @Column(nullable = false, updatable = false)
    private int points;

    @Column(name = "duplicate_of_test_run_id", updatable = false)
    private UUID duplicateOfTestRunId;

    @Column(name = "duplicate_reason", updatable = false)
    private String duplicateReason;

    @Column(name = "received_at", nullable = false, updatable = false)
    private Instant receivedAt;

    @Column(name = "received_by", nullable = false, updatable = false)
    private String receivedBy;

    protected CurveFile() {
    }

    CurveFile(UUID id, UUID testRunId, String sha256, long sizeBytes, String mediaType, String originalName, int points,
            UUID duplicateOfTestRunId, String duplicateReason, Instant receivedAt, String receivedBy) {
        this.id = id;
        this.testRunId = testRunId;
        this.sha256 = sha256;
        this.sizeBytes = sizeBytes;
        this.mediaType = mediaType;
        this.originalName = originalName;
        this.points = points;
        this.duplicateOfTestRunId = duplicateOfTestRunId;
        this.duplicateReason = duplicateReason;
        this.receivedAt = receivedAt;
        this.receivedBy = receivedBy;
    }

    UUID id() {
        return id;
    }

    UUID testRunId() {
        return testRunId;
    }

    String sha256() {
        return sha256;
    }

    long sizeBytes() {
        return sizeBytes;
    }

    String mediaType() {
        return mediaType;
    }

    String originalName() {
        return originalName;
    }

    int points() {
        return points;
    }

    UUID duplicateOfTestRunId() {
        return duplicateOfTestRunId;
    }

    String duplicateReason() {
        return duplicateReason;
    }

    Instant receivedAt() {
        return receivedAt;
    }

    String receivedBy() {
        return receivedBy;
    }
}
