package org.specimenledger.reliability;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import tools.jackson.databind.JsonNode;

/**
 * Sends one hostile request at a time and checks its answer against {@link AnswerRules}, the row counts of
 * every table (unchanged after a refusal) and, for accepted text, its rendering (see {@link RenderedText}).
 */
final class Corpus {

    private final StoredRows rows;
    private final List<RenderedText> places;
    private final List<String> findings = new ArrayList<>();
    private Map<String, Long> counts;
    private int sent;
    private int refused;
    private int accepted;
    private int echoed;

    Corpus(StoredRows rows, List<RenderedText> places) {
        this.rows = rows;
        this.places = places;
        this.counts = rows.count();
    }

    /** After set-up requests sent outside the corpus. */
    void resetCounts() {
        counts = rows.count();
    }

    Wire.Answer probe(String label, Wire wire, String method, String path, HostileInputTest.Multipart body) {
        return probe(label, wire, method, path, body.contentType(), body.bytes(), null);
    }

    Wire.Answer probe(String label, Wire wire, String method, String path, String contentType, byte[] body,
            String sentText) {
        return probe(label, wire, method, path, contentType, body, sentText, null, null);
    }

    /** The same, naming the endpoint and the field that carries {@code sentText}, for the pages that print it. */
    Wire.Answer probe(String label, Wire wire, String method, String path, String contentType, byte[] body,
            String sentText, String endpoint, String pointer) {
        Wire.Answer a;
        try {
            a = wire.send(method, path, contentType, body);
        } catch (IllegalStateException e) {
            findings.add(label + ": no answer (" + e.getMessage() + ")");
            counts = rows.count();
            return new Wire.Answer(0, java.net.http.HttpHeaders.of(Map.of(), (x, y) -> true), "");
        }
        sent++;
        for (String p : AnswerRules.problemsOf(a, sentText)) {
            findings.add(label + ": " + p + " — " + a);
        }
        Map<String, Long> after = rows.count();
        if (a.status() >= 300) {
            refused++;
            List<String> changed = StoredRows.changed(counts, after);
            if (!changed.isEmpty()) {
                findings.add(label + ": refused with " + a.status() + " but stored rows changed " + changed);
            }
        } else {
            accepted++;
            if (sentText != null) {
                RenderedText.Accepted accepted = new RenderedText.Accepted(endpoint, pointer, sentText, a);
                for (RenderedText place : places) {
                    String problem = place.check(accepted);
                    if (problem != null) {
                        findings.add(label + ": accepted text " + place.name() + ": " + problem);
                    }
                }
                if (containsString(a.json(), sentText)) {
                    echoed++;
                }
                // reading pages stores nothing, but count again so that no later refusal is blamed for it
                after = rows.count();
            }
        }
        counts = after;
        return a;
    }

    private static boolean containsString(JsonNode node, String value) {
        if (node == null) {
            return false;
        }
        if (node.isString()) {
            return node.asString().equals(value) || node.asString().equals(value.strip());
        }
        for (JsonNode child : node.values()) {
            if (containsString(child, value)) {
                return true;
            }
        }
        return false;
    }

    List<String> findings() {
        return findings.size() > 60 ? findings.subList(0, 60) : findings;
    }

    void report(String what, int endpoints) {
        System.out.printf("[reliability] %s: %d endpoints, %d requests, %d refused, %d accepted, "
                + "%d accepted texts read back exactly, %d findings%n", what, endpoints, sent, refused, accepted,
                echoed, findings.size());
    }
}
