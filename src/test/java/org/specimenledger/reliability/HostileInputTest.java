package org.specimenledger.reliability;

import static org.assertj.core.api.Assertions.assertThat;

import java.lang.reflect.Type;
import java.net.URLEncoder;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.UUID;
import java.util.function.Supplier;
import javax.sql.DataSource;
import org.junit.jupiter.api.Test;
import org.specimenledger.specimens.SpecimenFixtures;
import org.specimenledger.testing.ReliabilityBench;
import org.specimenledger.testsupport.IntegrationTest;
import org.specimenledger.testsupport.TestAccounts;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.core.MethodParameter;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.RequestBody;
import org.springframework.web.bind.annotation.RequestParam;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.node.ArrayNode;
import tools.jackson.databind.node.JsonNodeFactory;
import tools.jackson.databind.node.ObjectNode;

/**
 * The hostile-input corpus, generated from the live route table so that an endpoint added later is covered
 * without anyone listing it: every JSON body field, query parameter and path variable gets malformed,
 * mistyped, missing, extra, huge, negative, zero, NaN/Infinity, control-character, unicode and injection
 * values; every curve upload gets damaged files and hostile file names. For every answer: no 5xx, every
 * refusal an RFC 9457 problem with type/title/status/detail, no internals in the body, and after a refusal
 * the same row count in every table (so no partial rows and no ledger event). Accepted text must come back
 * as JSON that reads back to the stored value, served with {@code nosniff}, and arrive as text (never markup) on
 * the lab pages that show the record ({@link RenderedText}); {@link HostileTextRenderingTest} follows the same
 * texts into certificate PDFs, the portal, the trace and the results CSV.
 *
 * <p>Quick mode (part of {@code mvn verify}) takes a seeded sample of the values per field; full mode
 * ({@code -Dreliability.full=true}) sends every value to every field.
 */
class HostileInputTest extends IntegrationTest {

    static final boolean FULL = Boolean.getBoolean("reliability.full");
    private static final long SEED = Long.getLong("reliability.seed", 20261202L);
    private static final JsonNodeFactory NODES = JsonNodeFactory.instance;

    @Autowired
    @org.springframework.beans.factory.annotation.Qualifier("requestMappingHandlerMapping")
    org.springframework.web.servlet.mvc.method.annotation.RequestMappingHandlerMapping mapping;

    @Autowired
    DataSource dataSource;

    private Corpus corpus;
    private PageVisitor reader;

    /** Records made for the corpus alone, so that what it changes or retires is nobody else's. */
    private record Fixtures(String customerId, String orderId, String heatId, String specimenId, String machineId,
            String calibrationId, String runId, String analysisId, String accountId, ReliabilityBench bench) {
    }

    private Fixtures fixtures;

    private Corpus corpus() {
        if (corpus == null) {
            fixtures = fixtures();
            reader = PageVisitor.signedIn("http://127.0.0.1:" + port, TestAccounts.MANAGER,
                    TestAccounts.PASSWORD);
            corpus = new Corpus(new StoredRows(dataSource), RenderedText.places(reader));
        }
        return corpus;
    }

    private Wire manager() {
        return new Wire("http://127.0.0.1:" + port, TestAccounts.MANAGER, TestAccounts.PASSWORD);
    }

    private Fixtures fixtures() {
        var m = as(TestAccounts.MANAGER);
        var t = as(TestAccounts.TECHNICIAN);
        String customer = m.post("/api/v1/customers", Map.of("name", "Corpus Customer " + UUID.randomUUID(),
                "address", "9 Corpus Lane")).id();
        ReliabilityBench bench = ReliabilityBench.make(t, m, customer);
        var run = t.post("/api/v1/tests", bench.registration());
        assertThat(run.status()).as(run.toString()).isEqualTo(201);
        var upload = t.putBytes("/api/v1/tests/" + run.id() + "/curve", "text/csv", bench.curve());
        assertThat(upload.status()).as(upload.toString()).isEqualTo(201);
        String analysis = upload.json().get("analysis").get("id").asString();
        String calibration = m.get("/api/v1/equipment/" + bench.machineId() + "/calibrations").json().get(0)
                .get("id").asString();
        var account = m.post("/api/v1/accounts", Map.of("username", "corpus-" + UUID.randomUUID().toString()
                .substring(0, 8), "displayName", "Corpus Technician", "password", TestAccounts.PASSWORD,
                "role", "TECHNICIAN"));
        return new Fixtures(customer, bench.orderId(), bench.heatId(), bench.specimenId(), bench.machineId(),
                calibration, run.id(), analysis, account.id(), bench);
    }

    /** A path with its variables filled: the corpus's own records where the segment names one, else random. */
    private String fill(String pattern) {
        StringBuilder out = new StringBuilder();
        String previous = "";
        for (String segment : pattern.split("/")) {
            if (segment.isEmpty()) {
                continue;
            }
            out.append('/');
            if (segment.startsWith("{")) {
                out.append(idFor(previous, segment));
            } else {
                out.append(segment);
                previous = segment;
            }
        }
        return out.toString();
    }

    private String idFor(String collection, String variable) {
        if (variable.equals("{calibrationId}")) {
            return fixtures.calibrationId();
        }
        return switch (collection) {
            case "customers" -> fixtures.customerId();
            case "orders" -> fixtures.orderId();
            case "heats" -> fixtures.heatId();
            case "specimens" -> fixtures.specimenId();
            case "equipment" -> fixtures.machineId();
            case "tests" -> fixtures.runId();
            case "analyses" -> fixtures.analysisId();
            case "accounts" -> fixtures.accountId();
            case "proof" -> "1";
            default -> UUID.randomUUID().toString();
        };
    }

    /** Valid bodies for the endpoints whose records the corpus can really create, so text gets accepted. */
    private Map<String, Supplier<JsonNode>> seeds() {
        Map<String, Supplier<Map<String, Object>>> s = new LinkedHashMap<>();
        s.put("POST /api/v1/customers", () -> new LinkedHashMap<>(Map.of("name", "Corpus Customer " + UUID.randomUUID(),
                "address", "9 Corpus Lane")));
        s.put("PUT /api/v1/customers/{id}", () -> new LinkedHashMap<>(Map.of("name", "Corpus Customer " + UUID.randomUUID(),
                "address", "9 Corpus Lane", "reason", "address corrected")));
        s.put("POST /api/v1/heats", () -> SpecimenFixtures.heat("Corpus Mill " + UUID.randomUUID(), "H-" + UUID.randomUUID()));
        s.put("POST /api/v1/customers/{id}/orders", () -> new LinkedHashMap<>(Map.of("purchaseOrder",
                "PO-" + UUID.randomUUID(), "materialSpecification", "EN 10025-2 S355J2+N", "requirements",
                List.of(Map.of("property", "Rm", "min", 470, "max", 630, "unit", "MPa")))));
        s.put("POST /api/v1/specimens", () -> SpecimenFixtures.roundBar(SpecimenFixtures.mark(), fixtures.heatId(),
                fixtures.orderId()));
        s.put("POST /api/v1/tests", () -> {
            Map<String, Object> r = new LinkedHashMap<>(fixtures.bench().registration());
            r.put("retestReason", "repeat for the corpus");
            return r;
        });
        Map<String, Supplier<JsonNode>> out = new LinkedHashMap<>();
        s.forEach((k, v) -> out.put(k, () -> Wire.JSON.valueToTree(v.get())));
        return out;
    }

    @Test
    void everyJsonBodyFieldMeetsHostileValues() {
        Corpus c = corpus();
        Wire wire = manager();
        Map<String, Supplier<JsonNode>> seeds = seeds();
        Random random = new Random(SEED);
        int endpoints = 0;
        for (RouteTable.Route route : RouteTable.of(mapping).api()) {
            Type bodyType = bodyTypeOf(route);
            if (bodyType == null) {
                continue;
            }
            endpoints++;
            String key = route.method() + " " + route.pattern();
            Supplier<JsonNode> seed = seeds.getOrDefault(key, () -> RequestShapes.skeleton(bodyType));
            String path = fill(route.pattern());
            for (String malformed : HostileValues.MALFORMED_BODIES) {
                c.probe(key + " body " + abbreviate(malformed), wire, route.method(), path, "application/json",
                        malformed.getBytes(StandardCharsets.UTF_8), null);
            }
            c.probe(key + " extra field", wire, route.method(), path, "application/json",
                    bytes(withExtra(seed.get())), null);
            c.probe(key + " not UTF-8", wire, route.method(), path, "application/json",
                    new byte[] {'{', '"', (byte) 0xC3, (byte) 0x28, '"', ':', '1', '}'}, null);
            c.probe(key + " text/plain", wire, route.method(), path, "text/plain",
                    bytes(seed.get()), null);
            String text = Wire.JSON.writeValueAsString(seed.get());
            for (int cut : new int[] {1, text.length() / 3, text.length() / 2, text.length() - 1}) {
                c.probe(key + " truncated at " + cut, wire, route.method(), path, "application/json",
                        text.substring(0, Math.max(0, cut)).getBytes(StandardCharsets.UTF_8), null);
            }
            for (List<Object> leaf : leaves(seed.get())) {
                for (Object value : valuesFor(leaf, seed.get(), random)) {
                    JsonNode body = seed.get();
                    String sent = value instanceof String str ? str : null;
                    byte[] payload = value == REMOVE ? bytes(removed(body, leaf)) : replaced(body, leaf, value);
                    c.probe(key + " " + pointer(leaf) + "=" + describe(value), wire, route.method(), path,
                            "application/json", payload, sent, key, pointer(leaf));
                }
            }
        }
        c.report("JSON bodies", endpoints);
        System.out.printf("[reliability] pages read back for accepted text: %d%n", reader.reads() - 1);
        assertThat(endpoints).as("endpoints with a JSON body found in the route table").isGreaterThan(15);
        assertThat(c.findings()).as("hostile JSON bodies answered wrongly").isEmpty();
    }

    @Test
    void everyQueryParameterAndPathVariableMeetsHostileValues() {
        Corpus c = corpus();
        Wire wire = manager();
        int endpoints = 0;
        for (RouteTable.Route route : RouteTable.of(mapping).api()) {
            List<String> params = new ArrayList<>();
            List<String> variables = new ArrayList<>();
            for (MethodParameter p : route.handler().getMethodParameters()) {
                RequestParam rp = p.getParameterAnnotation(RequestParam.class);
                if (rp != null) {
                    params.add(!rp.name().isEmpty() ? rp.name() : !rp.value().isEmpty() ? rp.value() : p.getParameterName());
                }
                if (p.hasParameterAnnotation(PathVariable.class)) {
                    variables.add(p.getParameterName());
                }
            }
            if (params.isEmpty() && variables.isEmpty()) {
                continue;
            }
            endpoints++;
            String key = route.method() + " " + route.pattern();
            byte[] body = route.method().equals("GET") || route.method().equals("DELETE") ? null : "{}".getBytes();
            String type = body == null ? null : "application/json";
            for (String value : HostileValues.PARAMETERS) {
                String encoded = value.startsWith("..%2F") || value.equals("%00") ? value
                        : URLEncoder.encode(value, StandardCharsets.UTF_8);
                for (String name : params) {
                    c.probe(key + " ?" + name + "=" + abbreviate(value), wire, route.method(),
                            fill(route.pattern()) + "?" + name + "=" + encoded, type, body, null);
                }
                if (!variables.isEmpty()) {
                    String path = route.pattern().replaceAll("\\{[^}]+}", encoded);
                    c.probe(key + " path=" + abbreviate(value), wire, route.method(), path, type, body, null);
                }
            }
        }
        c.report("parameters and path variables", endpoints);
        assertThat(endpoints).isGreaterThan(10);
        assertThat(c.findings()).as("hostile parameters answered wrongly").isEmpty();
    }

    @Test
    void damagedCurveFilesAndHostileFileNamesAreRefusedCleanly() {
        Corpus c = corpus();
        Wire wire = manager();
        byte[] good = fixtures.bench().curve();
        var t = as(TestAccounts.TECHNICIAN);
        // a registered run without a curve yet, so that the upload reaches the reader
        ReliabilityBench bench = ReliabilityBench.make(t, as(TestAccounts.MANAGER), fixtures.customerId());
        String run = t.post("/api/v1/tests", bench.registration()).id();
        c.resetCounts();
        String specimen = "{\"S0\": 78.54, \"Le\": 50, \"L0\": 50}";
        List<CurveCorruptions.Corrupted> damaged = CurveCorruptions.of(good, SEED, FULL ? 200 : 10);
        int accepted = 0;
        for (CurveCorruptions.Corrupted file : damaged) {
            Wire.Answer a = c.probe("PUT curve: " + file.what(), wire, "PUT", "/api/v1/tests/" + run + "/curve",
                    "text/csv", file.bytes(), null);
            if (a.status() == 201) {
                // some damage leaves a readable curve (a flipped digit); the run is used, take a fresh one
                accepted++;
                bench = ReliabilityBench.make(t, as(TestAccounts.MANAGER), fixtures.customerId());
                run = t.post("/api/v1/tests", bench.registration()).id();
                c.resetCounts();
            }
            c.probe("preview: " + file.what(), wire, "POST", "/api/v1/analysis/preview",
                    multipart("run.csv", file.bytes(), specimen));
        }
        for (String name : HostileValues.FILE_NAMES) {
            c.probe("preview file name " + abbreviate(name), wire, "POST", "/api/v1/analysis/preview",
                    multipart(name, good, specimen));
            c.probe("PUT curve ?filename=" + abbreviate(name), wire, "PUT", "/api/v1/tests/" + UUID.randomUUID()
                    + "/curve?filename=" + URLEncoder.encode(name, StandardCharsets.UTF_8), "text/csv", good, null);
        }
        // a hostile name on an accepted upload is stored as text and never used as a path
        String hostile = "../../../../etc/passwd";
        Wire.Answer stored = c.probe("PUT curve with a path-trick name", wire, "PUT", "/api/v1/tests/" + run
                + "/curve?filename=" + URLEncoder.encode(hostile, StandardCharsets.UTF_8), "text/csv",
                bench.curve(), hostile);
        assertThat(stored.status()).as(stored.toString()).isEqualTo(201);
        for (String field : List.of("S0", "Le", "L0")) {
            for (Object v : HostileValues.NUMBERS) {
                String json = specimen.replaceFirst("\"" + field + "\": [0-9.]+", "\"" + field + "\": "
                        + (v instanceof HostileValues.Raw r ? r.token() : Wire.JSON.writeValueAsString(v)));
                c.probe("preview specimen " + field + "=" + describe(v), wire, "POST", "/api/v1/analysis/preview",
                        multipart("run.csv", good, json));
            }
        }
        c.report("curve files (" + damaged.size() + " damaged, " + accepted + " still readable)", 2);
        assertThat(c.findings()).as("damaged curves and file names answered wrongly").isEmpty();
    }

    // --- the generator ----------------------------------------------------------------------------------

    private static final Object REMOVE = new Object() {
        @Override
        public String toString() {
            return "(removed)";
        }
    };

    private static Type bodyTypeOf(RouteTable.Route route) {
        for (MethodParameter p : route.handler().getMethodParameters()) {
            if (p.hasParameterAnnotation(RequestBody.class)) {
                return p.getGenericParameterType();
            }
        }
        return null;
    }

    /** Paths to every value in the body: object members, the first element of arrays, and the nodes themselves. */
    private static List<List<Object>> leaves(JsonNode body) {
        List<List<Object>> out = new ArrayList<>();
        walk(body, new ArrayList<>(), out);
        return out;
    }

    private static void walk(JsonNode node, List<Object> path, List<List<Object>> out) {
        if (!path.isEmpty()) {
            out.add(List.copyOf(path));
        }
        if (node.isObject()) {
            for (Map.Entry<String, JsonNode> e : node.properties()) {
                path.add(e.getKey());
                walk(e.getValue(), path, out);
                path.remove(path.size() - 1);
            }
        } else if (node.isArray() && !node.isEmpty()) {
            path.add(0);
            walk(node.get(0), path, out);
            path.remove(path.size() - 1);
        }
    }

    private static JsonNode at(JsonNode body, List<Object> path) {
        JsonNode n = body;
        for (Object step : path) {
            n = step instanceof Integer i ? n.get(i) : n.get((String) step);
        }
        return n;
    }

    /** The values to try at one place: all of them in full mode, a seeded sample of each kind in quick mode. */
    private static List<Object> valuesFor(List<Object> leaf, JsonNode body, Random random) {
        JsonNode current = at(body, leaf);
        List<Object> texts = new ArrayList<>(HostileValues.TEXT);
        List<Object> numbers = new ArrayList<>(HostileValues.NUMBERS);
        List<Object> wrong = new ArrayList<>(HostileValues.WRONG_TYPES);
        List<Object> out = new ArrayList<>();
        out.add(REMOVE);
        out.add(null);
        if (FULL) {
            out.addAll(texts);
            out.addAll(numbers);
            out.addAll(wrong);
            return out;
        }
        boolean text = current != null && current.isString();
        boolean number = current != null && current.isNumber();
        out.addAll(sample(texts, text ? 5 : 1, random));
        out.addAll(sample(numbers, number ? 5 : 1, random));
        out.addAll(sample(wrong, 2, random));
        return out;
    }

    private static List<Object> sample(List<Object> from, int n, Random random) {
        List<Object> copy = new ArrayList<>(from);
        java.util.Collections.shuffle(copy, random);
        return copy.subList(0, Math.min(n, copy.size()));
    }

    private static JsonNode removed(JsonNode body, List<Object> leaf) {
        JsonNode parent = at(body, leaf.subList(0, leaf.size() - 1));
        Object last = leaf.get(leaf.size() - 1);
        if (parent instanceof ObjectNode o) {
            o.remove((String) last);
        } else if (parent instanceof ArrayNode a) {
            a.remove((Integer) last);
        }
        return body;
    }

    private static byte[] replaced(JsonNode body, List<Object> leaf, Object value) {
        String marker = "@@corpus-raw-value@@";
        JsonNode node = value instanceof HostileValues.Raw ? NODES.stringNode(marker) : Wire.JSON.valueToTree(value);
        if (node == null) {
            node = NODES.nullNode();
        }
        JsonNode parent = at(body, leaf.subList(0, leaf.size() - 1));
        Object last = leaf.get(leaf.size() - 1);
        if (parent instanceof ObjectNode o) {
            o.set((String) last, node);
        } else if (parent instanceof ArrayNode a) {
            a.set((Integer) last, node);
        }
        if (!(value instanceof HostileValues.Raw raw)) {
            // written by the JSON library as bytes: a lone surrogate goes out as a JSON escape, as a client would
            // send it; through a Java String and getBytes it would silently become '?'
            return Wire.JSON.writeValueAsBytes(body);
        }
        String text = Wire.JSON.writeValueAsString(body);
        return text.replace("\"" + marker + "\"", raw.token()).getBytes(StandardCharsets.UTF_8);
    }

    private static JsonNode withExtra(JsonNode body) {
        if (body instanceof ObjectNode o) {
            o.put("notAField", "extra");
        }
        return body;
    }

    private static byte[] bytes(JsonNode body) {
        return Wire.JSON.writeValueAsBytes(body);
    }

    private static String pointer(List<Object> leaf) {
        StringBuilder sb = new StringBuilder();
        leaf.forEach(s -> sb.append('/').append(s));
        return sb.toString();
    }

    static String describe(Object value) {
        if (value instanceof HostileValues.Raw r) {
            return "raw " + abbreviate(r.token());
        }
        return value instanceof String s ? "\"" + abbreviate(s) + "\"" : String.valueOf(value);
    }

    static String abbreviate(String s) {
        // control characters as a dot, and a lone surrogate by its code (it cannot be written to a UTF-8 report)
        String visible = s.replaceAll("\\p{Cntrl}", "·").replaceAll("\\p{Cs}", "[surrogate]");
        return visible.length() > 40 ? visible.substring(0, 40) + "…(" + s.length() + ")" : visible;
    }

    /** A multipart body (curve part with the given file name, specimen part); returns {content type, bytes}. */
    static Multipart multipart(String filename, byte[] curve, String specimen) {
        String boundary = "----corpus-" + System.nanoTime();
        var out = new java.io.ByteArrayOutputStream();
        String safeName = filename.replace("\"", "%22");
        out.writeBytes(("--" + boundary + "\r\nContent-Disposition: form-data; name=\"curve\"; filename=\"" + safeName
                + "\"\r\nContent-Type: text/csv\r\n\r\n").getBytes(StandardCharsets.UTF_8));
        out.writeBytes(curve);
        out.writeBytes(("\r\n--" + boundary + "\r\nContent-Disposition: form-data; name=\"specimen\"\r\n"
                + "Content-Type: application/json\r\n\r\n" + specimen + "\r\n--" + boundary + "--\r\n")
                .getBytes(StandardCharsets.UTF_8));
        return new Multipart("multipart/form-data; boundary=" + boundary, out.toByteArray());
    }

    record Multipart(String contentType, byte[] bytes) {
    }
}
