package org.specimenledger.curve;

import ch.randelshofer.fastdoubleparser.JavaDoubleParser;
import java.nio.charset.StandardCharsets;
import java.util.Locale;

/**
 * Parses data rows straight from the byte buffer into one primitive list per channel.
 *
 * <p>This is the hot loop: one pass per row finds the delimiters, and a numeric cell goes to
 * {@link JavaDoubleParser} as a byte slice without any copy, String or object per point. Only a cell
 * that fails takes the slow path, which works out the precise reason (NaN spellings, misplaced
 * decimal comma, invalid UTF-8). Non-ASCII bytes cannot be part of a number, so UTF-8 needs checking
 * only when a row holds one; the loop ORs the bytes together to find out for free.
 */
final class DataRows {

    /** Longer cells are refused before parsing: no instrument writes 100 characters for one number. */
    static final int MAX_NUMBER_LENGTH = 100;


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
            }
            slot++;
        }
        this.timeSlot = time;
    }

    /** Parses one non-blank data row {@code b[from, to)} found on physical line {@code line}. */
    void accept(byte[] b, int from, int to, int line) {
        final byte delim = delimiter;
        int cell = 0;
        int cellStart = from;
        int orOfBytes = 0;
        for (int i = from; ; i++) {
            if (i == to || b[i] == delim) {
                if (cell == cellCount) {
                    throw raggedRow(b, from, to, line);
                }
                int slot = slotOfColumn[cell];
                if (slot >= 0) {
                    store(slot, b, cellStart, i, line, cell + 1, from, to);
                }
                cell++;
                if (i == to) {
                    break;
                }
                cellStart = i + 1;
            } else {
                orOfBytes |= b[i];
            }
        }
        if (cell != cellCount) {
            throw raggedRow(b, from, to, line);
        }
        if (orOfBytes < 0) {
            // A byte >= 0x80 somewhere, so far only in ignored columns: the file must still be UTF-8.
            Utf8Text.check(b, from, to, line, delim);
        }
        rows++;
    }

    int rows() {
        return rows;
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

    private void store(int slot, byte[] b, int cellStart, int cellEnd, int line, int column, int rowFrom,
            int rowTo) {
        int s = cellStart;
        int e = cellEnd;
        while (s < e && (b[s] == ' ' || b[s] == '\t')) {
            s++;
        }
        while (e > s && (b[e - 1] == ' ' || b[e - 1] == '\t')) {
            e--;
        }
        double parsed = decimalCommaAllowed && contains(b, s, e, (byte) ',')
                ? parseWithDecimalComma(slot, b, s, e, line, column, rowFrom, rowTo)
                : parse(slot, b, s, e, b, s, line, column, rowFrom, rowTo);
        double value = factors[slot].toCanonical(parsed);
        if (!Double.isFinite(parsed) || !Double.isFinite(value)) {
            throw new CurveRejected(line, column, "the " + labels[slot] + " value \"" + shown(b, s, e)
                    + "\" is out of the range of a double");
        }
        GrowableDoubles list = lists[slot];
        if (slot == timeSlot && list.size() > 0) {
            checkTimeOrder(list.last(), value, b, s, e, line, column);
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
    private double parse(int slot, byte[] number, int s, int e, byte[] original, int os, int line, int column,
            int rowFrom, int rowTo) {
        int length = e - s;
        if (length > 0 && length <= MAX_NUMBER_LENGTH && isFirstOfNumber(number[s])
                && isLastOfNumber(number[e - 1]) && !isHex(number, s, e)) {
            try {
                return JavaDoubleParser.parseDouble(number, s, length);
            } catch (IllegalArgumentException notDecimal) {
                // NumberFormatException: "1.2.3", "-", "1e", "1 2" and the like; reported below.
            }
        }
        throw rejectCell(slot, original, os, os + length, line, column, rowFrom, rowTo);
    }

    private double parseWithDecimalComma(int slot, byte[] b, int s, int e, int line, int column, int rowFrom,
            int rowTo) {
        if (e - s > MAX_NUMBER_LENGTH) {
            throw rejectCell(slot, b, s, e, line, column, rowFrom, rowTo);
        }
        for (int i = s; i < e; i++) {
            scratch[i - s] = b[i] == ',' ? (byte) '.' : b[i];
        }
        return parse(slot, scratch, 0, e - s, b, s, line, column, rowFrom, rowTo);
    }

    private void checkTimeOrder(double previous, double value, byte[] b, int s, int e, int line, int column) {
        if (value < previous) {
            throw new CurveRejected(line, column, "time goes backwards: \"" + shown(b, s, e) + "\" is "
                    + value + " s, after " + previous + " s on the previous row");
        }
        if (value == previous) {
            if (repeatedTimes == 0) {
                firstRepeatedTimeLine = line;
            }
            repeatedTimes++;
        }
    }

    /** The slow path for a cell that is not a plain decimal number: say precisely what it is. */
    private CurveRejected rejectCell(int slot, byte[] b, int s, int e, int line, int column, int rowFrom, int rowTo) {
        Utf8Text.check(b, rowFrom, rowTo, line, delimiter); // invalid UTF-8 is named before anything else
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
        Utf8Text.check(b, from, to, line, delimiter);
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
