package org.specimenledger.reliability;

import java.util.ArrayList;
import java.util.List;
import java.util.regex.Pattern;
import tools.jackson.databind.JsonNode;

/**
 * What every answer of the service must look like, whatever was sent: never a 5xx; every refusal an
 * RFC 9457 problem ({@code application/problem+json} with type, title, status equal to the HTTP status,
 * and a detail); nothing of the internals (stack frames, exception classes, SQL, driver messages).
 */
final class AnswerRules {

    /** Traces of internals that must never reach a client. Checked case-sensitively. */
    private static final List<Pattern> LEAKS = List.of(
            Pattern.compile("\\tat [a-z]"), Pattern.compile("at (org|java|jakarta|tools|com)\\.[a-z]+\\."),
            Pattern.compile("(org\\.hibernate|org\\.postgresql|org\\.springframework|org\\.specimenledger|java\\.lang|java\\.util|jakarta\\.|tools\\.jackson)"),
            Pattern.compile("(?i)apache tomcat|<html"),
            Pattern.compile("[A-Za-z]+Exception"), Pattern.compile("PSQL|SQLState|SQL state|ERROR: "),
            Pattern.compile("(?i)\\b(insert into|update \"?[a-z_]+\"? set|delete from|select .* from [a-z_]+ where)\\b"),
            Pattern.compile("(?i)constraint \"[a-z_]+\""), Pattern.compile("\"trace\"\\s*:"));

    private AnswerRules() {
    }

    /** Every broken rule of one answer, empty when it is fine. {@code sent} is excluded from the leak search. */
    static List<String> problemsOf(Wire.Answer a, String sent) {
        List<String> out = new ArrayList<>();
        if (a.status() >= 500) {
            out.add("answered " + a.status());
        }
        String body = a.body() == null ? "" : a.body();
        String searched = sent == null || sent.isEmpty() ? body : body.replace(sent, "");
        for (Pattern leak : LEAKS) {
            if (leak.matcher(searched).find()) {
                out.add("body shows internals (" + leak.pattern() + ")");
            }
        }
        if (a.status() >= 400) {
            if (!a.contentType().startsWith("application/problem+json")) {
                out.add("refusal is not application/problem+json but '" + a.contentType() + "'");
                return out;
            }
            JsonNode p;
            try {
                p = a.json();
            } catch (RuntimeException e) {
                out.add("problem body is not JSON");
                return out;
            }
            if (p == null || !p.isObject()) {
                out.add("problem body is not a JSON object");
                return out;
            }
            for (String member : List.of("type", "title", "detail")) {
                if (p.get(member) == null || !p.get(member).isString() || p.get(member).asString().isBlank()) {
                    out.add("problem has no " + member);
                }
            }
            if (p.get("status") == null || p.get("status").asInt() != a.status()) {
                out.add("problem status " + p.get("status") + " differs from HTTP " + a.status());
            }
        }
        return out;
    }
}
