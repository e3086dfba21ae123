package org.specimenledger.curve;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.nio.charset.StandardCharsets;
import java.util.Locale;
import org.junit.jupiter.api.Test;

/** The most data points a curve may have, at its edge: exactly the limit is read, one more is refused at once. */
class CurvePointLimitTest {

    private static byte[] rows(int n) {
        StringBuilder csv = new StringBuilder("force [N],extension [mm]\n");
        for (int i = 0; i < n; i++) {
            csv.append(String.format(Locale.ROOT, "%d,%.3f%n", i * 10, i * 0.001));
        }
        return csv.toString().getBytes(StandardCharsets.UTF_8);
    }

    @Test
    void exactlyTheLimitIsRead() {
        CurveReader reader = new CurveReader(new CurveReadingLimits(1 << 20, 1, 30));
        assertThat(reader.read(rows(30)).forceN()).hasSize(30);
    }

    @Test
    void oneMoreIsRefusedOnTheLineThatPassesTheLimit() {
        CurveReader reader = new CurveReader(new CurveReadingLimits(1 << 20, 1, 30));
        assertThatThrownBy(() -> reader.read(rows(31))).isInstanceOf(CurveRejected.class)
                .hasMessageContaining("more than 30 data points")
                .satisfies(e -> assertThat(((CurveRejected) e).line()).isEqualTo(32));
    }

    @Test
    void theLimitCannotBeBelowTheMinimum() {
        assertThatThrownBy(() -> new CurveReadingLimits(100, 20, 19)).isInstanceOf(IllegalArgumentException.class)
                .hasMessageContaining("maxPoints must be at least minPoints");
        assertThat(new CurveReadingLimits(100, 20).maxPoints()).isEqualTo(CurveReadingLimits.DEFAULT_MAX_POINTS);
    }
}
