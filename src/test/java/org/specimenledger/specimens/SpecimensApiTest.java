package org.specimenledger.specimens;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;
import static org.specimenledger.specimens.SpecimenFixtures.mm;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Map;
import java.util.UUID;
import org.apache.commons.math3.stat.StatUtils;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.specimenledger.audit.LedgerQueries;
import org.specimenledger.testsupport.Api;
import org.specimenledger.testsupport.IntegrationTest;
import org.specimenledger.testsupport.TestAccounts;
import org.springframework.beans.factory.annotation.Autowired;
import tools.jackson.databind.JsonNode;

/** Registering, reading and correcting specimens over real HTTP on a real PostgreSQL. */
class SpecimensApiTest extends IntegrationTest {

    @Autowired
    private LedgerQueries ledger;

    private String heat;
    private String order;

    @BeforeEach
    void heatAndOrder() {
        heat = SpecimenFixtures.registerHeat(technician());
        order = SpecimenFixtures.order(manager(), organisations.get(TestAccounts.CUSTOMER));
    }

    private Api technician() {
        return as(TestAccounts.TECHNICIAN);
    }

    private Api manager() {
        return as(TestAccounts.MANAGER);
    }

    static JsonNode issue(Api.Response r, String pointer) {
        for (JsonNode e : r.json().get("errors")) {
            if (e.get("pointer").asString().equals(pointer)) {
                return e;
            }
        }
        throw new AssertionError("no issue at " + pointer + " in " + r);
    }

    private Api.Response refused(Map<String, Object> body) {
        long events = ledger.count();
        Api.Response r = technician().post("/api/v1/specimens", body);
        assertThat(r.status()).as(r.toString()).isEqualTo(422);
        assertThat(r.contentType()).startsWith("application/problem+json");
        assertThat(ledger.count()).as("a refused request writes no event").isEqualTo(events);
        assertThat(manager().get("/api/v1/specimens?labIdentifier=" + body.get("labIdentifier")).json()).isEmpty();
        return r;
    }

    @Test
    void roundSpecimenGetsS0FromTheMeanDiameterAndL0RoundedToFiftyMillimetres() {
        String mark = SpecimenFixtures.mark();
        Api.Response r = technician().post("/api/v1/specimens", SpecimenFixtures.roundBar(mark, heat, order));
        assertThat(r.status()).as(r.toString()).isEqualTo(201);
        JsonNode s = r.json();
        // S0 = π·d²/4 on the mean of 10.00, 10.01, 10.00 [S: ISO 6892-1 formula; CP: mean]; stored as the very double
        double mean = (10.00 + 10.01 + 10.00) / 3;
        assertThat(s.get("meansMm").get("d").asDouble()).isEqualTo(mean);
        assertThat(s.get("s0Mm2").asDouble()).isEqualTo(Math.PI * mean * mean / 4.0);
        double oracleMean = StatUtils.mean(new double[] {10.00, 10.01, 10.00});
        assertThat(s.get("s0Mm2").asDouble()).isCloseTo(Math.PI * oracleMean * oracleMean / 4, within(1e-10));
        assertThat(s.get("s0Formula").asString())
                .isEqualTo("S0 = π·d²/4 = 78.5922 mm², d = mean of 3 readings = 10.0033 mm");
        // L0 = 5.65·√78.59 = 50.09 → 50 mm [S: ISO 6892-1 rounding within 10 %]
        assertThat(s.get("l0Mm").asDouble()).isEqualTo(50.0);
        assertThat(s.get("gaugeLength").get("calculatedMm").asDouble()).isCloseTo(50.0885, within(0.0001));
        assertThat(s.get("gaugeLength").get("roundToFiveMm").asBoolean()).isTrue();
        assertThat(s.get("gaugeLength").get("rule").asString()).contains("rounded to 50 mm");
        // readings kept with the digits as given
        assertThat(r.body()).contains("\"readings\":{\"d\":[10.00,10.01,10.00]}");
        assertThat(s.get("customerId").asString()).isEqualTo(organisations.get(TestAccounts.CUSTOMER));
        assertThat(s.get("warnings")).isEmpty();
        assertThat(s.get("afterFracture").isNull()).isTrue();

        assertThat(as(TestAccounts.AUDITOR).get("/api/v1/specimens/" + r.id()).json().get("s0Mm2").asDouble())
                .isEqualTo(s.get("s0Mm2").asDouble());
    }

    @Test
    void flatAndTubeSpecimens() {
        Api.Response flat = technician().post("/api/v1/specimens",
                SpecimenFixtures.flat(SpecimenFixtures.mark(), heat, order));
        assertThat(flat.status()).as(flat.toString()).isEqualTo(201);
        // 12.5 × 3 → S0 = 37.5 mm², L0 = 5.65·√37.5 = 34.6 → 35 mm [S: ISO 6892-1]
        assertThat(flat.json().get("s0Mm2").asDouble()).isEqualTo(37.5);
        assertThat(flat.json().get("l0Mm").asDouble()).isEqualTo(35.0);
        assertThat(flat.json().get("s0Formula").asString()).startsWith("S0 = a·b = 37.5 mm²");

        Api.Response tube = technician().post("/api/v1/specimens",
                SpecimenFixtures.tube(SpecimenFixtures.mark(), heat, order));
        assertThat(tube.status()).as(tube.toString()).isEqualTo(201);
        // a = 2, D = 20 → S0 = π·2·18 = 113.097 mm² [S: ISO 6892-1 tube formula]; L0 = 5.65·√113.1 = 60.09 → 60 mm
        assertThat(tube.json().get("s0Mm2").asDouble()).isEqualTo(Math.PI * 2 * 18);
        assertThat(tube.json().get("l0Mm").asDouble()).isEqualTo(60.0);
        assertThat(tube.json().get("meansMm").get("D").asDouble()).isEqualTo(20.0);
    }

    @Test
    void otherShapeTakesS0DirectlyWithItsMethodAndAFixedGaugeLength() {
        Map<String, Object> body = SpecimenFixtures.roundBar(SpecimenFixtures.mark(), heat, order);
        body.put("shape", "OTHER");
        body.remove("readings");
        body.put("s0Mm2", mm("20.25"));
        body.put("s0Method", "mass, length and density of the wire sample");
        // ASTM E8M sheet-type piece: G = 50 mm [S]
        body.put("gaugeLength", Map.of("basis", "FIXED", "l0Mm", mm("50")));
        Api.Response r = technician().post("/api/v1/specimens", body);
        assertThat(r.status()).as(r.toString()).isEqualTo(201);
        assertThat(r.json().get("s0Mm2").asDouble()).isEqualTo(20.25);
        assertThat(r.json().get("s0Method").asString()).isEqualTo("mass, length and density of the wire sample");
        assertThat(r.json().get("l0Mm").asDouble()).isEqualTo(50.0);
        assertThat(r.json().get("gaugeLength").get("basis").asString()).isEqualTo("FIXED");
        assertThat(r.json().get("gaugeLength").get("k").isNull()).isTrue();
        assertThat(r.json().get("meansMm")).isEmpty();
    }

    @Test
    void roundingCanBeSwitchedOffAndKElevenThreeIsAccepted() {
        Map<String, Object> body = SpecimenFixtures.roundBar(SpecimenFixtures.mark(), heat, order);
        body.put("gaugeLength", SpecimenFixtures.proportional("11.30", false));
        body.put("lcMm", mm("120"));
        body.put("leMm", mm("100"));
        Api.Response r = technician().post("/api/v1/specimens", body);
        assertThat(r.status()).as(r.toString()).isEqualTo(201);
        JsonNode g = r.json().get("gaugeLength");
        assertThat(g.get("k").asDouble()).isEqualTo(11.3);
        assertThat(r.json().get("l0Mm").asDouble()).isEqualTo(g.get("calculatedMm").asDouble());
        assertThat(r.json().get("l0Mm").asDouble()).isCloseTo(100.177, within(0.001));
    }

    @Test
    void negativeDiameterIsRefusedNamingTheReading() {
        Map<String, Object> body = SpecimenFixtures.roundBar(SpecimenFixtures.mark(), heat, order);
        body.put("readings", Map.of("d", Arrays.asList(mm("10.0"), mm("-10.0"), null)));
        Api.Response r = refused(body);
        assertThat(issue(r, "/readings/d/1").get("detail").asString())
                .isEqualTo("reading 1 of d must be a positive finite number of mm, got -10.0");
        assertThat(issue(r, "/readings/d/2").get("detail").asString()).isEqualTo("a reading is required");
    }

    @Test
    void readingsMustMatchTheShape() {
        Map<String, Object> body = SpecimenFixtures.flat(SpecimenFixtures.mark(), heat, order);
        body.put("readings", Map.of("a", List.of(mm("3")), "d", List.of(mm("10"))));
        Api.Response r = refused(body);
        assertThat(issue(r, "/readings/d").get("detail").asString())
                .isEqualTo("a FLAT test piece has no dimension 'd'; give a and b");
        assertThat(issue(r, "/readings/b").get("detail").asString())
                .isEqualTo("at least one reading of b is required (mm)");

        Map<String, Object> other = SpecimenFixtures.roundBar(SpecimenFixtures.mark(), heat, order);
        other.put("shape", "OTHER");
        Api.Response o = refused(other);
        assertThat(issue(o, "/readings/d").get("detail").asString()).contains("an OTHER test piece has no readings");
        assertThat(issue(o, "/s0Mm2").get("detail").asString()).contains("needs S0 given directly");
        assertThat(issue(o, "/s0Method").get("detail").asString()).isEqualTo("say how S0 was determined");
    }

    @Test
    void tubeWallOfHalfTheOuterDiameterIsRefused() {
        Map<String, Object> body = SpecimenFixtures.tube(SpecimenFixtures.mark(), heat, order);
        body.put("readings", Map.of("a", List.of(mm("10")), "D", List.of(mm("20"))));
        Api.Response r = refused(body);
        assertThat(issue(r, "/readings/a").get("detail").asString())
                .contains("must be less than half the outer diameter D");
    }

    @Test
    void shortProportionalBelowFifteenMillimetresIsRefusedWithTheRuleNamed() {
        // d = 2 mm → S0 = 3.14 mm², 5.65·√S0 = 10.0 mm < 15 mm [S: ISO 6892-1]
        Map<String, Object> body = SpecimenFixtures.roundBar(SpecimenFixtures.mark(), heat, order);
        body.put("readings", Map.of("d", List.of(mm("2.00"))));
        Api.Response r = refused(body);
        assertThat(issue(r, "/gaugeLength/k").get("detail").asString())
                .startsWith("ISO 6892-1: with k = 5.65 the original gauge length must be at least 15 mm")
                .contains("use k = 11.3 or a fixed (non-proportional) gauge length");

        body.put("gaugeLength", SpecimenFixtures.proportional("6", true));
        assertThat(issue(refused(body), "/gaugeLength/k").get("detail").asString())
                .isEqualTo("k must be 5.65 or 11.3 (ISO 6892-1 proportional test pieces), got 6");
    }

    @Test
    void parallelLengthShorterThanL0IsRefusedAndShorterThanTheRecommendationIsAWarning() {
        Map<String, Object> body = SpecimenFixtures.roundBar(SpecimenFixtures.mark(), heat, order);
        body.put("lcMm", mm("45"));
        assertThat(issue(refused(body), "/lcMm").get("detail").asString())
                .isEqualTo("the parallel length Lc = 45 mm is shorter than L0 = 50 mm: the gauge marks must lie on the "
                        + "parallel length (Lc ≥ L0)");

        // Lc ≥ L0 + d/2 recommended for round pieces [M: ISO 6892-1]: 52 < 55.0 → stored with a warning
        body.put("lcMm", mm("52"));
        Api.Response r = technician().post("/api/v1/specimens", body);
        assertThat(r.status()).as(r.toString()).isEqualTo(201);
        assertThat(r.json().get("warnings")).hasSize(1);
        assertThat(r.json().get("warnings").get(0).asString()).contains("shorter than L0 + d/2 = 55.0017 mm");
    }

    @Test
    void unknownHeatAndOrderAreNamedTogether() {
        Map<String, Object> body = SpecimenFixtures.roundBar(SpecimenFixtures.mark(), UUID.randomUUID().toString(),
                UUID.randomUUID().toString());
        Api.Response r = refused(body);
        assertThat(issue(r, "/heatId").get("detail").asString()).startsWith("no heat with id ");
        assertThat(issue(r, "/orderId").get("detail").asString()).startsWith("no order with id ");
    }

    @Test
    void missingFieldsAndBadEnumsAreNamed() {
        Map<String, Object> body = SpecimenFixtures.roundBar(SpecimenFixtures.mark(), heat, order);
        body.remove("labIdentifier");
        body.remove("gaugeLength");
        body.put("leMm", mm("0"));
        Api.Response r = technician().post("/api/v1/specimens", body);
        assertThat(r.status()).isEqualTo(422);
        assertThat(r.body()).contains("/labIdentifier").contains("/gaugeLength").contains("/leMm");

        body = SpecimenFixtures.roundBar(SpecimenFixtures.mark(), heat, order);
        body.put("shape", "HEXAGON");
        Api.Response shape = technician().post("/api/v1/specimens", body);
        assertThat(shape.status()).isEqualTo(400);
        assertThat(issue(shape, "/shape").get("detail").asString()).contains("ROUND, FLAT, TUBE, OTHER");
    }

    @Test
    void labIdentifierIsUniqueIgnoringCase() {
        String mark = "lab-" + UUID.randomUUID();
        assertThat(technician().post("/api/v1/specimens", SpecimenFixtures.roundBar(mark, heat, order)).status())
                .isEqualTo(201);
        Api.Response again = technician().post("/api/v1/specimens",
                SpecimenFixtures.roundBar(mark.toUpperCase(), heat, order));
        assertThat(again.status()).isEqualTo(409);
        assertThat(issue(again, "/labIdentifier").get("detail").asString()).contains("is already registered");
    }

    @Test
    void correctionNeedsAReasonAndIsInTheLedgerWithBeforeAndAfter() {
        String mark = SpecimenFixtures.mark();
        Api.Response created = technician().post("/api/v1/specimens", SpecimenFixtures.roundBar(mark, heat, order));
        String id = created.id();
        Map<String, Object> body = SpecimenFixtures.roundBar(mark, heat, order);
        body.put("readings", Map.of("d", List.of(mm("10.02"), mm("10.02"))));
        Api.Response noReason = technician().put("/api/v1/specimens/" + id, body);
        assertThat(noReason.status()).isEqualTo(422);
        assertThat(issue(noReason, "/reason").get("detail").asString())
                .isEqualTo("a change to a stored record needs a reason");

        body.put("reason", "micrometer re-zeroed; diameter read again");
        Api.Response changed = manager().put("/api/v1/specimens/" + id, body);
        assertThat(changed.status()).as(changed.toString()).isEqualTo(200);
        assertThat(changed.json().get("meansMm").get("d").asDouble()).isEqualTo(10.02);

        JsonNode events = manager().get("/api/v1/audit/events?entityType=specimen&entityId=" + id).json()
                .get("events");
        assertThat(events).hasSize(2);
        assertThat(events.get(0).get("action").asString()).isEqualTo("specimen.registered");
        assertThat(events.get(0).get("before").isNull()).isTrue();
        assertThat(events.get(0).get("after").get("s0Mm2").asDouble())
                .isEqualTo(created.json().get("s0Mm2").asDouble());
        assertThat(events.get(1).get("action").asString()).isEqualTo("specimen.changed");
        assertThat(events.get(1).get("reason").asString()).isEqualTo("micrometer re-zeroed; diameter read again");
        assertThat(events.get(1).get("before").get("readings").get("d")).hasSize(3);
        assertThat(events.get(1).get("after").get("readings").get("d")).hasSize(2);
        assertThat(events.get(1).get("after").get("s0Mm2").asDouble())
                .isEqualTo(changed.json().get("s0Mm2").asDouble());

        String unknown = UUID.randomUUID().toString();
        assertThat(technician().put("/api/v1/specimens/" + unknown, body).status()).isEqualTo(404);
        assertThat(technician().get("/api/v1/specimens/" + unknown).status()).isEqualTo(404);
    }

    @Test
    void listFiltersByHeatOrderAndLabIdentifier() {
        String otherHeat = SpecimenFixtures.registerHeat(technician());
        String mark = SpecimenFixtures.mark();
        technician().post("/api/v1/specimens", SpecimenFixtures.roundBar(mark, heat, order));
        technician().post("/api/v1/specimens", SpecimenFixtures.flat(SpecimenFixtures.mark(), otherHeat, order));
        Api auditor = as(TestAccounts.AUDITOR);
        assertThat(auditor.get("/api/v1/specimens?heatId=" + heat).json()).hasSize(1);
        assertThat(auditor.get("/api/v1/specimens?orderId=" + order).json()).hasSize(2);
        assertThat(auditor.get("/api/v1/specimens?orderId=" + order + "&heatId=" + otherHeat).json()).hasSize(1);
        JsonNode byMark = auditor.get("/api/v1/specimens?labIdentifier=" + mark.toLowerCase()).json();
        assertThat(byMark).hasSize(1);
        assertThat(byMark.get(0).get("labIdentifier").asString()).isEqualTo(mark);
        assertThat(auditor.get("/api/v1/specimens?heatId=nonsense").status()).isEqualTo(400);
    }

    @Test
    void customerSeesOnlyTheirOwnOrganisationsSpecimens() {
        String own = technician().post("/api/v1/specimens",
                SpecimenFixtures.roundBar(SpecimenFixtures.mark(), heat, order)).id();
        String otherOrder = SpecimenFixtures.order(manager(), organisations.get(TestAccounts.OTHER_CUSTOMER));
        String foreign = technician().post("/api/v1/specimens",
                SpecimenFixtures.roundBar(SpecimenFixtures.mark(), heat, otherOrder)).id();

        Api customer = as(TestAccounts.CUSTOMER);
        assertThat(customer.get("/api/v1/specimens/" + own).status()).isEqualTo(200);
        Api.Response hidden = customer.get("/api/v1/specimens/" + foreign);
        assertThat(hidden.status()).isEqualTo(404);
        assertThat(hidden.contentType()).startsWith("application/problem+json");
        List<String> listed = new ArrayList<>();
        customer.get("/api/v1/specimens").json().forEach(s -> listed.add(s.get("id").asString()));
        assertThat(listed).contains(own).doesNotContain(foreign);
        assertThat(customer.get("/api/v1/specimens?orderId=" + otherOrder).json()).isEmpty();
        assertThat(as(TestAccounts.OTHER_CUSTOMER).get("/api/v1/specimens/" + foreign).status()).isEqualTo(200);
        assertThat(as(TestAccounts.OTHER_CUSTOMER).get("/api/v1/specimens/" + own).status()).isEqualTo(404);
    }

    @Test
    void roleMatrix() {
        List<String> users = List.of(TestAccounts.TECHNICIAN, TestAccounts.MANAGER, TestAccounts.AUDITOR,
                TestAccounts.CUSTOMER, TestAccounts.OTHER_CUSTOMER);
        Map<String, Integer> post = Map.of(TestAccounts.TECHNICIAN, 201, TestAccounts.MANAGER, 201,
                TestAccounts.AUDITOR, 403, TestAccounts.CUSTOMER, 403, TestAccounts.OTHER_CUSTOMER, 403);
        String id = null;
        for (String user : users) {
            String mark = SpecimenFixtures.mark();
            Api.Response r = as(user).post("/api/v1/specimens", SpecimenFixtures.roundBar(mark, heat, order));
            assertThat(r.status()).as("POST as " + user).isEqualTo(post.get(user));
            id = r.status() == 201 ? r.id() : id;
        }
        assertThat(anonymous().post("/api/v1/specimens",
                SpecimenFixtures.roundBar(SpecimenFixtures.mark(), heat, order)).status()).isEqualTo(401);

        for (String user : users) {
            assertThat(as(user).get("/api/v1/specimens").status()).as("GET list as " + user).isEqualTo(200);
        }
        assertThat(anonymous().get("/api/v1/specimens").status()).isEqualTo(401);

        Map<String, Integer> getOne = Map.of(TestAccounts.TECHNICIAN, 200, TestAccounts.MANAGER, 200,
                TestAccounts.AUDITOR, 200, TestAccounts.CUSTOMER, 200, TestAccounts.OTHER_CUSTOMER, 404);
        for (String user : users) {
            assertThat(as(user).get("/api/v1/specimens/" + id).status()).as("GET one as " + user)
                    .isEqualTo(getOne.get(user));
        }
        assertThat(anonymous().get("/api/v1/specimens/" + id).status()).isEqualTo(401);

        Map<String, Object> correction = SpecimenFixtures.roundBar("RM-" + UUID.randomUUID(), heat, order);
        correction.put("reason", "role matrix");
        Map<String, Integer> put = Map.of(TestAccounts.AUDITOR, 403, TestAccounts.CUSTOMER, 403,
                TestAccounts.OTHER_CUSTOMER, 403, TestAccounts.TECHNICIAN, 200, TestAccounts.MANAGER, 200);
        for (String user : List.of(TestAccounts.AUDITOR, TestAccounts.CUSTOMER, TestAccounts.OTHER_CUSTOMER,
                TestAccounts.TECHNICIAN, TestAccounts.MANAGER)) {
            assertThat(as(user).put("/api/v1/specimens/" + id, correction).status()).as("PUT as " + user)
                    .isEqualTo(put.get(user));
        }
        assertThat(anonymous().put("/api/v1/specimens/" + id, correction).status()).isEqualTo(401);

        Map<String, Object> broken = SpecimenFixtures.brokenRound();
        broken.put("reason", "role matrix");
        Map<String, Integer> fracture = Map.of(TestAccounts.AUDITOR, 403, TestAccounts.CUSTOMER, 403,
                TestAccounts.OTHER_CUSTOMER, 403, TestAccounts.TECHNICIAN, 200, TestAccounts.MANAGER, 200);
        for (String user : List.of(TestAccounts.AUDITOR, TestAccounts.CUSTOMER, TestAccounts.OTHER_CUSTOMER,
                TestAccounts.TECHNICIAN, TestAccounts.MANAGER)) {
            assertThat(as(user).put("/api/v1/specimens/" + id + "/after-fracture", broken).status())
                    .as("PUT after-fracture as " + user).isEqualTo(fracture.get(user));
        }
        assertThat(anonymous().put("/api/v1/specimens/" + id + "/after-fracture", broken).status()).isEqualTo(401);
    }
}
