package org.specimenledger.curve;

import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.specimenledger.curve.CurveFixtures.rejection;
import static org.specimenledger.curve.CurveFixtures.utf8;

import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/** Every rejection of the input contract names the line, the column and the bad value. */
class CurveReaderRejectsTest {

    private static final String HEADER = "time [s],force [N],extension [mm]\n";

    @Test
    void rejectsEmptyFile() {
        CurveRejected rejected = rejection(new byte[0]);

        assertThat(rejected.line()).isZero();
        assertThat(rejected.column()).isZero();
        assertThat(rejected.reason()).isEqualTo("the file is empty");
        assertThat(rejected.getMessage()).isEqualTo("file: the file is empty");
    }

    @Test
    void rejectsFileOfOnlyByteOrderMarkAndBlankLinesAsEmpty() {
        CurveRejected rejected = rejection("\uFEFF\n  \r\n");

        assertThat(rejected.line()).isZero();
        assertThat(rejected.reason()).startsWith("the file is empty");
    }

    @Test
    void rejectsFileWithMetadataButNoHeaderRow() {
        CurveRejected rejected = rejection("# rig: A\n# a comment\n");

        assertThat(rejected.line()).isZero();
        assertThat(rejected.reason()).contains("no header row", "2 lines");
    }

    @Test
    void rejectsHeaderWithoutDataRows() {
        CurveRejected rejected = rejection("# rig: A\n" + HEADER + "\n");

        assertThat(rejected.line()).isZero();
        assertThat(rejected.reason()).isEqualTo("the header row on line 2 is not followed by any data row");
    }

    @Test
    void rejectsMissingForceChannelNamingTheHeader() {
        CurveRejected rejected = rejection("time [s],extension [mm]\n0,1\n");

        assertThat(rejected.line()).isEqualTo(1);
        assertThat(rejected.column()).isZero();
        assertThat(rejected.reason()).contains("no force channel", "time [s],extension [mm]");
    }

    @Test
    void rejectsMissingExtensionChannel() {
        CurveRejected rejected = rejection("force [N],time [s]\n0,1\n");

        assertThat(rejected.reason()).contains("no extension channel", "nor a crosshead channel");
    }

    @Test
    void rejectsEmptyExtensionCellWithoutCrosshead() {
        CurveRejected rejected = rejection(HEADER + "0,1,\n");

        assertThat(rejected.reason()).isEqualTo("the extension cell is empty");
    }

    @Test
    void rejectsExtensometerThatResumesAfterItStopped() {
        StringBuilder b = new StringBuilder("force [N],extension [mm],crosshead [mm]\n");
        for (int i = 0; i < 12; i++) {
            b.append(i).append(',').append(i == 5 || i == 6 ? "" : String.valueOf(0.01 * i)).append(',')
                    .append(0.02 * i).append('\n');
        }
        CurveRejected rejected = rejection(b.toString());

        assertThat(rejected.line()).isEqualTo(9);
        assertThat(rejected.column()).isEqualTo(2);
        assertThat(rejected.reason()).contains("resumes after it stopped on line 7");
    }

    @Test
    void rejectsHeaderWithoutAnyDelimiter() {
        CurveRejected rejected = rejection("force [N] extension [mm]\n0 1\n");

        assertThat(rejected.line()).isEqualTo(1);
        assertThat(rejected.column()).isZero();
        assertThat(rejected.reason()).contains("\"force [N] extension [mm]\"", "no comma, semicolon or tab");
    }

    @Test
    void rejectsUnknownForceUnitNamingItAndTheAcceptedOnes() {
        CurveRejected rejected = rejection("# rig: A\ntime [s],force [kgf],extension [mm]\n0,1,2\n");

        assertThat(rejected.line()).isEqualTo(2);
        assertThat(rejected.column()).isEqualTo(2);
        assertThat(rejected.reason()).isEqualTo("unknown force unit \"kgf\"; use N, kN, lbf or kip");
        assertThat(rejected.getMessage()).isEqualTo("line 2, column 2: unknown force unit \"kgf\"; use N, kN, lbf or kip");
    }

    @ParameterizedTest
    @ValueSource(strings = {"KN", "kn", "n", "MM", "Mm", "S", "Ms"})
    void matchesUnitsCaseSensitively(String unit) {
        String header = unit.equalsIgnoreCase("s") || unit.equalsIgnoreCase("ms")
                ? "time [" + unit + "],force [N],extension [mm]" : unit.toLowerCase().contains("m")
                ? "time [s],force [N],extension [" + unit + "]" : "time [s],force [" + unit + "],extension [mm]";
        CurveRejected rejected = rejection(header + "\n0,1,2\n");

        assertThat(rejected.reason()).startsWith("unknown ").contains("\"" + unit + "\"");
    }

    @Test
    void rejectsUnknownLengthAndTimeUnits() {
        assertThat(rejection("force [N],extension [cm]\n1,2\n").reason())
                .isEqualTo("unknown extension unit \"cm\"; use mm, µm (or um) or in");
        assertThat(rejection("time [h],force [N],extension [mm]\n1,2,3\n").reason())
                .isEqualTo("unknown time unit \"h\"; use s, ms or min");
        assertThat(rejection("force [N],extension [mm],crosshead [ft]\n1,2,3\n").column()).isEqualTo(3);
    }

    @Test
    void rejectsKnownChannelWithoutUnit() {
        CurveRejected rejected = rejection("time [s],force,extension [mm]\n0,1,2\n");

        assertThat(rejected.column()).isEqualTo(2);
        assertThat(rejected.reason()).contains("\"force\"", "has no unit");
    }

    @Test
    void rejectsKnownChannelWithEmptyOrMalformedUnit() {
        assertThat(rejection("force [],extension [mm]\n1,2\n").reason()).contains("\"force []\"", "empty unit");
        assertThat(rejection("force [N,extension [mm]\n1,2\n").reason())
                .isEqualTo("header cell \"force [N\" is not of the form \"name [unit]\"");
        assertThat(rejection("force [N] x,extension [mm]\n1,2\n").reason()).contains("\"force [N] x\"");
    }

    @Test
    void rejectsAChannelGivenTwice() {
        CurveRejected rejected = rejection("force [N],extension [mm],Force [kN]\n1,2,3\n");

        assertThat(rejected.line()).isEqualTo(1);
        assertThat(rejected.column()).isEqualTo(3);
        assertThat(rejected.reason()).isEqualTo("channel \"force\" appears twice, in columns 1 and 3");
    }

    @Test
    void rejectsHeaderMixingDelimiters() {
        CurveRejected rejected = rejection("force [N];extension [mm],time [s]\n1;2,3\n");

        assertThat(rejected.line()).isEqualTo(1);
        assertThat(rejected.reason()).contains("mixes delimiters", "\";\"", "\",\"");
    }

    @Test
    void rejectsNonNumericCellNamingLineColumnAndValue() {
        CurveRejected rejected = rejection(HEADER + "0,1,2\n0.1,12.5kN,3\n");

        assertThat(rejected.line()).isEqualTo(3);
        assertThat(rejected.column()).isEqualTo(2);
        assertThat(rejected.reason()).isEqualTo("the force value \"12.5kN\" is not a number");
        assertThat(rejected.getMessage()).isEqualTo("line 3, column 2: the force value \"12.5kN\" is not a number");
    }

    @ParameterizedTest
    @ValueSource(strings = {"1.2.3", "-", "+", ".", "e5", "1e", "1 2", "0x1p3", "1.5d", "1.5f", "--1", "\"1.5\"", "1_000",
        "١٢", "1e+", "#1"})
    void rejectsEveryNonDecimalSpellingAsNotANumber(String cell) {
        CurveRejected rejected = rejection(HEADER + "0," + cell + ",2\n");

        assertThat(rejected.line()).isEqualTo(2);
        assertThat(rejected.column()).isEqualTo(2);
        assertThat(rejected.reason()).isEqualTo("the force value \"" + cell + "\" is not a number");
    }

    @ParameterizedTest
    @ValueSource(strings = {"NaN", "nan", "-NaN", "Inf", "inf", "Infinity", "-Infinity", "+infinity", "∞", "-∞"})
    void rejectsEverySpellingOfNanAndInfinity(String cell) {
        CurveRejected rejected = rejection(HEADER + "0,1,2\n0,1," + cell + "\n");

        assertThat(rejected.line()).isEqualTo(3);
        assertThat(rejected.column()).isEqualTo(3);
        assertThat(rejected.reason()).isEqualTo("the extension value \"" + cell + "\" is not a finite number");
    }

    @Test
    void rejectsNumbersOutsideTheRangeOfADouble() {
        assertThat(rejection(HEADER + "0,1e400,2\n").reason()).isEqualTo("the force value \"1e400\" is out of the range"
                + " of a double");
        // Finite in kip but not in newtons.
        CurveRejected converted = rejection("force [kip],extension [mm]\n1e306,0\n");
        assertThat(converted.column()).isEqualTo(1);
        assertThat(converted.reason()).contains("\"1e306\"", "out of the range");
    }

    @Test
    void rejectsDecimalCommaOutsideSemicolonFiles() {
        CurveRejected rejected = rejection("force [N]\textension [mm]\n1,5\t2\n");

        assertThat(rejected.column()).isEqualTo(1);
        assertThat(rejected.reason()).isEqualTo("the force value \"1,5\" is not a number; a decimal comma is accepted"
                + " only in semicolon-delimited files");
    }

    @Test
    void rejectsThousandsSeparatorsInSemicolonFiles() {
        CurveRejected rejected = rejection("force [N];extension [mm]\n1.234,5;2\n");

        assertThat(rejected.reason()).isEqualTo("the force value \"1.234,5\" is not a number");
    }

    @Test
    void rejectsEmptyChannelCell() {
        CurveRejected rejected = rejection(HEADER + "0,,2\n");

        assertThat(rejected.column()).isEqualTo(2);
        assertThat(rejected.reason()).isEqualTo("the force cell is empty");
    }

    @Test
    void rejectsOverlongNumberCellWithoutParsingIt() {
        String digits = "1".repeat(5000);
        CurveRejected rejected = rejection(HEADER + "0," + digits + ",2\n");

        assertThat(rejected.reason()).contains("too long to be a number", "5000 characters");
    }

    @Test
    void rejectsRaggedRowWithTooFewCellsNamingLineAndColumn() {
        CurveRejected rejected = rejection(HEADER + "0,1,2\n0.5,3\n");

        assertThat(rejected.line()).isEqualTo(3);
        assertThat(rejected.column()).isEqualTo(3);
        assertThat(rejected.reason()).isEqualTo("the row has 2 cells but the header row has 3");
    }

    @Test
    void rejectsRaggedRowWithTooManyCellsNamingLineAndColumn() {
        CurveRejected rejected = rejection(HEADER + "0,1,2\r\n0.5,3,4,5\r\n");

        assertThat(rejected.line()).isEqualTo(3);
        assertThat(rejected.column()).isEqualTo(4);
        assertThat(rejected.reason()).isEqualTo("the row has 4 cells but the header row has 3");
    }

    @Test
    void rejectsTimeGoingBackwardsNamingBothValues() {
        CurveRejected rejected = rejection(HEADER + "0,1,2\n0.5,1,2\n0.25,1,2\n");

        assertThat(rejected.line()).isEqualTo(4);
        assertThat(rejected.column()).isEqualTo(1);
        assertThat(rejected.reason()).isEqualTo("time goes backwards: \"0.25\" is 0.25 s, after 0.5 s on the previous row");
    }

    @Test
    void rejectsCommentLineAmongTheDataRows() {
        CurveRejected rejected = rejection(HEADER + "0,1,2\n# pause\n1,1,2\n");

        assertThat(rejected.line()).isEqualTo(3);
        assertThat(rejected.column()).isZero();
        assertThat(rejected.reason()).contains("\"#\" line after the header row");
    }

    @Test
    void rejectsFewerPointsThanTheConfiguredMinimum() {
        CurveReader reader = new CurveReader();
        byte[] file = utf8(HEADER + CurveFixtures.rows(19));

        CurveRejected rejected = assertThrows(CurveRejected.class, () -> reader.read(file));

        assertThat(rejected.line()).isZero();
        assertThat(rejected.reason()).isEqualTo("only 19 data points; at least 20 are required");
    }

    @Test
    void rejectsFileOverTheSizeLimitAndStopsReadingRightAfterIt() {
        byte[] file = utf8(HEADER + CurveFixtures.rows(5000));
        CountingStream in = new CountingStream(file);
        CurveReader reader = new CurveReader(new CurveReadingLimits(1000, 1));

        CurveRejected rejected = assertThrows(CurveRejected.class, () -> reader.read(in));

        assertThat(rejected.line()).isZero();
        assertThat(rejected.reason()).isEqualTo("the file is larger than the limit of 1000 bytes");
        assertThat(in.delivered()).isEqualTo(1001);
    }

    @Test
    void rejectsInvalidUtf8InADataRowNamingLineAndColumn() {
        ByteArrayOutputStream file = new ByteArrayOutputStream();
        file.writeBytes(utf8("force [N],extension [mm],note\n1,2,ok\n3,4,"));
        file.writeBytes(new byte[] {(byte) 0xC3, (byte) 0x28}); // 0xC3 needs a continuation byte, 0x28 is not one
        file.writeBytes(utf8("\n"));

        CurveRejected rejected = rejection(file.toByteArray());

        assertThat(rejected.line()).isEqualTo(3);
        assertThat(rejected.column()).isEqualTo(3);
        assertThat(rejected.reason()).startsWith("invalid UTF-8").contains("0xC3");
    }

    @Test
    void rejectsInvalidUtf8InANumberCellBeforeCallingItNonNumeric() {
        byte[] file = concat(utf8("force [N],extension [mm]\n1,"), new byte[] {(byte) 0xFF}, utf8("\n"));

        CurveRejected rejected = rejection(file);

        assertThat(rejected.line()).isEqualTo(2);
        assertThat(rejected.column()).isEqualTo(2);
        assertThat(rejected.reason()).contains("invalid UTF-8", "0xFF");
    }

    @Test
    void rejectsInvalidUtf8InMetadataAndHeader() {
        // An overlong encoding of "/" (0xC0 0xAF) and an encoded surrogate (0xED 0xA0 0x80) are malformed.
        byte[] metadata = concat(utf8("# rig: "), new byte[] {(byte) 0xC0, (byte) 0xAF}, utf8("\nforce [N],extension [mm]\n1,2\n"));
        byte[] header = concat(utf8("force [N],extension [mm],t "), new byte[] {(byte) 0xED, (byte) 0xA0, (byte) 0x80},
                utf8("\n1,2,3\n"));

        assertThat(rejection(metadata).line()).isEqualTo(1);
        assertThat(rejection(metadata).reason()).contains("invalid UTF-8", "0xC0");
        assertThat(rejection(header).line()).isEqualTo(1);
        assertThat(rejection(header).reason()).contains("invalid UTF-8", "0xED");
    }

    @Test
    void rejectsTruncatedMultiByteSequenceAtEndOfFile() {
        byte[] file = concat(utf8("force [N],extension [mm],note\n1,2,"), new byte[] {(byte) 0xE2, (byte) 0x82});

        CurveRejected rejected = rejection(file);

        assertThat(rejected.line()).isEqualTo(2);
        assertThat(rejected.reason()).contains("invalid UTF-8", "0xE2");
    }

    @Test
    void readingByteArrayAndStreamRejectTheSameWay() {
        byte[] file = utf8(HEADER + "0,1,2\n0.1,x,3\n");

        CurveRejected fromBytes = rejection(file);
        CurveRejected fromStream = assertThrows(CurveRejected.class,
                () -> CurveFixtures.ONE_POINT_READER.read(new ByteArrayInputStream(file)));

        assertThat(fromStream.getMessage()).isEqualTo(fromBytes.getMessage());
    }

    private static byte[] concat(byte[]... parts) {
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        for (byte[] part : parts) {
            out.writeBytes(part);
        }
        return out.toByteArray();
    }

    /** Counts how many bytes the reader actually pulled from the stream. */
    private static final class CountingStream extends ByteArrayInputStream {

        CountingStream(byte[] bytes) {
            super(bytes);
        }

        int delivered() {
            return pos;
        }
    }
}
