package org.specimenledger.curve;

import static org.junit.jupiter.api.Assertions.assertThrows;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.util.StringJoiner;

/** Builds small synthetic curve files for the reader tests. */
final class CurveFixtures {

    /** A reader that accepts a single data point, so short test files need no padding rows. */
    static final CurveReader ONE_POINT_READER = new CurveReader(CurveReadingLimits.defaults().withMinPoints(1));

    private CurveFixtures() {
    }

    static byte[] utf8(String text) {
        return text.getBytes(StandardCharsets.UTF_8);
    }

    static RawCurve read(String text) {
        return ONE_POINT_READER.read(utf8(text));
    }

    static CurveRejected rejection(String text) {
        return rejection(utf8(text));
    }

    static CurveRejected rejection(byte[] bytes) {
        return assertThrows(CurveRejected.class, () -> ONE_POINT_READER.read(bytes));
    }

    /** {@code count} rows of "time,force,extension" with simple increasing invented values. */
    static String rows(int count) {
        StringJoiner rows = new StringJoiner("\n", "", "\n");
        for (int i = 0; i < count; i++) {
            rows.add(i * 0.5 + "," + (100.0 + i) + "," + (0.01 * i));
        }
        return rows.toString();
    }

    static byte[] resource(String name) {
        try (InputStream in = CurveFixtures.class.getResourceAsStream("/curves/" + name)) {
            if (in == null) {
                throw new IllegalStateException("missing test resource /curves/" + name);
            }
            return in.readAllBytes();
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
