package org.specimenledger.equipment;

import static org.assertj.core.api.Assertions.assertThat;
import static org.specimenledger.equipment.EquipmentFixtures.assetId;
import static org.specimenledger.equipment.EquipmentFixtures.loadCellBody;
import static org.specimenledger.equipment.EquipmentFixtures.loadCellCalibrationBody;
import static org.specimenledger.equipment.EquipmentFixtures.with;

import java.time.LocalDate;
import java.time.ZoneOffset;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.function.Function;
import org.junit.jupiter.api.Test;
import org.specimenledger.testsupport.Api;
import org.specimenledger.testsupport.IntegrationTest;
import org.specimenledger.testsupport.TestAccounts;

/**
 * The role matrix of every equipment endpoint: the lab manager writes; technician, manager and auditor
 * read; customers get 403 everywhere (equipment is laboratory-internal); nobody signed in gets 401.
 * The bodies are valid, so a refusal can only come from the role.
 */
class EquipmentAccessTest extends IntegrationTest {

    private static final LocalDate TODAY = LocalDate.now(ZoneOffset.UTC);
    private static final List<String> NOT_MANAGER = List.of(TestAccounts.TECHNICIAN, TestAccounts.AUDITOR,
            TestAccounts.CUSTOMER, TestAccounts.OTHER_CUSTOMER);

    private record Endpoint(String name, boolean write, Function<Api, Api.Response> call) {
    }

    @Test
    void everyEndpointAnswersEachRoleAsTheMatrixSays() {
        Api manager = as(TestAccounts.MANAGER);
        String asset = assetId("LC");
        String id = manager.post("/api/v1/equipment", loadCellBody(asset)).id();
        String base = "/api/v1/equipment/" + id;
        String cal = manager.post(base + "/calibrations",
                loadCellCalibrationBody(TODAY.minusDays(2), TODAY.plusMonths(6), "M-" + asset)).id();

        List<Endpoint> endpoints = new ArrayList<>();
        endpoints.add(new Endpoint("POST /equipment", true, a -> a.post("/api/v1/equipment",
                loadCellBody(assetId("LC")))));
        endpoints.add(new Endpoint("GET /equipment", false, a -> a.get("/api/v1/equipment?kind=FORCE_TRANSDUCER")));
        endpoints.add(new Endpoint("GET /equipment/{id}", false, a -> a.get(base)));
        endpoints.add(new Endpoint("PUT /equipment/{id}", true, a -> a.put(base,
                with(loadCellBody(asset), "reason", "matrix"))));
        endpoints.add(new Endpoint("POST /equipment/{id}/calibrations", true, a -> a.post(base + "/calibrations",
                loadCellCalibrationBody(TODAY.minusDays(1), TODAY.plusMonths(6), "M2-" + asset))));
        endpoints.add(new Endpoint("GET /equipment/{id}/calibrations", false, a -> a.get(base + "/calibrations")));
        endpoints.add(new Endpoint("POST /equipment/{id}/calibrations/{calId}/withdraw", true,
                a -> a.post(base + "/calibrations/" + cal + "/withdraw", Map.of("reason", "matrix"))));
        endpoints.add(new Endpoint("GET /equipment/{id}/calibration-on", false,
                a -> a.get(base + "/calibration-on?date=" + TODAY)));
        // last: a retired instrument would refuse the calibration above
        endpoints.add(new Endpoint("POST /equipment/{id}/retire", true, a -> a.post(base + "/retire",
                Map.of("retiredOn", TODAY.toString(), "reason", "matrix"))));

        Map<String, Integer> wrong = new LinkedHashMap<>();
        for (Endpoint e : endpoints) {
            expect(wrong, e.name() + " anonymous", e.call().apply(anonymous()), 401);
            for (String role : NOT_MANAGER) {
                boolean customer = role.startsWith("t-customer");
                int expected = e.write() || customer ? 403 : 200;
                expect(wrong, e.name() + " " + role, e.call().apply(as(role)), expected);
            }
            expect(wrong, e.name() + " " + TestAccounts.MANAGER, e.call().apply(manager),
                    e.name().startsWith("POST /equipment") && !e.name().endsWith("withdraw")
                            && !e.name().endsWith("retire") ? 201 : 200);
        }
        assertThat(wrong).as("endpoint and role → status actually returned").isEmpty();
    }

    private static void expect(Map<String, Integer> wrong, String what, Api.Response r, int expected) {
        if (r.status() != expected) {
            wrong.put(what + " (expected " + expected + ")", r.status());
        }
        if (r.status() == 403) {
            assertThat(r.contentType()).as(what).startsWith("application/problem+json");
        }
    }
}
