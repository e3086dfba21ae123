package org.specimenledger.specimens;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;
import static org.specimenledger.specimens.SpecimenFixtures.mm;
import static org.specimenledger.specimens.SpecimensApiTest.issue;

import java.util.List;
import java.util.Map;
import java.util.UUID;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.specimenledger.audit.LedgerQueries;
import org.specimenledger.testsupport.Api;
import org.specimenledger.testsupport.IntegrationTest;
import org.specimenledger.testsupport.TestAccounts;
import org.springframework.beans.factory.annotation.Autowired;
import tools.jackson.databind.JsonNode;

/** After-fracture measurements (Lu, Su, fracture position) and what other features read through the directory. */
class AfterFractureApiTest extends IntegrationTest {

    @Autowired
    private LedgerQueries ledger;

    @Autowired
    private SpecimenDirectory directory;

    private String heat;
    private String order;
    private String specimen;

    @BeforeEach
    void roundSpecimen() {
        heat = SpecimenFixtures.registerHeat(technician());
        order = SpecimenFixtures.order(as(TestAccounts.MANAGER), organisations.get(TestAccounts.CUSTOMER));
        specimen = technician().post("/api/v1/specimens",
                SpecimenFixtures.roundBar(SpecimenFixtures.mark(), heat, order)).id();
    }

    private Api technician() {
        return as(TestAccounts.TECHNICIAN);
    }

    private String path() {
        return "/api/v1/specimens/" + specimen + "/after-fracture";
    }

    @Test
    void firstRecordingNeedsNoReasonAndComputesSuLikeS0() {
        Api.Response r = technician().put(path(), SpecimenFixtures.brokenRound());
        assertThat(r.status()).as(r.toString()).isEqualTo(200);
        JsonNode after = r.json().get("afterFracture");
        // du = mean of 6.10, 6.14 = 6.12 → Su = π·6.12²/4 = 29.4166 mm² [S: ISO 6892-1 symbols and round formula]
        double du = (6.10 + 6.14) / 2;
        assertThat(after.get("meansMm").get("du").asDouble()).isEqualTo(du);
        assertThat(after.get("suMm2").asDouble()).isEqualTo(Math.PI * du * du / 4.0);
        assertThat(after.get("suMm2").asDouble()).isCloseTo(29.4166, within(0.0001));
        assertThat(after.get("suFormula").asString()).startsWith("Su = π·du²/4 = 29.4166 mm²");
        assertThat(after.get("luMm").asDouble()).isEqualTo(61.5);
        // 20 mm from the nearest mark ≥ L0/3 = 16.7 mm → inside the middle third [S: ISO 6892-1 via national adoption]
        assertThat(after.get("fractureZone").asString()).isEqualTo("INSIDE_MIDDLE_THIRD");
        assertThat(r.body()).contains("\"readings\":{\"du\":[6.10,6.14]}");

        JsonNode events = as(TestAccounts.MANAGER)
                .get("/api/v1/audit/events?entityType=specimen&entityId=" + specimen).json().get("events");
        assertThat(events).hasSize(2);
        JsonNode recorded = events.get(1);
        assertThat(recorded.get("action").asString()).isEqualTo("specimen.after-fracture-recorded");
        assertThat(recorded.get("reason").isNull()).isTrue();
        assertThat(recorded.get("before").get("afterFracture").isNull()).isTrue();
        assertThat(recorded.get("after").get("afterFracture").get("suMm2").asDouble())
                .isEqualTo(after.get("suMm2").asDouble());
        // the ledger holds exactly what the API shows, digits as given (10.00 stays 10.00)
        assertThat(recorded.get("after")).isEqualTo(technician().get("/api/v1/specimens/" + specimen).json());
        assertThat(recorded.get("canonical").asString()).contains("\"readings\":{\"du\":[6.10,6.14]}");
    }

    @Test
    void changingRecordedMeasurementsNeedsAReason() {
        technician().put(path(), SpecimenFixtures.brokenRound());
        Map<String, Object> again = SpecimenFixtures.brokenRound();
        again.put("luMm", mm("61.0"));
        again.remove("fractureDistanceMm");
        again.put("fractureZone", "OUTSIDE_MIDDLE_THIRD");
        Api.Response noReason = technician().put(path(), again);
        assertThat(noReason.status()).isEqualTo(422);
        assertThat(issue(noReason, "/reason").get("detail").asString())
                .isEqualTo("a change to a stored record needs a reason");

        again.put("reason", "pieces re-fitted, marks measured again");
        Api.Response changed = as(TestAccounts.MANAGER).put(path(), again);
        assertThat(changed.status()).as(changed.toString()).isEqualTo(200);
        assertThat(changed.json().get("afterFracture").get("luMm").asDouble()).isEqualTo(61.0);
        assertThat(changed.json().get("afterFracture").get("fractureZone").asString()).isEqualTo("OUTSIDE_MIDDLE_THIRD");
        assertThat(changed.json().get("afterFracture").get("fractureDistanceMm").isNull()).isTrue();

        JsonNode events = as(TestAccounts.MANAGER)
                .get("/api/v1/audit/events?entityType=specimen&entityId=" + specimen).json().get("events");
        assertThat(events).hasSize(3);
        JsonNode change = events.get(2);
        assertThat(change.get("action").asString()).isEqualTo("specimen.after-fracture-changed");
        assertThat(change.get("reason").asString()).isEqualTo("pieces re-fitted, marks measured again");
        assertThat(change.get("before").get("afterFracture").get("luMm").asDouble()).isEqualTo(61.5);
        assertThat(change.get("after").get("afterFracture").get("luMm").asDouble()).isEqualTo(61.0);
    }

    @Test
    void suLargerThanS0IsRefusedWithTheRuleNamed() {
        long events = ledger.count();
        Map<String, Object> body = SpecimenFixtures.brokenRound();
        body.put("readings", Map.of("du", List.of(mm("10.5"))));
        Api.Response r = technician().put(path(), body);
        assertThat(r.status()).isEqualTo(422);
        assertThat(issue(r, "/readings").get("detail").asString())
                .contains("is larger than S0 = 78.5922 mm²")
                .contains("Su ≤ S0, else Z = 100·(S0 − Su)/S0 would be negative");
        assertThat(ledger.count()).isEqualTo(events);
        assertThat(technician().get("/api/v1/specimens/" + specimen).json().get("afterFracture").isNull()).isTrue();
    }

    @Test
    void fractureReadingsAndPositionAreChecked() {
        Map<String, Object> body = SpecimenFixtures.brokenRound();
        body.put("readings", Map.of("d", List.of(mm("6.1")), "du", List.of(mm("0"))));
        body.put("fractureDistanceMm", mm("10"));
        body.put("fractureZone", "INSIDE_MIDDLE_THIRD");
        Api.Response r = technician().put(path(), body);
        assertThat(r.status()).isEqualTo(422);
        assertThat(issue(r, "/readings/d").get("detail").asString())
                .isEqualTo("a ROUND test piece has no dimension 'd'; give du");
        assertThat(issue(r, "/readings/du/0").get("detail").asString())
                .isEqualTo("reading 0 of du must be a positive finite number of mm, got 0");
        assertThat(issue(r, "/fractureZone").get("detail").asString())
                .contains("is OUTSIDE_MIDDLE_THIRD (L0/3 = 16.6667 mm), not INSIDE_MIDDLE_THIRD");

        body = SpecimenFixtures.brokenRound();
        body.put("fractureDistanceMm", mm("40"));
        assertThat(issue(technician().put(path(), body), "/fractureDistanceMm").get("detail").asString())
                .contains("when Lu/2 is 30.75 mm");
        body = SpecimenFixtures.brokenRound();
        body.remove("luMm");
        assertThat(issue(technician().put(path(), body), "/luMm").get("detail").asString()).isNotBlank();
        assertThat(technician().put("/api/v1/specimens/" + UUID.randomUUID() + "/after-fracture",
                SpecimenFixtures.brokenRound()).status()).isEqualTo(404);
    }

    @Test
    void registerDataCannotBeCorrectedOnceTested() {
        technician().put(path(), SpecimenFixtures.brokenRound());
        Map<String, Object> correction = SpecimenFixtures.roundBar(SpecimenFixtures.mark(), heat, order);
        correction.put("reason", "too late");
        Api.Response r = technician().put("/api/v1/specimens/" + specimen, correction);
        assertThat(r.status()).isEqualTo(409);
        assertThat(r.json().get("detail").asString()).contains("can no longer be corrected");
    }

    @Test
    void tubeAfterFractureUsesAuAndDu() {
        String tube = technician().post("/api/v1/specimens",
                SpecimenFixtures.tube(SpecimenFixtures.mark(), heat, order)).id();
        Api.Response r = technician().put("/api/v1/specimens/" + tube + "/after-fracture", Map.of(
                "luMm", mm("72"), "readings", Map.of("au", List.of(mm("1.6")), "Du", List.of(mm("18.4")))));
        assertThat(r.status()).as(r.toString()).isEqualTo(200);
        // Su = π·au·(Du − au) = π·1.6·16.8 [S: ISO 6892-1 tube formula]
        assertThat(r.json().get("afterFracture").get("suMm2").asDouble()).isEqualTo(Math.PI * 1.6 * (18.4 - 1.6));
    }

    @Test
    void directoryGivesOtherFeaturesTheGeometryAndTheOwner() {
        technician().put(path(), SpecimenFixtures.brokenRound());
        SpecimenView view = directory.find(UUID.fromString(specimen)).orElseThrow();
        double d = (10.00 + 10.01 + 10.00) / 3;
        assertThat(view.s0Mm2().doubleValue()).isEqualTo(Math.PI * d * d / 4.0);
        assertThat(view.l0Mm()).isEqualByComparingTo("50");
        assertThat(view.leMm()).isEqualByComparingTo("50");
        assertThat(view.lcMm()).isEqualByComparingTo("60");
        assertThat(view.luMm()).isEqualByComparingTo("61.5");
        double du = (6.10 + 6.14) / 2;
        assertThat(view.suMm2().doubleValue()).isEqualTo(Math.PI * du * du / 4.0);
        assertThat(view.heatId()).hasToString(heat);
        assertThat(view.orderId()).hasToString(order);
        assertThat(view.customerId()).hasToString(organisations.get(TestAccounts.CUSTOMER));
        assertThat(directory.find(UUID.randomUUID())).isEmpty();
        assertThat(directory.find(null)).isEmpty();
    }
}
