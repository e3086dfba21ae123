package org.specimenledger.testing;

import java.time.LocalDate;
import java.time.OffsetDateTime;
import java.time.ZoneOffset;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.UUID;
import org.specimenledger.specimens.SpecimenFixtures;
import org.specimenledger.testsupport.Api;
import org.specimenledger.testsupport.TestRunBodies;

/**
 * An invented laboratory bench for the test-run tests: a specimen on a new heat and order, a testing machine
 * with its load cell (10 kN class 1, 100 kN class 0.5) and a 50 mm class 1 extensometer, each calibrated two
 * months ago and due in ten — all registered through the real API. Dates are relative to today (UTC).
 */
final class TestRunFixtures {

    static final LocalDate TODAY = LocalDate.now(ZoneOffset.UTC);

    private TestRunFixtures() {
    }

    /** The records one test run needs. */
    record Bench(String specimenId, String labIdentifier, String heatId, String orderId, String machineId,
            String transducerId, String extensometerId, double s0Mm2) {
    }

    static Bench bench(Api technician, Api manager, String customerId) {
        String heat = SpecimenFixtures.registerHeat(technician);
        String order = SpecimenFixtures.order(manager, customerId);
        String mark = SpecimenFixtures.mark();
        Api.Response specimen = technician.post("/api/v1/specimens", SpecimenFixtures.roundBar(mark, heat, order));
        check(specimen, 201);
        String transducer = instrument(manager, loadCell());
        calibrate(manager, transducer, Map.of("classes", List.of(Map.of("rangeN", 10000, "accuracyClass", "1"),
                Map.of("rangeN", 100000, "accuracyClass", "0.5"))));
        String machine = instrument(manager, machine(List.of(transducer)));
        calibrate(manager, machine, Map.of());
        String extensometer = instrument(manager, extensometer(50));
        calibrate(manager, extensometer, Map.of("accuracyClass", "1"));
        return new Bench(specimen.id(), mark, heat, order, machine, transducer, extensometer,
                specimen.json().get("s0Mm2").asDouble());
    }

    /** A registration body for the bench: 100 kN range, ISO 6892-1 method A1, 21.5 °C, yesterday at 10:00 +01:00. */
    static Map<String, Object> registration(Bench b) {
        Map<String, Object> m = TestRunBodies.registration(b.specimenId(), b.machineId(), b.transducerId(),
                b.extensometerId());
        m.put("remarks", "grips checked before the run");
        return m;
    }

    static OffsetDateTime testedAt() {
        return TestRunBodies.testedAt();
    }

    static Map<String, Object> with(Map<String, Object> body, String key, Object value) {
        Map<String, Object> m = new HashMap<>(body);
        m.put(key, value);
        return m;
    }

    /** A Ramberg–Osgood curve for the bench specimen: E 200 GPa, σ0.2 = 300 MPa, n = 10, to 5 % strain. */
    static byte[] curve(Bench b) {
        return SyntheticCurves.labelled("specimen: " + b.labIdentifier(),
                SyntheticCurves.rambergOsgood(200_000, 300, 10, b.s0Mm2(), 50, 0.05, 2000));
    }

    static String instrument(Api manager, Map<String, Object> body) {
        Api.Response r = manager.post("/api/v1/equipment", body);
        check(r, 201);
        return r.id();
    }

    /** Records a calibration made 60 days ago, due in 300 days, with the kind-specific class fields given. */
    static String calibrate(Api manager, String instrumentId, Map<String, Object> classes) {
        return calibrate(manager, instrumentId, TODAY.minusDays(60), TODAY.plusDays(300), classes);
    }

    static String calibrate(Api manager, String instrumentId, LocalDate on, LocalDate due,
            Map<String, Object> classes) {
        Map<String, Object> body = new HashMap<>(classes);
        body.put("calibratedOn", on.toString());
        body.put("dueOn", due.toString());
        body.put("calibratingBody", "Invented Calibration Service");
        body.put("certificateReference", "CAL-" + UUID.randomUUID().toString().substring(0, 8));
        Api.Response r = manager.post("/api/v1/equipment/" + instrumentId + "/calibrations", body);
        check(r, 201);
        return r.id();
    }

    static Map<String, Object> loadCell() {
        Map<String, Object> m = new HashMap<>();
        m.put("assetId", asset("LC"));
        m.put("kind", "FORCE_TRANSDUCER");
        m.put("description", "Load cell of the 100 kN frame");
        m.put("forceRanges", List.of(Map.of("upperLimitN", 10000), Map.of("upperLimitN", 100000)));
        return m;
    }

    static Map<String, Object> machine(List<String> transducers) {
        Map<String, Object> m = new HashMap<>();
        m.put("assetId", asset("TM"));
        m.put("kind", "TESTING_MACHINE");
        m.put("description", "Electromechanical frame, 100 kN");
        m.put("builtInTransducerIds", transducers);
        return m;
    }

    static Map<String, Object> extensometer(int gaugeLengthMm) {
        Map<String, Object> m = new HashMap<>();
        m.put("assetId", asset("EX"));
        m.put("kind", "EXTENSOMETER");
        m.put("description", "Clip-on extensometer");
        m.put("gaugeLengthMm", gaugeLengthMm);
        return m;
    }

    static String asset(String prefix) {
        return prefix + "-" + UUID.randomUUID().toString().substring(0, 8);
    }

    static void check(Api.Response r, int status) {
        if (r.status() != status) {
            throw new IllegalStateException("expected " + status + ", got " + r);
        }
    }
}
