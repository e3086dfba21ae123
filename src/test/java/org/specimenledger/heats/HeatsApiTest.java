package org.specimenledger.heats;

import static org.assertj.core.api.Assertions.assertThat;
import static org.specimenledger.specimens.SpecimenFixtures.mm;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.UUID;
import org.junit.jupiter.api.Test;
import org.specimenledger.specimens.SpecimenFixtures;
import org.specimenledger.testsupport.Api;
import org.specimenledger.testsupport.IntegrationTest;
import org.specimenledger.testsupport.TestAccounts;
import tools.jackson.databind.JsonNode;

class HeatsApiTest extends IntegrationTest {

    private Api technician() {
        return as(TestAccounts.TECHNICIAN);
    }

    private Api manager() {
        return as(TestAccounts.MANAGER);
    }

    private static String producer() {
        return "Eastfield Steel " + UUID.randomUUID();
    }

    private static List<String> fieldNames(JsonNode object) {
        List<String> names = new ArrayList<>();
        object.properties().forEach(e -> names.add(e.getKey()));
        return names;
    }

    private static JsonNode issue(Api.Response r, String pointer) {
        for (JsonNode e : r.json().get("errors")) {
            if (e.get("pointer").asString().equals(pointer)) {
                return e;
            }
        }
        throw new AssertionError("no issue at " + pointer + " in " + r);
    }

    @Test
    void technicianRegistersHeatAndCompositionComesBackInAtomicOrder() {
        Api.Response r = technician().post("/api/v1/heats", SpecimenFixtures.heat(producer(), "A-1001"));
        assertThat(r.status()).as(r.toString()).isEqualTo(201);
        assertThat(r.json().get("grade").asString()).isEqualTo("S355J2+N");
        assertThat(r.json().get("productForm").asString()).isEqualTo("BAR");
        // C (6), Si (14), Mn (25): order of atomic number; digits as given
        assertThat(fieldNames(r.json().get("composition"))).containsExactly("C", "Si", "Mn");
        assertThat(r.body()).contains("\"Mn\":1.45").contains("\"C\":0.18");

        Api.Response read = as(TestAccounts.AUDITOR).get("/api/v1/heats/" + r.id());
        assertThat(read.status()).isEqualTo(200);
        assertThat(read.json().get("heatNumber").asString()).isEqualTo("A-1001");
    }

    @Test
    void heatNumberIsUniquePerProducerIgnoringCase() {
        String producer = producer();
        assertThat(technician().post("/api/v1/heats", SpecimenFixtures.heat(producer, "b-77")).status()).isEqualTo(201);
        Api.Response again = technician().post("/api/v1/heats", SpecimenFixtures.heat(producer.toUpperCase(), "B-77"));
        assertThat(again.status()).isEqualTo(409);
        assertThat(again.contentType()).startsWith("application/problem+json");
        assertThat(issue(again, "/heatNumber").get("detail").asString()).contains("already has a heat numbered 'B-77'");
        // another producer may use the same number
        assertThat(technician().post("/api/v1/heats", SpecimenFixtures.heat(producer(), "B-77")).status())
                .isEqualTo(201);
    }

    @Test
    void compositionIsCheckedAgainstThePeriodicTableAndTheHundredPercentLimit() {
        String producer = producer();
        Map<String, Object> body = SpecimenFixtures.heat(producer, "C-1");
        body.put("composition", Map.of("Xx", mm("0.1"), "MN", mm("1.2"), "Cr", mm("101"), "Fe", mm("98")));
        Api.Response r = technician().post("/api/v1/heats", body);
        assertThat(r.status()).isEqualTo(422);
        assertThat(r.contentType()).startsWith("application/problem+json");
        assertThat(issue(r, "/composition/Xx").get("detail").asString())
                .isEqualTo("'Xx' is not a chemical element symbol");
        assertThat(issue(r, "/composition/MN").get("detail").asString()).contains("did you mean 'Mn'?");
        assertThat(issue(r, "/composition/Cr").get("detail").asString())
                .isEqualTo("mass % of Cr must lie between 0 and 100, got 101");

        body.put("composition", Map.of("Fe", mm("98.5"), "C", mm("0.8"), "Mn", mm("1.2")));
        Api.Response sum = technician().post("/api/v1/heats", body);
        assertThat(sum.status()).isEqualTo(422);
        assertThat(issue(sum, "/composition").get("detail").asString())
                .isEqualTo("the mass percentages add up to 100.5 %, more than 100 %");
        // refused requests leave no row
        assertThat(manager().get("/api/v1/heats?producer=" + producer.replace(" ", "%20")).json()).isEmpty();
    }

    @Test
    void missingAndMalformedFieldsAreNamed() {
        Map<String, Object> body = SpecimenFixtures.heat(producer(), "D-1");
        body.remove("heatNumber");
        body.put("nominalThicknessMm", mm("-3"));
        Api.Response r = technician().post("/api/v1/heats", body);
        assertThat(r.status()).isEqualTo(422);
        assertThat(r.body()).contains("/heatNumber").contains("/nominalThicknessMm");

        body = SpecimenFixtures.heat(producer(), "D-2");
        body.put("productForm", "BILLET");
        Api.Response form = technician().post("/api/v1/heats", body);
        assertThat(form.status()).isEqualTo(400);
        assertThat(issue(form, "/productForm").get("detail").asString())
                .contains("PLATE, BAR, TUBE, SHEET, WIRE, CASTING, OTHER");
    }

    @Test
    void changeNeedsAReasonAndIsInTheLedgerWithBeforeAndAfter() {
        Api.Response created = technician().post("/api/v1/heats", SpecimenFixtures.heat(producer(), "E-1"));
        String id = created.id();
        Map<String, Object> body = SpecimenFixtures.heat(created.text("producer"), "E-1");
        body.put("grade", "S355J2+N (corrected)");
        Api.Response noReason = technician().put("/api/v1/heats/" + id, body);
        assertThat(noReason.status()).isEqualTo(422);
        assertThat(issue(noReason, "/reason").get("detail").asString())
                .isEqualTo("a change to a stored record needs a reason");

        body.put("reason", "mill certificate reissued");
        Api.Response changed = manager().put("/api/v1/heats/" + id, body);
        assertThat(changed.status()).as(changed.toString()).isEqualTo(200);
        assertThat(changed.text("grade")).isEqualTo("S355J2+N (corrected)");

        JsonNode events = manager().get("/api/v1/audit/events?entityType=heat&entityId=" + id).json().get("events");
        assertThat(events).hasSize(2);
        assertThat(events.get(0).get("action").asString()).isEqualTo("heat.registered");
        assertThat(events.get(0).get("before").isNull()).isTrue();
        assertThat(events.get(0).get("after").get("grade").asString()).isEqualTo("S355J2+N");
        assertThat(events.get(1).get("after")).isEqualTo(manager().get("/api/v1/heats/" + id).json());
        assertThat(events.get(0).get("actor").asString()).isEqualTo(TestAccounts.TECHNICIAN);
        assertThat(events.get(1).get("action").asString()).isEqualTo("heat.changed");
        assertThat(events.get(1).get("reason").asString()).isEqualTo("mill certificate reissued");
        assertThat(events.get(1).get("before").get("grade").asString()).isEqualTo("S355J2+N");
        assertThat(events.get(1).get("after").get("grade").asString()).isEqualTo("S355J2+N (corrected)");
        assertThat(events.get(1).get("after").get("composition").get("Mn").decimalValue()).isEqualByComparingTo("1.45");
    }

    @Test
    void changeToAnotherHeatsNumberIsAConflictAndUnknownIdsAre404() {
        String producer = producer();
        technician().post("/api/v1/heats", SpecimenFixtures.heat(producer, "F-1"));
        String second = technician().post("/api/v1/heats", SpecimenFixtures.heat(producer, "F-2")).id();
        Map<String, Object> body = SpecimenFixtures.heat(producer, "f-1");
        body.put("reason", "typo");
        assertThat(technician().put("/api/v1/heats/" + second, body).status()).isEqualTo(409);
        String unknown = UUID.randomUUID().toString();
        assertThat(technician().put("/api/v1/heats/" + unknown, body).status()).isEqualTo(404);
        assertThat(technician().get("/api/v1/heats/" + unknown).status()).isEqualTo(404);
        assertThat(technician().get("/api/v1/heats/not-a-uuid").status()).isEqualTo(400);
    }

    @Test
    void listFiltersByProducerAndHeatNumberIgnoringCase() {
        String producer = producer();
        technician().post("/api/v1/heats", SpecimenFixtures.heat(producer, "G-1"));
        technician().post("/api/v1/heats", SpecimenFixtures.heat(producer, "G-2"));
        String query = producer.toUpperCase().replace(" ", "%20");
        assertThat(as(TestAccounts.AUDITOR).get("/api/v1/heats?producer=" + query).json()).hasSize(2);
        JsonNode one = as(TestAccounts.AUDITOR).get("/api/v1/heats?producer=" + query + "&heatNumber=g-2").json();
        assertThat(one).hasSize(1);
        assertThat(one.get(0).get("heatNumber").asString()).isEqualTo("G-2");
    }

    @Test
    void roleMatrix() {
        String producer = producer();
        Map<String, Integer> post = Map.of(TestAccounts.TECHNICIAN, 201, TestAccounts.MANAGER, 201,
                TestAccounts.AUDITOR, 403, TestAccounts.CUSTOMER, 403);
        String id = null;
        for (var e : post.entrySet()) {
            Api.Response r = as(e.getKey()).post("/api/v1/heats", SpecimenFixtures.heat(producer, "R-" + e.getKey()));
            assertThat(r.status()).as("POST as " + e.getKey()).isEqualTo(e.getValue());
            if (r.status() == 201) {
                id = r.id();
            }
        }
        assertThat(anonymous().post("/api/v1/heats", SpecimenFixtures.heat(producer, "R-anon")).status()).isEqualTo(401);

        for (String user : List.of(TestAccounts.TECHNICIAN, TestAccounts.MANAGER, TestAccounts.AUDITOR,
                TestAccounts.CUSTOMER)) {
            assertThat(as(user).get("/api/v1/heats").status()).as("GET list as " + user).isEqualTo(200);
        }
        assertThat(anonymous().get("/api/v1/heats").status()).isEqualTo(401);

        Map<String, Integer> getOne = Map.of(TestAccounts.TECHNICIAN, 200, TestAccounts.MANAGER, 200,
                TestAccounts.AUDITOR, 200, TestAccounts.CUSTOMER, 404);
        for (var e : getOne.entrySet()) {
            assertThat(as(e.getKey()).get("/api/v1/heats/" + id).status()).as("GET one as " + e.getKey())
                    .isEqualTo(e.getValue());
        }
        assertThat(anonymous().get("/api/v1/heats/" + id).status()).isEqualTo(401);

        Map<String, Object> change = SpecimenFixtures.heat(producer, "R-changed");
        change.put("reason", "role matrix");
        Map<String, Integer> put = Map.of(TestAccounts.AUDITOR, 403, TestAccounts.CUSTOMER, 403,
                TestAccounts.TECHNICIAN, 200, TestAccounts.MANAGER, 200);
        for (String user : List.of(TestAccounts.AUDITOR, TestAccounts.CUSTOMER, TestAccounts.TECHNICIAN,
                TestAccounts.MANAGER)) {
            assertThat(as(user).put("/api/v1/heats/" + id, change).status()).as("PUT as " + user)
                    .isEqualTo(put.get(user));
        }
        assertThat(anonymous().put("/api/v1/heats/" + id, change).status()).isEqualTo(401);
    }

    @Test
    void customerSeesOnlyHeatsOfTheirOwnSpecimens() {
        String heat = SpecimenFixtures.registerHeat(technician());
        String unused = SpecimenFixtures.registerHeat(technician());
        String order = SpecimenFixtures.order(manager(), organisations.get(TestAccounts.CUSTOMER));
        Api.Response specimen = technician().post("/api/v1/specimens",
                SpecimenFixtures.roundBar(SpecimenFixtures.mark(), heat, order));
        assertThat(specimen.status()).as(specimen.toString()).isEqualTo(201);

        Api customer = as(TestAccounts.CUSTOMER);
        assertThat(customer.get("/api/v1/heats/" + heat).status()).isEqualTo(200);
        assertThat(customer.get("/api/v1/heats/" + unused).status()).isEqualTo(404);
        List<String> listed = new ArrayList<>();
        customer.get("/api/v1/heats").json().forEach(h -> listed.add(h.get("id").asString()));
        assertThat(listed).contains(heat).doesNotContain(unused);

        Api other = as(TestAccounts.OTHER_CUSTOMER);
        assertThat(other.get("/api/v1/heats/" + heat).status()).isEqualTo(404);
        List<String> otherListed = new ArrayList<>();
        other.get("/api/v1/heats").json().forEach(h -> otherListed.add(h.get("id").asString()));
        assertThat(otherListed).doesNotContain(heat, unused);
    }
}
