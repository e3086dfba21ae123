package org.specimenledger.jobs;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.Duration;
import java.time.Instant;
import org.junit.jupiter.api.Test;
import org.specimenledger.testsupport.Api;
import org.specimenledger.testsupport.IntegrationTest;
import org.specimenledger.testsupport.TestAccounts;
import tools.jackson.databind.JsonNode;

/** The ledger verification as a job answers what the direct verification answers. */
class LedgerVerificationJobApiTest extends IntegrationTest {

    @Test
    void theJobsAnswerIsTheChainVerificationAndOnlyAuditReadersMayStartIt() throws Exception {
        Api auditor = as(TestAccounts.AUDITOR);
        Api.Response r = auditor.post("/api/v1/audit/verification-jobs", java.util.Map.of());
        assertThat(r.status()).as(r.toString()).isEqualTo(202);
        JsonNode job = null;
        Instant until = Instant.now().plus(Duration.ofSeconds(90));
        while (Instant.now().isBefore(until)) {
            job = auditor.get("/api/v1/jobs/" + r.id()).json();
            if (job.get("state").asString().matches("FINISHED|FAILED")) {
                break;
            }
            Thread.sleep(200);
        }
        assertThat(job.get("state").asString()).as(job.toString()).isEqualTo("FINISHED");
        JsonNode v = job.get("summary").get("verification");
        assertThat(v.get("valid").asBoolean()).isTrue();
        assertThat(v.get("eventsChecked").asLong()).isPositive();
        assertThat(job.get("done").asInt()).isEqualTo(1);
        assertThat(job.get("owner").asString()).isEqualTo(TestAccounts.AUDITOR);
        // the direct verification agrees (and has seen at least as many events: the job's own end came after)
        JsonNode direct = auditor.get("/api/v1/audit/verify").json();
        assertThat(direct.get("valid").asBoolean()).isTrue();
        assertThat(direct.get("eventsChecked").asLong()).isGreaterThan(v.get("eventsChecked").asLong());

        assertThat(as(TestAccounts.TECHNICIAN).post("/api/v1/audit/verification-jobs", java.util.Map.of()).status())
                .isEqualTo(403);
        assertThat(as(TestAccounts.TECHNICIAN).get("/api/v1/jobs/" + r.id()).status())
                .as("a technician does not see another user's job").isEqualTo(404);
    }
}
