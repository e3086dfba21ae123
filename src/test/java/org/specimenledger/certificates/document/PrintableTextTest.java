package org.specimenledger.certificates.document;

import static org.assertj.core.api.Assertions.assertThat;

import java.awt.Font;
import java.io.InputStream;
import org.junit.jupiter.api.Test;

/** The printable form of typed text, with the expected forms written out by hand. */
class PrintableTextTest {

    private static PrintableText printable() throws Exception {
        try (InputStream in = PrintableTextTest.class.getClassLoader()
                .getResourceAsStream("net/sf/jasperreports/fonts/dejavu/DejaVuSans.ttf")) {
            return new PrintableText(Font.createFont(Font.TRUETYPE_FONT, in));
        }
    }

    @Test
    void lineEndsBecomeOneLineBreakEach() throws Exception {
        PrintableText p = printable();
        assertThat(p.of("line\r\nInjected-Header: yes")).isEqualTo("line\nInjected-Header: yes");
        assertThat(p.of("a\rb\nc\r\n\r\nd")).isEqualTo("a\nb\nc\n\nd");
        assertThat(p.of("tab\there")).isEqualTo("tab here");
    }

    @Test
    void controlFormatAndUnprintableCharactersShowTheirCodePoint() throws Exception {
        PrintableText p = printable();
        assertThat(p.of("bell\u0007esc\u001b[31mred")).isEqualTo("bell[U+0007]esc[U+001B][31mred");
        assertThat(p.of("right\u202Eto-left")).isEqualTo("right[U+202E]to-left");
        assertThat(p.of("zero\u200Bwidth")).isEqualTo("zero[U+200B]width");
        assertThat(p.of("lone \uD800 surrogate")).isEqualTo("lone [U+D800] surrogate");
        assertThat(p.of("<script>alert('x')</script> e\u0301")).isEqualTo("<script>alert('x')</script> e\u0301");
        assertThat(p.of(null)).isNull();
    }
}
