package org.specimenledger.reliability;

import java.util.Set;

/**
 * How a spreadsheet takes a CSV cell: one that starts with {@code = + - @}, a tab, a carriage return or a line
 * feed — also after leading spaces, and with the full-width forms of those signs — is read as a formula [CP:
 * OWASP's page on CSV injection lists = + - @ tab and CR; the line feed, the leading spaces and the full-width
 * signs are known ways past a filter that looks at the first character only]. A plain number ({@code -2.5}) is a
 * number, not a formula.
 */
public final class CsvCells {

    private static final Set<Integer> FORMULA_START = Set.of((int) '=', (int) '+', (int) '-', (int) '@',
            0xFF1D, 0xFF0B, 0xFF0D, 0xFF20);

    private CsvCells() {
    }

    /** Whether a spreadsheet would evaluate the cell as read back from the file. */
    public static boolean evaluated(String cell) {
        return startsLikeFormula(cell) && !cell.matches("[-+]?[0-9]+(\\.[0-9]+)?([eE][-+]?[0-9]+)?");
    }

    /**
     * What the export must hold for a typed text: the text, with an apostrophe in front when it starts like a
     * formula (a typed mark that happens to be a number, {@code -2.5}, gets one too: it is a mark, not a value).
     */
    public static String expected(String typed) {
        return startsLikeFormula(typed) ? "'" + typed : typed;
    }

    private static boolean startsLikeFormula(String cell) {
        if (cell.isEmpty()) {
            return false;
        }
        char first = cell.charAt(0);
        if (first == '\t' || first == '\r' || first == '\n') {
            return true;
        }
        String rest = cell.stripLeading();
        return !rest.isEmpty() && FORMULA_START.contains(rest.codePointAt(0));
    }
}
