package org.specimenledger.reliability;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.io.StringReader;
import java.math.BigDecimal;
import java.text.Normalizer;
import java.time.LocalDate;
import java.time.ZoneOffset;
import java.util.ArrayList;
import java.util.EnumMap;
import java.util.EnumSet;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.UUID;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVRecord;
import org.junit.jupiter.api.Test;
import org.specimenledger.certificates.document.PdfReadBack;
import org.specimenledger.testing.SyntheticCurves;
import org.specimenledger.testsupport.Api;
import org.specimenledger.testsupport.IntegrationTest;
import org.specimenledger.testsupport.TestAccounts;
import org.specimenledger.testsupport.TestRunBodies;
import org.verapdf.pdfa.flavours.PDFAFlavour;

/**
 * Hostile text through the whole chain, out where people read it: every text field that reaches a page, a
 * certificate PDF or the results CSV is filled with one of the corpus's texts ({@link HostileValues#TEXT}, less
 * those no field stores), one chain of records per rotation — customer, order, heat, specimen, instruments and
 * calibration, test run with its curve, a re-analysis, a certificate draft and its issue. Then:
 * <ul>
 *   <li>every page that shows those records, for a role that may open it (manager, auditor, the customer's own
 *       portal account), is read back with an HTML5 parser ({@link PageChecks}): each text as a text node, nothing
 *       made from it, the pages' content security policy on the answer; search fields that echo a query too;</li>
 *   <li>the issued PDF is read back with PDFBox: each text printed literally, control and format characters as
 *       {@code [U+XXXX]} (the expected forms are written out below, not computed by the renderer's code); still
 *       PDF/A-2b for veraPDF; no action, script, link or form anywhere in it;</li>
 *   <li>{@code results.csv} parsed with Commons CSV gives the mark back, with an apostrophe in front when a
 *       spreadsheet would take it for a formula.</li>
 * </ul>
 * Quick mode runs two rotations (every text in at least one field, most in two); full mode
 * ({@code -Dreliability.full=true}) runs one per text, so every text goes into every field once.
 */
class HostileTextRenderingTest extends IntegrationTest {

    private static final LocalDate TODAY = LocalDate.now(ZoneOffset.UTC);

    /** The text fields filled with hostile text, and where each is printed. */
    enum Field {
        CUSTOMER_NAME(200), CUSTOMER_ADDRESS(1000), PURCHASE_ORDER(100), MATERIAL_SPECIFICATION(300),
        HEAT_NUMBER(50), PRODUCER(200), GRADE(100), SPECIMEN_MARK(100), MACHINE_DESCRIPTION(500),
        CALIBRATION_REFERENCE(100), ANALYSIS_REASON(2000), PRODUCT_DESCRIPTION(500), DEVIATIONS(4000),
        SIGNATORY_FUNCTION(200), NON_CONFORMITY_STATEMENT(4000);

        final int maxLength;

        Field(int maxLength) {
            this.maxLength = maxLength;
        }
    }

    /** Fields printed on the certificate PDF. */
    private static final Set<Field> IN_PDF = EnumSet.complementOf(EnumSet.of(Field.ANALYSIS_REASON));

    /**
     * The corpus's texts that every field here stores: not blank (blank is "none" or refused, and is trimmed
     * away), no NUL (PostgreSQL text cannot hold U+0000: refused as a conflict, see {@link HostileInputTest}), no
     * lone surrogate (not UTF-8: the client sends '?'), not over the shortest field's length.
     */
    static List<String> storable() {
        return HostileValues.TEXT.stream().filter(t -> !t.isBlank() && t.indexOf('\u0000') < 0)
                .filter(t -> t.codePoints().noneMatch(cp -> cp >= 0xD800 && cp <= 0xDFFF))
                .filter(t -> t.length() + 8 <= Field.HEAT_NUMBER.maxLength).toList();
    }

    /**
     * How each text prints: as typed, except control characters (other than line breaks) and format characters
     * (U+202E right-to-left override, U+200B zero-width space) shown as their code point, CR LF as one line break.
     * Written out by hand from the renderer's documented rule, so that the check does not reuse its code.
     */
    private static final Map<String, String> PRINTED = Map.of(
            "bell\u0007esc\u001b[31mred", "bell[U+0007]esc[U+001B][31mred",
            "line\r\nInjected-Header: yes", "line\nInjected-Header: yes",
            "right\u202Eto-left override", "right[U+202E]to-left override",
            "zero\u200Bwidth", "zero[U+200B]width");

    private static String printed(String text) {
        return PRINTED.getOrDefault(text, text);
    }

    /** One chain's texts: field → stored text (the hostile text, a space and a tag that makes it unique). */
    private static Map<Field, String> rotation(List<String> texts, int shift, String run) {
        Map<Field, String> out = new EnumMap<>(Field.class);
        for (Field f : Field.values()) {
            String hostile = texts.get((f.ordinal() + shift) % texts.size());
            out.put(f, hostile + " ~" + run + Integer.toString(f.ordinal(), 36));
        }
        return out;
    }

    private String base() {
        return "http://127.0.0.1:" + port;
    }

    @Test
    void hostileTextComesOutAsTextInPagesPdfsAndCsv() {
        List<String> texts = storable();
        assertThat(texts).as("texts every field stores").hasSizeGreaterThan(15);
        int rotations = HostileInputTest.FULL ? texts.size() : 2;
        List<String> findings = new ArrayList<>();
        PageVisitor manager = PageVisitor.signedIn(base(), TestAccounts.MANAGER, TestAccounts.PASSWORD);
        PageVisitor auditor = PageVisitor.signedIn(base(), TestAccounts.AUDITOR, TestAccounts.PASSWORD);
        int pages = 0;
        int pdfChecks = 0;
        for (int k = 0; k < rotations; k++) {
            String run = UUID.randomUUID().toString().substring(0, 5);
            Map<Field, String> t = rotation(texts, k * 7, run);
            Chain chain = chain(t, run);
            List<Visit> visits = visits(chain, t, manager, auditor);
            pages += visits.size();
            for (Visit v : visits) {
                findings.addAll(v.problems());
            }
            byte[] pdf = as(TestAccounts.MANAGER).getBytes("/api/v1/certificates/" + chain.number() + "/pdf").body();
            findings.addAll(pdfProblems(pdf, t));
            pdfChecks += IN_PDF.size();
            findings.addAll(csvProblems(chain, t));
        }
        System.out.printf("[reliability] hostile text rendering: %d texts, %d rotations × %d fields, %d page reads, "
                + "%d PDF texts, %d findings%n", texts.size(), rotations, Field.values().length, pages, pdfChecks,
                findings.size());
        assertThat(findings).as("hostile text rendered wrongly").isEmpty();
    }

    /**
     * The corpus's lone surrogate is valid JSON syntax but no text: refused with a problem naming the field, instead
     * of being stored as '?' (what the database driver's UTF-8 encoder makes of it).
     */
    @Test
    void aLoneSurrogateIsRefusedNotStoredAsSomethingElse() {
        Api m = as(TestAccounts.MANAGER);
        int before = m.get("/api/v1/customers").json().size();
        Api.Response r = m.postRaw("/api/v1/customers", "{\"name\": \"lone \\ud800 surrogate\", \"address\": \"1 Way\"}");
        assertThat(r.status()).as(r.toString()).isEqualTo(400);
        assertThat(r.contentType()).startsWith("application/problem+json");
        assertThat(r.json().get("errors").get(0).get("pointer").asString()).isEqualTo("/name");
        assertThat(r.json().get("detail").asString()).contains("unpaired surrogate U+D800 at character 6");
        assertThat(m.get("/api/v1/customers").json().size()).isEqualTo(before);
        Api.Response pair = m.postRaw("/api/v1/customers", "{\"name\": \"pair \\ud83d\\ude00 " + UUID.randomUUID()
                + "\", \"address\": \"1 Way\"}");
        assertThat(pair.status()).as(pair.toString()).isEqualTo(201);
        assertThat(pair.json().get("name").asString()).startsWith("pair \uD83D\uDE00 ");
    }

    // --- the chain of records ----------------------------------------------------------------------------

    private record Chain(String customerId, String customerUser, String orderId, String heatId, String specimenId,
            String runId, String draftId, String number) {
    }

    private Chain chain(Map<Field, String> t, String run) {
        Api m = as(TestAccounts.MANAGER);
        Api tech = as(TestAccounts.TECHNICIAN);
        String customer = created(m.post("/api/v1/customers", Map.of("name", t.get(Field.CUSTOMER_NAME),
                "address", t.get(Field.CUSTOMER_ADDRESS))));
        String customerUser = "hx-" + run;
        Map<String, Object> account = new HashMap<>(Map.of("username", customerUser, "displayName", "Portal reader",
                "password", TestAccounts.PASSWORD, "role", "CUSTOMER", "organisationId", customer));
        created(m.post("/api/v1/accounts", account));
        Map<String, Object> rm = new HashMap<>();
        rm.put("property", "Rm");
        rm.put("min", new BigDecimal("2000"));
        rm.put("unit", "MPa");
        String order = created(m.post("/api/v1/customers/" + customer + "/orders", Map.of(
                "purchaseOrder", t.get(Field.PURCHASE_ORDER), "materialSpecification",
                t.get(Field.MATERIAL_SPECIFICATION), "receivedOn", TODAY.minusDays(5).toString(),
                "requirements", List.of(rm))));
        String heat = created(tech.post("/api/v1/heats", Map.of("heatNumber", t.get(Field.HEAT_NUMBER),
                "producer", t.get(Field.PRODUCER), "grade", t.get(Field.GRADE), "productForm", "BAR",
                "nominalThicknessMm", new BigDecimal("20"))));
        Map<String, Object> specimen = new HashMap<>(org.specimenledger.specimens.SpecimenFixtures.roundBar(
                t.get(Field.SPECIMEN_MARK), heat, order));
        Api.Response s = tech.post("/api/v1/specimens", specimen);
        String specimenId = created(s);
        double s0 = s.json().get("s0Mm2").asDouble();
        String transducer = created(m.post("/api/v1/equipment", Map.of("assetId", "LC-" + run, "kind",
                "FORCE_TRANSDUCER", "description", "Load cell of the 100 kN frame",
                "forceRanges", List.of(Map.of("upperLimitN", 100000)))));
        calibrate(m, transducer, "CAL-LC-" + run, Map.of("classes", List.of(Map.of("rangeN", 100000,
                "accuracyClass", "0.5"))));
        String machine = created(m.post("/api/v1/equipment", Map.of("assetId", "TM-" + run, "kind",
                "TESTING_MACHINE", "description", t.get(Field.MACHINE_DESCRIPTION),
                "builtInTransducerIds", List.of(transducer))));
        calibrate(m, machine, t.get(Field.CALIBRATION_REFERENCE), Map.of());
        String extensometer = created(m.post("/api/v1/equipment", Map.of("assetId", "EX-" + run, "kind",
                "EXTENSOMETER", "description", "Clip-on extensometer", "gaugeLengthMm", 50)));
        calibrate(m, extensometer, "CAL-EX-" + run, Map.of("accuracyClass", "1"));
        Map<String, Object> registration = TestRunBodies.registration(specimenId, machine, transducer, extensometer);
        String testRun = created(tech.post("/api/v1/tests", registration));
        // the mark is not put into the file: a CR LF in it would end the metadata line
        byte[] curve = SyntheticCurves.labelled("run: " + run, SyntheticCurves.rambergOsgood(200_000, 300, 10, s0,
                50, 0.05, 2000));
        created(tech.putBytes("/api/v1/tests/" + testRun + "/curve", "text/csv", curve));
        created(tech.post("/api/v1/tests/" + testRun + "/analyses", Map.of("parameters",
                Map.of("proofOffsetsPercent", List.of(0.2, 0.5)), "reason", t.get(Field.ANALYSIS_REASON))));
        Map<String, Object> draft = new HashMap<>();
        draft.put("orderId", order);
        draft.put("specimenIds", List.of(specimenId));
        draft.put("decisionRule", "SIMPLE_ACCEPTANCE");
        draft.put("productDescription", t.get(Field.PRODUCT_DESCRIPTION));
        draft.put("deviations", t.get(Field.DEVIATIONS));
        draft.put("includeCurves", false);
        String draftId = created(m.post("/api/v1/certificates/drafts", draft));
        // the order asks Rm ≥ 2000 MPa, so the line fails and the statement is printed with it
        Api.Response issued = m.post("/api/v1/certificates/drafts/" + draftId + "/issue", Map.of("password",
                TestAccounts.PASSWORD, "signatoryFunction", t.get(Field.SIGNATORY_FUNCTION),
                "nonConformityStatement", t.get(Field.NON_CONFORMITY_STATEMENT)));
        assertThat(issued.status()).as(issued.toString()).isEqualTo(201);
        return new Chain(customer, customerUser, order, heat, specimenId, testRun, draftId,
                issued.json().get("number").asString());
    }

    private static void calibrate(Api manager, String instrument, String reference, Map<String, Object> classes) {
        Map<String, Object> body = new HashMap<>(classes);
        body.put("calibratedOn", TODAY.minusDays(60).toString());
        body.put("dueOn", TODAY.plusDays(300).toString());
        body.put("calibratingBody", "Invented Calibration Service");
        body.put("certificateReference", reference);
        created(manager.post("/api/v1/equipment/" + instrument + "/calibrations", body));
    }

    private static String created(Api.Response r) {
        assertThat(r.status()).as(r.toString()).isEqualTo(201);
        return r.id();
    }

    // --- pages -------------------------------------------------------------------------------------------

    /** One page read with the fields it prints (every other hostile text of the chain must not be markup there). */
    private record Visit(PageVisitor.Page page, Map<Field, String> texts, Set<Field> shown, List<String> reflected) {

        List<String> problems() {
            List<String> out = new ArrayList<>(PageChecks.headerProblems(page));
            if (page.status() != 200) {
                out.add(page + ": answered " + page.status());
                return out;
            }
            org.jsoup.nodes.Document doc = org.jsoup.Jsoup.parse(page.html());
            for (Map.Entry<Field, String> e : texts.entrySet()) {
                for (String p : PageChecks.treeProblems(page, doc, e.getValue(), shown.contains(e.getKey()))) {
                    out.add(e.getKey() + ": " + p);
                }
            }
            for (String q : reflected) {
                out.addAll(PageChecks.treeProblems(page, doc, q, false));
            }
            return out;
        }
    }

    private List<Visit> visits(Chain c, Map<Field, String> t, PageVisitor manager, PageVisitor auditor) {
        PageVisitor customer = PageVisitor.signedIn(base(), c.customerUser(), TestAccounts.PASSWORD);
        List<Visit> out = new ArrayList<>();
        out.add(visit(manager, "/lab", t, Field.SPECIMEN_MARK, Field.HEAT_NUMBER));
        out.add(visit(manager, "/lab/specimens/" + c.specimenId(), t, Field.SPECIMEN_MARK, Field.HEAT_NUMBER,
                Field.GRADE, Field.PURCHASE_ORDER));
        out.add(visit(manager, "/lab/tests/" + c.runId(), t, Field.SPECIMEN_MARK, Field.MACHINE_DESCRIPTION,
                Field.ANALYSIS_REASON));
        out.add(visit(manager, "/lab/equipment", t, Field.MACHINE_DESCRIPTION, Field.CALIBRATION_REFERENCE));
        out.add(visit(manager, "/lab/certificates", t, Field.PURCHASE_ORDER, Field.MATERIAL_SPECIFICATION,
                Field.PRODUCT_DESCRIPTION));
        out.add(visit(manager, "/lab/certificates/new?orderId=" + c.orderId(), t, Field.PURCHASE_ORDER,
                Field.MATERIAL_SPECIFICATION, Field.SPECIMEN_MARK));
        out.add(visit(manager, "/lab/certificates/drafts/" + c.draftId(), t, Field.PURCHASE_ORDER,
                Field.PRODUCT_DESCRIPTION, Field.DEVIATIONS, Field.SPECIMEN_MARK, Field.HEAT_NUMBER));
        out.add(visit(manager, "/lab/certificates/" + c.number(), t, Field.PURCHASE_ORDER, Field.SIGNATORY_FUNCTION,
                Field.SPECIMEN_MARK, Field.HEAT_NUMBER));
        out.add(visit(manager, "/lab/jobs", t, Field.PURCHASE_ORDER, Field.MATERIAL_SPECIFICATION));
        out.add(visit(auditor, "/audit-desk/trace?number=" + c.number(), t, Field.SPECIMEN_MARK, Field.HEAT_NUMBER,
                Field.PRODUCER, Field.GRADE, Field.MACHINE_DESCRIPTION, Field.CALIBRATION_REFERENCE));
        out.add(visit(customer, "/portal", t, Field.PRODUCT_DESCRIPTION));
        out.add(visit(customer, "/portal/certificates/" + c.number(), t, Field.PURCHASE_ORDER,
                Field.PRODUCT_DESCRIPTION, Field.SPECIMEN_MARK, Field.HEAT_NUMBER));
        // search fields echo what was typed into their input's value: the hostile query must stay a value
        String heat = t.get(Field.HEAT_NUMBER).trim();
        String po = t.get(Field.PURCHASE_ORDER).trim();
        out.add(new Visit(customer.get("/portal?heat=" + PageVisitor.enc(heat) + "&order=" + PageVisitor.enc(po)),
                t, EnumSet.of(Field.PRODUCT_DESCRIPTION), List.of(heat, po)));
        String mark = t.get(Field.SPECIMEN_MARK);
        out.add(new Visit(customer.get("/portal?number=" + PageVisitor.enc(mark)), Map.of(), Set.of(), List.of(mark)));
        return out;
    }

    private static Visit visit(PageVisitor who, String path, Map<Field, String> t, Field... shown) {
        return new Visit(who.get(path), t, shown.length == 0 ? Set.of() : EnumSet.of(shown[0], shown), List.of());
    }

    // --- the PDF -----------------------------------------------------------------------------------------

    private static List<String> pdfProblems(byte[] pdf, Map<Field, String> t) {
        List<String> out = new ArrayList<>();
        if (pdf == null) {
            out.add("PDF: not downloaded");
            return out;
        }
        String text = comparable(PdfReadBack.text(pdf));
        for (Field f : IN_PDF) {
            String stored = t.get(f).trim();
            String hostile = stored.substring(0, stored.lastIndexOf(" ~"));
            String expected = printed(hostile) + stored.substring(stored.lastIndexOf(" ~"));
            if (!text.contains(comparable(expected))) {
                out.add("PDF " + f + ": " + HostileInputTest.describe(expected) + " not printed literally");
            }
        }
        out.addAll(PdfActions.of(pdf));
        for (String rule : PdfReadBack.failedRules(pdf, PDFAFlavour.PDFA_2_B)) {
            out.add("PDF/A-2b: " + rule);
        }
        return out;
    }

    /**
     * Text as compared with the PDF's: white space removed (a table cell wraps wherever the column ends) and
     * canonical composition, since the text extractor joins a base letter and its combining accent into one
     * character [S: Unicode Standard Annex #15, NFKC].
     */
    private static String comparable(String s) {
        return Normalizer.normalize(s, Normalizer.Form.NFKC).replaceAll("\\s+", "");
    }

    // --- the CSV -----------------------------------------------------------------------------------------

    private List<String> csvProblems(Chain c, Map<Field, String> t) {
        Api.Response r = as(TestAccounts.MANAGER).get("/api/v1/results.csv?orderId=" + c.orderId());
        List<String> out = new ArrayList<>();
        if (r.status() != 200) {
            out.add("results.csv answered " + r);
            return out;
        }
        List<CSVRecord> rows;
        try {
            rows = CSVFormat.RFC4180.builder().setHeader().setSkipHeaderRecord(true).get()
                    .parse(new StringReader(r.body())).getRecords();
        } catch (IOException e) {
            out.add("results.csv does not parse as RFC 4180: " + e.getMessage());
            return out;
        }
        String mark = t.get(Field.SPECIMEN_MARK).trim();
        if (rows.size() != 1 || !rows.get(0).get("specimen").equals(CsvCells.expected(mark))) {
            out.add("results.csv specimen cell: " + (rows.isEmpty() ? "no row" : HostileInputTest.describe(
                    rows.get(0).get("specimen"))) + " for the mark " + HostileInputTest.describe(mark));
        }
        for (CSVRecord row : rows) {
            for (String cell : row) {
                if (CsvCells.evaluated(cell)) {
                    out.add("results.csv has a cell a spreadsheet evaluates: " + HostileInputTest.describe(cell));
                }
            }
        }
        return out;
    }
}
