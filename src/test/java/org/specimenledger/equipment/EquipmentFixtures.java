package org.specimenledger.equipment;

import java.math.BigDecimal;
import java.time.Instant;
import java.time.LocalDate;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.UUID;

/** Requests and records of an invented laboratory's instruments, for the equipment tests. */
final class EquipmentFixtures {

    private EquipmentFixtures() {
    }

    static String assetId(String prefix) {
        return prefix + "-" + UUID.randomUUID().toString().substring(0, 8);
    }

    /** A load cell with two ranges, 10 kN and 100 kN, lower limits left to their default. */
    static EquipmentRequests.InstrumentRequest loadCell(String assetId) {
        return new EquipmentRequests.InstrumentRequest(assetId, InstrumentKind.FORCE_TRANSDUCER,
                "Load cell in the 100 kN frame", "Invented Maker", "Model One", "SN-0001", "Hall B",
                List.of(range("10000", null), range("100000", null)), null, null, null, null);
    }

    static EquipmentRequests.InstrumentRequest clipOnExtensometer(String assetId) {
        return new EquipmentRequests.InstrumentRequest(assetId, InstrumentKind.EXTENSOMETER,
                "Clip-on extensometer", null, null, null, null, null, new BigDecimal("50"), new BigDecimal("10"),
                null, null);
    }

    static EquipmentRequests.ForceRangeRequest range(String upper, String lower) {
        return new EquipmentRequests.ForceRangeRequest(new BigDecimal(upper), lower == null ? null
                : new BigDecimal(lower));
    }

    static EquipmentRequests.CalibrationRequest extensometerCalibration(LocalDate on, LocalDate due, String cls) {
        return new EquipmentRequests.CalibrationRequest(on, due, "Invented Calibration Service", "EXT-" + on,
                cls, null, null);
    }

    static EquipmentRequests.CalibrationRequest loadCellCalibration(LocalDate on, LocalDate due,
            EquipmentRequests.RangeClassRequest... classes) {
        return new EquipmentRequests.CalibrationRequest(on, due, "Invented Calibration Service", "LC-" + on,
                null, List.of(classes), null);
    }

    static EquipmentRequests.RangeClassRequest rangeClass(String rangeN, String cls) {
        return new EquipmentRequests.RangeClassRequest(new BigDecimal(rangeN), cls);
    }

    static List<ForceRange> loadCellRanges() {
        return List.of(new ForceRange(new BigDecimal("10000"), new BigDecimal("2000")),
                new ForceRange(new BigDecimal("100000"), new BigDecimal("20000")));
    }

    /** A standing calibration record made on {@code on}, due on {@code due}, recorded at {@code recordedAt}. */
    static CalibrationView calibration(String reference, LocalDate on, LocalDate due, Instant recordedAt) {
        return new CalibrationView(UUID.randomUUID(), UUID.randomUUID(), on, due, "Invented Calibration Service",
                reference, "1", List.of(), recordedAt, null, null);
    }

    static CalibrationView withdrawn(CalibrationView c, String reason) {
        return new CalibrationView(c.id(), c.equipmentId(), c.calibratedOn(), c.dueOn(), c.calibratingBody(),
                c.certificateReference(), c.accuracyClass(), c.rangeClasses(), c.recordedAt(),
                c.recordedAt().plusSeconds(60), reason);
    }

    // JSON bodies for the HTTP tests

    static Map<String, Object> loadCellBody(String assetId) {
        Map<String, Object> m = new HashMap<>();
        m.put("assetId", assetId);
        m.put("kind", "FORCE_TRANSDUCER");
        m.put("description", "Load cell in the 100 kN frame");
        m.put("maker", "Invented Maker");
        m.put("model", "Model One");
        m.put("serialNumber", "SN-0001");
        m.put("location", "Hall B");
        m.put("forceRanges", List.of(Map.of("upperLimitN", 10000), Map.of("upperLimitN", 100000,
                "lowerLimitN", 10000)));
        return m;
    }

    static Map<String, Object> extensometerBody(String assetId) {
        Map<String, Object> m = new HashMap<>();
        m.put("assetId", assetId);
        m.put("kind", "EXTENSOMETER");
        m.put("description", "Clip-on extensometer, 50 mm");
        m.put("gaugeLengthMm", 50);
        m.put("travelMm", 10);
        return m;
    }

    static Map<String, Object> machineBody(String assetId, List<String> transducers) {
        Map<String, Object> m = new HashMap<>();
        m.put("assetId", assetId);
        m.put("kind", "TESTING_MACHINE");
        m.put("description", "Electromechanical frame, 100 kN");
        m.put("location", "Hall B");
        m.put("builtInTransducerIds", transducers);
        return m;
    }

    static Map<String, Object> calibrationBody(LocalDate on, LocalDate due, String reference) {
        Map<String, Object> m = new HashMap<>();
        m.put("calibratedOn", on.toString());
        m.put("dueOn", due.toString());
        m.put("calibratingBody", "Invented Calibration Service");
        m.put("certificateReference", reference);
        return m;
    }

    static Map<String, Object> loadCellCalibrationBody(LocalDate on, LocalDate due, String reference) {
        Map<String, Object> m = calibrationBody(on, due, reference);
        m.put("classes", List.of(Map.of("rangeN", 10000, "accuracyClass", "1"),
                Map.of("rangeN", 100000, "accuracyClass", "0.5")));
        return m;
    }

    static Map<String, Object> with(Map<String, Object> body, String key, Object value) {
        Map<String, Object> m = new HashMap<>(body);
        m.put(key, value);
        return m;
    }
}
