package org.specimenledger.testing;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.specimenledger.testsupport.Api;
import tools.jackson.databind.JsonNode;

/**
 * An uploaded record whose extensometer was taken off before fracture: the crosshead channel carries the
 * extension on, the flags say which properties came from it, and the replay reproduces it bit for bit.
 */
class RealRecordUploadTest extends TestRunTesting {

    /** A frame of 500 kN/mm (invented value): C = 2·10⁻⁶ mm/N. */
    private static final double C = 2e-6;

    @Test
    void extensometerRemovedAt2PercentIsContinuedFromTheCrossheadAndFlagged() {
        TestRunFixtures.Bench b = bench();
        String id = register(b);
        byte[] file = SyntheticCurves.labelled("specimen: " + b.labIdentifier(),
                SyntheticCurves.rambergOsgoodExtensometerRemoved(200_000, 300, 10, b.s0Mm2(), 50, 0.05, 2000, 0.02, C));

        JsonNode analysis = uploaded(id, file).get("analysis");

        JsonNode properties = analysis.get("results").get("properties");
        // Ramberg & Osgood 1943: Rp0.2 = σ0.2 = 300 MPa (from the extensometer part), 1 MPa as in TestRunFlowTest
        assertThat(properties.get("Rp0.2").get("value").asDouble()).isCloseTo(300.0, within(1.0));
        // the record ends at 5 % strain before the fracture drop: At = 5 % of Le, taken from the crosshead with
        // C·F removed (crosshead = extension + C·F, a spring in series); 0.01 % covers the file's rounding
        assertThat(properties.get("At").get("value").asDouble()).isCloseTo(5.0, within(0.01));
        assertThat(properties.get("At").get("evidence").get("extensionSource").asString()).contains("crosshead");
        JsonNode flag = flag(analysis, ResultFlag.EXTENSION_FROM_CROSSHEAD);
        assertThat(flag.get("message").asString()).contains("elastic part of both channels");
        assertThat(flag.get("properties").valueStream().map(JsonNode::asString)).contains("At", "Agt");
        assertThat(analysis.get("input").get("readerWarnings").get(0).asString()).contains("extension cells end");

        Api.Response replay = as("t-auditor").post("/api/v1/analyses/" + analysis.get("id").asString() + "/replay", "");
        assertThat(replay.status()).as(replay.toString()).isEqualTo(200);
        assertThat(replay.json().get("identical").asBoolean()).as(replay.toString()).isTrue();
    }

    @Test
    void complianceSettingIsAcceptedAsAParameterAndStored() {
        TestRunFixtures.Bench b = bench();
        String id = register(b);
        byte[] file = SyntheticCurves.labelled("specimen: " + b.labIdentifier() + " (setting)",
                SyntheticCurves.rambergOsgoodExtensometerRemoved(200_000, 300, 10, b.s0Mm2(), 50, 0.05, 2000, 0.02, C));
        JsonNode first = uploaded(id, file).get("analysis");
        assertThat(first.get("parameters").get("machineComplianceMmPerN").isNull()).isTrue();

        Api.Response again = technician().post("/api/v1/tests/" + id + "/analyses",
                java.util.Map.of("reason", "compliance from the frame's verification", "parameters",
                        java.util.Map.of("machineComplianceMmPerN", C)));
        assertThat(again.status()).as(again.toString()).isEqualTo(201);
        JsonNode second = again.json();
        assertThat(second.get("parameters").get("machineComplianceMmPerN").asDouble()).isEqualTo(C);
        assertThat(flag(second, ResultFlag.EXTENSION_FROM_CROSSHEAD).get("message").asString())
                .contains("equipment setting");
    }

    @Test
    void crossheadOnlyRecordReportsNoModulusAndIsFlagged() {
        TestRunFixtures.Bench b = bench();
        String id = register(b);
        String full = new String(SyntheticCurves.rambergOsgoodExtensometerRemoved(200_000, 300, 10, b.s0Mm2(), 50, 0.05,
                2000, 1.0, 0), java.nio.charset.StandardCharsets.UTF_8);
        // drop the extension column: "time,force,extension,crosshead" → "time,force,crosshead"
        StringBuilder csv = new StringBuilder("# specimen: " + b.labIdentifier() + " (crosshead only)\n");
        full.lines().forEach(line -> {
            if (line.startsWith("#")) {
                return;
            }
            String[] cells = line.split(",", -1);
            csv.append(cells[0]).append(',').append(cells[1]).append(',').append(cells[3]).append('\n');
        });

        JsonNode analysis = uploaded(id, csv.toString().getBytes(java.nio.charset.StandardCharsets.UTF_8))
                .get("analysis");

        JsonNode properties = analysis.get("results").get("properties");
        assertThat(properties.get("E").get("status").asString()).isEqualTo("NOT_DETERMINABLE");
        assertThat(properties.get("E").get("reason").asString()).contains("crosshead data");
        // C = 0 in this file, so crosshead − 20 mm is the extension: Rp0.2 = σ0.2 = 300 MPa [Ramberg & Osgood 1943]
        assertThat(properties.get("Rp0.2").get("value").asDouble()).isCloseTo(300.0, within(1.0));
        JsonNode flag = flag(analysis, ResultFlag.CROSSHEAD_ONLY);
        assertThat(flag.get("properties").valueStream().map(JsonNode::asString)).contains("E", "Rp0.2", "At");
        assertThat(flag(analysis, "COMPLIANCE_NOT_GIVEN").get("message").asString()).contains("deflection");
    }

    private static JsonNode flag(JsonNode analysis, String code) {
        return analysis.get("flags").valueStream().filter(f -> f.get("code").asString().equals(code)).findFirst()
                .orElseThrow(() -> new AssertionError("no flag " + code + " in " + analysis.get("flags")));
    }
}
