package org.specimenledger.testing;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.Map;
import org.junit.jupiter.api.Test;
import org.specimenledger.testsupport.Api;
import org.specimenledger.testsupport.TestAccounts;
import tools.jackson.databind.JsonNode;

/**
 * Who may do what with test runs: laboratory workers write; the auditor reads everything, downloads raw
 * data and replays, and writes nothing; a customer reads their own organisation's runs and results, never
 * raw data, and gets 404 for any other organisation's.
 */
class TestRunAccessTest extends TestRunTesting {

    private record Run(String id, String analysisId, TestRunFixtures.Bench bench) {
    }

    private Run uploadedRun(TestRunFixtures.Bench b) {
        String id = register(b);
        String analysis = uploaded(id, TestRunFixtures.curve(b)).get("analysis").get("id").asString();
        return new Run(id, analysis, b);
    }

    @Test
    void eachRoleOnEachEndpoint() {
        Run run = uploadedRun(bench());
        String t = "/api/v1/tests/" + run.id();
        String a = "/api/v1/analyses/" + run.analysisId();
        Api technician = technician();
        Api manager = manager();
        Api auditor = as(TestAccounts.AUDITOR);
        Api customer = as(TestAccounts.CUSTOMER);

        // register
        TestRunFixtures.Bench fresh = bench();
        assertThat(auditor.post("/api/v1/tests", TestRunFixtures.registration(fresh)).status()).isEqualTo(403);
        assertThat(customer.post("/api/v1/tests", TestRunFixtures.registration(fresh)).status()).isEqualTo(403);
        assertThat(anonymous().post("/api/v1/tests", TestRunFixtures.registration(fresh)).status()).isEqualTo(401);
        assertThat(manager.post("/api/v1/tests", TestRunFixtures.registration(fresh)).status()).isEqualTo(201);

        // read
        for (Api reader : new Api[] {technician, manager, auditor, customer}) {
            assertThat(reader.get(t).status()).isEqualTo(200);
            assertThat(reader.get(t + "/analyses").status()).isEqualTo(200);
            assertThat(reader.get(a).status()).isEqualTo(200);
            assertThat(reader.get("/api/v1/tests?specimenId=" + run.bench().specimenId()).status()).isEqualTo(200);
            assertThat(reader.get("/api/v1/results?specimenId=" + run.bench().specimenId()).json().get("items")).hasSize(1);
            assertThat(reader.get("/api/v1/results.csv?specimenId=" + run.bench().specimenId()).status()).isEqualTo(200);
        }
        assertThat(anonymous().get(t).status()).isEqualTo(401);

        // raw data: laboratory roles and the auditor
        assertThat(technician.getBytes(t + "/curve").status()).isEqualTo(200);
        assertThat(manager.getBytes(t + "/curve").status()).isEqualTo(200);
        assertThat(auditor.getBytes(t + "/curve").status()).isEqualTo(200);
        assertThat(customer.getBytes(t + "/curve").status()).isEqualTo(403);

        // replay: laboratory roles and the auditor (it adds to the ledger, changes no record)
        assertThat(technician.post(a + "/replay", "").status()).isEqualTo(200);
        assertThat(auditor.post(a + "/replay", "").status()).isEqualTo(200);
        assertThat(customer.post(a + "/replay", "").status()).isEqualTo(403);

        // writes: never the auditor or a customer
        for (Api reader : new Api[] {auditor, customer}) {
            assertThat(reader.putBytes(t + "/curve", "text/csv", new byte[] {1}).status()).isEqualTo(403);
            assertThat(reader.post(t + "/analyses", Map.of("reason", "x")).status()).isEqualTo(403);
            assertThat(reader.put(t + "/current-analysis", Map.of("analysisId", run.analysisId(), "reason", "x"))
                    .status()).isEqualTo(403);
            assertThat(reader.post(t + "/invalidate", Map.of("reason", "x")).status()).isEqualTo(403);
            assertThat(reader.post(t + "/reinstate", Map.of("reason", "x")).status()).isEqualTo(403);
        }
        assertThat(technician.post(t + "/analyses", Map.of("reason", "technician re-runs")).status()).isEqualTo(201);
        assertThat(manager.post(t + "/invalidate", Map.of("reason", "manager invalidates")).status()).isEqualTo(200);
        assertThat(technician.post(t + "/reinstate", Map.of("reason", "technician reinstates")).status()).isEqualTo(200);
    }

    @Test
    void customerNeverReachesAnotherOrganisationsRunsResultsOrRawData() {
        Run theirs = uploadedRun(otherOrganisationBench());
        Run mine = uploadedRun(bench());
        Api customer = as(TestAccounts.CUSTOMER);
        String t = "/api/v1/tests/" + theirs.id();

        assertThat(customer.get(t).status()).isEqualTo(404);
        assertThat(customer.get(t + "/analyses").status()).isEqualTo(404);
        assertThat(customer.get("/api/v1/analyses/" + theirs.analysisId()).status()).isEqualTo(404);
        assertThat(customer.getBytes(t + "/curve").status()).isEqualTo(404);
        assertThat(customer.get("/api/v1/results?specimenId=" + theirs.bench().specimenId()).json().get("items")).isEmpty();
        assertThat(customer.get("/api/v1/tests?specimenId=" + theirs.bench().specimenId()).json().get("items")).isEmpty();
        assertThat(customer.get("/api/v1/results.csv?specimenId=" + theirs.bench().specimenId()).body()
                .split("\r\n")).hasSize(1);

        JsonNode all = customer.get("/api/v1/tests?size=500").json().get("items");
        assertThat(all.valueStream().map(n -> n.get("id").asString())).contains(mine.id()).doesNotContain(theirs.id());
        JsonNode results = customer.get("/api/v1/results?size=500").json().get("items");
        assertThat(results.valueStream().map(n -> n.get("testRunId").asString())).contains(mine.id())
                .doesNotContain(theirs.id());
        // and the other organisation's customer sees theirs, not mine
        Api other = as(TestAccounts.OTHER_CUSTOMER);
        assertThat(other.get(t).status()).isEqualTo(200);
        assertThat(other.get("/api/v1/tests/" + mine.id()).status()).isEqualTo(404);
    }
}
