package org.specimenledger.curve;

import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;

/**
 * Reads a raw tensile test curve file (CSV, semicolon or tab separated) into a {@link RawCurve}.
 *
 * <p>The file is UTF-8 text, optionally starting with a byte order mark, in this order:
 * <ol>
 *   <li>optional lines starting with {@code #}: {@code # key: value} or {@code # key = value} become
 *       {@link RawCurve#metadata()}, any other {@code #} line is a comment;</li>
 *   <li>one header row of {@code name [unit]} cells: {@code force} (N, kN, lbf, kip) and
 *       {@code extension} (mm, µm, um, in) are required, {@code time} (s, ms, min) and
 *       {@code crosshead} (mm, µm, um, in) optional; with a crosshead channel the extension channel may
 *       be left out (no extensometer) or its cells may end, empty to the last row (extensometer
 *       removed, see {@link RawCurve#extensometerPoints()}), names case-insensitive, units case-sensitive;
 *       the delimiter (comma, semicolon or tab) is the one found in this row; other column names are
 *       ignored with a warning;</li>
 *   <li>data rows with exactly as many cells as the header; numeric cells in decimal notation
 *       ({@code 12}, {@code -0.5}, {@code 1.5e-3}); in semicolon files a decimal comma is accepted as
 *       well as a decimal point; spaces around a cell are ignored.</li>
 * </ol>
 * Lines end with LF or CRLF; the last line may lack its line end. Lines holding nothing but spaces
 * or tabs are skipped anywhere (and counted in a warning when they come after the header), because
 * exporters often end a file with one and a skipped blank line cannot shift any value. A {@code #}
 * line after the header is rejected: a comment inside the data is more likely a spliced file than
 * an annotation. Quoted cells are not part of the contract: a quoted number is rejected as
 * non-numeric (in an ignored column any text is left alone).
 *
 * <p>Every problem is a {@link CurveRejected} naming the line and column; no other exception escapes
 * for any input bytes. I/O failures of the stream itself surface as {@link UncheckedIOException}.
 *
 * <p>Instances hold only their limits and are safe to share between threads.
 */
public final class CurveReader {

    private final CurveReadingLimits limits;

    /** A reader with {@link CurveReadingLimits#defaults()}. */
    public CurveReader() {
        this(CurveReadingLimits.defaults());
    }

    /**
     * A reader with the given limits.
     *
     * @param limits file size and point count limits, not null
     */
    public CurveReader(CurveReadingLimits limits) {
        this.limits = Objects.requireNonNull(limits, "limits");
    }

    /**
     * The limits this reader enforces.
     *
     * @return the limits given at construction
     */
    public CurveReadingLimits limits() {
        return limits;
    }

    /**
     * Reads a whole curve file from a byte array.
     *
     * @param bytes the exact bytes of the file, not null
     * @return the curve
     * @throws CurveRejected when the bytes do not meet the input contract
     */
    public RawCurve read(byte[] bytes) {
        Objects.requireNonNull(bytes, "bytes");
        return read(new ByteArrayInputStream(bytes));
    }

    /**
     * Reads a curve file from a stream until its end, fingerprinting every byte. The stream is read in
     * chunks and never held whole in memory; reading stops at the first problem, or as soon as the
     * size limit is passed. The stream is not closed.
     *
     * @param in the file's bytes, not null
     * @return the curve
     * @throws CurveRejected when the bytes do not meet the input contract
     * @throws UncheckedIOException when the stream itself fails
     */
    public RawCurve read(InputStream in) {
        Objects.requireNonNull(in, "in");
        try {
            return readLines(new LineSource(in, limits.maxBytes()));
        } catch (IOException e) {
            throw new UncheckedIOException("reading the curve file failed", e);
        }
    }

    private RawCurve readLines(LineSource lines) throws IOException {
        List<String> warnings = new ArrayList<>();
        Preamble preamble = new Preamble(warnings);
        HeaderRow header = null;
        int headerLine = 0;
        DataRows rows = null;
        int blankDataLines = 0;
        int firstBlankDataLine = 0;
        int preambleLines = 0;
        while (lines.next()) {
            if (lines.lineNumber() == 1) {
                lines.skipByteOrderMark();
            }
            byte[] b = lines.buffer();
            int from = lines.start();
            int to = lines.end();
            int line = lines.lineNumber();
            if (rows != null && from < to && b[from] != '#' && b[from] != ' ' && b[from] != '\t') {
                rows.accept(b, from, to, line, lines.lineIsAscii()); // the common case, first
                if (rows.rows() > limits.maxPoints()) {
                    throw new CurveRejected(line, 0, "more than " + limits.maxPoints()
                            + " data points; the limit is " + limits.maxPoints());
                }
            } else if (isBlank(b, from, to)) {
                if (rows != null) {
                    firstBlankDataLine = blankDataLines++ == 0 ? line : firstBlankDataLine;
                }
            } else if (rows != null) {
                if (b[from] == '#') {
                    throw new CurveRejected(line, 0, "a \"#\" line after the header row; metadata and comments"
                            + " belong before the header");
                }
                rows.accept(b, from, to, line, lines.lineIsAscii());
                if (rows.rows() > limits.maxPoints()) {
                    throw new CurveRejected(line, 0, "more than " + limits.maxPoints()
                            + " data points; the limit is " + limits.maxPoints());
                }
            } else if (Preamble.isPreambleLine(b, from, to)) {
                preamble.accept(b, from, to, line);
                preambleLines++;
            } else {
                header = HeaderRow.parse(b, from, to, line, warnings);
                headerLine = line;
                rows = new DataRows(header);
            }
        }
        if (header == null && preambleLines == 0) {
            throw new CurveRejected(0, 0, lines.byteCount() == 0 ? "the file is empty"
                    : "the file is empty: " + lines.byteCount() + " bytes of byte order mark or blank lines only");
        }
        if (header == null) {
            throw new CurveRejected(0, 0, "the file has no header row, only " + preambleLines
                    + (preambleLines == 1 ? " line" : " lines") + " starting with \"#\"");
        }
        if (rows.rows() == 0) {
            throw new CurveRejected(0, 0, "the header row on line " + headerLine + " is not followed by any data row");
        }
        if (rows.rows() < limits.minPoints()) {
            throw new CurveRejected(0, 0, "only " + rows.rows() + (rows.rows() == 1 ? " data point" : " data points")
                    + "; at least " + limits.minPoints() + " are required");
        }
        if (blankDataLines > 0) {
            warnings.add(blankDataLines + (blankDataLines == 1 ? " blank line" : " blank lines")
                    + " among the data rows skipped, the first on line " + firstBlankDataLine);
        }
        if (rows.repeatedTimes() > 0) {
            warnings.add(rows.repeatedTimes() + (rows.repeatedTimes() == 1 ? " data row repeats" : " data rows repeat")
                    + " the time stamp of the row before, the first on line " + rows.firstRepeatedTimeLine());
        }
        if (rows.extensionStopLine() != 0) {
            warnings.add("the extension cells end on line " + rows.extensionStopLine() + " (extensometer removed after "
                    + rows.extensometerPoints() + " points); the later points carry the crosshead only");
        }
        return new RawCurve(rows.values(Channel.FORCE), rows.values(Channel.EXTENSION), rows.values(Channel.TIME),
                rows.values(Channel.CROSSHEAD), rows.extensometerPoints(), lines.sha256Hex(), lines.byteCount(),
                preamble.metadata(), header.channels(), warnings);
    }

    private static boolean isBlank(byte[] b, int from, int to) {
        for (int i = from; i < to; i++) {
            if (b[i] != ' ' && b[i] != '\t') {
                return false;
            }
        }
        return true;
    }
}
