package org.specimenledger.testing;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.zip.ZipEntry;
import java.util.zip.ZipOutputStream;
import org.junit.jupiter.api.Test;
import org.specimenledger.specimens.SpecimenFixtures;
import org.specimenledger.testsupport.Api;
import org.specimenledger.testsupport.TestAccounts;
import tools.jackson.databind.JsonNode;

/**
 * Many curve files of one order in one zip, run as a job: each entry through the single-upload path, failures
 * reported per entry, path tricks and oversized entries refused before any job or record exists.
 */
class CurveBatchApiTest extends TestRunTesting {

    /** A second specimen of the bench's order with its own registered test run: [mark, test run id, S0]. */
    private String[] anotherRun(TestRunFixtures.Bench b) {
        String mark = SpecimenFixtures.mark();
        Api.Response s = technician().post("/api/v1/specimens", SpecimenFixtures.roundBar(mark, b.heatId(), b.orderId()));
        assertThat(s.status()).as(s.toString()).isEqualTo(201);
        String run = register(TestRunFixtures.with(TestRunFixtures.registration(b), "specimenId", s.id()));
        return new String[] {mark, run, String.valueOf(s.json().get("s0Mm2").asDouble())};
    }

    static byte[] zip(Map<String, byte[]> entries) throws IOException {
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        try (ZipOutputStream zip = new ZipOutputStream(out)) {
            for (Map.Entry<String, byte[]> e : entries.entrySet()) {
                zip.putNextEntry(new ZipEntry(e.getKey()));
                zip.write(e.getValue());
                zip.closeEntry();
            }
        }
        return out.toByteArray();
    }

    private Api.Response send(String orderId, byte[] zip) {
        return technician().postBytes("/api/v1/orders/" + orderId + "/curves", "application/zip", zip);
    }

    private JsonNode awaitEnd(String jobId) throws InterruptedException {
        Instant until = Instant.now().plus(Duration.ofSeconds(90));
        while (Instant.now().isBefore(until)) {
            JsonNode job = technician().get("/api/v1/jobs/" + jobId).json();
            String state = job.get("state").asString();
            if (state.equals("FINISHED") || state.equals("FAILED")) {
                return job;
            }
            Thread.sleep(200);
        }
        throw new AssertionError("job " + jobId + " did not end within 90 s");
    }

    @Test
    void eachEntryGoesThroughTheSingleUploadPathAndFailuresAreReportedPerEntry() throws Exception {
        TestRunFixtures.Bench b = bench();
        String first = register(b);
        String[] second = anotherRun(b);
        String[] third = anotherRun(b);
        Map<String, byte[]> entries = new LinkedHashMap<>();
        entries.put(b.labIdentifier() + ".csv", TestRunFixtures.curve(b));
        entries.put(second[0] + ".csv", "force [N],extension [mm]\n1,2\nthree,4\n".getBytes(StandardCharsets.UTF_8));
        entries.put("machine-7/" + third[0].toLowerCase() + ".CSV", SyntheticCurves.labelled("specimen: " + third[0],
                SyntheticCurves.rambergOsgood(200_000, 300, 10, Double.parseDouble(third[2]), 50, 0.05, 2000)));
        entries.put("SP-NOBODY.csv", TestRunFixtures.curve(b));
        entries.put("machine-7/", new byte[0]);

        Api.Response r = send(b.orderId(), zip(entries));
        assertThat(r.status()).as(r.toString()).isEqualTo(202);
        assertThat(r.json().get("state").asString()).isIn("QUEUED", "RUNNING", "FINISHED");
        assertThat(r.json().get("total").asInt()).isEqualTo(4);
        String jobId = r.id();

        JsonNode job = awaitEnd(jobId);
        assertThat(job.get("state").asString()).as(job.toString()).isEqualTo("FINISHED");
        assertThat(job.get("done").asInt()).isEqualTo(4);
        assertThat(job.get("succeeded").asInt()).isEqualTo(2);
        assertThat(job.get("failed").asInt()).isEqualTo(2);
        JsonNode items = job.get("summary").get("items");
        assertThat(items.get(0).get("outcome").asString()).isEqualTo("SUCCEEDED");
        assertThat(items.get(0).get("testRunId").asString()).isEqualTo(first);
        assertThat(items.get(1).get("outcome").asString()).isEqualTo("FAILED");
        assertThat(items.get(1).get("problem").asString()).isEqualTo("curve-rejected");
        assertThat(items.get(1).get("detail").asString()).contains("line 3");
        assertThat(items.get(2).get("outcome").asString()).isEqualTo("SUCCEEDED");
        assertThat(items.get(2).get("testRunId").asString()).isEqualTo(third[1]);
        assertThat(items.get(3).get("problem").asString()).isEqualTo("no-match");

        // stored exactly as a single upload: the run points at its analysis, the file keeps its own name
        JsonNode run = technician().get("/api/v1/tests/" + first).json();
        assertThat(run.get("currentAnalysisId").isNull()).isFalse();
        assertThat(run.get("rawCurve").get("sha256").asString()).isEqualTo(items.get(0).get("sha256").asString());
        assertThat(technician().get("/api/v1/tests/" + third[1]).json().get("rawCurve").get("originalName").asString())
                .isEqualTo(third[0].toLowerCase() + ".CSV");
        assertThat(technician().get("/api/v1/tests/" + second[1]).json().get("rawCurve").isNull()).isTrue();
        assertThat(events("raw-curve", items.get(0).get("rawCurveId").asString())).hasSize(1);
        List<String> jobEvents = new ArrayList<>();
        events("job", jobId).forEach(e -> jobEvents.add(e.get("action").asString()));
        assertThat(jobEvents).containsExactly("job.submitted", "job.finished");

        // the lab manager and the auditor see the job; the technician's own list has it; a customer gets nothing
        assertThat(manager().get("/api/v1/jobs/" + jobId).status()).isEqualTo(200);
        assertThat(as(TestAccounts.AUDITOR).get("/api/v1/jobs/" + jobId).status()).isEqualTo(200);
        assertThat(as(TestAccounts.CUSTOMER).get("/api/v1/jobs/" + jobId).status()).isEqualTo(403);
        JsonNode page = technician().get("/api/v1/jobs?size=200").json();
        assertThat(page.get("total").asLong()).isPositive();
        assertThat(page.get("items").findValuesAsString("id")).contains(jobId);
    }

    @Test
    void entryNamesThatClimbOutOrAreAbsoluteAreRefusedBeforeAnyJob() throws Exception {
        TestRunFixtures.Bench b = bench();
        register(b);
        for (String name : List.of("../" + b.labIdentifier() + ".csv", "/etc/" + b.labIdentifier() + ".csv",
                "a\\..\\" + b.labIdentifier() + ".csv", "C:" + b.labIdentifier() + ".csv")) {
            Map<String, Long> before = footprint();
            long jobs = count("job");
            Api.Response r = send(b.orderId(), zip(Map.of(name, TestRunFixtures.curve(b))));
            assertProblem(r, 422, "/entries/0", "is refused");
            assertThat(footprint()).isEqualTo(before);
            assertThat(count("job")).isEqualTo(jobs);
        }
    }

    @Test
    void anEntryInflatingBeyondTheLimitIsRefusedAsTheBytesArriveAndNothingIsKept() throws Exception {
        TestRunFixtures.Bench b = bench();
        register(b);
        // 65 MiB of zeros deflate to well under 100 kB: the limit is counted on the inflated bytes (64 MB default)
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        try (ZipOutputStream zip = new ZipOutputStream(out)) {
            zip.putNextEntry(new ZipEntry(b.labIdentifier() + ".csv"));
            byte[] zeros = new byte[1 << 20];
            for (int i = 0; i < 65; i++) {
                zip.write(zeros);
            }
            zip.closeEntry();
        }
        assertThat(out.size()).isLessThan(1_000_000);
        Map<String, Long> before = footprint();
        long jobs = count("job");
        Api.Response r = send(b.orderId(), out.toByteArray());
        assertThat(r.status()).as(r.toString()).isEqualTo(413);
        assertThat(r.json().get("detail").asString()).contains("inflates to more than");
        assertThat(footprint()).isEqualTo(before);
        assertThat(count("job")).isEqualTo(jobs);
    }

    @Test
    void tooManyEntriesNotAZipAndAnUnknownOrderAreRefused() throws Exception {
        TestRunFixtures.Bench b = bench();
        Map<String, byte[]> folders = new LinkedHashMap<>();
        for (int i = 0; i <= 1000; i++) {
            folders.put("f" + i + "/", new byte[0]);
        }
        assertProblem(send(b.orderId(), zip(folders)), 422, "/entries", "at most 1000");
        assertProblem(send(b.orderId(), "not a zip".getBytes(StandardCharsets.UTF_8)), 422, "/", "holds no file");
        assertThat(send(java.util.UUID.randomUUID().toString(), zip(Map.of("x.csv", new byte[1]))).status())
                .isEqualTo(404);
        assertThat(technician().postBytes("/api/v1/orders/" + b.orderId() + "/curves", "text/csv", new byte[1])
                .status()).isEqualTo(415);
    }
}
