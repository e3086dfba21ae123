package org.specimenledger.curve;

import java.io.IOException;
import java.io.InputStream;
import java.lang.invoke.MethodHandles;
import java.lang.invoke.VarHandle;
import java.nio.ByteOrder;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;

/**
 * Splits a stream into physical lines without decoding it, fingerprinting every byte on the way.
 *
 * <p>Bytes are read in 64 KiB chunks into one reusable buffer; a line is handed out as a slice
 * ({@link #buffer()}, {@link #start()}, {@link #end()}) valid until the next call to {@link #next()}.
 * The buffer only grows for a single line longer than itself, and never beyond the size limit, which
 * is checked on every read so an oversized upload is stopped after {@code maxBytes + 1} bytes.
 */
final class LineSource {

    private static final int CHUNK = 64 * 1024;
    private static final VarHandle LONGS = MethodHandles.byteArrayViewVarHandle(long[].class, ByteOrder.LITTLE_ENDIAN);
    private static final long EIGHT_NEWLINES = 0x0A0A0A0A0A0A0A0AL;

    private final InputStream in;
    private final long maxBytes;
    private final MessageDigest digest;
    private byte[] buffer = new byte[CHUNK];
    private int pos;
    private int filled;
    private boolean eof;
    private long byteCount;
    private int lineNumber;
    private int start;
    private int end;
    /** OR of every byte of the current line: negative when the line holds a byte of 0x80 or more. */
    private long orOfLine;
    private long orPending;

    LineSource(InputStream in, long maxBytes) {
        this.in = in;
        this.maxBytes = maxBytes;
        this.digest = sha256();
    }

    /**
     * Advances to the next physical line; the LF and one CR before it are not part of the slice.
     *
     * @return false at the end of the stream
     * @throws CurveRejected when the stream passes the size limit
     */
    boolean next() throws IOException {
        int searchFrom = pos;
        while (true) {
            int newline = indexOfNewline(searchFrom);
            if (newline >= 0) {
                setLine(pos, newline);
                pos = newline + 1;
                return true;
            }
            if (eof) {
                if (pos == filled) {
                    return false;
                }
                setLine(pos, filled);
                pos = filled;
                return true;
            }
            int searched = filled - pos;
            makeRoom();
            searchFrom = searched;
            fill();
        }
    }

    byte[] buffer() {
        return buffer;
    }

    int start() {
        return start;
    }

    int end() {
        return end;
    }

    /** 1-based physical line number of the current line. */
    int lineNumber() {
        return lineNumber;
    }

    /**
     * Whether the current line is pure ASCII, learned for free while looking for its end; only lines
     * with other bytes need UTF-8 validation (numbers, delimiters and line ends are all ASCII).
     */
    boolean lineIsAscii() {
        return (orOfLine & 0x8080808080808080L) == 0;
    }

    long byteCount() {
        return byteCount;
    }

    /** Lower-case hex SHA-256 of every byte read so far; call once, after the last line. */
    String sha256Hex() {
        return HexFormat.of().formatHex(digest.digest());
    }

    /** Skips a UTF-8 byte order mark at the start of the current line (only meaningful on line 1). */
    void skipByteOrderMark() {
        if (end - start >= 3 && buffer[start] == (byte) 0xEF && buffer[start + 1] == (byte) 0xBB
                && buffer[start + 2] == (byte) 0xBF) {
            start += 3;
        }
    }

    private void setLine(int from, int to) {
        lineNumber++;
        orOfLine = orPending;
        orPending = 0;
        start = from;
        end = to > from && buffer[to - 1] == '\r' ? to - 1 : to;
    }

    /**
     * Finds the next LF eight bytes at a time: XOR with eight LFs turns an LF byte into zero, and the
     * classic "has a zero byte" test ({@code (x - 0x01..) & ~x & 0x80..}) flags it; the lowest flag
     * is the first LF because the words are read little-endian.
     */
    private int indexOfNewline(int from) {
        byte[] b = buffer;
        int i = from;
        long or = orPending;
        for (int last = filled - Long.BYTES; i <= last; i += Long.BYTES) {
            long word = (long) LONGS.get(b, i);
            long x = word ^ EIGHT_NEWLINES;
            long found = (x - 0x0101010101010101L) & ~x & 0x8080808080808080L;
            if (found != 0) {
                // Only the bytes before the LF belong to this line: keep the bits below its flag.
                orPending = or | (word & (found ^ (found - 1)));
                return i + (Long.numberOfTrailingZeros(found) >>> 3);
            }
            or |= word;
        }
        for (; i < filled; i++) {
            if (b[i] == '\n') {
                orPending = or;
                return i;
            }
            or |= b[i] & 0xFF;
        }
        orPending = or;
        return -1;
    }

    /** Moves the unfinished line to the front; grows the buffer only when that line fills it. */
    private void makeRoom() {
        int rest = filled - pos;
        if (pos > 0) {
            System.arraycopy(buffer, pos, buffer, 0, rest);
        } else if (rest == buffer.length) {
            byte[] larger = new byte[buffer.length * 2];
            System.arraycopy(buffer, 0, larger, 0, rest);
            buffer = larger;
        }
        pos = 0;
        filled = rest;
    }

    private void fill() throws IOException {
        // Never ask for more than one byte past the limit: that byte is the proof the file is too big.
        long allowed = maxBytes + 1 - byteCount;
        int want = (int) Math.min(buffer.length - filled, allowed);
        int n = in.read(buffer, filled, want);
        if (n < 0) {
            eof = true;
            return;
        }
        digest.update(buffer, filled, n);
        filled += n;
        byteCount += n;
        if (byteCount > maxBytes) {
            throw new CurveRejected(0, 0, "the file is larger than the limit of " + maxBytes + " bytes");
        }
    }

    private static MessageDigest sha256() {
        try {
            return MessageDigest.getInstance("SHA-256");
        } catch (NoSuchAlgorithmException e) {
            // Every Java platform must provide SHA-256 (MessageDigest class documentation).
            throw new IllegalStateException("SHA-256 is not available", e);
        }
    }
}
