package org.specimenledger.curve;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * The {@code #} lines before the header row: {@code # key: value} and {@code # key = value} become
 * ordered metadata, anything else is a comment and ignored.
 *
 * <p>The separator is the first {@code '='}, or the first {@code ':'} followed by white space or
 * ending the line, whichever comes first; so {@code # source: http://lab.invalid/run/7} keeps its URL
 * intact, {@code # rate=0.5} works without spaces and {@code # operator:} gives an empty value. The first occurrence of a repeated key wins; the repeat is
 * reported as a warning rather than silently overwriting what the machine wrote first.
 */
final class Preamble {

    private final Map<String, String> metadata = new LinkedHashMap<>();
    private final List<String> warnings;

    Preamble(List<String> warnings) {
        this.warnings = warnings;
    }

    static boolean isPreambleLine(byte[] b, int from, int to) {
        return from < to && b[from] == '#';
    }

    void accept(byte[] b, int from, int to, int line) {
        String body = Utf8Text.decode(b, from + 1, to, line, Utf8Text.NO_DELIMITER).strip();
        int separator = separatorIndex(body);
        if (separator <= 0) {
            return;
        }
        String key = body.substring(0, separator).strip();
        String value = body.substring(separator + 1).strip();
        if (key.isEmpty()) {
            return;
        }
        if (metadata.containsKey(key)) {
            warnings.add("metadata key \"" + key + "\" repeated on line " + line + "; the first value is kept");
            return;
        }
        metadata.put(key, value);
    }

    Map<String, String> metadata() {
        return Collections.unmodifiableMap(new LinkedHashMap<>(metadata));
    }

    private static int separatorIndex(String body) {
        for (int i = 0; i < body.length(); i++) {
            char c = body.charAt(i);
            if (c == '=' || c == ':' && (i + 1 == body.length() || Character.isWhitespace(body.charAt(i + 1)))) {
                return i;
            }
        }
        return -1;
    }
}
