package org.specimenledger.certificates;

import java.math.BigDecimal;
import java.time.LocalDate;
import java.time.ZoneOffset;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.UUID;
import org.specimenledger.specimens.SpecimenFixtures;
import org.specimenledger.testsupport.Api;
import org.specimenledger.testsupport.TestRunBodies;

/**
 * An invented bench for the certificate tests, registered through the real API: one heat (20 mm bar), an order
 * with the given requirements, a calibrated 100 kN frame, load cell and 50 mm class 1 extensometer, and round
 * specimens each pulled once with a Ramberg–Osgood curve (E 200 GPa, σ0.2 = 300 MPa, n = 10, to 5 % strain), so
 * the analysis reports Rp0.2 ≈ 300 MPa and Rm ≈ 413 MPa (the stress at 5 % strain of that model).
 */
public final class CertificateBench {

    static final LocalDate TODAY = LocalDate.now(ZoneOffset.UTC);

    private final Api technician;
    private final Api manager;
    private final String machine;
    private final String transducer;
    private final String extensometer;

    /** The records one certificate needs. */
    public record Order(String orderId, String heatId, List<String> specimenIds, List<String> marks) {
    }

    public CertificateBench(Api technician, Api manager) {
        this.technician = technician;
        this.manager = manager;
        transducer = create(manager, "/api/v1/equipment", Map.of("assetId", asset("LC"), "kind", "FORCE_TRANSDUCER",
                "description", "Load cell of the 100 kN frame",
                "forceRanges", List.of(Map.of("upperLimitN", 10000), Map.of("upperLimitN", 100000))));
        calibrate(transducer, Map.of("classes", List.of(Map.of("rangeN", 10000, "accuracyClass", "1"),
                Map.of("rangeN", 100000, "accuracyClass", "0.5"))));
        machine = create(manager, "/api/v1/equipment", Map.of("assetId", asset("TM"), "kind", "TESTING_MACHINE",
                "description", "Electromechanical frame, 100 kN", "builtInTransducerIds", List.of(transducer)));
        calibrate(machine, Map.of());
        extensometer = create(manager, "/api/v1/equipment", Map.of("assetId", asset("EX"), "kind", "EXTENSOMETER",
                "description", "Clip-on extensometer", "gaugeLengthMm", 50));
        calibrate(extensometer, Map.of("accuracyClass", "1"));
    }

    /** The bench's testing machine, force transducer and extensometer (ids), for forms that choose them. */
    public String machineId() {
        return machine;
    }

    public String transducerId() {
        return transducer;
    }

    public String extensometerId() {
        return extensometer;
    }

    /** A requirement body: property, min, max (either may be null), unit. */
    public static Map<String, Object> requirement(String property, String min, String max, String unit) {
        Map<String, Object> r = new HashMap<>();
        r.put("property", property);
        r.put("min", min == null ? null : new BigDecimal(min));
        r.put("max", max == null ? null : new BigDecimal(max));
        r.put("unit", unit);
        return r;
    }

    /** An order of {@code customerId} with {@code requirements} and {@code count} tested specimens. */
    public Order order(String customerId, List<Map<String, Object>> requirements, int count) {
        return order(customerId, requirements, count, "SI");
    }

    /** The same, with the order's choice of printed unit systems ({@code SI}, {@code US_CUSTOMARY}, ...). */
    public Order order(String customerId, List<Map<String, Object>> requirements, int count, String reportingUnits) {
        String heat = SpecimenFixtures.registerHeat(technician);
        String order = create(manager, "/api/v1/customers/" + customerId + "/orders", Map.of(
                "purchaseOrder", "PO-" + UUID.randomUUID(), "materialSpecification", "EN 10025-2 S355J2+N",
                "receivedOn", TODAY.minusDays(5).toString(), "requirements", requirements,
                "reportingUnits", reportingUnits));
        List<String> specimens = new ArrayList<>();
        List<String> marks = new ArrayList<>();
        for (int i = 0; i < count; i++) {
            String mark = SpecimenFixtures.mark();
            Api.Response s = technician.post("/api/v1/specimens", SpecimenFixtures.roundBar(mark, heat, order));
            check(s, 201);
            String run = create(technician, "/api/v1/tests", registration(s.id()));
            byte[] curve = curve(mark, s.json().get("s0Mm2").asDouble());
            check(technician.putBytes("/api/v1/tests/" + run + "/curve", "text/csv", curve), 201);
            specimens.add(s.id());
            marks.add(mark);
        }
        return new Order(order, heat, specimens, marks);
    }

    /**
     * Ramberg–Osgood ε = σ/E + 0.002·(σ/σ0.2)^n (Ramberg &amp; Osgood 1943) with E = 200 GPa, σ0.2 = 300 MPa, n = 10, to
     * 5 % strain, then fracture; pulled at the ISO 6892-1 method A rates [M, DOMAIN.md]: 0.00025 s⁻¹ up to just
     * past Rp0.2 (ε = 0.36 %), 0.0067 s⁻¹ after it, so no strain-rate flag blocks a verdict.
     */
    static byte[] curve(String mark, double s0Mm2) {
        StringBuilder csv = new StringBuilder("# specimen: " + mark + "\ntime [s],force [kN],extension [mm]\n");
        int points = 2000;
        double maxStrain = 0.05;
        double knee = 0.0036;
        double t = 0;
        for (int i = 0; i < points; i++) {
            double strain = maxStrain * i / (points - 1);
            t = strain <= knee ? strain / 0.00025 : knee / 0.00025 + (strain - knee) / 0.0067;
            csv.append(String.format(java.util.Locale.ROOT, "%.6f,%.9f,%.9f%n", t,
                    stressAt(strain) * s0Mm2 / 1000.0, strain * 50));
        }
        double last = maxStrain * 50;
        csv.append(String.format(java.util.Locale.ROOT, "%.6f,%.9f,%.9f%n", t + 0.1, 0.02 * 300 * s0Mm2 / 1000.0,
                last + 0.001));
        csv.append(String.format(java.util.Locale.ROOT, "%.6f,%.9f,%.9f%n", t + 0.2, 0.0, last + 0.002));
        return csv.toString().getBytes(java.nio.charset.StandardCharsets.UTF_8);
    }

    /** Inverts the Ramberg–Osgood strain by bisection. */
    static double stressAt(double strain) {
        double lo = 0;
        double hi = 200_000 * strain + 1;
        for (int k = 0; k < 200; k++) {
            double mid = (lo + hi) / 2;
            if (mid / 200_000 + 0.002 * Math.pow(mid / 300, 10) < strain) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        return (lo + hi) / 2;
    }

    /** A draft body for the order's specimens. */
    static Map<String, Object> draft(Order o, List<String> specimens, String rule, boolean curves) {
        Map<String, Object> m = new HashMap<>();
        m.put("orderId", o.orderId());
        m.put("specimenIds", specimens);
        m.put("decisionRule", rule);
        m.put("productDescription", "Hot-rolled round bar, 20 mm");
        m.put("includeCurves", curves);
        return m;
    }

    private Map<String, Object> registration(String specimenId) {
        return TestRunBodies.registration(specimenId, machine, transducer, extensometer);
    }

    private void calibrate(String instrument, Map<String, Object> classes) {
        Map<String, Object> body = new HashMap<>(classes);
        body.put("calibratedOn", TODAY.minusDays(60).toString());
        body.put("dueOn", TODAY.plusDays(300).toString());
        body.put("calibratingBody", "Invented Calibration Service");
        body.put("certificateReference", "CAL-" + UUID.randomUUID().toString().substring(0, 8));
        create(manager, "/api/v1/equipment/" + instrument + "/calibrations", body);
    }

    private static String create(Api api, String path, Map<String, Object> body) {
        Api.Response r = api.post(path, body);
        check(r, 201);
        return r.id();
    }

    private static String asset(String prefix) {
        return prefix + "-" + UUID.randomUUID().toString().substring(0, 8);
    }

    static void check(Api.Response r, int status) {
        if (r.status() != status) {
            throw new IllegalStateException("expected " + status + ", got " + r);
        }
    }
}
