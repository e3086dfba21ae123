package org.specimenledger.specimens;

import java.math.BigDecimal;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.UUID;
import org.specimenledger.testsupport.Api;

/** Request bodies and small set-ups for the heats and specimens tests: an invented bar mill, its heats and pieces. */
public final class SpecimenFixtures {

    private SpecimenFixtures() {
    }

    public static BigDecimal mm(String value) {
        return new BigDecimal(value);
    }

    public static Map<String, Object> heat(String producer, String heatNumber) {
        Map<String, Object> body = new HashMap<>();
        body.put("heatNumber", heatNumber);
        body.put("producer", producer);
        body.put("grade", "S355J2+N");
        body.put("productForm", "BAR");
        body.put("nominalThicknessMm", mm("20"));
        body.put("composition", Map.of("Mn", mm("1.45"), "C", mm("0.18"), "Si", mm("0.35")));
        return body;
    }

    /** Registers a heat of a new invented producer; returns its id. */
    public static String registerHeat(Api lab) {
        Api.Response r = lab.post("/api/v1/heats", heat("Northbank Rolling " + UUID.randomUUID(), "H-" + UUID.randomUUID()));
        if (r.status() != 201) {
            throw new IllegalStateException("could not register a heat: " + r);
        }
        return r.id();
    }

    /** Places an order for the customer; returns its id. */
    public static String order(Api manager, String customerId) {
        Api.Response r = manager.post("/api/v1/customers/" + customerId + "/orders", Map.of(
                "purchaseOrder", "PO-" + UUID.randomUUID(), "materialSpecification", "EN 10025-2 S355J2+N",
                "requirements", List.of()));
        if (r.status() != 201) {
            throw new IllegalStateException("could not place an order: " + r);
        }
        return r.id();
    }

    public static String mark() {
        return "SP-" + UUID.randomUUID();
    }

    public static Map<String, Object> proportional(String k, Boolean roundToFiveMm) {
        Map<String, Object> g = new HashMap<>();
        g.put("basis", "PROPORTIONAL");
        g.put("k", mm(k));
        if (roundToFiveMm != null) {
            g.put("roundToFiveMm", roundToFiveMm);
        }
        return g;
    }

    private static Map<String, Object> base(String mark, String heatId, String orderId, String shape) {
        Map<String, Object> body = new HashMap<>();
        body.put("labIdentifier", mark);
        body.put("heatId", heatId);
        body.put("orderId", orderId);
        body.put("orientation", "LONGITUDINAL");
        body.put("samplingPosition", "mid-radius, bar end A");
        body.put("shape", shape);
        body.put("gaugeLength", proportional("5.65", null));
        body.put("leMm", mm("50"));
        body.put("lcMm", mm("60"));
        return body;
    }

    /** A machined round piece, d read three times around 10 mm. */
    public static Map<String, Object> roundBar(String mark, String heatId, String orderId) {
        Map<String, Object> body = base(mark, heatId, orderId, "ROUND");
        body.put("readings", Map.of("d", List.of(mm("10.00"), mm("10.01"), mm("10.00"))));
        return body;
    }

    /** A 12.5 × 3 mm flat piece. */
    public static Map<String, Object> flat(String mark, String heatId, String orderId) {
        Map<String, Object> body = base(mark, heatId, orderId, "FLAT");
        body.put("readings", Map.of("a", List.of(mm("3.00"), mm("3.00")), "b", List.of(mm("12.50"))));
        body.put("leMm", mm("25"));
        body.put("lcMm", mm("45"));
        return body;
    }

    /** A full tube, wall 2 mm, outer diameter 20 mm. */
    public static Map<String, Object> tube(String mark, String heatId, String orderId) {
        Map<String, Object> body = base(mark, heatId, orderId, "TUBE");
        body.put("readings", Map.of("a", List.of(mm("2.0")), "D", List.of(mm("20.0"))));
        body.put("lcMm", mm("80"));
        return body;
    }

    /** After fracture of the round bar: du twice, Lu, fracture 20 mm from the nearest mark. */
    public static Map<String, Object> brokenRound() {
        Map<String, Object> body = new HashMap<>();
        body.put("luMm", mm("61.5"));
        body.put("readings", Map.of("du", List.of(mm("6.10"), mm("6.14"))));
        body.put("fractureDistanceMm", mm("20"));
        return body;
    }
}
