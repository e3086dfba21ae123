package org.specimenledger.testing;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.Duration;
import java.time.Instant;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.specimenledger.specimens.SpecimenFixtures;
import org.specimenledger.testsupport.Api;
import tools.jackson.databind.JsonNode;

/** Re-analysing the runs of an order as one job: a new analysis per run, the earlier ones kept. */
class ReanalysisJobApiTest extends TestRunTesting {

    private JsonNode awaitEnd(String jobId) throws InterruptedException {
        Instant until = Instant.now().plus(Duration.ofSeconds(90));
        while (Instant.now().isBefore(until)) {
            JsonNode job = technician().get("/api/v1/jobs/" + jobId).json();
            if (job.get("state").asString().matches("FINISHED|FAILED")) {
                return job;
            }
            Thread.sleep(200);
        }
        throw new AssertionError("job " + jobId + " did not end within 90 s");
    }

    @Test
    void everyRunOfTheOrderGetsANewCurrentAnalysisAndKeepsItsEarlierOne() throws Exception {
        TestRunFixtures.Bench b = bench();
        String first = register(b);
        JsonNode firstUpload = uploaded(first, TestRunFixtures.curve(b));
        String mark = SpecimenFixtures.mark();
        Api.Response s = technician().post("/api/v1/specimens", SpecimenFixtures.roundBar(mark, b.heatId(), b.orderId()));
        String second = register(TestRunFixtures.with(TestRunFixtures.registration(b), "specimenId", s.id()));
        uploaded(second, SyntheticCurves.labelled("specimen: " + mark,
                SyntheticCurves.rambergOsgood(200_000, 300, 10, s.json().get("s0Mm2").asDouble(), 50, 0.05, 2000)));
        String withoutCurve = register(TestRunFixtures.with(TestRunFixtures.registration(b), "specimenId",
                technician().post("/api/v1/specimens", SpecimenFixtures.roundBar(SpecimenFixtures.mark(), b.heatId(),
                        b.orderId())).id()));

        Api.Response r = technician().post("/api/v1/analyses/reanalysis-jobs", Map.of("orderId", b.orderId(),
                "parameters", Map.of("proofOffsetsPercent", List.of(0.2, 0.5)), "reason", "second proof offset asked"));
        assertThat(r.status()).as(r.toString()).isEqualTo(202);
        assertThat(r.json().get("total").asInt()).as("the run without a curve is not taken").isEqualTo(2);
        JsonNode job = awaitEnd(r.id());
        assertThat(job.get("state").asString()).as(job.toString()).isEqualTo("FINISHED");
        assertThat(job.get("succeeded").asInt()).isEqualTo(2);

        JsonNode analyses = technician().get("/api/v1/tests/" + first + "/analyses").json();
        assertThat(analyses).hasSize(2);
        String newId = job.get("summary").get("items").get(0).get("analysisId").asString();
        assertThat(analyses.get(0).get("id").asString()).isEqualTo(firstUpload.get("analysis").get("id").asString());
        assertThat(analyses.get(1).get("id").asString()).isEqualTo(newId);
        assertThat(analyses.get(1).get("reason").asString()).isEqualTo("second proof offset asked");
        assertThat(technician().get("/api/v1/tests/" + first).json().get("currentAnalysisId").asString())
                .isEqualTo(newId);
        assertThat(technician().get("/api/v1/tests/" + withoutCurve + "/analyses").json()).isEmpty();
    }

    @Test
    void aFilterIsRequiredAndSoIsAReason() {
        Api.Response none = technician().post("/api/v1/analyses/reanalysis-jobs", Map.of("reason", "all of them"));
        assertThat(none.status()).as(none.toString()).isEqualTo(422);
        Api.Response noReason = technician().post("/api/v1/analyses/reanalysis-jobs",
                Map.of("orderId", java.util.UUID.randomUUID().toString()));
        assertThat(noReason.status()).as(noReason.toString()).isEqualTo(422);
        assertThat(as(org.specimenledger.testsupport.TestAccounts.AUDITOR).post("/api/v1/analyses/reanalysis-jobs",
                Map.of("orderId", java.util.UUID.randomUUID().toString(), "reason", "x")).status()).isEqualTo(403);
    }
}
