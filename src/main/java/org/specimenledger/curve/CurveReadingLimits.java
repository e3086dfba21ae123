package org.specimenledger.curve;

/**
 * Limits a {@link CurveReader} enforces on every file.
 *
 * @param maxBytes maximum file size in bytes, at least 1; a file with more bytes is rejected as soon
 *     as byte {@code maxBytes + 1} has been read, without reading the rest
 * @param minPoints minimum number of data rows, at least 1; fewer rows are rejected
 */
public record CurveReadingLimits(long maxBytes, int minPoints) {

    /** Default maximum file size: 64 MiB, room for several million three-channel rows. */
    public static final long DEFAULT_MAX_BYTES = 64L * 1024 * 1024;

    /** Default minimum number of data points: fewer cannot carry an elastic fit and a plastic part. */
    public static final int DEFAULT_MIN_POINTS = 20;

    /**
     * Checks the ranges.
     *
     * @throws IllegalArgumentException if {@code maxBytes < 1} or {@code minPoints < 1}
     */
    public CurveReadingLimits {
        if (maxBytes < 1) {
            throw new IllegalArgumentException("maxBytes must be at least 1, was " + maxBytes);
        }
        if (minPoints < 1) {
            throw new IllegalArgumentException("minPoints must be at least 1, was " + minPoints);
        }
    }

    /**
     * The default limits: {@value #DEFAULT_MAX_BYTES} bytes and {@value #DEFAULT_MIN_POINTS} points.
     *
     * @return the default limits
     */
    public static CurveReadingLimits defaults() {
        return new CurveReadingLimits(DEFAULT_MAX_BYTES, DEFAULT_MIN_POINTS);
    }

    /**
     * A copy with another maximum file size.
     *
     * @param bytes the new maximum in bytes, at least 1
     * @return the new limits
     */
    public CurveReadingLimits withMaxBytes(long bytes) {
        return new CurveReadingLimits(bytes, minPoints);
    }

    /**
     * A copy with another minimum number of data points.
     *
     * @param points the new minimum, at least 1
     * @return the new limits
     */
    public CurveReadingLimits withMinPoints(int points) {
        return new CurveReadingLimits(maxBytes, points);
    }
}
