package org.specimenledger.curve;

/**
 * A curve file that does not meet the input contract, with where and why.
 *
 * <p>{@link #getMessage()} reads {@code "line 7, column 2: <reason>"}, {@code "line 7: <reason>"} when
 * the problem is a whole line, or {@code "file: <reason>"} when it is the file as a whole.
 */
public final class CurveRejected extends IllegalArgumentException {

    private static final long serialVersionUID = 1L;

    private final int line;
    private final int column;
    private final String reason;

    /**
     * Creates the rejection.
     *
     * @param line 1-based physical line number in the file, 0 when the problem is the file as a whole
     * @param column 1-based cell number in the line, 0 when the problem is not about one cell
     * @param reason short human-readable sentence naming the bad value, not blank
     * @throws IllegalArgumentException if {@code line} or {@code column} is negative or the reason is
     *     blank
     */
    public CurveRejected(int line, int column, String reason) {
        super(describe(line, column, reason));
        this.line = line;
        this.column = column;
        this.reason = reason;
    }

    /**
     * Where the problem is.
     *
     * @return the 1-based physical line number, 0 when the problem is the file as a whole
     */
    public int line() {
        return line;
    }

    /**
     * Which cell the problem is in.
     *
     * @return the 1-based cell (column) number, 0 when the problem is not about one cell
     */
    public int column() {
        return column;
    }

    /**
     * What is wrong, without the position.
     *
     * @return a short sentence naming the bad value
     */
    public String reason() {
        return reason;
    }

    private static String describe(int line, int column, String reason) {
        if (line < 0 || column < 0) {
            throw new IllegalArgumentException("line and column must not be negative: " + line + ", " + column);
        }
        if (reason == null || reason.isBlank()) {
            throw new IllegalArgumentException("a rejection needs a reason");
        }
        if (line == 0) {
            return "file: " + reason;
        }
        return column == 0 ? "line " + line + ": " + reason : "line " + line + ", column " + column + ": " + reason;
    }
}
