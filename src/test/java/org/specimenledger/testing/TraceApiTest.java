package org.specimenledger.testing;

import static org.assertj.core.api.Assertions.assertThat;

import java.math.BigDecimal;
import java.security.MessageDigest;
import java.util.HexFormat;
import org.junit.jupiter.api.Test;
import org.specimenledger.testsupport.Api;
import org.specimenledger.testsupport.TestAccounts;
import tools.jackson.databind.JsonNode;

/**
 * The trace of an analysis run and of a test run, over real HTTP against a real PostgreSQL. Lives beside the
 * test-run tests for their fixtures. Oracles: the JDK's SHA-256 for the curve fingerprint and each event hash
 * (FIPS 180-4), the values the test itself registered for everything else.
 */
class TraceApiTest extends TestRunTesting {

    @Test
    void traceWalksFromTheAnalysisToRawDataInstrumentsAndLedger() throws Exception {
        TestRunFixtures.Bench b = bench();
        String run = register(b);
        byte[] curve = TestRunFixtures.curve(b);
        String analysis = uploaded(run, curve).get("analysis").get("id").asString();
        long eventsBefore = count("audit_event");

        Api.Response r = as(TestAccounts.AUDITOR).get("/api/v1/trace/tests/" + run);
        assertThat(r.status()).as(r.toString()).isEqualTo(200);
        JsonNode t = r.json();
        assertThat(t.get("replayRecorded").asBoolean()).isFalse();
        assertThat(t.get("lines")).hasSize(1);
        JsonNode line = t.get("lines").get(0);
        assertThat(line.get("label").asString()).isEqualTo(b.labIdentifier());

        JsonNode a = line.get("analysis");
        assertThat(a.get("record").get("id").asString()).isEqualTo(analysis);
        assertThat(a.get("record").get("softwareVersion").asString()).isNotBlank();
        assertThat(a.get("record").get("softwareCommit").asString()).isNotBlank();
        assertThat(a.get("record").get("methodVersion").asString()).startsWith("tensile/");
        assertThat(a.get("record").get("parameters").size()).isPositive();
        assertThat(a.get("record").get("results").get("properties").get("Rp0.2").get("evidence")).isNotNull();

        String sha = HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(curve));
        JsonNode c = line.get("rawCurve");
        assertThat(c.get("record").get("sha256").asString()).isEqualTo(sha);
        assertThat(c.get("record").get("sizeBytes").asLong()).isEqualTo(curve.length);
        assertThat(c.get("download").asString()).isEqualTo("/api/v1/tests/" + run + "/curve");
        assertThat(as(TestAccounts.AUDITOR).getBytes(c.get("download").asString()).body()).isEqualTo(curve);

        JsonNode tr = line.get("testRun").get("record");
        assertThat(tr.get("id").asString()).isEqualTo(run);
        assertThat(tr.get("operator").asString()).isNotBlank();
        assertThat(new BigDecimal(tr.get("temperatureC").asString())).isEqualByComparingTo("21.5");
        assertThat(tr.get("testDate").asString()).isEqualTo(TestRunFixtures.testedAt().toLocalDate().toString());

        JsonNode sp = line.get("specimen").get("record");
        assertThat(sp.get("id").asString()).isEqualTo(b.specimenId());
        assertThat(sp.get("s0Mm2").asDouble()).isEqualTo(b.s0Mm2());
        assertThat(sp.get("l0Mm").isNull()).isFalse();
        assertThat(line.get("heat").get("record").get("id").asString()).isEqualTo(b.heatId());

        JsonNode instruments = line.get("instruments");
        assertThat(instruments).hasSize(3);
        for (JsonNode i : instruments) {
            assertThat(i.get("validOnTestDate").asBoolean()).as(i.toString()).isTrue();
            assertThat(i.get("calibrationOnTestDate").get("record").get("id").asString())
                    .isEqualTo(i.get("calibrationAtAnalysis").get("calibrationId").asString());
            assertThat(i.get("equipment").get("events")).isNotEmpty();
            assertThat(i.get("calibrationOnTestDate").get("events").get(0).get("action").asString())
                    .isEqualTo("calibration.recorded");
        }

        // every node carries its events; each event's hash is the SHA-256 of its stored canonical text
        for (String node : new String[] {"analysis", "rawCurve", "testRun", "specimen", "heat"}) {
            JsonNode events = line.get(node).get("events");
            assertThat(events).as(node).isNotEmpty();
            for (JsonNode e : events) {
                String canonical = jdbc.sql("SELECT canonical FROM audit_event WHERE seq = ?")
                        .param(e.get("seq").asLong()).query(String.class).single();
                assertThat(e.get("hash").asString()).isEqualTo(HexFormat.of().formatHex(
                        MessageDigest.getInstance("SHA-256").digest(canonical.getBytes("UTF-8"))));
                assertThat(e.get("actor").asString()).isNotBlank();
                assertThat(e.get("occurredAt").asString()).isNotBlank();
            }
        }
        assertThat(line.get("rawCurve").get("events").get(0).get("action").asString()).isEqualTo("curve.received");
        assertThat(t.get("ledgerPosition").asLong()).isPositive();

        JsonNode replay = line.get("replay");
        assertThat(replay.get("identical").asBoolean()).as(replay.toString()).isTrue();
        assertThat(replay.get("inputFingerprintMatches").asBoolean()).isTrue();
        assertThat(count("audit_event")).as("a trace records nothing").isEqualTo(eventsBefore);

        Api.Response byAnalysis = manager().get("/api/v1/trace/analyses/" + analysis);
        assertThat(byAnalysis.status()).isEqualTo(200);
        assertThat(byAnalysis.json().get("lines").get(0).get("testRun").get("record").get("id").asString())
                .isEqualTo(run);

        // several lines at once, as a certificate trace will ask (a repeated id is one line)
        TestRunFixtures.Bench second = bench();
        String secondRun = register(second);
        String secondAnalysis = uploaded(secondRun, TestRunFixtures.curve(second)).get("analysis").get("id").asString();
        Api.Response both = as(TestAccounts.AUDITOR).get("/api/v1/trace/analyses?id=" + analysis + "&id="
                + secondAnalysis + "&id=" + analysis);
        assertThat(both.status()).as(both.toString()).isEqualTo(200);
        assertThat(both.json().get("lines")).hasSize(2);
        assertThat(both.json().get("lines").get(1).get("specimen").get("record").get("id").asString())
                .isEqualTo(second.specimenId());
    }

    /**
     * The trace remembers replay outcomes by their exact inputs; a stored value changed behind the
     * application's back (as superuser, trigger disabled) is a new input and must show as not reproduced.
     */
    @Test
    void aTamperedStoredResultIsNotReproducedEvenAfterAnEarlierTrace() {
        TestRunFixtures.Bench b = bench();
        String run = register(b);
        String analysis = uploaded(run, TestRunFixtures.curve(b)).get("analysis").get("id").asString();
        String path = "/api/v1/trace/analyses/" + analysis;
        assertThat(replayIn(path).get("identical").asBoolean()).isTrue();
        String original = jdbc.sql("SELECT results::text FROM analysis_run WHERE id = ?::uuid").param(analysis)
                .query(String.class).single();
        jdbc.sql("ALTER TABLE analysis_run DISABLE TRIGGER analysis_run_append_only").update();
        try {
            jdbc.sql("""
                    UPDATE analysis_run SET results = jsonb_set(results, '{properties,Rm,value}',
                        to_jsonb((results #>> '{properties,Rm,value}')::numeric + 1)) WHERE id = ?::uuid""")
                    .param(analysis).update();
            JsonNode replay = replayIn(path);
            assertThat(replay.get("identical").asBoolean()).as(replay.toString()).isFalse();
            assertThat(replay.get("differences").toString()).contains("/results/properties/Rm/value");
        } finally {
            jdbc.sql("UPDATE analysis_run SET results = ?::jsonb WHERE id = ?::uuid").params(original, analysis)
                    .update();
            jdbc.sql("ALTER TABLE analysis_run ENABLE TRIGGER analysis_run_append_only").update();
        }
        assertThat(replayIn(path).get("identical").asBoolean()).isTrue();
    }

    /**
     * The remembered replay is keyed by the hash the database computes over the stored curve bytes now, not by
     * the hash recorded at upload: one byte changed behind the application's back must show as not reproduced,
     * with the input fingerprint not matching, even though the same trace was answered (and remembered) before.
     */
    @Test
    void aTamperedStoredCurveIsNotReproducedEvenAfterAnEarlierTrace() {
        TestRunFixtures.Bench b = bench();
        String run = register(b);
        String analysis = uploaded(run, TestRunFixtures.curve(b)).get("analysis").get("id").asString();
        String path = "/api/v1/trace/analyses/" + analysis;
        assertThat(replayIn(path).get("identical").asBoolean()).isTrue();
        String curveId = jdbc.sql("SELECT raw_curve_id::text FROM analysis_run WHERE id = ?::uuid").param(analysis)
                .query(String.class).single();
        byte[] original = jdbc.sql("SELECT content FROM raw_curve_content WHERE raw_curve_id = ?::uuid")
                .param(curveId).query(byte[].class).single();
        byte[] changed = original.clone();
        int last = changed.length - 1;
        while (last > 0 && !Character.isDigit(changed[last])) {
            last--;
        }
        changed[last] = (byte) (changed[last] == '9' ? '8' : changed[last] + 1); // one digit of the last sample
        // a tamperer with superuser rights also lifts the check that the bytes match their recorded hash
        String check = jdbc.sql("""
                SELECT conname FROM pg_constraint WHERE conrelid = 'raw_curve_content'::regclass
                   AND pg_get_constraintdef(oid) LIKE '%sha256(content)%'""").query(String.class).single();
        jdbc.sql("ALTER TABLE raw_curve_content DISABLE TRIGGER raw_curve_content_append_only").update();
        jdbc.sql("ALTER TABLE raw_curve_content DROP CONSTRAINT " + check).update();
        try {
            jdbc.sql("UPDATE raw_curve_content SET content = ? WHERE raw_curve_id = ?::uuid").params(changed, curveId)
                    .update();
            JsonNode replay = replayIn(path);
            assertThat(replay.get("identical").asBoolean()).as(replay.toString()).isFalse();
            assertThat(replay.get("inputFingerprintMatches").asBoolean()).as(replay.toString()).isFalse();
        } finally {
            jdbc.sql("UPDATE raw_curve_content SET content = ? WHERE raw_curve_id = ?::uuid").params(original, curveId)
                    .update();
            jdbc.sql("ALTER TABLE raw_curve_content ADD CONSTRAINT " + check
                    + " CHECK (encode(sha256(content), 'hex') = sha256)").update();
            jdbc.sql("ALTER TABLE raw_curve_content ENABLE TRIGGER raw_curve_content_append_only").update();
        }
        assertThat(replayIn(path).get("identical").asBoolean()).isTrue();
    }

    /** The replay outcome of the first line of the trace at {@code path}, as the manager sees it. */
    private JsonNode replayIn(String path) {
        return manager().get(path).json().get("lines").get(0).get("replay");
    }

    @Test
    void customersTraceOnlyTheirOwnOrganisationsRecords() {
        TestRunFixtures.Bench own = bench();
        String ownRun = register(own);
        String ownAnalysis = uploaded(ownRun, TestRunFixtures.curve(own)).get("analysis").get("id").asString();
        TestRunFixtures.Bench other = otherOrganisationBench();
        String otherRun = register(other);
        String otherAnalysis = uploaded(otherRun, TestRunFixtures.curve(other)).get("analysis").get("id").asString();

        Api customer = as(TestAccounts.CUSTOMER);
        assertThat(customer.get("/api/v1/trace/tests/" + ownRun).status()).isEqualTo(200);
        assertThat(customer.get("/api/v1/trace/analyses/" + ownAnalysis).status()).isEqualTo(200);
        Api.Response foreign = customer.get("/api/v1/trace/tests/" + otherRun);
        assertThat(foreign.status()).isEqualTo(404);
        assertThat(foreign.body()).doesNotContain(other.specimenId()).doesNotContain(other.labIdentifier());
        Api.Response foreignAnalysis = customer.get("/api/v1/trace/analyses/" + otherAnalysis);
        assertThat(foreignAnalysis.status()).isEqualTo(404);
        assertThat(foreignAnalysis.body()).doesNotContain(otherRun);
        // the bundle holds raw curves, which customers do not download
        assertThat(customer.getBytes("/api/v1/trace/tests/" + ownRun + "/bundle").status()).isEqualTo(403);
        assertThat(anonymous().get("/api/v1/trace/tests/" + ownRun).status()).isEqualTo(401);
    }

    @Test
    void aRunWithoutCurveOrAnUnknownIdIsAProblemNotAnError() {
        String run = register(bench());
        Api.Response early = as(TestAccounts.AUDITOR).get("/api/v1/trace/tests/" + run);
        assertThat(early.status()).as(early.toString()).isEqualTo(409);
        assertThat(early.contentType()).startsWith("application/problem+json");
        Api.Response unknown = as(TestAccounts.AUDITOR).get("/api/v1/trace/analyses/" + java.util.UUID.randomUUID());
        assertThat(unknown.status()).isEqualTo(404);
        assertThat(unknown.contentType()).startsWith("application/problem+json");
        assertThat(as(TestAccounts.AUDITOR).get("/api/v1/trace/tests/not-a-uuid").status()).isEqualTo(400);
        Api.Response none = as(TestAccounts.AUDITOR).get("/api/v1/trace/analyses");
        assertThat(none.status()).as(none.toString()).isEqualTo(422);
        assertThat(none.body()).contains("between 1 and 100");
        StringBuilder many = new StringBuilder("/api/v1/trace/analyses?id=" + java.util.UUID.randomUUID());
        for (int i = 0; i < 100; i++) {
            many.append("&id=").append(java.util.UUID.randomUUID());
        }
        assertThat(as(TestAccounts.AUDITOR).get(many.toString()).status()).isEqualTo(422);
    }
}
