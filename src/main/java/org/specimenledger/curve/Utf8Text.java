package org.specimenledger.curve;

import java.nio.ByteBuffer;
import java.nio.CharBuffer;
import java.nio.charset.CharsetDecoder;
import java.nio.charset.CoderResult;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;

/**
 * Strict UTF-8 decoding of one line, using the JDK decoder so malformed sequences, overlong forms and
 * encoded surrogates are caught by a well-tested implementation rather than our own state machine.
 * ASCII-only slices (all numbers, almost every line) take a fast path that never builds a decoder.
 */
final class Utf8Text {

    /** Marker for "no delimiter known yet": the column of a bad byte is then not reported. */
    static final int NO_DELIMITER = -1;

    private Utf8Text() {
    }

    /**
     * Decodes the slice or rejects it.
     *
     * @param delimiter the cell delimiter used to turn a byte position into a column, or
     *     {@link #NO_DELIMITER}
     */
    static String decode(byte[] b, int from, int to, int line, int delimiter) {
        if (isAscii(b, from, to)) {
            return new String(b, from, to - from, StandardCharsets.ISO_8859_1);
        }
        CharsetDecoder decoder = StandardCharsets.UTF_8.newDecoder()
                .onMalformedInput(CodingErrorAction.REPORT)
                .onUnmappableCharacter(CodingErrorAction.REPORT);
        ByteBuffer in = ByteBuffer.wrap(b, from, to - from);
        CharBuffer out = CharBuffer.allocate(to - from);
        CoderResult result = decoder.decode(in, out, true);
        if (!result.isError()) {
            result = decoder.flush(out);
        }
        if (result.isError()) {
            throw malformed(b, in.position(), result, to, from, line, delimiter);
        }
        return out.flip().toString();
    }

    /** Rejects the slice if it holds malformed UTF-8; does nothing for valid text. */
    static void check(byte[] b, int from, int to, int line, int delimiter) {
        decode(b, from, to, line, delimiter);
    }

    static boolean isAscii(byte[] b, int from, int to) {
        for (int i = from; i < to; i++) {
            if (b[i] < 0) {
                return false;
            }
        }
        return true;
    }

    private static CurveRejected malformed(byte[] b, int at, CoderResult result, int to, int from, int line,
            int delimiter) {
        int length = result.isMalformed() || result.isUnmappable() ? result.length() : 1;
        StringBuilder bytes = new StringBuilder();
        for (int i = at; i < Math.min(at + Math.max(length, 1), to); i++) {
            if (bytes.length() > 0) {
                bytes.append(' ');
            }
            bytes.append(String.format("0x%02X", b[i] & 0xFF));
        }
        int column = 0;
        if (delimiter != NO_DELIMITER) {
            column = 1;
            for (int i = from; i < at; i++) {
                if (b[i] == delimiter) {
                    column++;
                }
            }
        }
        return new CurveRejected(line, column, "invalid UTF-8: malformed byte sequence " + bytes
                + " at byte " + (at - from + 1) + " of the line");
    }
}
