package org.specimenledger.curve;

import ch.randelshofer.fastdoubleparser.JavaDoubleParser;
import java.lang.invoke.MethodHandles;
import java.lang.invoke.VarHandle;
import java.nio.ByteOrder;
import java.nio.charset.StandardCharsets;
import java.util.Locale;

/**
 * Parses data rows straight from the byte buffer into one primitive list per channel.
 *
 * <p>This is the hot loop: delimiters are found eight bytes at a time, and a numeric cell goes to
 * {@link JavaDoubleParser} as a byte slice without any copy, String or object per point. Only a cell
 * that fails takes the slow path, which works out the precise reason (NaN spellings, misplaced
 * decimal comma). Non-ASCII bytes cannot be part of a number, so UTF-8 needs checking only for a
 * row that holds one, which the line splitter notices for free.
 */
final class DataRows {

    /** Longer cells are refused before parsing: no instrument writes 100 characters for one number. */
    static final int MAX_NUMBER_LENGTH = 100;

    private static final VarHandle LONGS = MethodHandles.byteArrayViewVarHandle(long[].class, ByteOrder.LITTLE_ENDIAN);

    private final HeaderRow header;
    private final byte delimiter;
    private final boolean decimalCommaAllowed;
    private final int cellCount;
    /** Per 0-based column: index into {@link #lists}, or -1 for an ignored column. */
    private final int[] slotOfColumn;
    private final GrowableDoubles[] lists;
    private final UnitFactor[] factors;
    private final String[] labels;
    private final int timeSlot;
    /** Slot of the extension channel, or -1; its cells may end (extensometer removed) when a crosshead is present. */
    private final int extensionSlot;
    private final boolean extensionMayStop;
    /** Line of the first empty extension cell, 0 while the extensometer still reads. */
    private int extensionStopLine;
    private int extensometerPoints = -1;
    /** The delimiter repeated in all eight bytes of a long, for the word-at-a-time search. */
    private final long delimiterWord;
    private final byte[] scratch = new byte[MAX_NUMBER_LENGTH];
    private int rows;
    private int repeatedTimes;
    private int firstRepeatedTimeLine;

    DataRows(HeaderRow header) {
        this.header = header;
        this.delimiter = header.delimiter();
        this.decimalCommaAllowed = delimiter == ';';
        this.cellCount = header.cellCount();
        this.slotOfColumn = new int[cellCount];
        int slots = header.channels().size();
        this.lists = new GrowableDoubles[slots];
        this.factors = new UnitFactor[slots];
        this.labels = new String[slots];
        int time = -1;
        int extension = -1;
        boolean crosshead = false;
        int slot = 0;
        for (int i = 0; i < cellCount; i++) {
            Channel channel = header.channelOf(i);
            if (channel == null) {
                slotOfColumn[i] = -1;
                continue;
            }
            slotOfColumn[i] = slot;
            lists[slot] = new GrowableDoubles();
            factors[slot] = header.factorOf(i);
            labels[slot] = channel.label();
            if (channel == Channel.TIME) {
                time = slot;
            } else if (channel == Channel.EXTENSION) {
                extension = slot;
            } else if (channel == Channel.CROSSHEAD) {
                crosshead = true;
            }
            slot++;
        }
        this.timeSlot = time;
        this.extensionSlot = extension;
        this.extensionMayStop = crosshead;
        this.delimiterWord = (delimiter & 0xFFL) * 0x0101010101010101L;
    }

    /**
     * Parses one non-blank data row {@code b[from, to)} found on physical line {@code line}.
     *
     * @param ascii whether the row holds only ASCII bytes (then it cannot be malformed UTF-8)
     */
    void accept(byte[] b, int from, int to, int line, boolean ascii) {
        if (!ascii) {
            // Rare: a byte of 0x80 or more (a unit sign in an ignored column, or junk). Name invalid
            // UTF-8 before anything else; valid non-ASCII text then fails as a number if it matters.
            Utf8Text.check(b, from, to, line, delimiter);
        }
        final long delimiters = delimiterWord;
        int cellStart = from;
        for (int cell = 0; ; cell++) {
            int cellEnd = indexOfDelimiter(b, cellStart, to, delimiters);
            if (cell == cellCount) {
                throw raggedRow(b, from, to, line);
            }
            int slot = slotOfColumn[cell];
            if (slot >= 0) {
                store(slot, b, cellStart, cellEnd, line, cell + 1);
            }
            if (cellEnd == to) {
                if (cell + 1 != cellCount) {
                    throw raggedRow(b, from, to, line);
                }
                break;
            }
            cellStart = cellEnd + 1;
        }
        rows++;
    }

    /**
     * Position of the next delimiter in {@code b[from, to)}, or {@code to}; eight bytes at a time with
     * the same zero-byte test as the line splitter. Reading a word may look past {@code to} (into the
     * line end or the next line) but never past the array, and a hit beyond {@code to} is ignored.
     */
    private static int indexOfDelimiter(byte[] b, int from, int to, long delimiters) {
        int i = from;
        for (int last = Math.min(to, b.length - Long.BYTES); i < last; i += Long.BYTES) {
            long x = (long) LONGS.get(b, i) ^ delimiters;
            long found = (x - 0x0101010101010101L) & ~x & 0x8080808080808080L;
            if (found != 0) {
                return Math.min(to, i + (Long.numberOfTrailingZeros(found) >>> 3));
            }
        }
        byte delimiter = (byte) delimiters;
        for (; i < to; i++) {
            if (b[i] == delimiter) {
                return i;
            }
        }
        return to;
    }

    int rows() {
        return rows;
    }

    /** Rows with an extension value: all rows unless the extension cells stop, 0 without the channel. */
    int extensometerPoints() {
        return extensionSlot < 0 ? 0 : extensometerPoints < 0 ? rows : extensometerPoints;
    }

    int extensionStopLine() {
        return extensionStopLine;
    }

    int repeatedTimes() {
        return repeatedTimes;
    }

    int firstRepeatedTimeLine() {
        return firstRepeatedTimeLine;
    }

    /** The trimmed values of a channel in canonical units, or null when the file lacks it. */
    double[] values(Channel channel) {
        for (int i = 0; i < cellCount; i++) {
            if (header.channelOf(i) == channel) {
                return lists[slotOfColumn[i]].toTrimmedArray();
            }
        }
        return null;
    }

    private void store(int slot, byte[] b, int cellStart, int cellEnd, int line, int column) {
        int s = cellStart;
        int e = cellEnd;
        while (s < e && (b[s] == ' ' || b[s] == '\t')) {
            s++;
        }
        while (e > s && (b[e - 1] == ' ' || b[e - 1] == '\t')) {
            e--;
        }
        if (slot == extensionSlot && (s == e && extensionMayStop || extensionStopLine != 0)) {
            extensionEnded(s == e, line, column);
            return;
        }
        double parsed = decimalCommaAllowed && contains(b, s, e, (byte) ',')
                ? parseWithDecimalComma(slot, b, s, e, line, column)
                : parse(slot, b, s, e, b, s, line, column);
        double value = factors[slot].toCanonical(parsed);
        if (!Double.isFinite(value)) {
            throw outOfRange(slot, b, s, e, line, column);
        }
        GrowableDoubles list = lists[slot];
        if (slot == timeSlot && list.size() > 0) {
            double previous = list.last();
            if (value <= previous) {
                timeNotIncreasing(previous, value, b, s, e, line, column);
            }
        }
        list.add(value);
    }

    /**
     * Parses the trimmed cell {@code number[s, e)}; {@code original} and {@code os} locate the same
     * cell in the row for the error message. fastdoubleparser follows the Java literal grammar, which is
     * wider than ours, so its input is first narrowed: the first byte must be a digit, sign or point and
     * the last a digit or point (this rules out NaN, Infinity, the d/f suffixes and any surrounding
     * control characters), and a hexadecimal {@code 0x} prefix is refused. What is left of the Java
     * grammar is exactly decimal notation, so the checks cost two or three byte reads, not a pass.
     */
    private double parse(int slot, byte[] number, int s, int e, byte[] original, int os, int line, int column) {
        int length = e - s;
        if (length > 0 && length <= MAX_NUMBER_LENGTH && isFirstOfNumber(number[s])
                && isLastOfNumber(number[e - 1]) && !isHex(number, s, e)) {
            try {
                return JavaDoubleParser.parseDouble(number, s, length);
            } catch (IllegalArgumentException notDecimal) {
                // NumberFormatException: "1.2.3", "-", "1e", "1 2" and the like; reported below.
            }
        }
        throw rejectCell(slot, original, os, os + length, line, column);
    }

    private double parseWithDecimalComma(int slot, byte[] b, int s, int e, int line, int column) {
        if (e - s > MAX_NUMBER_LENGTH) {
            throw rejectCell(slot, b, s, e, line, column);
        }
        for (int i = s; i < e; i++) {
            scratch[i - s] = b[i] == ',' ? (byte) '.' : b[i];
        }
        return parse(slot, scratch, 0, e - s, b, s, line, column);
    }

    /**
     * An empty extension cell in a file with a crosshead channel: the extensometer was taken off. The
     * point gets NaN and every later extension cell must be empty too.
     */
    private void extensionEnded(boolean empty, int line, int column) {
        if (!empty) {
            throw new CurveRejected(line, column, "the extension channel resumes after it stopped on line "
                    + extensionStopLine + "; once the extensometer is removed its cells must stay empty");
        }
        if (extensionStopLine == 0) {
            extensionStopLine = line;
            extensometerPoints = rows;
        }
        lists[extensionSlot].add(Double.NaN);
    }

    /** Equal time stamps are counted for a warning; a smaller one rejects the file. */
    private void timeNotIncreasing(double previous, double value, byte[] b, int s, int e, int line, int column) {
        if (value < previous) {
            throw new CurveRejected(line, column, "time goes backwards: \"" + shown(b, s, e) + "\" is "
                    + value + " s, after " + previous + " s on the previous row");
        }
        if (repeatedTimes == 0) {
            firstRepeatedTimeLine = line;
        }
        repeatedTimes++;
    }

    private CurveRejected outOfRange(int slot, byte[] b, int s, int e, int line, int column) {
        return new CurveRejected(line, column, "the " + labels[slot] + " value \"" + shown(b, s, e)
                + "\" is out of the range of a double");
    }

    /** The slow path for a cell that is not a plain decimal number: say precisely what it is. */
    private CurveRejected rejectCell(int slot, byte[] b, int s, int e, int line, int column) {
        String label = labels[slot];
        if (s == e) {
            return new CurveRejected(line, column, "the " + label + " cell is empty");
        }
        String text = Utf8Text.decode(b, s, e, line, delimiter);
        String shown = text.length() > 40 ? text.substring(0, 40) + "\u2026" : text;
        if (text.length() > MAX_NUMBER_LENGTH) {
            return new CurveRejected(line, column, "the " + label + " value \"" + shown
                    + "\" is too long to be a number (" + text.length() + " characters)");
        }
        String unsigned = text.startsWith("-") || text.startsWith("+") ? text.substring(1) : text;
        String lower = unsigned.toLowerCase(Locale.ROOT);
        if (lower.equals("nan") || lower.equals("inf") || lower.equals("infinity") || lower.equals("\u221E")) {
            return new CurveRejected(line, column, "the " + label + " value \"" + shown + "\" is not a finite number");
        }
        if (text.indexOf(',') >= 0 && delimiter != ';') {
            return new CurveRejected(line, column, "the " + label + " value \"" + shown
                    + "\" is not a number; a decimal comma is accepted only in semicolon-delimited files");
        }
        return new CurveRejected(line, column, "the " + label + " value \"" + shown + "\" is not a number");
    }

    private CurveRejected raggedRow(byte[] b, int from, int to, int line) {
        int cells = 1;
        for (int i = from; i < to; i++) {
            if (b[i] == delimiter) {
                cells++;
            }
        }
        int column = Math.min(cells, cellCount) + 1;
        return new CurveRejected(line, column, "the row has " + cells + (cells == 1 ? " cell" : " cells")
                + " but the header row has " + cellCount);
    }

    private static String shown(byte[] b, int s, int e) {
        return new String(b, s, e - s, StandardCharsets.ISO_8859_1);
    }

    private static boolean isFirstOfNumber(byte c) {
        return c >= '0' && c <= '9' || c == '-' || c == '+' || c == '.';
    }

    private static boolean isLastOfNumber(byte c) {
        return c >= '0' && c <= '9' || c == '.';
    }

    private static boolean isHex(byte[] b, int s, int e) {
        int i = b[s] == '-' || b[s] == '+' ? s + 1 : s;
        return i + 1 < e && b[i] == '0' && (b[i + 1] == 'x' || b[i + 1] == 'X');
    }

    private static boolean contains(byte[] b, int s, int e, byte wanted) {
        for (int i = s; i < e; i++) {
            if (b[i] == wanted) {
                return true;
            }
        }
        return false;
    }
}
