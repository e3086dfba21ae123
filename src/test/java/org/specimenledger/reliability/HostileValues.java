package org.specimenledger.reliability;

import java.util.List;

/**
 * The hostile and malformed values the corpus puts into every field, parameter and body. Each entry says
 * what it tries; none of them is a measurement. Raw JSON tokens (not strings) are marked {@link Raw}.
 */
public final class HostileValues {

    private HostileValues() {
    }

    /** A JSON token written into the body as it is, e.g. {@code NaN} or {@code 1e400}. */
    record Raw(String token) {
    }

    /** Text a person could type into a name, number or remark: stored if the field allows it, never run. */
    public static final List<String> TEXT = List.of(
            "'; DROP TABLE heat; --",
            "\" OR \"1\"=\"1",
            "1' OR '1'='1' /*",
            "<script>alert('x')</script>",
            "\"><img src=x onerror=alert(1)>",
            "{{7*7}}${7*7}#{7*7}",
            "${jndi:ldap://127.0.0.1/x}",
            "=HYPERLINK(\"http://127.0.0.1/x\",\"open\")",
            "@SUM(1+1)*cmd|' /C calc'!A0",
            "-2+3",
            "javascript:alert(1)",
            "../../../../etc/passwd",
            "nul\u0000byte",
            "bell\u0007esc\u001b[31mred",
            "line\r\nInjected-Header: yes",
            "right\u202Eto-left override",
            "zero\u200Bwidth",
            "combining e\u0301 and \uD83D\uDE00 emoji",
            "lone \uD800 surrogate",
            "   ",
            "",
            "A".repeat(100_000));

    /** Values for number fields: edges, overflows, and the tokens JSON does not have. */
    static final List<Object> NUMBERS = List.of(
            -1, 0, -0.0, 1e-320, 1e308, new Raw("1e400"), new Raw("-1e400"),
            new Raw("123456789012345678901234567890.123456789012345678901234567890"),
            new Raw("NaN"), new Raw("Infinity"), new Raw("-Infinity"),
            "NaN", "Infinity", "-Infinity", "1e400", "12,5", "0x1F", Long.MAX_VALUE, Long.MIN_VALUE);

    /** Values of the wrong JSON type for any field. */
    static final List<Object> WRONG_TYPES = List.of(
            new Raw("true"), new Raw("{}"), new Raw("[]"), new Raw("[1,2]"), new Raw("{\"x\":1}"), 12345, "text");

    /** Values for a path variable or query parameter (sent URL-encoded). */
    static final List<String> PARAMETERS = List.of(
            "not-a-uuid", "00000000-0000-0000-0000-000000000000", "-1", "0", "99999999999999999999", "NaN",
            "1e400", "'; SELECT pg_sleep(5); --", "<script>alert(1)</script>", "..%2F..%2Fetc%2Fpasswd",
            "%00", "\u0000", "\uFFFF", "2026-13-45T99:99:99Z", "A".repeat(10_000), " ", "true");

    /** Whole bodies that are not the JSON object asked for. */
    static final List<String> MALFORMED_BODIES = List.of(
            "", "{", "}", "[", "{\"a\":", "{\"a\":1,}", "{'a':1}", "null", "[]", "\"text\"", "42", "true",
            "{\"a\":1}{\"b\":2}", "\uFEFF{}", "{\"a\":\"\\uZZZZ\"}", "{\"a\":\"unterminated}",
            "[".repeat(5000) + "]".repeat(5000), "{\"a\":" + "[".repeat(2000) + "]".repeat(2000) + "}",
            "{\"a\":1,\"a\":2}", "<xml/>", "%PDF-1.7");

    /** Uploaded file names that try to leave the folder they are stored in, or to confuse a header. */
    static final List<String> FILE_NAMES = List.of(
            "../../../../etc/passwd", "..\\..\\windows\\win.ini", "/absolute/path.csv", "C:\\boot.ini",
            "curve\u0000.csv", "curve\r\nX-Injected: 1.csv", "CON", ".", "..", "%2e%2e%2fcurve.csv",
            "<script>.csv", "A".repeat(5000) + ".csv", "\u202Egnp.csv", "curve.csv;.exe", "~/.ssh/id_rsa");
}
