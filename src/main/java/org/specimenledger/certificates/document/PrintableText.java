package org.specimenledger.certificates.document;

import java.awt.Font;

/**
 * Makes any text safe to print literally with the report font: control characters (other than line
 * breaks) and code points the font has no glyph for are shown as {@code [U+XXXX]}, so the PDF never
 * references a missing glyph (forbidden in PDF/A) and nothing is silently dropped. Markup is never
 * interpreted: the templates print text fields without markup.
 */
final class PrintableText {

    private final Font font;

    PrintableText(Font font) {
        this.font = font;
    }

    /** The printable form of {@code text}; {@code null} stays {@code null} (the template hides the line). */
    String of(String text) {
        if (text == null) {
            return null;
        }
        StringBuilder out = new StringBuilder(text.length());
        int[] codePoints = text.codePoints().toArray();
        for (int i = 0; i < codePoints.length; i++) {
            int cp = codePoints[i];
            if (cp == '\r') {
                // CR LF and a lone CR both become one line break (the LF of a CR LF is skipped here)
                out.append('\n');
                if (i + 1 < codePoints.length && codePoints[i + 1] == '\n') {
                    i++;
                }
            } else if (cp == '\n') {
                out.append('\n');
            } else if (cp == '\t') {
                out.append(' ');
            } else if (Character.isISOControl(cp) || !font.canDisplay(cp) || Character.getType(cp) == Character.FORMAT) {
                out.append(String.format("[U+%04X]", cp));
            } else {
                out.appendCodePoint(cp);
            }
        }
        return out.toString();
    }
}
