package org.specimenledger.reliability;

import java.util.List;
import tools.jackson.databind.JsonNode;

/**
 * A place where accepted text is shown to someone, and the check that it arrives there as text, never as
 * markup or script. Today the only place is the JSON answer itself. Hook for other branches: the pages add
 * a place that fetches the record's page and checks the text is HTML-escaped; the certificates add one that
 * renders the PDF and reads the text back with PDFBox. Add them to {@link #PLACES}.
 */
interface RenderedText {

    /** What the place is, for the failure message. */
    String name();

    /** Null when {@code text}, accepted in the request that got {@code answer}, is rendered safely; else why not. */
    String check(String text, Wire.Answer answer);

    /** JSON answers: served as JSON with {@code nosniff}, and the body parses (so every string is escaped). */
    RenderedText JSON = new RenderedText() {
        @Override
        public String name() {
            return "in the JSON answer";
        }

        @Override
        public String check(String text, Wire.Answer answer) {
            if (answer.body() == null || answer.body().isEmpty()) {
                return null;
            }
            if (!answer.contentType().startsWith("application/json")) {
                return "served as '" + answer.contentType() + "'";
            }
            if (!"nosniff".equals(answer.headers().firstValue("X-Content-Type-Options").orElse(null))) {
                return "served without X-Content-Type-Options: nosniff";
            }
            try {
                JsonNode ignored = answer.json();
            } catch (RuntimeException e) {
                return "the body is not valid JSON";
            }
            return null;
        }
    };

    List<RenderedText> PLACES = List.of(JSON);
}
