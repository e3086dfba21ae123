package org.specimenledger.customers;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;
import java.util.Map;
import java.util.UUID;
import org.junit.jupiter.api.Test;
import org.specimenledger.testsupport.Api;
import org.specimenledger.testsupport.IntegrationTest;
import org.specimenledger.testsupport.TestAccounts;

class CustomersApiTest extends IntegrationTest {

    private static Map<String, Object> requirement(String property, Object min, Object max, String unit) {
        var m = new java.util.HashMap<String, Object>();
        m.put("property", property);
        m.put("min", min);
        m.put("max", max);
        m.put("unit", unit);
        return m;
    }

    private Api manager() {
        return as(TestAccounts.MANAGER);
    }

    @Test
    void managerRegistersCustomerAndOrderWithRequirements() {
        Api.Response customer = manager().post("/api/v1/customers",
                Map.of("name", "Girder Works " + UUID.randomUUID(), "address", "Quay 4"));
        assertThat(customer.status()).isEqualTo(201);

        Api.Response order = manager().post("/api/v1/customers/" + customer.id() + "/orders", Map.of(
                "purchaseOrder", "PO-1", "materialSpecification", "EN 10025-2 S355J2+N",
                "requirements", List.of(requirement("ReH", 355, null, "MPa"), requirement("Rm", 470, 630, "MPa"),
                        requirement("A", 22, null, "%"))));
        assertThat(order.status()).as(order.toString()).isEqualTo(201);
        assertThat(order.json().get("requirements")).hasSize(3);

        Api.Response read = as(TestAccounts.TECHNICIAN).get("/api/v1/orders/" + order.id());
        assertThat(read.status()).isEqualTo(200);
        assertThat(read.json().get("requirements").get(1).get("max").asInt()).isEqualTo(630);
    }

    @Test
    void orderChoosesUsCustomaryReportingWithLimitsInKsi() {
        String customer = manager().post("/api/v1/customers",
                Map.of("name", "Prairie Span " + UUID.randomUUID(), "address", "Dock 9")).id();
        Api.Response order = manager().post("/api/v1/customers/" + customer + "/orders", Map.of(
                "purchaseOrder", "PO-US-1", "materialSpecification", "ASTM A572 Grade 50",
                "reportingUnits", "SI_AND_US_CUSTOMARY",
                "requirements", List.of(requirement("ReH", 50, null, "ksi"), requirement("Rm", 65, null, "ksi"),
                        requirement("Fm", 20, null, "kip"))));
        assertThat(order.status()).as(order.toString()).isEqualTo(201);
        assertThat(order.json().get("reportingUnits").asText()).isEqualTo("SI_AND_US_CUSTOMARY");
        assertThat(order.json().get("requirements").get(0).get("unit").asText()).isEqualTo("ksi");

        Api.Response plain = manager().post("/api/v1/customers/" + customer + "/orders", Map.of(
                "purchaseOrder", "PO-SI-1", "materialSpecification", "EN 10025-2 S355J2+N",
                "requirements", List.of(requirement("ReH", 355, null, "MPa"))));
        assertThat(plain.json().get("reportingUnits").asText()).as("SI when not chosen").isEqualTo("SI");

        Api.Response wrong = manager().post("/api/v1/customers/" + customer + "/orders", Map.of(
                "purchaseOrder", "PO-US-2", "materialSpecification", "spec", "reportingUnits", "IMPERIAL",
                "requirements", List.of(requirement("ReH", 50, null, "ksi"))));
        assertThat(wrong.status()).isEqualTo(400);
        assertThat(wrong.body()).contains("reportingUnits");
        Api.Response badUnit = manager().post("/api/v1/customers/" + customer + "/orders", Map.of(
                "purchaseOrder", "PO-US-3", "materialSpecification", "spec",
                "requirements", List.of(requirement("A", 20, null, "ksi"))));
        assertThat(badUnit.status()).isEqualTo(422);
        assertThat(badUnit.body()).contains("/requirements/0/unit");
    }

    @Test
    void requirementWithMinAboveMaxIsRefusedNamingTheField() {
        String customer = manager().post("/api/v1/customers",
                Map.of("name", "Upside Down " + UUID.randomUUID(), "address", "x")).id();
        Api.Response r = manager().post("/api/v1/customers/" + customer + "/orders", Map.of(
                "purchaseOrder", "PO-2", "materialSpecification", "spec",
                "requirements", List.of(requirement("Rm", 630, 470, "MPa"), requirement("Xy", 1, null, "MPa"))));
        assertThat(r.status()).isEqualTo(422);
        assertThat(r.contentType()).startsWith("application/problem+json");
        assertThat(r.body()).contains("/requirements/0/min").contains("min 630 is above max 470")
                .contains("/requirements/1/property");
        assertThat(manager().get("/api/v1/orders?customerId=" + customer).json()).isEmpty();
    }

    @Test
    void duplicateCustomerNameIsAConflict() {
        String name = "Twin Forge " + UUID.randomUUID();
        assertThat(manager().post("/api/v1/customers", Map.of("name", name, "address", "a")).status()).isEqualTo(201);
        Api.Response again = manager().post("/api/v1/customers", Map.of("name", name.toUpperCase(), "address", "b"));
        assertThat(again.status()).isEqualTo(409);
        assertThat(again.body()).contains("/name");
    }

    @Test
    void changeWithoutReasonIsRefused() {
        String id = manager().post("/api/v1/customers", Map.of("name", "No Reason " + UUID.randomUUID(),
                "address", "a")).id();
        Api.Response r = manager().put("/api/v1/customers/" + id, Map.of("name", "Renamed " + UUID.randomUUID(),
                "address", "b"));
        assertThat(r.status()).isEqualTo(422);
        assertThat(r.body()).contains("/reason");
    }

    @Test
    void customerSeesOwnOrganisationAndGets404ForAnother() {
        String own = organisations.get(TestAccounts.CUSTOMER);
        String other = organisations.get(TestAccounts.OTHER_CUSTOMER);
        Api customer = as(TestAccounts.CUSTOMER);
        assertThat(customer.get("/api/v1/customers/" + own).status()).isEqualTo(200);
        assertThat(customer.get("/api/v1/customers/" + other).status()).isEqualTo(404);
        assertThat(customer.get("/api/v1/customers").json()).hasSize(1);
        String otherOrder = manager().post("/api/v1/customers/" + other + "/orders", Map.of(
                "purchaseOrder", "PO-" + UUID.randomUUID(), "materialSpecification", "spec",
                "requirements", List.of())).id();
        assertThat(customer.get("/api/v1/orders/" + otherOrder).status()).isEqualTo(404);
        assertThat(as(TestAccounts.OTHER_CUSTOMER).get("/api/v1/orders/" + otherOrder).status()).isEqualTo(200);
    }

    @Test
    void malformedJsonIsA400Problem() {
        Api.Response r = manager().postRaw("/api/v1/customers", "{\"name\": \"x\", ");
        assertThat(r.status()).isEqualTo(400);
        assertThat(r.contentType()).startsWith("application/problem+json");
        Api.Response unknown = manager().postRaw("/api/v1/customers", "{\"name\":\"x\",\"address\":\"y\",\"colour\":1}");
        assertThat(unknown.status()).isEqualTo(400);
        assertThat(unknown.body()).contains("colour");
    }
}
