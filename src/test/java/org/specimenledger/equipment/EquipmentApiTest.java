package org.specimenledger.equipment;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.specimenledger.equipment.EquipmentFixtures.assetId;
import static org.specimenledger.equipment.EquipmentFixtures.calibrationBody;
import static org.specimenledger.equipment.EquipmentFixtures.extensometerBody;
import static org.specimenledger.equipment.EquipmentFixtures.loadCellBody;
import static org.specimenledger.equipment.EquipmentFixtures.loadCellCalibrationBody;
import static org.specimenledger.equipment.EquipmentFixtures.machineBody;
import static org.specimenledger.equipment.EquipmentFixtures.with;

import java.time.LocalDate;
import java.time.ZoneOffset;
import java.util.List;
import java.util.Map;
import java.util.UUID;
import org.junit.jupiter.api.Test;
import org.specimenledger.testsupport.Api;
import org.specimenledger.testsupport.IntegrationTest;
import org.specimenledger.testsupport.TestAccounts;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.jdbc.core.simple.JdbcClient;
import tools.jackson.databind.JsonNode;

/** The equipment register over real HTTP against a real PostgreSQL. Dates are relative to today (UTC). */
class EquipmentApiTest extends IntegrationTest {

    private static final LocalDate TODAY = LocalDate.now(ZoneOffset.UTC);

    @Autowired
    private EquipmentDirectory directory;

    @Autowired
    private JdbcClient jdbc;

    private Api manager() {
        return as(TestAccounts.MANAGER);
    }

    private String register(Map<String, Object> body) {
        Api.Response r = manager().post("/api/v1/equipment", body);
        assertThat(r.status()).as(r.toString()).isEqualTo(201);
        return r.id();
    }

    private String calibrate(String id, Map<String, Object> body) {
        Api.Response r = manager().post("/api/v1/equipment/" + id + "/calibrations", body);
        assertThat(r.status()).as(r.toString()).isEqualTo(201);
        return r.id();
    }

    private JsonNode events(String entityType, String id) {
        Api.Response r = manager().get("/api/v1/audit/events?entityType=" + entityType + "&entityId=" + id);
        assertThat(r.status()).isEqualTo(200);
        return r.json().get("events");
    }

    private static void assertProblem(Api.Response r, int status, String pointer, String detailPart) {
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

    // --- instruments

    @Test
    void managerRegistersEachKindAndEveryLabRoleReadsIt() {
        String cell = register(loadCellBody(assetId("LC")));
        String ext = register(extensometerBody(assetId("EX")));
        String machine = register(machineBody(assetId("TM"), List.of(cell)));

        JsonNode c = as(TestAccounts.TECHNICIAN).get("/api/v1/equipment/" + cell).json();
        assertThat(c.get("kind").asString()).isEqualTo("FORCE_TRANSDUCER");
        assertThat(c.get("forceRanges")).hasSize(2);
        assertThat(c.get("forceRanges").get(0).get("upperLimitN").asInt()).isEqualTo(10000);
        // 20 % of the range when not given, ISO 7500-1 [from memory]
        assertThat(c.get("forceRanges").get(0).get("lowerLimitN").asInt()).isEqualTo(2000);
        assertThat(c.get("forceRanges").get(1).get("lowerLimitN").asInt()).isEqualTo(10000);
        assertThat(c.get("calibrationStatus").asString()).isEqualTo("NONE");
        assertThat(c.get("currentCalibration").isNull()).isTrue();
        assertThat(c.get("statusOn").asString()).isEqualTo(TODAY.toString());

        JsonNode e = as(TestAccounts.AUDITOR).get("/api/v1/equipment/" + ext).json();
        assertThat(e.get("gaugeLengthMm").asInt()).isEqualTo(50);
        assertThat(e.get("travelMm").asInt()).isEqualTo(10);
        assertThat(e.get("forceRanges")).isEmpty();

        JsonNode m = manager().get("/api/v1/equipment/" + machine).json();
        assertThat(m.get("builtInTransducerIds").get(0).asString()).isEqualTo(cell);

        JsonNode extensometers = manager().get("/api/v1/equipment?kind=EXTENSOMETER").json();
        assertThat(extensometers.valueStream().map(n -> n.get("id").asString())).contains(ext)
                .doesNotContain(cell, machine);
        assertThat(extensometers.valueStream().map(n -> n.get("kind").asString())).containsOnly("EXTENSOMETER");
        assertThat(manager().get("/api/v1/equipment").json().valueStream().map(n -> n.get("id").asString()))
                .contains(cell, ext, machine);
    }

    @Test
    void assetIdIsUniqueWhateverItsCase() {
        String asset = assetId("tm");
        register(machineBody(asset, null));
        Api.Response again = manager().post("/api/v1/equipment", machineBody(asset.toUpperCase(), null));
        assertProblem(again, 409, "/assetId", "already exists");
    }

    @Test
    void invalidInstrumentsAreRefusedNamingTheField() {
        assertProblem(manager().post("/api/v1/equipment", with(loadCellBody(assetId("LC")), "forceRanges", List.of())),
                422, "/forceRanges", "at least one force range");
        assertProblem(manager().post("/api/v1/equipment", with(loadCellBody(assetId("LC")), "forceRanges",
                List.of(Map.of("upperLimitN", -5)))), 422, "/forceRanges/0/upperLimitN", "greater than 0");
        assertProblem(manager().post("/api/v1/equipment", with(loadCellBody(assetId("LC")), "forceRanges",
                List.of(Map.of("upperLimitN", 500), Map.of("upperLimitN", 500.0)))),
                422, "/forceRanges/1/upperLimitN", "given twice");
        assertProblem(manager().post("/api/v1/equipment", with(extensometerBody(assetId("EX")), "gaugeLengthMm", null)),
                422, "/gaugeLengthMm", "gauge length");
        assertProblem(manager().post("/api/v1/equipment", with(extensometerBody(assetId("EX")), "gaugeLengthMm", 0)),
                422, "/gaugeLengthMm", "greater than 0");
        assertProblem(manager().post("/api/v1/equipment", with(machineBody(assetId("TM"), null), "assetId", "TM 01")),
                422, "/assetId", "letters, digits");
        assertProblem(manager().post("/api/v1/equipment", with(machineBody(assetId("TM"), null), "description", " ")),
                422, "/description", "blank");
        String unknown = UUID.randomUUID().toString();
        assertProblem(manager().post("/api/v1/equipment", machineBody(assetId("TM"), List.of(unknown))),
                422, "/builtInTransducerIds/0", "no instrument with id " + unknown);
        Api.Response badKind = manager().post("/api/v1/equipment", with(machineBody(assetId("TM"), null), "kind", "ROBOT"));
        assertProblem(badKind, 400, "/kind", "TESTING_MACHINE");
    }

    @Test
    void changeNeedsAReasonAndKeepsTheKind() {
        String asset = assetId("EX");
        String id = register(extensometerBody(asset));
        assertProblem(manager().put("/api/v1/equipment/" + id, extensometerBody(asset)), 422, "/reason", "reason");
        Map<String, Object> asCell = with(loadCellBody(asset), "reason", "typo");
        assertProblem(manager().put("/api/v1/equipment/" + id, asCell), 422, "/kind", "cannot change");

        Map<String, Object> moved = with(with(extensometerBody(asset), "location", "Hall C"), "reason", "moved");
        Api.Response ok = manager().put("/api/v1/equipment/" + id, moved);
        assertThat(ok.status()).as(ok.toString()).isEqualTo(200);
        assertThat(ok.text("location")).isEqualTo("Hall C");
        assertThat(manager().put("/api/v1/equipment/" + UUID.randomUUID(), moved).status()).isEqualTo(404);
    }

    @Test
    void rangesMayBeAddedButAReferencedRangeNeitherRemovedNorAltered() {
        String asset = assetId("LC");
        String id = register(loadCellBody(asset));
        calibrate(id, loadCellCalibrationBody(TODAY.minusDays(10), TODAY.plusMonths(11), "CERT-" + asset));

        Map<String, Object> threeRanges = with(with(loadCellBody(asset), "forceRanges", List.of(
                Map.of("upperLimitN", 10000), Map.of("upperLimitN", 100000, "lowerLimitN", 10000),
                Map.of("upperLimitN", 1000))), "reason", "1 kN range enabled");
        Api.Response added = manager().put("/api/v1/equipment/" + id, threeRanges);
        assertThat(added.status()).as(added.toString()).isEqualTo(200);
        assertThat(added.json().get("forceRanges").valueStream().map(r -> r.get("upperLimitN").asInt()))
                .containsExactly(1000, 10000, 100000);

        // the new range has no calibration yet: it may go again
        Map<String, Object> back = with(loadCellBody(asset), "reason", "1 kN range disabled again");
        assertThat(manager().put("/api/v1/equipment/" + id, back).status()).isEqualTo(200);

        Map<String, Object> withoutTen = with(with(loadCellBody(asset), "forceRanges",
                List.of(Map.of("upperLimitN", 100000, "lowerLimitN", 10000))), "reason", "drop 10 kN");
        Api.Response removed = manager().put("/api/v1/equipment/" + id, withoutTen);
        assertThat(removed.status()).isEqualTo(409);
        assertThat(removed.json().get("detail").asString()).contains("force range 10000 N")
                .contains("CERT-" + asset).contains("cannot be removed");

        Map<String, Object> altered = with(with(loadCellBody(asset), "forceRanges", List.of(
                Map.of("upperLimitN", 10000, "lowerLimitN", 1000),
                Map.of("upperLimitN", 100000, "lowerLimitN", 10000))), "reason", "lower limit");
        Api.Response changed = manager().put("/api/v1/equipment/" + id, altered);
        assertThat(changed.status()).isEqualTo(409);
        assertThat(changed.json().get("detail").asString()).contains("force range 10000 N").contains("cannot change");

        assertThat(manager().get("/api/v1/equipment/" + id).json().get("forceRanges")).hasSize(2);
    }

    @Test
    void retiredInstrumentStaysInTheRegister() {
        String asset = assetId("EX");
        String id = register(extensometerBody(asset));
        calibrate(id, with(calibrationBody(TODAY.minusMonths(2), TODAY.plusMonths(9), "R-" + asset),
                "accuracyClass", "1"));
        Map<String, Object> retirement = Map.of("retiredOn", TODAY.minusDays(1).toString());
        assertProblem(manager().post("/api/v1/equipment/" + id + "/retire", retirement), 422, "/reason", "reason");

        Api.Response retired = manager().post("/api/v1/equipment/" + id + "/retire",
                with(retirement, "reason", "knife edges worn beyond repair"));
        assertThat(retired.status()).as(retired.toString()).isEqualTo(200);
        assertThat(retired.text("calibrationStatus")).isEqualTo("RETIRED");
        assertThat(retired.text("retiredOn")).isEqualTo(TODAY.minusDays(1).toString());
        assertThat(retired.text("retirementReason")).isEqualTo("knife edges worn beyond repair");

        Api.Response again = manager().post("/api/v1/equipment/" + id + "/retire",
                with(retirement, "reason", "twice"));
        assertThat(again.status()).isEqualTo(409);
        assertThat(again.json().get("detail").asString()).contains("already retired on " + TODAY.minusDays(1));

        JsonNode on = manager().get("/api/v1/equipment/" + id + "/calibration-on?date=" + TODAY).json();
        assertThat(on.get("valid").asBoolean()).isFalse();
        assertThat(on.get("reason").asString()).isEqualTo("instrument retired on " + TODAY.minusDays(1));
        assertThat(manager().get("/api/v1/equipment/" + id + "/calibration-on?date=" + TODAY.minusDays(2)).json()
                .get("valid").asBoolean()).isTrue();

        Api.Response late = manager().post("/api/v1/equipment/" + id + "/calibrations",
                with(calibrationBody(TODAY, TODAY.plusMonths(6), "L-" + asset), "accuracyClass", "1"));
        assertThat(late.status()).isEqualTo(409);
        assertThat(late.json().get("detail").asString()).contains("was retired on");
        assertThat(manager().get("/api/v1/equipment/" + id).status()).isEqualTo(200);
        assertThat(manager().post("/api/v1/equipment/" + UUID.randomUUID() + "/retire",
                with(retirement, "reason", "x")).status()).isEqualTo(404);
    }

    // --- calibrations

    @Test
    void calibrationOfEachRangeIsRecordedAndSetsTheStatus() {
        String asset = assetId("LC");
        String id = register(loadCellBody(asset));
        Api.Response cal = manager().post("/api/v1/equipment/" + id + "/calibrations",
                loadCellCalibrationBody(TODAY.minusDays(20), TODAY.plusMonths(11), "C-" + asset));
        assertThat(cal.status()).as(cal.toString()).isEqualTo(201);
        assertThat(cal.json().get("rangeClasses").get(0).get("rangeN").asInt()).isEqualTo(10000);
        assertThat(cal.json().get("rangeClasses").get(1).get("accuracyClass").asString()).isEqualTo("0.5");
        assertThat(cal.json().get("withdrawnAt").isNull()).isTrue();

        JsonNode view = as(TestAccounts.TECHNICIAN).get("/api/v1/equipment/" + id).json();
        assertThat(view.get("calibrationStatus").asString()).isEqualTo("VALID");
        assertThat(view.get("currentCalibration").get("certificateReference").asString()).isEqualTo("C-" + asset);
        assertThat(view.get("currentCalibration").get("dueOn").asString()).isEqualTo(TODAY.plusMonths(11).toString());

        JsonNode list = as(TestAccounts.AUDITOR).get("/api/v1/equipment/" + id + "/calibrations").json();
        assertThat(list).hasSize(1);
        assertThat(list.get(0).get("id").asString()).isEqualTo(cal.id());
    }

    @Test
    void statusIsDueSoonOrExpiredByTheDueDate() {
        String soon = register(extensometerBody(assetId("EX")));
        calibrate(soon, with(calibrationBody(TODAY.minusDays(300), TODAY.plusDays(10), "S-" + soon), "accuracyClass",
                "0.5"));
        assertThat(manager().get("/api/v1/equipment/" + soon).text("calibrationStatus")).isEqualTo("DUE_SOON");

        String expired = register(extensometerBody(assetId("EX")));
        calibrate(expired, with(calibrationBody(TODAY.minusDays(360), TODAY.minusDays(1), "E-" + expired),
                "accuracyClass", "2"));
        assertThat(manager().get("/api/v1/equipment/" + expired).text("calibrationStatus")).isEqualTo("EXPIRED");
        JsonNode listed = manager().get("/api/v1/equipment?kind=EXTENSOMETER").json().valueStream()
                .filter(n -> n.get("id").asString().equals(expired)).findFirst().orElseThrow();
        assertThat(listed.get("calibrationStatus").asString()).isEqualTo("EXPIRED");
    }

    @Test
    void invalidCalibrationsAreRefusedNamingTheRuleAndLeaveNothing() {
        String asset = assetId("LC");
        String id = register(loadCellBody(asset));
        String path = "/api/v1/equipment/" + id + "/calibrations";

        assertProblem(manager().post(path, loadCellCalibrationBody(TODAY.minusDays(1), TODAY.minusDays(2), "A")),
                422, "/dueOn", "calibration due before calibration date");
        assertProblem(manager().post(path, loadCellCalibrationBody(TODAY.plusDays(1), TODAY.plusMonths(6), "B")),
                422, "/calibratedOn", "in the future");
        assertProblem(manager().post(path, loadCellCalibrationBody(TODAY.minusMonths(1), TODAY.plusMonths(12), "C")),
                422, "/dueOn", "ledger.equipment.max-calibration-interval");
        Map<String, Object> unknownRange = with(calibrationBody(TODAY, TODAY.plusMonths(6), "D"), "classes", List.of(
                Map.of("rangeN", 10000, "accuracyClass", "1"), Map.of("rangeN", 100000, "accuracyClass", "1"),
                Map.of("rangeN", 20000, "accuracyClass", "1")));
        assertProblem(manager().post(path, unknownRange), 422, "/classes/2/rangeN", "no force range of 20000 N");
        Map<String, Object> missing = with(calibrationBody(TODAY, TODAY.plusMonths(6), "E"), "classes",
                List.of(Map.of("rangeN", 10000, "accuracyClass", "1")));
        assertProblem(manager().post(path, missing), 422, "/classes", "force range 100000 N has no class");
        Map<String, Object> badClass = with(calibrationBody(TODAY, TODAY.plusMonths(6), "F"), "classes", List.of(
                Map.of("rangeN", 10000, "accuracyClass", "1"), Map.of("rangeN", 100000, "accuracyClass", "5")));
        assertProblem(manager().post(path, badClass), 422, "/classes/1/accuracyClass", "allowed: 0.5, 1, 2, 3");
        assertProblem(manager().post(path, with(loadCellCalibrationBody(TODAY, TODAY.plusMonths(6), "G"),
                "calibratingBody", "")), 422, "/calibratingBody", "blank");

        String ext = register(extensometerBody(assetId("EX")));
        // ISO 9513 has no class 3 [from memory: classes 0.5, 1, 2]
        assertProblem(manager().post("/api/v1/equipment/" + ext + "/calibrations",
                with(calibrationBody(TODAY, TODAY.plusMonths(6), "H"), "accuracyClass", "3")),
                422, "/accuracyClass", "not an ISO 9513 extensometer class");

        assertThat(manager().get(path).json()).isEmpty();
        assertThat(manager().post("/api/v1/equipment/" + UUID.randomUUID() + "/calibrations",
                loadCellCalibrationBody(TODAY, TODAY.plusMonths(6), "I")).status()).isEqualTo(404);
        assertThat(manager().get("/api/v1/equipment/" + UUID.randomUUID() + "/calibrations").status()).isEqualTo(404);
    }

    @Test
    void duplicateCertificateReferenceIsAConflictUntilWithdrawn() {
        String id = register(loadCellBody(assetId("LC")));
        String first = calibrate(id, loadCellCalibrationBody(TODAY.minusDays(5), TODAY.plusMonths(6), "CERT-77"));
        Api.Response twin = manager().post("/api/v1/equipment/" + id + "/calibrations",
                loadCellCalibrationBody(TODAY.minusDays(5), TODAY.plusMonths(7), "cert-77"));
        assertProblem(twin, 409, "/certificateReference", "already has a calibration with certificate reference");

        // another instrument may carry the same reference
        String other = register(loadCellBody(assetId("LC")));
        calibrate(other, loadCellCalibrationBody(TODAY.minusDays(5), TODAY.plusMonths(6), "CERT-77"));

        // the wrong record withdrawn, the corrected one is entered under the same certificate
        assertThat(manager().post("/api/v1/equipment/" + id + "/calibrations/" + first + "/withdraw",
                Map.of("reason", "due date typed wrongly")).status()).isEqualTo(200);
        calibrate(id, loadCellCalibrationBody(TODAY.minusDays(5), TODAY.plusMonths(7), "CERT-77"));
        assertThat(manager().get("/api/v1/equipment/" + id + "/calibrations").json()).hasSize(2);
    }

    @Test
    void withdrawnCalibrationStaysInTheHistory() {
        String asset = assetId("LC");
        String id = register(loadCellBody(asset));
        String older = calibrate(id, loadCellCalibrationBody(TODAY.minusDays(100), TODAY.plusDays(50), "W1-" + asset));
        String newer = calibrate(id, loadCellCalibrationBody(TODAY.minusDays(10), TODAY.plusMonths(11), "W2-" + asset));
        String withdraw = "/api/v1/equipment/" + id + "/calibrations/" + newer + "/withdraw";

        assertProblem(manager().post(withdraw, Map.of()), 422, "/reason", "reason");
        Api.Response w = manager().post(withdraw, Map.of("reason", "certificate belongs to another load cell"));
        assertThat(w.status()).as(w.toString()).isEqualTo(200);
        assertThat(w.text("withdrawalReason")).isEqualTo("certificate belongs to another load cell");
        assertThat(w.text("withdrawnAt")).isNotNull();
        assertThat(manager().post(withdraw, Map.of("reason", "again")).status()).isEqualTo(409);

        JsonNode view = manager().get("/api/v1/equipment/" + id).json();
        assertThat(view.get("currentCalibration").get("id").asString()).isEqualTo(older);
        assertThat(view.get("calibrationStatus").asString()).isEqualTo("VALID");
        assertThat(manager().get("/api/v1/equipment/" + id + "/calibrations").json()).hasSize(2);

        String elsewhere = register(loadCellBody(assetId("LC")));
        assertThat(manager().post("/api/v1/equipment/" + elsewhere + "/calibrations/" + older + "/withdraw",
                Map.of("reason", "x")).status()).isEqualTo(404);
        assertThat(manager().post("/api/v1/equipment/" + id + "/calibrations/" + UUID.randomUUID() + "/withdraw",
                Map.of("reason", "x")).status()).isEqualTo(404);
    }

    @Test
    void theDatabaseItselfKeepsCalibrationsAppendOnlyAndInstrumentsUndeleted() {
        String id = register(loadCellBody(assetId("LC")));
        String cal = calibrate(id, loadCellCalibrationBody(TODAY.minusDays(1), TODAY.plusMonths(6), "DB-" + id));
        UUID calId = UUID.fromString(cal);
        assertThatThrownBy(() -> jdbc.sql("UPDATE calibration SET due_on = due_on + 30 WHERE id = ?").param(calId)
                .update()).rootCause().hasMessageContaining("may only withdraw a standing record");
        assertThatThrownBy(() -> jdbc.sql("DELETE FROM calibration WHERE id = ?").param(calId).update())
                .rootCause().hasMessageContaining("withdrawn, never removed");
        assertThatThrownBy(() -> jdbc.sql("UPDATE calibration_range_class SET accuracy_class = '3'"
                + " WHERE calibration_id = ?").param(calId).update()).rootCause().hasMessageContaining("append-only");
        assertThatThrownBy(() -> jdbc.sql("DELETE FROM instrument WHERE id = ?").param(UUID.fromString(id)).update())
                .rootCause().hasMessageContaining("append-only");
        assertThatThrownBy(() -> jdbc.sql("DELETE FROM force_range WHERE instrument_id = ? AND upper_limit_n = 10000")
                .param(UUID.fromString(id)).update()).rootCause().hasMessageContaining("calibration_range_class");
        assertThat(manager().get("/api/v1/equipment/" + id + "/calibrations").json().get(0).get("dueOn").asString())
                .isEqualTo(TODAY.plusMonths(6).toString());
    }

    // --- calibration on a date

    @Test
    void calibrationOnADateNamesTheGoverningRecordOrWhyNot() {
        String asset = assetId("EX");
        String id = register(extensometerBody(asset));
        String path = "/api/v1/equipment/" + id + "/calibration-on?date=";
        LocalDate on = TODAY.minusDays(200);
        LocalDate due = TODAY.minusDays(30);
        String cal = calibrate(id, with(calibrationBody(on, due, "CAL-" + asset), "accuracyClass", "1"));

        JsonNode before = manager().get(path + on.minusDays(1)).json();
        assertThat(before.get("valid").asBoolean()).isFalse();
        assertThat(before.get("calibration").isNull()).isTrue();
        assertThat(before.get("reason").asString()).isEqualTo("no calibration on or before " + on.minusDays(1));

        JsonNode first = as(TestAccounts.TECHNICIAN).get(path + on).json();
        assertThat(first.get("date").asString()).isEqualTo(on.toString());
        assertThat(first.get("valid").asBoolean()).isTrue();
        assertThat(first.get("calibration").get("id").asString()).isEqualTo(cal);
        assertThat(first.get("reason").isNull()).isTrue();
        assertThat(manager().get(path + due).json().get("valid").asBoolean()).isTrue();

        JsonNode after = as(TestAccounts.AUDITOR).get(path + due.plusDays(1)).json();
        assertThat(after.get("valid").asBoolean()).isFalse();
        assertThat(after.get("reason").asString()).isEqualTo("calibration CAL-" + asset + " expired on " + due);

        manager().post("/api/v1/equipment/" + id + "/calibrations/" + cal + "/withdraw",
                Map.of("reason", "wrong extensometer on the certificate"));
        JsonNode withdrawn = manager().get(path + on).json();
        assertThat(withdrawn.get("valid").asBoolean()).isFalse();
        assertThat(withdrawn.get("reason").asString()).startsWith("withdrawn: ")
                .contains("wrong extensometer on the certificate");

        Api.Response badDate = manager().get(path + "10.01.2025");
        assertThat(badDate.status()).isEqualTo(400);
        assertThat(badDate.body()).contains("date");
        assertThat(manager().get("/api/v1/equipment/" + id + "/calibration-on").status()).isEqualTo(400);
        assertThat(manager().get("/api/v1/equipment/" + UUID.randomUUID() + "/calibration-on?date=" + TODAY)
                .status()).isEqualTo(404);
    }

    @Test
    void otherFeaturesAskTheDirectory() {
        String asset = assetId("LC");
        String id = register(loadCellBody(asset));
        calibrate(id, loadCellCalibrationBody(TODAY.minusDays(3), TODAY.plusMonths(6), "DIR-" + asset));
        UUID uuid = UUID.fromString(id);

        assertThat(directory.find(uuid)).hasValueSatisfying(v -> {
            assertThat(v.assetId()).isEqualTo(asset);
            assertThat(v.calibrationStatus()).isEqualTo(CalibrationStatus.VALID);
        });
        assertThat(directory.find(UUID.randomUUID())).isEmpty();
        CalibrationOnDate today = directory.calibrationOn(uuid, TODAY);
        assertThat(today.valid()).isTrue();
        assertThat(today.calibration().certificateReference()).isEqualTo("DIR-" + asset);
        assertThat(directory.calibrationOn(uuid, TODAY.minusDays(4)).valid()).isFalse();
    }

    // --- the ledger

    @Test
    void eachWriteIsOneLedgerEventWithBeforeAndAfter() {
        String asset = assetId("LC");
        Api.Response created = manager().post("/api/v1/equipment", loadCellBody(asset));
        String id = created.id();
        JsonNode registered = events("equipment", id);
        assertThat(registered).hasSize(1);
        assertThat(registered.get(0).get("action").asString()).isEqualTo("equipment.registered");
        assertThat(registered.get(0).get("actor").asString()).isEqualTo(TestAccounts.MANAGER);
        assertThat(registered.get(0).get("before").isNull()).isTrue();
        assertThat(registered.get(0).get("after")).isEqualTo(created.json());

        Api.Response changed = manager().put("/api/v1/equipment/" + id,
                with(with(loadCellBody(asset), "location", "Hall D"), "reason", "moved to Hall D"));
        JsonNode afterChange = events("equipment", id);
        assertThat(afterChange).hasSize(2);
        JsonNode change = afterChange.get(1);
        assertThat(change.get("action").asString()).isEqualTo("equipment.changed");
        assertThat(change.get("reason").asString()).isEqualTo("moved to Hall D");
        assertThat(change.get("before")).isEqualTo(created.json());
        assertThat(change.get("after")).isEqualTo(changed.json());

        Api.Response cal = manager().post("/api/v1/equipment/" + id + "/calibrations",
                loadCellCalibrationBody(TODAY.minusDays(1), TODAY.plusMonths(6), "LEDGER-" + asset));
        JsonNode recorded = events("calibration", cal.id());
        assertThat(recorded).hasSize(1);
        assertThat(recorded.get(0).get("action").asString()).isEqualTo("calibration.recorded");
        assertThat(recorded.get(0).get("before").isNull()).isTrue();
        assertThat(recorded.get(0).get("after")).isEqualTo(cal.json());

        Api.Response withdrawn = manager().post("/api/v1/equipment/" + id + "/calibrations/" + cal.id() + "/withdraw",
                Map.of("reason", "wrong certificate"));
        JsonNode withdrawal = events("calibration", cal.id());
        assertThat(withdrawal).hasSize(2);
        assertThat(withdrawal.get(1).get("action").asString()).isEqualTo("calibration.withdrawn");
        assertThat(withdrawal.get(1).get("reason").asString()).isEqualTo("wrong certificate");
        assertThat(withdrawal.get(1).get("before")).isEqualTo(cal.json());
        assertThat(withdrawal.get(1).get("after")).isEqualTo(withdrawn.json());

        JsonNode beforeRetirement = manager().get("/api/v1/equipment/" + id).json();
        Api.Response retired = manager().post("/api/v1/equipment/" + id + "/retire",
                Map.of("retiredOn", TODAY.toString(), "reason", "overloaded"));
        JsonNode all = events("equipment", id);
        assertThat(all).hasSize(3);
        assertThat(all.get(2).get("action").asString()).isEqualTo("equipment.retired");
        assertThat(all.get(2).get("reason").asString()).isEqualTo("overloaded");
        assertThat(all.get(2).get("before")).isEqualTo(beforeRetirement);
        assertThat(all.get(2).get("after")).isEqualTo(retired.json());
        assertThat(manager().get("/api/v1/audit/verify").json().get("valid").asBoolean()).isTrue();
    }

    @Test
    void refusedRequestsLeaveNoEvent() {
        String asset = assetId("LC");
        String id = register(loadCellBody(asset));
        String cal = calibrate(id, loadCellCalibrationBody(TODAY.minusDays(1), TODAY.plusMonths(6), "N-" + asset));
        long before = allEvents();

        manager().put("/api/v1/equipment/" + id, loadCellBody(asset)); // no reason
        manager().put("/api/v1/equipment/" + id, with(with(loadCellBody(asset), "forceRanges",
                List.of(Map.of("upperLimitN", 100000, "lowerLimitN", 10000))), "reason", "drop a referenced range"));
        manager().post("/api/v1/equipment", loadCellBody(asset)); // duplicate
        manager().post("/api/v1/equipment/" + id + "/calibrations",
                loadCellCalibrationBody(TODAY.minusDays(1), TODAY.plusMonths(6), "N-" + asset)); // duplicate
        manager().post("/api/v1/equipment/" + id + "/calibrations",
                loadCellCalibrationBody(TODAY, TODAY.minusDays(1), "Z-" + asset)); // due before
        manager().post("/api/v1/equipment/" + id + "/calibrations/" + cal + "/withdraw", Map.of());
        manager().post("/api/v1/equipment/" + id + "/retire", Map.of("retiredOn", TODAY.toString()));
        as(TestAccounts.TECHNICIAN).post("/api/v1/equipment", loadCellBody(assetId("LC")));
        as(TestAccounts.AUDITOR).post("/api/v1/equipment/" + id + "/retire",
                Map.of("retiredOn", TODAY.toString(), "reason", "not theirs to do"));

        assertThat(allEvents()).isEqualTo(before);
        assertThat(manager().get("/api/v1/equipment/" + id + "/calibrations").json()).hasSize(1);
        assertThat(manager().get("/api/v1/equipment/" + id).json().get("retiredOn").isNull()).isTrue();
    }

    private long allEvents() {
        long count = 0;
        long after = 0;
        while (true) {
            JsonNode page = manager().get("/api/v1/audit/events?limit=1000&after=" + after).json();
            count += page.get("events").size();
            if (page.get("nextAfter").isNull()) {
                return count;
            }
            after = page.get("nextAfter").asLong();
        }
    }
}
