package org.specimenledger.curve;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import org.junit.jupiter.api.Test;

/** RawCurve is immutable and holds its channels trimmed to size. */
class RawCurveTest {

    private final RawCurve curve = CurveFixtures.read("time [s],force [N],extension [mm]\n" + CurveFixtures.rows(3000));

    @Test
    void arrayAccessorsReturnCopiesThatCannotChangeTheCurve() {
        double[] force = curve.forceN();
        force[0] = -1;

        assertThat(curve.forceN()[0]).isEqualTo(100.0);
        assertThat(curve.forceN()).isNotSameAs(curve.forceN());
    }

    @Test
    void metadataChannelsAndWarningsAreUnmodifiable() {
        assertThatThrownBy(() -> curve.metadata().put("x", "y")).isInstanceOf(UnsupportedOperationException.class);
        assertThatThrownBy(() -> curve.channels().clear()).isInstanceOf(UnsupportedOperationException.class);
        assertThatThrownBy(() -> curve.warnings().add("x")).isInstanceOf(UnsupportedOperationException.class);
    }

    @Test
    void holdsEachChannelExactlyOnceTrimmedToSize() {
        // 3 channels of 3000 points: 8 bytes each plus a 16-byte array header, no spare capacity.
        assertThat(curve.size()).isEqualTo(3000);
        assertThat(curve.arrayHeapBytes()).isEqualTo(3 * (16 + 8L * 3000));
    }

    @Test
    void absentOptionalChannelsAreEmptyNotNull() {
        RawCurve twoChannels = CurveFixtures.read("force [N],extension [mm]\n1,2\n");

        assertThat(twoChannels.timeS()).isEmpty();
        assertThat(twoChannels.crossheadMm()).isEmpty();
        assertThat(twoChannels.hasTime()).isFalse();
        assertThat(twoChannels.arrayHeapBytes()).isEqualTo(2 * (16 + 8));
    }

    @Test
    void limitsRejectNonsenseValues() {
        assertThatThrownBy(() -> new CurveReadingLimits(0, 20)).isInstanceOf(IllegalArgumentException.class)
                .hasMessageContaining("maxBytes");
        assertThatThrownBy(() -> new CurveReadingLimits(10, 0)).isInstanceOf(IllegalArgumentException.class)
                .hasMessageContaining("minPoints");
        assertThat(CurveReadingLimits.defaults()).isEqualTo(new CurveReadingLimits(64L * 1024 * 1024, 20));
    }

    @Test
    void rejectionMessageCombinesPositionAndReason() {
        assertThat(new CurveRejected(7, 2, "bad").getMessage()).isEqualTo("line 7, column 2: bad");
        assertThat(new CurveRejected(7, 0, "bad").getMessage()).isEqualTo("line 7: bad");
        assertThat(new CurveRejected(0, 0, "bad").getMessage()).isEqualTo("file: bad");
        assertThat(new CurveRejected(1, 1, "bad")).isInstanceOf(IllegalArgumentException.class);
        assertThatThrownBy(() -> new CurveRejected(-1, 0, "bad")).isInstanceOf(IllegalArgumentException.class)
                .isNotInstanceOf(CurveRejected.class);
    }
}
