package org.specimenledger.testing;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;
import static org.specimenledger.testing.TestRunFixtures.TODAY;
import static org.specimenledger.testing.TestRunFixtures.with;

import java.math.BigDecimal;
import java.util.List;
import java.util.Map;
import java.util.UUID;
import org.junit.jupiter.api.Test;
import org.specimenledger.testsupport.Api;
import tools.jackson.databind.JsonNode;

/** Re-analysis with other parameters, the current-analysis pointer, the flags shown with results, queries and CSV. */
class AnalysisApiTest extends TestRunTesting {

    @org.springframework.beans.factory.annotation.Autowired
    private org.springframework.transaction.support.TransactionTemplate transactions;

    private static List<String> codes(JsonNode analysis) {
        return analysis.get("flags").valueStream().map(f -> f.get("code").asString()).toList();
    }

    private static JsonNode flag(JsonNode analysis, String code) {
        return analysis.get("flags").valueStream().filter(f -> f.get("code").asString().equals(code)).findFirst()
                .orElseThrow(() -> new AssertionError("no flag " + code + " in " + analysis.get("flags")));
    }

    @Test
    void reanalysisAddsARunThatReplacesTheCurrentOneAndKeepsIt() {
        TestRunFixtures.Bench b = bench();
        String id = register(b);
        JsonNode first = uploaded(id, TestRunFixtures.curve(b)).get("analysis");
        String firstId = first.get("id").asString();

        assertProblem(manager().post("/api/v1/tests/" + id + "/analyses", Map.of("parameters",
                Map.of("proofOffsetsPercent", List.of(0.2, 1.0)))), 422, "/reason", "reason");
        assertProblem(manager().post("/api/v1/tests/" + id + "/analyses", Map.of("parameters",
                Map.of("offsetz", List.of(0.2)), "reason", "typo")), 422, "/parameters", "offsetz");

        Api.Response r = manager().post("/api/v1/tests/" + id + "/analyses", Map.of("parameters",
                Map.of("proofOffsetsPercent", List.of(0.2, 1.0)), "reason", "customer asks for Rp1 as well"));
        assertThat(r.status()).as(r.toString()).isEqualTo(201);
        JsonNode second = r.json();
        assertThat(second.get("sequence").asInt()).isEqualTo(2);
        assertThat(second.get("replacesId").asString()).isEqualTo(firstId);
        assertThat(second.get("reason").asString()).isEqualTo("customer asks for Rp1 as well");
        // Ramberg & Osgood 1943: Rp_x = sigma0.2 (x / 0.2)^(1/n) = 300 * 5^(1/10) = 352.3 MPa for x = 1 %
        assertThat(second.get("results").get("properties").get("Rp1").get("value").asDouble())
                .isCloseTo(300 * Math.pow(5, 0.1), within(1.0));
        // the parameters not asked for keep the run's defaults, including the calibration classes
        assertThat(second.get("parameters").get("uncertainty.forceClassPercent").asDouble()).isEqualTo(0.5);

        assertThat(technician().get("/api/v1/tests/" + id).json().get("currentAnalysisId").asString())
                .isEqualTo(second.get("id").asString());
        JsonNode all = technician().get("/api/v1/tests/" + id + "/analyses").json();
        assertThat(all.valueStream().map(a -> a.get("sequence").asInt())).containsExactly(1, 2);
        assertThat(all.get(0).get("results").get("properties").has("Rp1")).isFalse();

        JsonNode pointer = events("test-run", id).get(2);
        assertThat(pointer.get("action").asString()).isEqualTo("test-run.analysis-changed");
        assertThat(pointer.get("before").get("currentAnalysisId").asString()).isEqualTo(firstId);
        assertThat(pointer.get("reason").asString()).isEqualTo("customer asks for Rp1 as well");

        // pointing back at the first one is a change with a reason, and the replaced run replays as it was
        assertProblem(manager().put("/api/v1/tests/" + id + "/current-analysis", Map.of("analysisId", firstId)), 422,
                "/reason", "reason");
        assertProblem(manager().put("/api/v1/tests/" + id + "/current-analysis", Map.of("analysisId",
                UUID.randomUUID().toString(), "reason", "x")), 422, "/analysisId", "has no analysis");
        Api.Response back = manager().put("/api/v1/tests/" + id + "/current-analysis", Map.of("analysisId", firstId,
                "reason", "Rp1 withdrawn from the order"));
        assertThat(back.status()).as(back.toString()).isEqualTo(200);
        assertThat(technician().get("/api/v1/tests/" + id).json().get("currentAnalysisId").asString()).isEqualTo(firstId);
        assertThat(technician().post("/api/v1/analyses/" + second.get("id").asString() + "/replay", "")
                .json().get("identical").asBoolean()).isTrue();
    }

    @Test
    void replayListsEveryValueThatNoLongerReproducesNamingBothSoftwareVersions() {
        TestRunFixtures.Bench b = bench();
        String id = register(b);
        JsonNode analysis = uploaded(id, TestRunFixtures.curve(b)).get("analysis");
        String analysisId = analysis.get("id").asString();
        double rm = analysis.get("results").get("properties").get("Rm").get("value").asDouble();
        // an alteration behind the application's back, as the table owner who can switch the guard off: the
        // replay must find it
        transactions.executeWithoutResult(t -> {
            jdbc.sql("ALTER TABLE analysis_run DISABLE TRIGGER analysis_run_append_only").update();
            jdbc.sql("UPDATE analysis_run SET results = jsonb_set(results, '{properties,Rm,value}', '500.0'::jsonb) "
                    + "WHERE id = ?").param(UUID.fromString(analysisId)).update();
            jdbc.sql("ALTER TABLE analysis_run ENABLE TRIGGER analysis_run_append_only").update();
        });
        JsonNode replay = as("t-auditor").post("/api/v1/analyses/" + analysisId + "/replay", "").json();
        assertThat(replay.get("identical").asBoolean()).isFalse();
        assertThat(replay.get("inputFingerprintMatches").asBoolean()).isTrue();
        assertThat(replay.get("differenceCount").asInt()).isEqualTo(1);
        JsonNode difference = replay.get("differences").get(0);
        assertThat(difference.get("pointer").asString()).isEqualTo("/results/properties/Rm/value");
        assertThat(difference.get("stored").asDouble()).isEqualTo(500.0);
        assertThat(difference.get("replayed").asDouble()).isEqualTo(rm);
        assertThat(replay.get("stored").get("commit").asString()).isNotBlank();
        assertThat(replay.get("replayed").get("commit").asString()).isEqualTo(replay.get("stored").get("commit").asString());
        JsonNode event = events("analysis", analysisId).get(1);
        assertThat(event.get("action").asString()).isEqualTo("analysis.replayed");
        assertThat(event.get("after").get("identical").asBoolean()).isFalse();
    }

    @Test
    void reanalysisBeforeAnyCurveIsAConflict() {
        String id = register(bench());
        Api.Response r = manager().post("/api/v1/tests/" + id + "/analyses", Map.of("reason", "too early"));
        assertThat(r.status()).isEqualTo(409);
        assertThat(r.json().get("detail").asString()).contains("no raw curve yet");
        assertThat(manager().post("/api/v1/tests/" + UUID.randomUUID() + "/analyses", Map.of("reason", "x")).status())
                .isEqualTo(404);
    }

    @Test
    void conditionsOutsideTheStandardAreFlaggedWithTheResultsTheyConcern() {
        TestRunFixtures.Bench b = bench();
        // 40 °C is outside ISO 6892-1's 10–35 °C [M]; the synthetic curve runs at 0.00025 1/s throughout, so the
        // hardening phase is far below range 4 (0.0067 1/s ± 20 %) [M]
        String id = register(with(TestRunFixtures.registration(b), "temperatureC", new BigDecimal("40")));
        JsonNode analysis = uploaded(id, TestRunFixtures.curve(b)).get("analysis");
        assertThat(codes(analysis)).contains("TEMPERATURE_OUTSIDE_RANGE", "STRAIN_RATE_OUTSIDE_RANGE",
                "ELONGATION_FROM_EXTENSOMETER").doesNotContain("CALIBRATION_OVERRIDE", "FRACTURE_OUTSIDE_VALID_ZONE");
        assertThat(flag(analysis, "TEMPERATURE_OUTSIDE_RANGE").get("message").asString()).contains("40 °C")
                .contains("10–35 °C");
        JsonNode rate = flag(analysis, "STRAIN_RATE_OUTSIDE_RANGE");
        assertThat(rate.get("message").asString()).startsWith("HARDENING");
        assertThat(rate.get("properties").valueStream().map(JsonNode::asString)).contains("Rm", "A");
        assertThat(flag(analysis, "ELONGATION_FROM_EXTENSOMETER").get("properties").get(0).asString()).isEqualTo("A");
        assertThat(analysis.get("results").get("properties").get("A").get("reason").asString())
                .startsWith("from extensometer");

        // the broken pieces: Lu measured, fracture 5 mm from a gauge mark (less than L0/3): re-analysed, A comes
        // from the pieces and its position is flagged
        Map<String, Object> broken = Map.of("luMm", new BigDecimal("61.5"),
                "readings", Map.of("du", List.of(new BigDecimal("7.10"), new BigDecimal("7.14"))),
                "fractureDistanceMm", new BigDecimal("5"));
        Api.Response measured = technician().put("/api/v1/specimens/" + b.specimenId() + "/after-fracture", broken);
        assertThat(measured.status()).as(measured.toString()).isEqualTo(200);
        JsonNode again = manager().post("/api/v1/tests/" + id + "/analyses",
                Map.of("reason", "Lu and Su measured on the broken pieces")).json();
        assertThat(codes(again)).contains("FRACTURE_OUTSIDE_VALID_ZONE").doesNotContain("ELONGATION_FROM_EXTENSOMETER");
        assertThat(again.get("geometry").get("fractureZone").asString()).isEqualTo("OUTSIDE_MIDDLE_THIRD");
        // A = 100 (Lu - L0) / L0 = 100 (61.5 - 50) / 50 = 23 % (ISO 6892-1 definition)
        assertThat(again.get("results").get("properties").get("A").get("value").asDouble()).isCloseTo(23.0, within(1e-9));
        assertThat(again.get("results").get("properties").get("Z").get("status").asString()).isEqualTo("DETERMINED");

        // method B controls stress rate, not strain rate: no method A flag
        TestRunFixtures.Bench other = bench();
        String b2 = register(with(TestRunFixtures.registration(other), "method", "B"));
        assertThat(codes(uploaded(b2, TestRunFixtures.curve(other)).get("analysis")))
                .doesNotContain("STRAIN_RATE_OUTSIDE_RANGE", "TEMPERATURE_OUTSIDE_RANGE");
    }

    @Test
    void maximumForceBelowTheVerifiedPartOfTheRangeIsFlagged() {
        TestRunFixtures.Bench b = bench();
        // Fm of the model curve is about 32 kN; the 100 kN range is verified from 20 kN (20 %, ISO 7500-1 [M]),
        // so a stronger piece is fine and a weaker one is not: use a model at a tenth of the stress
        String id = register(b);
        byte[] weak = SyntheticCurves.labelled("weak " + b.labIdentifier(),
                SyntheticCurves.rambergOsgood(200_000, 30, 10, b.s0Mm2(), 50, 0.05, 2000));
        JsonNode analysis = uploaded(id, weak).get("analysis");
        assertThat(flag(analysis, "FORCE_OUTSIDE_CALIBRATED_RANGE").get("message").asString())
                .contains("below 20000 N");
    }

    @Test
    void resultsAreFoundBySpecimenHeatOrderAndDateAndExportedWithUnits() {
        TestRunFixtures.Bench b = bench();
        String id = register(b);
        String analysisId = uploaded(id, TestRunFixtures.curve(b)).get("analysis").get("id").asString();

        for (String query : List.of("specimenId=" + b.specimenId(), "heatId=" + b.heatId(), "orderId=" + b.orderId(),
                "orderId=" + b.orderId() + "&from=" + TODAY.minusDays(1) + "&to=" + TODAY.minusDays(1))) {
            JsonNode rows = technician().get("/api/v1/results?" + query).json().get("items");
            assertThat(rows).as(query).hasSize(1);
            JsonNode row = rows.get(0);
            assertThat(row.get("testRunId").asString()).isEqualTo(id);
            assertThat(row.get("analysisId").asString()).isEqualTo(analysisId);
            assertThat(row.get("labIdentifier").asString()).isEqualTo(b.labIdentifier());
            assertThat(row.get("properties").get("Rp0.2").get("reported").asString()).isEqualTo("300");
            assertThat(row.get("properties").get("Rp0.2").get("unit").asString()).isEqualTo("MPa");
        }
        assertThat(technician().get("/api/v1/results?orderId=" + b.orderId() + "&from=" + TODAY).json().get("items")).isEmpty();
        assertProblem(technician().get("/api/v1/results?from=" + TODAY + "&to=" + TODAY.minusDays(3)), 422, "from",
                "after its end");

        Api.Response csv = technician().get("/api/v1/results.csv?orderId=" + b.orderId());
        assertThat(csv.status()).isEqualTo(200);
        assertThat(csv.contentType()).startsWith("text/csv");
        String[] lines = csv.body().split("\r\n");
        assertThat(lines).hasSize(2);
        assertThat(lines[0]).startsWith("specimen,test run,test date,standard,mode,validity,analysis,")
                .contains(",Rp0.2 [MPa],").contains(",Fm [N],").contains(",A [%],").endsWith(",cycles,flags");
        List<String> header = List.of(lines[0].split(","));
        List<String> cells = List.of(lines[1].split(",", -1));
        assertThat(cells.get(0)).isEqualTo(b.labIdentifier());
        assertThat(cells.get(header.indexOf("Rp0.2 [MPa]"))).isEqualTo("300");
        assertThat(cells.get(header.indexOf("flags"))).contains("STRAIN_RATE_OUTSIDE_RANGE");

        // an invalidated run drops out unless asked for
        technician().post("/api/v1/tests/" + id + "/invalidate", Map.of("reason", "extensometer knife slipped"));
        assertThat(technician().get("/api/v1/results?specimenId=" + b.specimenId()).json().get("items")).isEmpty();
        assertThat(technician().get("/api/v1/results?specimenId=" + b.specimenId() + "&includeInvalid=true").json().get("items")
                .get(0).get("validity").asString()).isEqualTo("INVALID");
    }
}
