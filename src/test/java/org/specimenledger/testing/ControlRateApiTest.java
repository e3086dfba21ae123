package org.specimenledger.testing;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import tools.jackson.databind.JsonNode;

/**
 * The method B and ASTM rate checks stored with the results and shown as flags. The curve is the Ramberg–Osgood
 * record of {@link TestRunFixtures#curve} run at a constant 0.00025 s⁻¹, so its elastic stress rate is
 * E·ε̇ = 200 000 MPa × 0.00025 s⁻¹ = 50 MPa/s (closed form of the model's linear part,
 * measured over the modulus fit window, where the plastic term of the model is negligible: 1 %).
 */
class ControlRateApiTest extends TestRunTesting {

    private JsonNode analysed(String standard, String method) {
        TestRunFixtures.Bench b = bench();
        var body = TestRunFixtures.with(TestRunFixtures.registration(b), "standard", standard);
        body = TestRunFixtures.with(body, "method", method);
        if (!standard.startsWith("ISO")) {
            body = TestRunFixtures.with(body, "standardReference", "ASTM E8/E8M-22");
        }
        return uploaded(register(body), TestRunFixtures.curve(b)).get("analysis");
    }

    private static List<String> codes(JsonNode analysis) {
        List<String> out = new ArrayList<>();
        analysis.get("flags").forEach(f -> out.add(f.get("code").asString()));
        return out;
    }

    @Test
    void methodBRunGetsItsStressRateCheckedAgainstTheHighModulusRange() {
        JsonNode a = analysed("ISO_6892_1", "B");
        JsonNode rates = a.get("results").get("controlRates");
        assertThat(rates).hasSize(3);
        JsonNode elastic = rates.get(0);
        assertThat(elastic.get("rule").asString()).isEqualTo("ISO 6892-1 method B, elastic range (E ≥ 150 GPa)");
        assertThat(elastic.get("unit").asString()).isEqualTo("MPa/s");
        assertThat(elastic.get("measured").asDouble()).isCloseTo(50, within(0.5));
        assertThat(elastic.get("withinRange").asBoolean()).isTrue();
        assertThat(rates.get(1).get("status").asString()).isEqualTo("NOT_APPLICABLE");
        assertThat(rates.get(2).get("withinRange").asBoolean()).as("0.00025 s⁻¹ ≤ 0.008 s⁻¹").isTrue();
        assertThat(codes(a)).doesNotContain(ResultFlag.STRESS_RATE_OUTSIDE_RANGE, ResultFlag.STRAIN_RATE_OUTSIDE_RANGE);
    }

    @Test
    void astmRunIsFlaggedForTheTensileStrengthRateButNotUpToYieldWhereTheStrainRateIsInRange() {
        JsonNode a = analysed("ASTM_E8M", null);
        JsonNode rates = a.get("results").get("controlRates");
        assertThat(rates).hasSize(3);
        assertThat(rates.get(0).get("withinRange").asBoolean()).as("50 MPa/s above 1.15–11.5 MPa/s").isFalse();
        assertThat(rates.get(1).get("withinRange").asBoolean()).as("0.00025 s⁻¹ in 0.00015–0.00035 s⁻¹").isTrue();
        assertThat(rates.get(2).get("withinRange").asBoolean()).as("0.00025 s⁻¹ below 0.000833 s⁻¹").isFalse();
        assertThat(codes(a)).containsOnlyOnce(ResultFlag.STRAIN_RATE_OUTSIDE_RANGE)
                .doesNotContain(ResultFlag.STRESS_RATE_OUTSIDE_RANGE);
        JsonNode replay = manager().post("/api/v1/analyses/" + a.get("id").asString() + "/replay", java.util.Map.of())
                .json();
        assertThat(replay.get("identical").asBoolean()).as(replay.toString()).isTrue();
    }

    @Test
    void methodARunsKeepTheirResultsWithoutControlRates() {
        JsonNode a = analysed("ISO_6892_1", "A1");
        assertThat(a.get("results").has("controlRates")).isFalse();
    }
}
