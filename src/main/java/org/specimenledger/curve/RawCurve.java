package org.specimenledger.curve;

import java.util.List;
import java.util.Map;

/**
 * One curve file as read: the channels in canonical units (force in N, lengths in mm, time in s),
 * the fingerprint of the exact bytes, the metadata and what the reader noticed.
 *
 * <p>Immutable. The array accessors return a fresh copy on every call (8 bytes per point, about a
 * millisecond for a million points) so no caller can change what another sees or what was
 * fingerprinted; an analysis takes its copy once and works on that. The instance itself holds each
 * channel exactly once, trimmed to {@link #size()}, so its retained heap is the primitive arrays plus
 * a few hundred bytes.
 *
 * <p>Absent optional channels (time, crosshead) are returned as empty arrays, never null; use
 * {@link #hasTime()} and {@link #hasCrosshead()} to tell.
 */
public final class RawCurve {

    private static final double[] NONE = new double[0];

    private final double[] forceN;
    private final double[] extensionMm;
    private final double[] timeS;
    private final double[] crossheadMm;
    private final int extensometerPoints;
    private final String sha256;
    private final long byteCount;
    private final Map<String, String> metadata;
    private final List<ChannelColumn> channels;
    private final List<String> warnings;

    RawCurve(double[] forceN, double[] extensionMm, double[] timeS, double[] crossheadMm, int extensometerPoints,
            String sha256, long byteCount, Map<String, String> metadata, List<ChannelColumn> channels,
            List<String> warnings) {
        this.forceN = forceN;
        this.extensionMm = extensionMm == null ? NONE : extensionMm;
        this.extensometerPoints = extensometerPoints;
        this.timeS = timeS == null ? NONE : timeS;
        this.crossheadMm = crossheadMm == null ? NONE : crossheadMm;
        this.sha256 = sha256;
        this.byteCount = byteCount;
        this.metadata = metadata;
        this.channels = List.copyOf(channels);
        this.warnings = List.copyOf(warnings);
    }

    /**
     * Number of data points (data rows).
     *
     * @return at least the configured minimum of the reader that produced this curve
     */
    public int size() {
        return forceN.length;
    }

    /**
     * Force of every point.
     *
     * @return a new array of {@link #size()} finite values in newtons
     */
    public double[] forceN() {
        return forceN.clone();
    }

    /**
     * Extensometer extension of every point.
     *
     * @return a new array of {@link #size()} values in millimetres, finite for the first
     *     {@link #extensometerPoints()} and NaN after them (extensometer removed, only in a file with a
     *     crosshead channel); an empty array for a crosshead-only file
     */
    public double[] extensionMm() {
        return extensionMm.clone();
    }

    /**
     * Elapsed time of every point, never decreasing.
     *
     * @return a new array of {@link #size()} values in seconds, or an empty array when the file has
     *     no time channel
     */
    public double[] timeS() {
        return timeS.clone();
    }

    /**
     * Crosshead displacement of every point.
     *
     * @return a new array of {@link #size()} values in millimetres, or an empty array when the file
     *     has no crosshead channel
     */
    public double[] crossheadMm() {
        return crossheadMm.clone();
    }

    /**
     * How many leading points carry an extensometer value.
     *
     * @return {@link #size()} for a complete extension channel, fewer when its cells end (the extensometer
     *     was removed; the crosshead continues), 0 when the file has no extension channel
     */
    public int extensometerPoints() {
        return extensometerPoints;
    }

    /**
     * Whether the file had an extension channel (a crosshead-only file has none).
     *
     * @return true when {@link #extensionMm()} holds {@link #size()} values
     */
    public boolean hasExtensometer() {
        return extensionMm.length > 0;
    }

    /**
     * Whether the file had a time channel.
     *
     * @return true when {@link #timeS()} holds {@link #size()} values
     */
    public boolean hasTime() {
        return timeS.length > 0;
    }

    /**
     * Whether the file had a crosshead channel.
     *
     * @return true when {@link #crossheadMm()} holds {@link #size()} values
     */
    public boolean hasCrosshead() {
        return crossheadMm.length > 0;
    }

    /**
     * SHA-256 of the exact bytes read, byte order mark and line endings included.
     *
     * @return 64 lower-case hexadecimal digits
     */
    public String sha256() {
        return sha256;
    }

    /**
     * Number of bytes read, the whole file.
     *
     * @return the file size in bytes
     */
    public long byteCount() {
        return byteCount;
    }

    /**
     * The {@code # key: value} and {@code # key = value} lines before the header, in file order.
     *
     * @return an unmodifiable ordered map, empty when the file has none
     */
    public Map<String, String> metadata() {
        return metadata;
    }

    /**
     * The known channels found in the header, in column order.
     *
     * @return an unmodifiable list with force and extension always present
     */
    public List<ChannelColumn> channels() {
        return channels;
    }

    /**
     * What the reader accepted but wants a person to know: ignored columns, skipped blank lines,
     * repeated time stamps, repeated metadata keys.
     *
     * @return an unmodifiable list of sentences, empty when there is nothing to report
     */
    public List<String> warnings() {
        return warnings;
    }

    /**
     * Estimated heap held by the point arrays: 8 bytes per value plus a 16-byte array header each.
     * It makes the "trimmed to size" claim checkable without an object-layout tool.
     *
     * @return bytes, a lower bound of the instance's retained heap
     */
    public long arrayHeapBytes() {
        return arrayBytes(forceN) + arrayBytes(extensionMm) + arrayBytes(timeS) + arrayBytes(crossheadMm);
    }

    @Override
    public String toString() {
        return "RawCurve[" + size() + " points, channels " + channels + ", sha256 " + sha256 + ", " + byteCount
                + " bytes]";
    }

    private static long arrayBytes(double[] values) {
        return values == NONE ? 0 : 16L + 8L * values.length;
    }
}
