package org.specimenledger.curve;

/**
 * Limits a {@link CurveReader} enforces on every file.
 *
 * @param maxBytes maximum file size in bytes, at least 1; a file with more bytes is rejected as soon
 *     as byte {@code maxBytes + 1} has been read, without reading the rest
 * @param minPoints minimum number of data rows, at least 1; fewer rows are rejected
 * @param maxPoints maximum number of data rows, at least {@code minPoints}; the file is rejected as soon
 *     as row {@code maxPoints + 1} is read, so a file of many tiny rows cannot fill the memory
 */
public record CurveReadingLimits(long maxBytes, int minPoints, int maxPoints) {

    /** Default maximum file size: 64 MiB, room for several million three-channel rows. */
    public static final long DEFAULT_MAX_BYTES = 64L * 1024 * 1024;

    /** Default minimum number of data points: fewer cannot carry an elastic fit and a plastic part. */
    public static final int DEFAULT_MIN_POINTS = 20;

    /** Default maximum number of data points: above what a 64 MiB file of ordinary rows can hold. */
    public static final int DEFAULT_MAX_POINTS = 5_000_000;

    /**
     * Checks the ranges.
     *
     * @throws IllegalArgumentException if {@code maxBytes < 1}, {@code minPoints < 1} or
     *     {@code maxPoints < minPoints}
     */
    public CurveReadingLimits {
        if (maxBytes < 1) {
            throw new IllegalArgumentException("maxBytes must be at least 1, was " + maxBytes);
        }
        if (minPoints < 1) {
            throw new IllegalArgumentException("minPoints must be at least 1, was " + minPoints);
        }
        if (maxPoints < minPoints) {
            throw new IllegalArgumentException("maxPoints must be at least minPoints (" + minPoints + "), was "
                    + maxPoints);
        }
    }

    /**
     * Limits with the default maximum number of points ({@value #DEFAULT_MAX_POINTS}).
     *
     * @param maxBytes maximum file size in bytes, at least 1
     * @param minPoints minimum number of data rows, at least 1
     */
    public CurveReadingLimits(long maxBytes, int minPoints) {
        this(maxBytes, minPoints, Math.max(minPoints, DEFAULT_MAX_POINTS));
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
        return new CurveReadingLimits(bytes, minPoints, maxPoints);
    }

    /**
     * A copy with another minimum number of data points.
     *
     * @param points the new minimum, at least 1
     * @return the new limits
     */
    public CurveReadingLimits withMinPoints(int points) {
        return new CurveReadingLimits(maxBytes, points, Math.max(points, maxPoints));
    }

    /**
     * A copy with another maximum number of data points.
     *
     * @param points the new maximum, at least the minimum
     * @return the new limits
     */
    public CurveReadingLimits withMaxPoints(int points) {
        return new CurveReadingLimits(maxBytes, minPoints, points);
    }
}
