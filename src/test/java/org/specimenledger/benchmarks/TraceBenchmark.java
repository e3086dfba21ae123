package org.specimenledger.benchmarks;

import java.net.URI;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Map;
import java.util.Locale;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * Trace of 20 analysis runs against the running service ({@code GET /api/v1/trace/analyses?id=…}, the path a
 * 20-line certificate trace takes through {@code TraceService}): sets up 20 specimens with a test run and an
 * uploaded curve each, warms the server up, then times sequential requests end to end in this client.
 *
 * <p>Arguments: base URL, user, password, points per curve (default 10,000), measured requests (default 50).
 * Command and figures: {@code benchmarks/trace.md}.
 */
public final class TraceBenchmark {

    private static final JsonMapper JSON = JsonMapper.builder().build();
    private static final int LINES = 20;

    private TraceBenchmark() {
    }

    public static void main(String[] args) throws Exception {
        String base = args.length > 0 ? args[0] : "http://127.0.0.1:8080";
        String user = args.length > 1 ? args[1] : "demo-manager";
        String password = args.length > 2 ? args[2] : "demo-password";
        int points = args.length > 3 ? Integer.parseInt(args[3]) : 10_000;
        int measured = args.length > 4 ? Integer.parseInt(args[4]) : 50;
        UploadBenchmark client = new UploadBenchmark(base, user, password);

        var bench = client.bench(List.of(Map.of("property", "Rm", "min", 1, "unit", "MPa")));
        List<String> analyses = new ArrayList<>();
        List<String> specimens = new ArrayList<>();
        for (int i = 0; i < LINES; i++) {
            String run = client.testRun(bench);
            specimens.add(JSON.readTree(client.send(HttpRequest.newBuilder(URI.create(base + "/api/v1/tests/" + run))
                    .GET()).body()).get("specimenId").asString());
            HttpResponse<String> r = client.send(HttpRequest.newBuilder(URI.create(base + "/api/v1/tests/" + run + "/curve"))
                    .header("Content-Type", "text/csv")
                    .PUT(HttpRequest.BodyPublishers.ofByteArray(UploadBenchmark.csv(points, "trace " + i + " " + run))));
            if (r.statusCode() != 201) {
                throw new IllegalStateException("upload failed: " + r.statusCode() + " " + r.body());
            }
            analyses.add(JSON.readTree(r.body()).get("analysis").get("id").asString());
        }
        StringBuilder q = new StringBuilder("/api/v1/trace/analyses?");
        analyses.forEach(a -> q.append(q.charAt(q.length() - 1) == '?' ? "" : "&").append("id=").append(a));
        URI uri = URI.create(base + q);
        time(client, uri, "trace of " + LINES + " analyses", points, measured, user);

        // the same 20 specimens on one issued certificate (with its curve appendix), traced from its number
        String draft = JSON.readTree(client.send(json(base + "/api/v1/certificates/drafts", Map.of(
                "orderId", bench.get("order"), "specimenIds", specimens,
                "productDescription", "benchmark flat specimens", "includeCurves", true))).body()).get("id").asString();
        HttpResponse<String> issued = client.send(json(base + "/api/v1/certificates/drafts/" + draft + "/issue",
                Map.of("password", password, "nonConformityStatement", "benchmark data, not a product")));
        if (issued.statusCode() != 201) {
            throw new IllegalStateException("issue failed: " + issued.statusCode() + " " + issued.body());
        }
        String number = JSON.readTree(issued.body()).get("number").asString();
        time(client, URI.create(base + "/api/v1/trace/certificates/" + number), "trace of certificate " + number
                + " (" + LINES + " specimens)", points, measured, user);
    }

    private static HttpRequest.Builder json(String uri, Object body) throws Exception {
        return HttpRequest.newBuilder(URI.create(uri)).header("Content-Type", "application/json")
                .POST(HttpRequest.BodyPublishers.ofString(JSON.writeValueAsString(body)));
    }

    private static void time(UploadBenchmark client, URI uri, String what, int points, int measured, String user)
            throws Exception {
        int bytes = 0;
        for (int i = 0; i < 20; i++) {
            bytes = call(client, uri);
        }
        double[] t = new double[measured];
        for (int i = 0; i < measured; i++) {
            long t0 = System.nanoTime();
            call(client, uri);
            t[i] = (System.nanoTime() - t0) / 1e6;
        }
        Arrays.sort(t);
        System.out.printf(Locale.ROOT, "%s (%,d points each, %,d bytes of JSON): median %.1f ms, "
                + "p90 %.1f ms, min %.1f ms, max %.1f ms over %d requests after 20 warm-ups%n", what, points, bytes,
                t[t.length / 2], t[(int) (t.length * 0.9)], t[0], t[t.length - 1], measured);
        System.out.println("the same request with curl: curl -s -o /dev/null -w '%{http_code} %{time_total}s\\n' -u "
                + user + ":… '" + uri + "'");
    }

    private static int call(UploadBenchmark client, URI uri) throws Exception {
        HttpResponse<String> r = client.send(HttpRequest.newBuilder(uri).GET());
        if (r.statusCode() != 200) {
            throw new IllegalStateException("trace failed: " + r.statusCode() + " " + r.body());
        }
        JsonNode answer = JSON.readTree(r.body());
        JsonNode lines = answer.has("trace") ? answer.get("trace").get("lines") : answer.get("lines");
        for (JsonNode l : lines) {
            if (!l.get("replay").get("identical").asBoolean()) {
                throw new IllegalStateException("a replay did not reproduce: " + l.get("replay"));
            }
        }
        return r.body().length();
    }
}
