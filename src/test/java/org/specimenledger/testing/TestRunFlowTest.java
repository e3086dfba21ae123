package org.specimenledger.testing;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.security.MessageDigest;
import java.util.Base64;
import java.util.HexFormat;
import org.junit.jupiter.api.Test;
import org.specimenledger.testsupport.Api;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.info.BuildProperties;
import org.springframework.boot.info.GitProperties;
import tools.jackson.databind.JsonNode;

/** The laboratory's daily flow in small steps: register → upload → analysis stored → download → replay. */
class TestRunFlowTest extends TestRunTesting {

    @Autowired
    BuildProperties build;

    @Autowired
    GitProperties git;

    @Test
    void registerUploadAnalyseDownloadReplay() throws Exception {
        TestRunFixtures.Bench b = bench();

        // 1. register: operator defaults to the signed-in technician, calibrations of the test date are named
        Api.Response registered = technician().post("/api/v1/tests", TestRunFixtures.registration(b));
        assertThat(registered.status()).as(registered.toString()).isEqualTo(201);
        JsonNode run = registered.json();
        String id = run.get("id").asString();
        assertThat(run.get("operator").asString()).isEqualTo("t-technician");
        assertThat(run.get("validity").asString()).isEqualTo("VALID");
        assertThat(run.get("testDate").asString()).isEqualTo(TestRunFixtures.TODAY.minusDays(1).toString());
        assertThat(run.get("testedAt").asString()).isEqualTo(TestRunFixtures.testedAt().toInstant().toString());
        assertThat(run.get("calibrations").get("forceTransducer").isNull()).isFalse();
        assertThat(run.get("calibrationOverride").isNull()).isTrue();
        assertThat(run.get("currentAnalysisId").isNull()).isTrue();

        // 2. upload the raw file as the body
        byte[] curve = TestRunFixtures.curve(b);
        String sha = HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(curve));
        JsonNode received = uploaded(id, curve);
        JsonNode raw = received.get("curve");
        assertThat(raw.get("sha256").asString()).isEqualTo(sha);
        assertThat(raw.get("sizeBytes").asLong()).isEqualTo(curve.length);
        assertThat(raw.get("mediaType").asString()).isEqualTo("text/csv");
        assertThat(raw.get("originalName").asString()).isEqualTo("run-" + id.substring(0, 8) + ".csv");
        assertThat(raw.get("points").asInt()).isEqualTo(2002);

        // 3. the analysis: software from the build, method version, parameters, snapshots, results with evidence
        JsonNode analysis = received.get("analysis");
        String analysisId = analysis.get("id").asString();
        assertThat(analysis.get("sequence").asInt()).isEqualTo(1);
        assertThat(analysis.get("inputSha256").asString()).isEqualTo(sha);
        assertThat(analysis.get("softwareVersion").asString()).isEqualTo(build.getVersion());
        assertThat(analysis.get("softwareCommit").asString()).startsWith(git.getCommitId());
        assertThat(analysis.get("methodVersion").asString()).isEqualTo("tensile/1.1.0");
        assertThat(analysis.get("parameters").get("proofOffsetsPercent").get(0).asDouble()).isEqualTo(0.2);
        // the uncertainty budget takes the classes of the calibrations used: 100 kN range class 0.5, extensometer 1
        assertThat(analysis.get("parameters").get("uncertainty.forceClassPercent").asDouble()).isEqualTo(0.5);
        assertThat(analysis.get("parameters").get("uncertainty.extensometerClassPercent").asDouble()).isEqualTo(1.0);
        JsonNode calibrations = analysis.get("calibrations");
        assertThat(calibrations).hasSize(3);
        JsonNode transducer = calibrations.get(1);
        assertThat(transducer.get("role").asString()).isEqualTo("FORCE_TRANSDUCER");
        assertThat(transducer.get("calibrationId").asString())
                .isEqualTo(run.get("calibrations").get("forceTransducer").asString());
        assertThat(transducer.get("certificateReference").asString()).startsWith("CAL-");
        assertThat(transducer.get("accuracyClass").asString()).isEqualTo("0.5");
        assertThat(transducer.get("rangeN").asInt()).isEqualTo(100000);
        assertThat(transducer.get("dueOn").asString()).isEqualTo(TestRunFixtures.TODAY.plusDays(300).toString());
        assertThat(transducer.get("validOnTestDate").asBoolean()).isTrue();
        assertThat(analysis.get("geometry").get("leMm").asInt()).isEqualTo(50);
        assertThat(analysis.get("geometry").get("labIdentifier").asString()).isEqualTo(b.labIdentifier());
        // Ramberg & Osgood 1943 (NACA TN 902): the 0.2 % offset proof strength is sigma0.2 = 300 MPa exactly;
        // the file rounds force to 1 mN and has 2000 points to 5 % strain, so 1 MPa is ample
        JsonNode rp = analysis.get("results").get("properties").get("Rp0.2");
        assertThat(rp.get("status").asString()).isEqualTo("DETERMINED");
        assertThat(rp.get("value").asDouble()).isCloseTo(300.0, within(1.0));
        assertThat(rp.get("evidence").size()).isPositive();
        assertThat(rp.get("expandedUncertainty").isNull()).isFalse();
        assertThat(analysis.get("results").get("properties").get("ReH").get("value").isNull()).isTrue();
        assertThat(analysis.get("input").get("points").asInt()).isEqualTo(2002);

        // the run points at it
        JsonNode after = technician().get("/api/v1/tests/" + id).json();
        assertThat(after.get("currentAnalysisId").asString()).isEqualTo(analysisId);
        assertThat(after.get("rawCurve").get("sha256").asString()).isEqualTo(sha);
        assertThat(technician().get("/api/v1/analyses/" + analysisId).json().get("inputSha256").asString())
                .isEqualTo(sha);

        // 4. download: byte for byte, with the fingerprint in the headers
        Api.Download d = as("t-auditor").getBytes("/api/v1/tests/" + id + "/curve");
        assertThat(d.status()).isEqualTo(200);
        assertThat(d.body()).isEqualTo(curve);
        assertThat(d.header("Curve-SHA256")).isEqualTo(sha);
        assertThat(d.header("Repr-Digest")).isEqualTo("sha-256=:"
                + Base64.getEncoder().encodeToString(HexFormat.of().parseHex(sha)) + ":");
        assertThat(d.header("Content-Type")).startsWith("text/csv");
        assertThat(d.header("Content-Disposition")).contains("run-" + id.substring(0, 8) + ".csv");

        // 5. replay: identical, both software versions named
        Api.Response replay = as("t-auditor").post("/api/v1/analyses/" + analysisId + "/replay", "");
        assertThat(replay.status()).as(replay.toString()).isEqualTo(200);
        JsonNode answer = replay.json();
        assertThat(answer.get("identical").asBoolean()).as(replay.toString()).isTrue();
        assertThat(answer.get("inputFingerprintMatches").asBoolean()).isTrue();
        assertThat(answer.get("differenceCount").asInt()).isZero();
        assertThat(answer.get("comparedValues").asLong()).isGreaterThan(100);
        assertThat(answer.get("stored").get("version").asString()).isEqualTo(build.getVersion());
        assertThat(answer.get("replayed").get("methodVersion").asString()).isEqualTo("tensile/1.1.0");

        // 6. the ledger: one event per record written, with before and after
        JsonNode runEvents = events("test-run", id);
        assertThat(runEvents.valueStream().map(e -> e.get("action").asString()))
                .containsExactly("test-run.registered", "test-run.analysis-changed");
        assertThat(runEvents.get(0).get("after").get("operator").asString()).isEqualTo("t-technician");
        assertThat(runEvents.get(1).get("before").get("currentAnalysisId").isNull()).isTrue();
        assertThat(runEvents.get(1).get("after").get("currentAnalysisId").asString()).isEqualTo(analysisId);
        JsonNode curveEvents = events("raw-curve", raw.get("id").asString());
        assertThat(curveEvents).hasSize(1);
        assertThat(curveEvents.get(0).get("action").asString()).isEqualTo("curve.received");
        assertThat(curveEvents.get(0).get("after").get("sha256").asString()).isEqualTo(sha);
        JsonNode analysisEvents = events("analysis", analysisId);
        assertThat(analysisEvents.valueStream().map(e -> e.get("action").asString()))
                .containsExactly("analysis.recorded", "analysis.replayed");
        assertThat(analysisEvents.get(0).get("after").get("inputSha256").asString()).isEqualTo(sha);
        assertThat(analysisEvents.get(1).get("actor").asString()).isEqualTo("t-auditor");
        assertThat(analysisEvents.get(1).get("after").get("identical").asBoolean()).isTrue();
    }

    @Test
    void cyclicRunOfAnElastomerStripStoresItsLoops() {
        TestRunFixtures.Bench b = bench();
        var body = TestRunFixtures.registration(b);
        body.put("standard", "OTHER");
        body.put("method", null);
        body.put("standardReference", "in-house loading-unloading procedure LU-3");
        body.put("mode", "CYCLIC");
        body.put("forceRangeN", 10000);
        String id = register(body);
        // loading F = k x, unloading F = k x^2 / xm: loading energy k xm^2 / 2, returned k xm^2 / 3 (exact
        // integrals), loss ratio 100 (1/2 - 1/3) / (1/2) = 33.3 %
        JsonNode analysis = uploaded(id, SyntheticCurves.labelled("specimen: " + b.labIdentifier(),
                SyntheticCurves.triangleCycles(1000, 2, 3, 400))).get("analysis");
        assertThat(analysis.get("methodVersion").asString()).isEqualTo("cyclic/1.0.0");
        JsonNode first = analysis.get("results").get("cycles").get(0);
        assertThat(first.get("lossRatio").asDouble()).isCloseTo(100.0 / 3, within(0.05));
        Api.Response replay = technician().post("/api/v1/analyses/" + analysis.get("id").asString() + "/replay", "");
        assertThat(replay.json().get("identical").asBoolean()).as(replay.toString()).isTrue();
    }
}
