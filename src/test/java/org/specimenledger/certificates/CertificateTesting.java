package org.specimenledger.certificates;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;
import java.util.Map;
import org.specimenledger.testsupport.Api;
import org.specimenledger.testsupport.IntegrationTest;
import org.specimenledger.testsupport.TestAccounts;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.jdbc.core.simple.JdbcClient;
import tools.jackson.databind.JsonNode;

/** Shared steps of the certificate API tests: the bench, drafting and issuing, row counts. */
abstract class CertificateTesting extends IntegrationTest {

    private static CertificateBench bench;

    @Autowired
    protected JdbcClient jdbc;

    protected Api manager() {
        return as(TestAccounts.MANAGER);
    }

    protected Api technician() {
        return as(TestAccounts.TECHNICIAN);
    }

    protected String customerId() {
        return organisations.get(TestAccounts.CUSTOMER);
    }

    protected synchronized CertificateBench bench() {
        if (bench == null) {
            bench = new CertificateBench(technician(), manager());
        }
        return bench;
    }

    /** Requirements the bench's curves pass: Rp0.2 ≥ 280 MPa, Rm 380 … 500 MPa. */
    protected static List<Map<String, Object>> passingRequirements() {
        return List.of(CertificateBench.requirement("Rp0.2", "280", null, "MPa"),
                CertificateBench.requirement("Rm", "380", "500", "MPa"));
    }

    /**
     * Every line's specimen, property and reported value stand in one row of the printed results. Long identifiers
     * wrap inside their table cell, so the row is compared without white space.
     */
    protected static void assertEveryLinePrinted(String pdfText, JsonNode lines) {
        String compact = pdfText.replace(" ", "");
        for (JsonNode line : lines) {
            assertThat(compact).as("line %s", line).contains(line.get("specimenLabel").asString()
                    + line.get("property").asString() + line.get("reported").asString() + "MPa");
        }
    }

    protected JsonNode draft(CertificateBench.Order order, List<String> specimens, String rule, boolean curves) {
        Api.Response r = manager().post("/api/v1/certificates/drafts",
                CertificateBench.draft(order, specimens, rule, curves));
        assertThat(r.status()).as(r.toString()).isEqualTo(201);
        return r.json();
    }

    protected Api.Response issue(Api as, String draftId, String statement) {
        return as.post("/api/v1/certificates/drafts/" + draftId + "/issue", statement == null
                ? Map.of("password", TestAccounts.PASSWORD)
                : Map.of("password", TestAccounts.PASSWORD, "nonConformityStatement", statement));
    }

    protected JsonNode issued(String draftId) {
        Api.Response r = issue(manager(), draftId, null);
        assertThat(r.status()).as(r.toString()).isEqualTo(201);
        return r.json();
    }

    protected long count(String table) {
        return jdbc.sql("SELECT count(*) FROM " + table).query(Long.class).single();
    }

    protected Map<String, Long> footprint() {
        return Map.of("certificate", count("certificate"), "certificate_pdf", count("certificate_pdf"),
                "certificate_line", count("certificate_line"), "certificate_counter_total",
                jdbc.sql("SELECT coalesce(sum(last_serial), 0) FROM certificate_counter").query(Long.class).single(),
                "audit_event", count("audit_event"), "ledger_checkpoint", count("ledger_checkpoint"));
    }
}
