package org.specimenledger.testing;

import java.io.IOException;
import java.io.InputStream;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.Arrays;
import java.util.HexFormat;

/**
 * Takes in an upload's bytes, keeping a copy of everything read through it: the file is held once in
 * memory, for the reader and the store alike. Holds at most {@code limit} bytes; one more and it throws
 * {@link CurveTooLarge}. When the size is announced (Content-Length), the copy is allocated once at that
 * size. Read through it (as a stream) or {@link #drain()} it. The SHA-256 of the bytes is computed as they
 * arrive, so the duplicate check needs no second pass over the file.
 */
final class CapturedUpload extends InputStream {

    private final InputStream in;
    private final long limit;
    private byte[] copy;
    private int size;
    private final MessageDigest sha256;

    CapturedUpload(InputStream in, long announcedSize, long limit) {
        this.in = in;
        this.limit = limit;
        this.copy = new byte[(int) Math.min(announcedSize > 0 ? announcedSize : 64 * 1024, limit)];
        try {
            this.sha256 = MessageDigest.getInstance("SHA-256");
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("every Java platform has SHA-256", e);
        }
    }

    @Override
    public int read() throws IOException {
        byte[] one = new byte[1];
        int n = read(one, 0, 1);
        return n < 0 ? -1 : one[0] & 0xff;
    }

    @Override
    public int read(byte[] b, int off, int len) throws IOException {
        int n = in.read(b, off, len);
        if (n > 0) {
            if ((long) size + n > limit) {
                throw new CurveTooLarge(-1, limit);
            }
            if (size + n > copy.length) {
                copy = Arrays.copyOf(copy, (int) Math.min(limit, Math.max((long) copy.length * 2, (long) size + n)));
            }
            System.arraycopy(b, off, copy, size, n);
            sha256.update(b, off, n);
            size += n;
        }
        return n;
    }

    /** Reads the rest of the upload into the copy. */
    void drain() throws IOException {
        byte[] buffer = new byte[64 * 1024];
        while (read(buffer, 0, buffer.length) >= 0) {
            // keep copying: every byte of the file is stored
        }
    }

    /** The bytes received, exactly. */
    byte[] bytes() {
        return size == copy.length ? copy : Arrays.copyOf(copy, size);
    }

    /** Lower-case hex SHA-256 of everything read; call once, after the last byte. */
    String sha256() {
        return HexFormat.of().formatHex(sha256.digest());
    }

    long size() {
        return size;
    }
}
