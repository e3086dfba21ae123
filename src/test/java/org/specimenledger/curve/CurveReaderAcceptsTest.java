package org.specimenledger.curve;

import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.specimenledger.curve.CurveFixtures.read;
import static org.specimenledger.curve.CurveFixtures.resource;

import java.math.BigDecimal;
import java.nio.charset.StandardCharsets;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/** Every accepted variant of the curve input contract. */
class CurveReaderAcceptsTest {

    private final CurveReader reader = new CurveReader();

    @Test
    void readsCommaFileWithMetadataInKilonewtons() {
        RawCurve curve = reader.read(resource("synthetic-comma-kn.csv"));

        assertThat(curve.size()).isEqualTo(25);
        // Line 1 and line 4 have no "key: value" or "key = value" form: comments, not metadata.
        assertThat(curve.metadata()).containsExactly(
                Map.entry("laboratory", "Quillmere Test Bench (fictitious)"), Map.entry("specimen", "QTB-0001"));
        assertThat(curve.forceN()[1]).isEqualTo(2.4975 * 1000.0);
        assertThat(curve.extensionMm()[1]).isEqualTo(0.004);
        assertThat(curve.timeS()[1]).isEqualTo(0.1);
        assertThat(curve.hasCrosshead()).isFalse();
        assertThat(curve.channels()).containsExactly(
                new ChannelColumn(Channel.TIME, "s", 1),
                new ChannelColumn(Channel.FORCE, "kN", 2),
                new ChannelColumn(Channel.EXTENSION, "mm", 3));
        assertThat(curve.warnings()).isEmpty();
    }

    @Test
    void readsSemicolonFileWithDecimalCommaBomAndCrlf() {
        RawCurve curve = reader.read(resource("synthetic-semicolon-decimal-comma.csv"));

        assertThat(curve.size()).isEqualTo(25);
        assertThat(curve.metadata()).containsExactly(Map.entry("machine", "frame 2 (fictitious)"));
        assertThat(curve.forceN()[1]).isEqualTo(2497.53);
        assertThat(curve.timeS()[24]).isEqualTo(2.4);
        // The crosshead column of this file uses a decimal point: both are accepted with semicolons.
        assertThat(curve.crossheadMm()[1]).isEqualTo(0.006);
        assertThat(curve.channels()).extracting(ChannelColumn::channel)
                .containsExactly(Channel.TIME, Channel.FORCE, Channel.EXTENSION, Channel.CROSSHEAD);
    }

    @Test
    void readsTabFileInPoundForceInchesAndMillisecondsIgnoringTemperature() {
        RawCurve curve = reader.read(resource("synthetic-tab-lbf-in.tsv"));

        assertThat(curve.size()).isEqualTo(25);
        assertThat(curve.timeS()[3]).isEqualTo(0.3);
        // Oracle: the file's own cells split with String.split and converted exactly with BigDecimal.
        String[] lines = new String(resource("synthetic-tab-lbf-in.tsv"), StandardCharsets.UTF_8).split("\n");
        for (int i = 0; i < curve.size(); i++) {
            String[] cells = lines[i + 2].split("\t");
            assertThat(curve.forceN()[i]).isEqualTo(
                    new BigDecimal(cells[1]).multiply(new BigDecimal("4.4482216152605")).doubleValue(), withinOneUlp());
            assertThat(curve.extensionMm()[i]).isEqualTo(
                    new BigDecimal(cells[2]).multiply(new BigDecimal("25.4")).doubleValue(), withinOneUlp());
        }
        assertThat(curve.channels()).hasSize(3);
        assertThat(curve.warnings()).singleElement().asString()
                .contains("column 4", "temperature [°C]", "ignored");
    }

    private static org.assertj.core.data.Offset<Double> withinOneUlp() {
        // Offsets in AssertJ are absolute; the values in this file are below 10^4 N, where 1 ulp is
        // below 2e-12, so 1e-11 is a looser but still tight bound. Exact ulp checks: UnitConversionTest.
        return org.assertj.core.api.Assertions.within(1e-11);
    }

    @Test
    void readsFileWithoutOptionalChannelsAndSkipsBlankLines() {
        RawCurve curve = reader.read(resource("synthetic-force-extension-only.csv"));

        assertThat(curve.size()).isEqualTo(25);
        assertThat(curve.hasTime()).isFalse();
        assertThat(curve.timeS()).isEmpty();
        assertThat(curve.crossheadMm()).isEmpty();
        assertThat(curve.extensionMm()[1]).isEqualTo(0.004);
        assertThat(curve.channels()).containsExactly(
                new ChannelColumn(Channel.FORCE, "N", 1), new ChannelColumn(Channel.EXTENSION, "µm", 2));
        assertThat(curve.warnings()).singleElement().asString().contains("3 blank lines", "line 2");
    }

    @ParameterizedTest
    @ValueSource(strings = {",", ";", "\t"})
    void detectsEachDelimiterFromTheHeaderRow(String delimiter) {
        RawCurve curve = read(String.join(delimiter, "force [N]", "extension [mm]") + "\n"
                + String.join(delimiter, "10.5", "0.25") + "\n");

        assertArrayEquals(new double[] {10.5}, curve.forceN());
        assertArrayEquals(new double[] {0.25}, curve.extensionMm());
    }

    @Test
    void acceptsDecimalCommaAndDecimalPointSideBySideInSemicolonFiles() {
        RawCurve curve = read("force [N];extension [mm]\n1,5;0.25\n2.5;0,5\n");

        assertArrayEquals(new double[] {1.5, 2.5}, curve.forceN());
        assertArrayEquals(new double[] {0.25, 0.5}, curve.extensionMm());
    }

    @Test
    void acceptsCrlfAndMissingFinalLineEnd() {
        RawCurve curve = read("force [N],extension [mm]\r\n1,2\r\n3,4");

        assertArrayEquals(new double[] {1, 3}, curve.forceN());
        assertArrayEquals(new double[] {2, 4}, curve.extensionMm());
    }

    @Test
    void skipsByteOrderMarkBeforeMetadata() {
        RawCurve curve = read("\uFEFF# rig: B\nforce [N],extension [mm]\n1,2\n");

        assertThat(curve.metadata()).containsExactly(Map.entry("rig", "B"));
    }

    @Test
    void matchesChannelNamesCaseInsensitivelyAndTrimsSpaces() {
        RawCurve curve = read("  FORCE [kN] ,  Extension [ mm ]  ,TIME[s]\n 1.5 , 2 ,0\n");

        assertThat(curve.forceN()).containsExactly(1500.0);
        assertThat(curve.channels()).extracting(ChannelColumn::unit).containsExactly("kN", "mm", "s");
    }

    @Test
    void keepsMetadataInFileOrderWithBothSeparatorsAndFirstOfARepeatedKey() {
        RawCurve curve = read("""
                # operator: A. Example
                # rate = 0.00025 1/s
                #plain comment line
                # source: https://lab.invalid/run?id=7
                # operator: someone else
                force [N],extension [mm]
                1,2
                """);

        assertThat(curve.metadata()).containsExactly(
                Map.entry("operator", "A. Example"),
                Map.entry("rate", "0.00025 1/s"),
                Map.entry("source", "https://lab.invalid/run?id=7"));
        assertThat(curve.warnings()).singleElement().asString().contains("\"operator\"", "line 5");
    }

    @Test
    void ignoresUnknownChannelColumnWithWarningWhateverItHolds() {
        RawCurve curve = read("force [N],temperature [°C],extension [mm]\n1,warm,2\n3,,4\n");

        assertArrayEquals(new double[] {1, 3}, curve.forceN());
        assertThat(curve.warnings()).singleElement().asString()
                .isEqualTo("column 2 \"temperature [°C]\" is not a known channel (time, force, extension, crosshead);"
                        + " its values are ignored");
    }

    @Test
    void acceptsValidNonAsciiTextInAnIgnoredColumn() {
        RawCurve curve = read("force [N],chamber,extension [mm]\n1,23 °C,2\n3,Ω ok,4\n");

        assertArrayEquals(new double[] {2, 4}, curve.extensionMm());
    }

    @Test
    void countsRepeatedTimeStampsInAWarning() {
        RawCurve curve = read("time [s],force [N],extension [mm]\n0,1,0\n0.1,2,0.1\n0.1,3,0.2\n0.1,4,0.3\n0.2,5,0.4\n");

        assertThat(curve.timeS()).containsExactly(0, 0.1, 0.1, 0.1, 0.2);
        assertThat(curve.warnings()).singleElement().asString().startsWith("2 data rows repeat").contains("line 4");
    }

    @Test
    void acceptsSignsExponentsAndLeadingOrTrailingPoints() {
        RawCurve curve = read("force [N],extension [mm]\n+1.5e3,-.5\n2.,1E-3\n-0,0\n");

        assertThat(curve.forceN()).containsExactly(1500.0, 2.0, -0.0);
        assertThat(curve.extensionMm()).containsExactly(-0.5, 0.001, 0.0);
    }

    @Test
    void readsTheSameCurveFromAStreamDeliveringOneByteAtATime() {
        byte[] file = resource("synthetic-semicolon-decimal-comma.csv");
        RawCurve whole = reader.read(file);
        RawCurve trickled = reader.read(new OneByteAtATime(file));

        assertArrayEquals(whole.forceN(), trickled.forceN());
        assertArrayEquals(whole.crossheadMm(), trickled.crossheadMm());
        assertThat(trickled.sha256()).isEqualTo(whole.sha256());
        assertThat(trickled.metadata()).isEqualTo(whole.metadata());
    }

    @Test
    void readsLinesLongerThanTheReadBuffer() {
        // 20 ignored columns of 5000 characters make a 100 kB header and rows, past the 64 KiB chunk.
        String wide = "x".repeat(5000);
        StringBuilder header = new StringBuilder("force [N],extension [mm]");
        StringBuilder row = new StringBuilder("7,8");
        for (int i = 0; i < 20; i++) {
            header.append(',').append(wide);
            row.append(',').append(wide);
        }
        RawCurve curve = read(header + "\n" + row + "\n" + row);

        assertArrayEquals(new double[] {7, 7}, curve.forceN());
        assertThat(curve.warnings()).hasSize(20);
    }

    @Test
    void acceptsExactlyTheConfiguredMinimumOfPoints() {
        CurveReader twenty = new CurveReader(new CurveReadingLimits(1 << 20, 20));

        assertThat(twenty.read(CurveFixtures.utf8("time [s],force [N],extension [mm]\n" + CurveFixtures.rows(20))).size())
                .isEqualTo(20);
    }

    @Test
    void acceptsAFileOfExactlyTheMaximumSize() {
        byte[] file = CurveFixtures.utf8("force [N],extension [mm]\n1,2\n");
        CurveReader exact = new CurveReader(new CurveReadingLimits(file.length, 1));

        assertThat(exact.read(file).byteCount()).isEqualTo(file.length);
    }

    @Test
    void reportsChannelsInColumnOrderWithUnitsAsWritten() {
        RawCurve curve = read("crosshead [in],extension [um],force [kip],time [min]\n1,1,1,1\n");

        assertThat(curve.channels()).isEqualTo(List.of(
                new ChannelColumn(Channel.CROSSHEAD, "in", 1),
                new ChannelColumn(Channel.EXTENSION, "um", 2),
                new ChannelColumn(Channel.FORCE, "kip", 3),
                new ChannelColumn(Channel.TIME, "min", 4)));
    }

    @Test
    void readsRecordWhoseExtensometerWasRemovedWhileTheCrossheadContinues() {
        StringBuilder b = new StringBuilder("time [s],force [kN],extension [mm],crosshead [mm]\n");
        for (int i = 0; i < 24; i++) {
            b.append(i).append(',').append(i).append(',').append(i < 8 ? String.valueOf(0.01 * i) : " ").append(',')
                    .append(0.25 * i).append('\n');
        }
        RawCurve curve = reader.read(b.toString().getBytes(StandardCharsets.UTF_8));

        assertThat(curve.size()).isEqualTo(24);
        assertThat(curve.extensometerPoints()).isEqualTo(8);
        assertThat(curve.hasExtensometer()).isTrue();
        assertThat(curve.extensionMm()[7]).isEqualTo(0.07);
        assertThat(curve.extensionMm()[8]).isNaN();
        assertThat(curve.extensionMm()[23]).isNaN();
        assertThat(curve.crossheadMm()[23]).isEqualTo(5.75);
        assertThat(curve.warnings()).anyMatch(w -> w.contains("extension cells end on line 10"));
    }

    @Test
    void readsCrossheadOnlyRecord() {
        StringBuilder b = new StringBuilder("force [N];crosshead [mm]\n");
        for (int i = 0; i < 24; i++) {
            b.append(i).append(';').append(i).append(",5\n");
        }
        RawCurve curve = reader.read(b.toString().getBytes(StandardCharsets.UTF_8));

        assertThat(curve.hasExtensometer()).isFalse();
        assertThat(curve.extensometerPoints()).isZero();
        assertThat(curve.extensionMm()).isEmpty();
        assertThat(curve.crossheadMm()[3]).isEqualTo(3.5);
    }

    @Test
    void completeExtensionChannelCountsEveryPoint() {
        RawCurve curve = reader.read(resource("synthetic-comma-kn.csv"));

        assertThat(curve.extensometerPoints()).isEqualTo(curve.size());
        assertThat(curve.hasExtensometer()).isTrue();
    }
}
