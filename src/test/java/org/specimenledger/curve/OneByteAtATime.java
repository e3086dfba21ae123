package org.specimenledger.curve;

import java.io.InputStream;

/** A stream that hands out one byte per read call, the worst case for chunk and line boundaries. */
final class OneByteAtATime extends InputStream {

    private final byte[] bytes;
    private int next;

    OneByteAtATime(byte[] bytes) {
        this.bytes = bytes.clone();
    }

    @Override
    public int read() {
        return next < bytes.length ? bytes[next++] & 0xFF : -1;
    }

    @Override
    public int read(byte[] target, int offset, int length) {
        if (length == 0) {
            return 0;
        }
        int b = read();
        if (b < 0) {
            return -1;
        }
        target[offset] = (byte) b;
        return 1;
    }
}
