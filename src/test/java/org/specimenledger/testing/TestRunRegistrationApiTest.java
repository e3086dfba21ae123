package org.specimenledger.testing;

import static org.assertj.core.api.Assertions.assertThat;
import static org.specimenledger.testing.TestRunFixtures.TODAY;
import static org.specimenledger.testing.TestRunFixtures.with;

import java.util.List;
import java.util.Map;
import java.util.UUID;
import org.junit.jupiter.api.Test;
import org.specimenledger.testsupport.Api;
import tools.jackson.databind.JsonNode;

/** Registration: the calibration gate, its override, the rules on each field, retests and invalidation. */
class TestRunRegistrationApiTest extends TestRunTesting {

    /** A bench whose extensometer's only calibration ran out before the test date. */
    private TestRunFixtures.Bench benchWithExpiredExtensometer() {
        TestRunFixtures.Bench b = bench();
        String expired = TestRunFixtures.instrument(manager(), TestRunFixtures.extensometer(50));
        TestRunFixtures.calibrate(manager(), expired, TODAY.minusDays(400), TODAY.minusDays(40),
                Map.of("accuracyClass", "1"));
        return new TestRunFixtures.Bench(b.specimenId(), b.labIdentifier(), b.heatId(), b.orderId(), b.machineId(),
                b.transducerId(), expired, b.s0Mm2());
    }

    @Test
    void expiredCalibrationIsRefusedNamingTheInstrumentItsCalibrationAndWhy() {
        TestRunFixtures.Bench b = benchWithExpiredExtensometer();
        Map<String, Long> before = footprint();
        Api.Response r = technician().post("/api/v1/tests", TestRunFixtures.registration(b));
        assertProblem(r, 422, "/extensometerId", "expired on " + TODAY.minusDays(40));
        JsonNode body = r.json();
        assertThat(body.get("type").asString()).isEqualTo("urn:specimen-ledger:problem:calibration-not-valid");
        JsonNode instrument = body.get("instruments").get(0);
        assertThat(instrument.get("equipmentId").asString()).isEqualTo(b.extensometerId());
        assertThat(instrument.get("assetId").asString()).startsWith("EX-");
        assertThat(instrument.get("lastCalibration").get("dueOn").asString()).isEqualTo(TODAY.minusDays(40).toString());
        assertThat(instrument.get("lastCalibration").get("certificateReference").asString()).startsWith("CAL-");
        assertThat(body.get("detail").asString()).contains(instrument.get("assetId").asString());
        assertThat(body.get("instruments")).hasSize(1);
        assertThat(footprint()).isEqualTo(before);
    }

    @Test
    void labManagerMayAcceptARefusedRunWithAReasonAndEveryResultIsFlagged() {
        TestRunFixtures.Bench b = benchWithExpiredExtensometer();
        Map<String, Object> body = with(TestRunFixtures.registration(b), "calibrationOverrideReason",
                "extensometer verified in house against the gauge block set on the test date");

        Api.Response technician = technician().post("/api/v1/tests", body);
        assertThat(technician.status()).as(technician.toString()).isEqualTo(403);

        Api.Response r = manager().post("/api/v1/tests", body);
        assertThat(r.status()).as(r.toString()).isEqualTo(201);
        JsonNode override = r.json().get("calibrationOverride");
        assertThat(override.get("acceptedBy").asString()).isEqualTo("t-manager");
        assertThat(override.get("reason").asString()).contains("gauge block");
        assertThat(override.get("findings").get(0).asString()).contains("expired");
        String id = r.id();

        JsonNode event = events("test-run", id).get(0);
        assertThat(event.get("action").asString()).isEqualTo("test-run.registered");
        assertThat(event.get("reason").asString()).startsWith("calibration override: extensometer verified");
        assertThat(event.get("after").get("calibrationOverride").get("acceptedBy").asString()).isEqualTo("t-manager");

        JsonNode flags = uploaded(id, TestRunFixtures.curve(b)).get("analysis").get("flags");
        JsonNode flag = flags.valueStream().filter(f -> f.get("code").asString().equals("CALIBRATION_OVERRIDE"))
                .findFirst().orElseThrow();
        assertThat(flag.get("properties").isNull()).as("concerns every result").isTrue();
        assertThat(flag.get("message").asString()).contains("t-manager").contains("gauge block");
    }

    @Test
    void overrideWithNothingToOverrideIsRefused() {
        Map<String, Object> body = with(TestRunFixtures.registration(bench()), "calibrationOverrideReason", "just in case");
        assertProblem(manager().post("/api/v1/tests", body), 422, "/calibrationOverrideReason", "nothing to accept");
    }

    @Test
    void forceRangeOfTheWrongClassIsRefused() {
        TestRunFixtures.Bench b = bench();
        String cell = TestRunFixtures.instrument(manager(), TestRunFixtures.loadCell());
        TestRunFixtures.calibrate(manager(), cell, Map.of("classes", List.of(
                Map.of("rangeN", 10000, "accuracyClass", "1"), Map.of("rangeN", 100000, "accuracyClass", "2"))));
        String machine = TestRunFixtures.instrument(manager(), TestRunFixtures.machine(List.of(cell)));
        TestRunFixtures.calibrate(manager(), machine, Map.of());
        Map<String, Object> body = with(with(TestRunFixtures.registration(b), "forceTransducerId", cell),
                "machineId", machine);
        // ISO 6892-1 needs a class 1 force-measuring system (ISO 7500-1) [M]
        assertProblem(technician().post("/api/v1/tests", body), 422, "/forceTransducerId",
                "100000 N range used is class 2");
        // the 10 kN range of the same cell is class 1: accepted
        assertThat(technician().post("/api/v1/tests", with(body, "forceRangeN", 10000)).status()).isEqualTo(201);
    }

    @Test
    void extensometerClassFollowsThePropertiesToBeReported() {
        TestRunFixtures.Bench b = bench();
        String coarse = TestRunFixtures.instrument(manager(), TestRunFixtures.extensometer(50));
        TestRunFixtures.calibrate(manager(), coarse, Map.of("accuracyClass", "2"));
        Map<String, Object> body = with(TestRunFixtures.registration(b), "extensometerId", coarse);
        // ISO 6892-1: class 1 for ReH, ReL, Rp, Rt, Ae; class 2 for Ag, Agt, A, At (ISO 9513) [M]
        assertProblem(technician().post("/api/v1/tests", body), 422, "/extensometerId", "needs class 1");
        assertProblem(technician().post("/api/v1/tests", with(body, "reportedProperties", List.of("Rp0.2", "A"))),
                422, "/extensometerId", "needs class 1 or better for Rp0.2, A");
        Api.Response ok = technician().post("/api/v1/tests", with(body, "reportedProperties", List.of("Rm", "Agt", "A")));
        assertThat(ok.status()).as(ok.toString()).isEqualTo(201);
        assertThat(ok.json().get("reportedProperties").valueStream().map(JsonNode::asString))
                .containsExactly("Rm", "Agt", "A");
    }

    @Test
    void elastomerRunsNeedOnlyAValidCalibration() {
        TestRunFixtures.Bench b = bench();
        String coarse = TestRunFixtures.instrument(manager(), TestRunFixtures.extensometer(50));
        TestRunFixtures.calibrate(manager(), coarse, Map.of("accuracyClass", "2"));
        Map<String, Object> body = with(with(with(TestRunFixtures.registration(b), "extensometerId", coarse),
                "standard", "ISO_37"), "method", null);
        Api.Response r = technician().post("/api/v1/tests", with(body, "temperatureC", 23));
        assertThat(r.status()).as(r.toString()).isEqualTo(201);
    }

    @Test
    void everyFieldProblemIsNamedAtOnce() {
        TestRunFixtures.Bench b = bench();
        Map<String, Object> body = TestRunFixtures.registration(b);
        body.put("specimenId", UUID.randomUUID().toString());
        body.put("machineId", b.transducerId());
        body.put("forceRangeN", 50000);
        body.put("method", null);
        body.put("reportedProperties", List.of("Rm", "Hardness"));
        body.put("operator", "nobody-" + UUID.randomUUID());
        body.put("testedAt", TestRunFixtures.testedAt().plusDays(5).toString());
        Map<String, Long> before = footprint();
        Api.Response r = technician().post("/api/v1/tests", body);
        assertProblem(r, 422, "/specimenId", "no specimen with id");
        assertProblem(r, 422, "/machineId", "is a FORCE_TRANSDUCER, not a TESTING_MACHINE");
        assertProblem(r, 422, "/forceRangeN", "has no 50000 N range; its ranges are 10000 N, 100000 N");
        assertProblem(r, 422, "/method", "A1, A2 or B");
        assertProblem(r, 422, "/reportedProperties/1", "unknown property 'Hardness'");
        assertProblem(r, 422, "/operator", "no account with username");
        assertProblem(r, 422, "/testedAt", "in the future");
        assertThat(footprint()).isEqualTo(before);

        assertProblem(technician().post("/api/v1/tests", with(with(TestRunFixtures.registration(b), "standard", "OTHER"),
                "method", "A1")), 422, "/method", "only ISO 6892-1");
        Map<String, Object> other = with(with(TestRunFixtures.registration(b), "standard", "OTHER"), "method", null);
        assertProblem(technician().post("/api/v1/tests", with(other, "standardReference", " ")), 422,
                "/standardReference", "must name it");
        assertProblem(technician().post("/api/v1/tests", with(TestRunFixtures.registration(b), "operator", "t-auditor")),
                422, "/operator", "an operator is a technician or a lab manager");
        assertProblem(technician().post("/api/v1/tests", with(TestRunFixtures.registration(b), "temperatureC", null)),
                422, "/temperatureC", "null");
        assertProblem(technician().post("/api/v1/tests", with(TestRunFixtures.registration(b), "standard", "ISO_9999")),
                400, "/standard", "ISO_6892_1");
    }

    @Test
    void extensometerGaugeLengthMustBeTheSpecimensLe() {
        TestRunFixtures.Bench b = bench();
        String short25 = TestRunFixtures.instrument(manager(), TestRunFixtures.extensometer(25));
        TestRunFixtures.calibrate(manager(), short25, Map.of("accuracyClass", "1"));
        assertProblem(technician().post("/api/v1/tests", with(TestRunFixtures.registration(b), "extensometerId", short25)),
                422, "/extensometerId", "gauge length 25 mm but specimen " + b.labIdentifier() + " has Le = 50 mm");
    }

    @Test
    void transducerMustBelongToTheMachineThatNamesItsTransducers() {
        TestRunFixtures.Bench b = bench();
        String loose = TestRunFixtures.instrument(manager(), TestRunFixtures.loadCell());
        TestRunFixtures.calibrate(manager(), loose, Map.of("classes", List.of(
                Map.of("rangeN", 10000, "accuracyClass", "1"), Map.of("rangeN", 100000, "accuracyClass", "1"))));
        assertProblem(technician().post("/api/v1/tests", with(TestRunFixtures.registration(b), "forceTransducerId", loose)),
                422, "/forceTransducerId", "is not among the transducers of testing machine");
    }

    @Test
    void aRetestInvalidatesThePreviousRunWithItsReason() {
        TestRunFixtures.Bench b = bench();
        String first = register(b);
        Api.Response again = technician().post("/api/v1/tests", TestRunFixtures.registration(b));
        assertThat(again.status()).as(again.toString()).isEqualTo(409);
        assertThat(again.json().get("detail").asString()).contains(first).contains("retestReason");

        String second = register(with(TestRunFixtures.registration(b), "retestReason", "specimen slipped in the grips"));
        JsonNode old = technician().get("/api/v1/tests/" + first).json();
        assertThat(old.get("validity").asString()).isEqualTo("INVALID");
        assertThat(old.get("invalidationReason").asString()).isEqualTo("retest: specimen slipped in the grips");
        assertThat(technician().get("/api/v1/tests/" + second).json().get("validity").asString()).isEqualTo("VALID");
        JsonNode invalidated = events("test-run", first).get(1);
        assertThat(invalidated.get("action").asString()).isEqualTo("test-run.invalidated");
        assertThat(invalidated.get("before").get("validity").asString()).isEqualTo("VALID");
        assertThat(invalidated.get("after").get("validity").asString()).isEqualTo("INVALID");
        assertThat(events("test-run", second).get(0).get("reason").asString())
                .isEqualTo("retest of " + first + ": specimen slipped in the grips");

        assertThat(technician().get("/api/v1/tests?specimenId=" + b.specimenId()).json().get("items")
                .valueStream().map(n -> n.get("id").asString())).containsExactly(first, second);
    }

    @Test
    void invalidatingNeedsAReasonAndReinstatingSupersedesTheOtherValidRun() {
        TestRunFixtures.Bench b = bench();
        String first = register(b);
        assertProblem(technician().post("/api/v1/tests/" + first + "/invalidate", Map.of()), 422, "/reason", "reason");
        Api.Response invalid = technician().post("/api/v1/tests/" + first + "/invalidate",
                Map.of("reason", "load cell cable found loose after the run"));
        assertThat(invalid.status()).as(invalid.toString()).isEqualTo(200);
        assertThat(invalid.json().get("invalidatedBy").asString()).isEqualTo("t-technician");
        Api.Response twice = technician().post("/api/v1/tests/" + first + "/invalidate", Map.of("reason", "again"));
        assertThat(twice.status()).isEqualTo(409);

        // with no valid run left, a new run is a plain registration (no retest reason)
        String second = register(b);
        Api.Response back = manager().post("/api/v1/tests/" + first + "/reinstate",
                Map.of("reason", "cable checked: it was the spare cable that was loose"));
        assertThat(back.status()).as(back.toString()).isEqualTo(200);
        assertThat(back.json().get("validity").asString()).isEqualTo("VALID");
        assertThat(back.json().get("invalidationReason").isNull()).isTrue();
        JsonNode superseded = technician().get("/api/v1/tests/" + second).json();
        assertThat(superseded.get("validity").asString()).isEqualTo("INVALID");
        assertThat(superseded.get("invalidationReason").asString()).startsWith("superseded by reinstated run " + first);
        assertThat(events("test-run", first).valueStream().map(e -> e.get("action").asString()))
                .containsExactly("test-run.registered", "test-run.invalidated", "test-run.reinstated");
        assertThat(technician().post("/api/v1/tests/" + UUID.randomUUID() + "/invalidate", Map.of("reason", "x"))
                .status()).isEqualTo(404);
    }
}
