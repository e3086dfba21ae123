package org.specimenledger.curve;

import java.io.ByteArrayOutputStream;
import java.nio.charset.StandardCharsets;
import java.util.List;

/**
 * A well-formed curve file built by the property tests, with the values it was built from.
 *
 * @param bytes the file
 * @param columns the columns in file order
 * @param values per column, the numbers written (in the column's unit); null for the ignored column
 * @param rows number of data rows
 */
record GeneratedCurve(byte[] bytes, List<GeneratedColumn> columns, double[][] values, int rows) {

    /**
     * One column of a generated file.
     *
     * @param channel the channel, or null for an ignored extra column
     * @param header the header cell as written
     * @param exactFactor exact decimal factor to the canonical unit, e.g. "0.001" for ms
     */
    record GeneratedColumn(Channel channel, String header, String exactFactor) {
    }

    /** Writes the file: the layout choices come from the generator, the values are Double.toString. */
    static GeneratedCurve write(Layout layout, List<GeneratedColumn> columns, double[][] values, int rows) {
        String end = layout.crlf() ? "\r\n" : "\n";
        StringBuilder text = new StringBuilder();
        if (layout.byteOrderMark()) {
            text.append('\uFEFF');
        }
        for (int i = 0; i < layout.metadataLines(); i++) {
            text.append(i % 2 == 0 ? "# key" + i + ": value " + i : "# key" + i + " = v" + i).append(end);
        }
        if (layout.metadataLines() > 0) {
            text.append("# a plain comment").append(end);
        }
        for (int c = 0; c < columns.size(); c++) {
            text.append(c == 0 ? "" : layout.delimiter()).append(layout.padding()).append(columns.get(c).header())
                    .append(layout.padding());
        }
        for (int r = 0; r < rows; r++) {
            text.append(end);
            if (layout.blankLineAfterRow() == r) {
                text.append(end);
            }
            for (int c = 0; c < columns.size(); c++) {
                String cell = values[c] == null ? "note" + r : Double.toString(values[c][r]);
                if (layout.decimalComma()) {
                    cell = cell.replace('.', ',');
                }
                text.append(c == 0 ? "" : layout.delimiter()).append(layout.padding()).append(cell);
            }
        }
        if (layout.trailingLineEnd()) {
            text.append(end);
        }
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        out.writeBytes(text.toString().getBytes(StandardCharsets.UTF_8));
        return new GeneratedCurve(out.toByteArray(), columns, values, rows);
    }

    /**
     * How the file is laid out.
     *
     * @param delimiter comma, semicolon or tab
     * @param decimalComma write decimal commas (only generated with semicolons)
     * @param byteOrderMark start with a UTF-8 BOM
     * @param crlf CRLF instead of LF
     * @param trailingLineEnd end the last row with a line end
     * @param metadataLines number of metadata lines before the header
     * @param padding spaces written around cells
     * @param blankLineAfterRow a blank line after this data row index, or -1
     */
    record Layout(String delimiter, boolean decimalComma, boolean byteOrderMark, boolean crlf, boolean trailingLineEnd,
            int metadataLines, String padding, int blankLineAfterRow) {
    }
}
