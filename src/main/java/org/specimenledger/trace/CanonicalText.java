package org.specimenledger.trace;

/**
 * Cuts the {@code after} value out of an event's canonical text, character for character, so that the
 * audit bundle can hold a record exactly as the ledger hashed it and {@code grep -F} can find it there.
 * The canonical text is a JSON object with sorted keys: {@code action}, {@code actor}, then {@code after}.
 */
final class CanonicalText {

    private static final String KEY = ",\"after\":";

    private CanonicalText() {
    }

    /**
     * The JSON text of {@code after} (an object, array, string, number, literal), or null when the text has
     * no top-level {@code after}. Inside a JSON string a quote is always escaped, so {@code ,"after":} with a
     * bare quote can only be the key itself; the first one follows the {@code actor} value.
     */
    static String after(String canonical) {
        int at = canonical.indexOf(KEY);
        if (at < 0) {
            return null;
        }
        int start = at + KEY.length();
        int end = endOfValue(canonical, start);
        return end < 0 ? null : canonical.substring(start, end);
    }

    /** Index just past the JSON value that starts at {@code start}; -1 if the text ends first. */
    private static int endOfValue(String s, int start) {
        int depth = 0;
        boolean inString = false;
        for (int i = start; i < s.length(); i++) {
            char c = s.charAt(i);
            if (inString) {
                if (c == '\\') {
                    i++;
                } else if (c == '"') {
                    inString = false;
                    if (depth == 0) {
                        return i + 1;
                    }
                }
                continue;
            }
            switch (c) {
                case '"' -> inString = true;
                case '{', '[' -> depth++;
                case '}', ']' -> {
                    if (depth == 0) {
                        return i; // end of the enclosing object: a scalar value ended here
                    }
                    depth--;
                    if (depth == 0) {
                        return i + 1;
                    }
                }
                case ',' -> {
                    if (depth == 0) {
                        return i;
                    }
                }
                default -> {
                }
            }
        }
        return -1;
    }
}
