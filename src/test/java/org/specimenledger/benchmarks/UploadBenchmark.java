package org.specimenledger.benchmarks;

import java.io.ByteArrayOutputStream;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.time.LocalDate;
import java.time.ZoneOffset;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Base64;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.UUID;
import org.specimenledger.analysis.TensileAnalysis;
import org.specimenledger.analysis.TensileParameters;
import org.specimenledger.analysis.TensileResult;
import org.specimenledger.analysis.TensileSpecimen;
import org.specimenledger.curve.CurveReader;
import org.specimenledger.curve.RawCurve;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * Upload of a 1,000,000-point curve file through HTTP to a stored, analysed, ledgered result, against a
 * running service, side by side with the engine's own read + analyse time for the same file in this JVM.
 *
 * <pre>
 * mvn -q -o test-compile dependency:build-classpath -Dmdep.outputFile=target/bench.cp
 * java -cp target/test-classes:target/classes:$(cat target/bench.cp) \
 *      org.specimenledger.benchmarks.UploadBenchmark http://127.0.0.1:18080 demo-manager demo-password 10
 * </pre>
 *
 * It registers, as the given lab manager, an invented bench (heat, order of the first customer, one flat
 * specimen per upload with S0 = 100 mm² and Le = 50 mm, a frame, a 100 kN load cell, a 50 mm extensometer,
 * calibrated), then for each upload a test run, and sends the file with a unique first line so no two uploads
 * are the same bytes. Not a JMH benchmark: each upload changes the register, so it cannot be repeated in place.
 */
public final class UploadBenchmark {

    private static final JsonMapper JSON = JsonMapper.builder().build();
    private static final HttpClient HTTP = HttpClient.newHttpClient();
    private static final TensileSpecimen SPECIMEN = new TensileSpecimen(100, 50, 55, null, null);

    private final String base;
    private final String auth;

    UploadBenchmark(String base, String user, String password) {
        this.base = base;
        this.auth = "Basic " + Base64.getEncoder().encodeToString((user + ":" + password).getBytes(StandardCharsets.UTF_8));
    }

    public static void main(String[] args) throws Exception {
        String base = args.length > 0 ? args[0] : "http://127.0.0.1:8080";
        int uploads = args.length > 3 ? Integer.parseInt(args[3]) : 10;
        UploadBenchmark b = new UploadBenchmark(base, args.length > 1 ? args[1] : "demo-manager",
                args.length > 2 ? args[2] : "demo-password");
        byte[] file = csv(1_000_000, "engine");
        System.out.printf(Locale.ROOT, "file: %,d bytes, 1,000,000 points%n", file.length);

        double[] engine = new double[15];
        for (int i = -5; i < engine.length; i++) {
            long t0 = System.nanoTime();
            RawCurve c = new CurveReader().read(file);
            TensileResult r = TensileAnalysis.analyse(c.forceN(), c.extensionMm(), c.timeS(), SPECIMEN,
                    TensileParameters.defaults());
            long t1 = System.nanoTime();
            if (i >= 0) {
                engine[i] = (t1 - t0) / 1e6;
            }
            if (i == -5) {
                System.out.println("engine: Rm = " + r.property("Rm").reported() + " MPa, ReH = "
                        + r.property("ReH").reported() + " MPa");
            }
        }
        double engineMedian = median(engine);
        System.out.printf(Locale.ROOT, "engine read + analyse (in this JVM, after 5 warm-ups): median %.0f ms, min %.0f ms%n",
                engineMedian, Arrays.stream(engine).min().orElse(0));

        Map<String, String> bench = b.bench();
        List<Double> times = new ArrayList<>();
        for (int i = 0; i < uploads; i++) {
            String run = b.testRun(bench);
            byte[] bytes = csv(1_000_000, "upload " + i + " " + run);
            long t0 = System.nanoTime();
            HttpResponse<String> r = b.send(HttpRequest.newBuilder(URI.create(base + "/api/v1/tests/" + run + "/curve"))
                    .header("Content-Type", "text/csv").PUT(HttpRequest.BodyPublishers.ofByteArray(bytes)));
            long t1 = System.nanoTime();
            if (r.statusCode() != 201) {
                throw new IllegalStateException("upload failed: " + r.statusCode() + " " + r.body());
            }
            JsonNode analysis = JSON.readTree(r.body()).get("analysis");
            double ms = (t1 - t0) / 1e6;
            times.add(ms);
            System.out.printf(Locale.ROOT, "upload %2d: %6.0f ms  (Rm %s MPa, analysis %s)%n", i, ms,
                    analysis.get("results").get("properties").get("Rm").get("reported").asString(),
                    analysis.get("id").asString());
        }
        double[] t = times.stream().mapToDouble(Double::doubleValue).toArray();
        double uploadMedian = median(t);
        System.out.printf(Locale.ROOT, "upload through HTTP: median %.0f ms, min %.0f ms, max %.0f ms%n", uploadMedian,
                Arrays.stream(t).min().orElse(0), Arrays.stream(t).max().orElse(0));
        System.out.printf(Locale.ROOT, "ratio upload / engine (medians): %.2f%n", uploadMedian / engineMedian);
    }

    /** A discontinuously yielding record (the analysis benchmark's) as a three-channel CSV file. */
    public static byte[] csv(int points, String label) {
        double[][] c = AnalysisBenchmarkCurves.curve("discontinuous", points);
        ByteArrayOutputStream out = new ByteArrayOutputStream(points * 32);
        StringBuilder line = new StringBuilder(64);
        write(out, "# benchmark: " + label + "\ntime [s],force [N],extension [mm]\n");
        for (int i = 0; i < points; i++) {
            line.setLength(0);
            line.append(String.format(Locale.ROOT, "%.4f,%.2f,%.6f%n", c[2][i], c[0][i], c[1][i]));
            write(out, line.toString());
        }
        return out.toByteArray();
    }

    Map<String, String> bench() throws Exception {
        return bench(List.of());
    }

    /** The bench with an order that states these requirements (each: property, min, max, unit). */
    Map<String, String> bench(List<Map<String, Object>> requirements) throws Exception {
        String suffix = UUID.randomUUID().toString().substring(0, 8);
        String customer = JSON.readTree(send(get("/api/v1/customers")).body()).get(0).get("id").asString();
        String order = post("/api/v1/customers/" + customer + "/orders", Map.of("purchaseOrder", "BENCH-" + suffix,
                "materialSpecification", requirements.isEmpty() ? "benchmark, no requirements"
                        : "benchmark requirements", "requirements", requirements));
        String heat = post("/api/v1/heats", Map.of("heatNumber", "BENCH-" + suffix, "producer", "Benchmark mill",
                "grade", "benchmark steel", "productForm", "PLATE", "nominalThicknessMm", 4));
        String cell = post("/api/v1/equipment", Map.of("assetId", "BLC-" + suffix, "kind", "FORCE_TRANSDUCER",
                "description", "benchmark load cell", "forceRanges", List.of(Map.of("upperLimitN", 100000))));
        String machine = post("/api/v1/equipment", Map.of("assetId", "BTM-" + suffix, "kind", "TESTING_MACHINE",
                "description", "benchmark frame", "builtInTransducerIds", List.of(cell)));
        String ext = post("/api/v1/equipment", Map.of("assetId", "BEX-" + suffix, "kind", "EXTENSOMETER",
                "description", "benchmark extensometer", "gaugeLengthMm", 50));
        LocalDate today = LocalDate.now(ZoneOffset.UTC);
        for (String[] c : new String[][] {{cell, null}, {machine, null}, {ext, "1"}}) {
            var body = new java.util.HashMap<String, Object>(Map.of("calibratedOn", today.minusDays(30).toString(),
                    "dueOn", today.plusDays(300).toString(), "calibratingBody", "benchmark",
                    "certificateReference", "BENCH-" + UUID.randomUUID().toString().substring(0, 8)));
            if (c[0].equals(cell)) {
                body.put("classes", List.of(Map.of("rangeN", 100000, "accuracyClass", "1")));
            }
            if (c[1] != null) {
                body.put("accuracyClass", c[1]);
            }
            post("/api/v1/equipment/" + c[0] + "/calibrations", body);
        }
        return Map.of("order", order, "heat", heat, "cell", cell, "machine", machine, "ext", ext);
    }

    String testRun(Map<String, String> bench) throws Exception {
        String specimen = post("/api/v1/specimens", Map.of("labIdentifier", "BENCH-" + UUID.randomUUID(),
                "heatId", bench.get("heat"), "orderId", bench.get("order"), "orientation", "LONGITUDINAL",
                "shape", "FLAT", "readings", Map.of("a", List.of(4), "b", List.of(25)),
                "gaugeLength", Map.of("basis", "PROPORTIONAL", "k", 5.65), "leMm", 50, "lcMm", 70));
        Map<String, Object> run = new java.util.HashMap<>(Map.of("specimenId", specimen, "machineId",
                bench.get("machine"), "forceTransducerId", bench.get("cell"), "forceRangeN", 100000,
                "extensometerId", bench.get("ext"), "operator", "demo-technician"));
        run.putAll(Map.of("testedAt", java.time.OffsetDateTime.now(ZoneOffset.UTC).toString(), "temperatureC", 21,
                "standard", "ISO_6892_1", "method", "A1", "mode", "TENSILE"));
        return post("/api/v1/tests", run);
    }

    private HttpRequest.Builder get(String path) {
        return HttpRequest.newBuilder(URI.create(base + path)).GET();
    }

    private String post(String path, Object body) throws Exception {
        HttpResponse<String> r = send(HttpRequest.newBuilder(URI.create(base + path))
                .header("Content-Type", "application/json")
                .POST(HttpRequest.BodyPublishers.ofString(JSON.writeValueAsString(body))));
        if (r.statusCode() != 201) {
            throw new IllegalStateException(path + ": " + r.statusCode() + " " + r.body());
        }
        return JSON.readTree(r.body()).get("id").asString();
    }

    HttpResponse<String> send(HttpRequest.Builder request) throws Exception {
        return HTTP.send(request.header("Authorization", auth).build(), HttpResponse.BodyHandlers.ofString());
    }

    private static double median(double[] values) {
        double[] s = values.clone();
        Arrays.sort(s);
        return s.length % 2 == 1 ? s[s.length / 2] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2;
    }

    private static void write(ByteArrayOutputStream out, String text) {
        out.writeBytes(text.getBytes(StandardCharsets.US_ASCII));
    }
}
