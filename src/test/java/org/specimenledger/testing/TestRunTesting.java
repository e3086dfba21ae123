package org.specimenledger.testing;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.Map;
import org.specimenledger.testsupport.Api;
import org.specimenledger.testsupport.IntegrationTest;
import org.specimenledger.testsupport.TestAccounts;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.jdbc.core.simple.JdbcClient;
import tools.jackson.databind.JsonNode;

/** Shared steps of the test-run API tests: a bench, registration, upload, ledger and row counts. */
abstract class TestRunTesting extends IntegrationTest {

    @Autowired
    protected JdbcClient jdbc;

    protected Api technician() {
        return as(TestAccounts.TECHNICIAN);
    }

    protected Api manager() {
        return as(TestAccounts.MANAGER);
    }

    protected TestRunFixtures.Bench bench() {
        return TestRunFixtures.bench(technician(), manager(), organisations.get(TestAccounts.CUSTOMER));
    }

    protected TestRunFixtures.Bench otherOrganisationBench() {
        return TestRunFixtures.bench(technician(), manager(), organisations.get(TestAccounts.OTHER_CUSTOMER));
    }

    protected String register(TestRunFixtures.Bench b) {
        return register(TestRunFixtures.registration(b));
    }

    protected String register(Map<String, Object> body) {
        Api.Response r = technician().post("/api/v1/tests", body);
        assertThat(r.status()).as(r.toString()).isEqualTo(201);
        return r.id();
    }

    protected Api.Response upload(String testRunId, byte[] bytes, String... query) {
        String q = query.length == 0 ? "" : "?" + String.join("&", query);
        return technician().putBytes("/api/v1/tests/" + testRunId + "/curve" + q, "text/csv", bytes,
                "Content-Disposition", "attachment; filename=\"run-" + testRunId.substring(0, 8) + ".csv\"");
    }

    protected JsonNode uploaded(String testRunId, byte[] bytes) {
        Api.Response r = upload(testRunId, bytes);
        assertThat(r.status()).as(r.toString()).isEqualTo(201);
        return r.json();
    }

    protected JsonNode events(String entityType, String id) {
        Api.Response r = manager().get("/api/v1/audit/events?entityType=" + entityType + "&entityId=" + id);
        assertThat(r.status()).as(r.toString()).isEqualTo(200);
        return r.json().get("events");
    }

    protected long count(String table) {
        return jdbc.sql("SELECT count(*) FROM " + table).query(Long.class).single();
    }

    /** Rows of the feature's tables and ledger events, to show that a refused request left nothing behind. */
    protected Map<String, Long> footprint() {
        return Map.of("test_run", count("test_run"), "raw_curve", count("raw_curve"),
                "raw_curve_content", count("raw_curve_content"), "analysis_run", count("analysis_run"),
                "audit_event", count("audit_event"));
    }

    protected static void assertProblem(Api.Response r, int status, String pointer, String detailPart) {
        assertThat(r.status()).as(r.toString()).isEqualTo(status);
        assertThat(r.contentType()).startsWith("application/problem+json");
        JsonNode errors = r.json().get("errors");
        assertThat(errors).as(r.toString()).isNotNull();
        boolean found = false;
        for (JsonNode e : errors) {
            if (e.get("pointer").asString().equals(pointer) && e.get("detail").asString().contains(detailPart)) {
                found = true;
            }
        }
        assertThat(found).as("expected %s '%s' in %s", pointer, detailPart, r).isTrue();
    }
}
