package org.specimenledger.testing;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.nio.charset.StandardCharsets;
import java.security.MessageDigest;
import java.util.HexFormat;
import org.junit.jupiter.api.Test;
import org.specimenledger.testsupport.Api;
import org.specimenledger.testsupport.Api.Part;
import org.specimenledger.testsupport.IntegrationTest;
import org.specimenledger.testsupport.TestAccounts;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.jdbc.core.JdbcTemplate;
import tools.jackson.databind.JsonNode;

class AnalysisPreviewApiTest extends IntegrationTest {

    private static final String SPECIMEN = "{\"S0\": 100, \"Le\": 50, \"L0\": 50}";

    @Autowired
    JdbcTemplate jdbc;

    private Api.Response preview(String user, byte[] curve, String specimen, String parameters) {
        Part curvePart = Part.file("curve", "run.csv", curve);
        Part specimenPart = Part.json("specimen", specimen);
        return parameters == null
                ? as(user).multipart("POST", "/api/v1/analysis/preview", curvePart, specimenPart)
                : as(user).multipart("POST", "/api/v1/analysis/preview", curvePart, specimenPart,
                        Part.json("parameters", parameters));
    }

    @Test
    void previewOfARambergOsgoodCurveGivesItsProofStrengthAndStoresNothing() throws Exception {
        byte[] curve = SyntheticCurves.rambergOsgood(200_000, 300, 10, 100, 50, 0.05, 4000);
        long eventsBefore = jdbc.queryForObject("SELECT count(*) FROM audit_event", Long.class);

        Api.Response r = preview(TestAccounts.TECHNICIAN, curve, SPECIMEN,
                "{\"proofOffsetsPercent\": [0.2, 1.0]}");
        assertThat(r.status()).as(r.toString()).isEqualTo(200);
        JsonNode body = r.json();
        assertThat(body.get("method").asString()).isEqualTo("tensile/1.1.0");
        assertThat(body.get("yielding").asString()).isEqualTo("CONTINUOUS");
        // Ramberg & Osgood 1943 (NACA TN 902): the 0.2 % offset proof strength is sigma0.2 exactly; the file
        // rounds forces to 1 mN and 4000 points give 1.25e-5 strain per step, so 0.5 MPa is ample.
        JsonNode rp02 = body.get("properties").get("Rp0.2");
        assertThat(rp02.get("status").asString()).isEqualTo("DETERMINED");
        assertThat(rp02.get("value").asDouble()).isCloseTo(300.0, within(0.5));
        assertThat(rp02.get("reported").asString()).isEqualTo("300");
        // Rp_x = sigma0.2 * (x / 0.2)^(1/n), same source: Rp1 = 300 * 5^(1/10) = 352.34 MPa
        assertThat(body.get("properties").get("Rp1").get("value").asDouble())
                .isCloseTo(300 * Math.pow(5, 0.1), within(0.5));
        assertThat(body.get("properties").get("ReH").get("status").asString()).isEqualTo("NOT_APPLICABLE");
        // force was sent in kN: the reader converted it (1 kN = 1000 N exactly) before the analysis
        assertThat(body.get("properties").get("Fm").get("unit").asString()).isEqualTo("N");

        String sha = HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(curve));
        assertThat(body.get("input").get("sha256").asString()).isEqualTo(sha);
        assertThat(body.get("input").get("points").asInt()).isEqualTo(4002);
        assertThat(jdbc.queryForObject("SELECT count(*) FROM audit_event", Long.class)).isEqualTo(eventsBefore);
    }

    @Test
    void cyclicModeReportsLoopEnergies() {
        // loading F = k x, unloading F = k x^2 / xm: loading energy k xm^2 / 2, returned k xm^2 / 3 (exact
        // integrals), so the loss ratio is 100 * (1/2 - 1/3) / (1/2) = 33.3 %
        byte[] curve = SyntheticCurves.triangleCycles(1000, 2, 3, 400);
        Api.Response r = preview(TestAccounts.MANAGER, curve, SPECIMEN, "{\"mode\": \"cyclic\"}");
        assertThat(r.status()).as(r.toString()).isEqualTo(200);
        JsonNode cycles = r.json().get("cycles");
        assertThat(cycles.size()).isGreaterThanOrEqualTo(2);
        JsonNode first = cycles.get(0);
        // trapezoid error on 400 segments of x^2 is xm^3 k / (6 * 400^2 * xm) ~ 4e-6 J; allow 1e-4 J
        assertThat(first.get("loadingEnergy").asDouble()).isCloseTo(1000 * 4 / 2.0 / 1000, within(1e-4));
        assertThat(first.get("returnedEnergy").asDouble()).isCloseTo(1000 * 4 / 3.0 / 1000, within(1e-4));
        assertThat(first.get("lossRatio").asDouble()).isCloseTo(100.0 / 3, within(0.05));
    }

    @Test
    void malformedCurveIsRefusedNamingLineAndColumn() {
        byte[] curve = "force [kN],extension [mm]\n1.0,0.1\n2.0,abc\n".getBytes(StandardCharsets.UTF_8);
        Api.Response r = preview(TestAccounts.TECHNICIAN, curve, SPECIMEN, null);
        assertThat(r.status()).isEqualTo(422);
        assertThat(r.contentType()).startsWith("application/problem+json");
        assertThat(r.json().get("line").asInt()).isEqualTo(3);
        assertThat(r.json().get("column").asInt()).isEqualTo(2);
        assertThat(r.json().get("detail").asString()).contains("abc");
    }

    @Test
    void missingOrBadGeometryIsNamed() {
        byte[] curve = SyntheticCurves.rambergOsgood(200_000, 300, 10, 100, 50, 0.05, 200);
        Api.Response r = preview(TestAccounts.TECHNICIAN, curve, "{\"Le\": -5, \"L0\": 50}", null);
        assertThat(r.status()).isEqualTo(422);
        assertThat(r.body()).contains("/specimen/S0").contains("/specimen/Le");
        Api.Response notJson = preview(TestAccounts.TECHNICIAN, curve, "S0=100", null);
        assertThat(notJson.status()).isEqualTo(422);
        assertThat(notJson.body()).contains("/specimen");
    }

    @Test
    void unknownParameterOrModeIsNamed() {
        byte[] curve = SyntheticCurves.rambergOsgood(200_000, 300, 10, 100, 50, 0.05, 200);
        Api.Response unknown = preview(TestAccounts.TECHNICIAN, curve, SPECIMEN, "{\"offsetz\": [0.2]}");
        assertThat(unknown.status()).isEqualTo(422);
        assertThat(unknown.body()).contains("offsetz");
        Api.Response mode = preview(TestAccounts.TECHNICIAN, curve, SPECIMEN, "{\"mode\": \"fatigue\"}");
        assertThat(mode.status()).isEqualTo(422);
        assertThat(mode.body()).contains("/parameters/mode");
    }

    @Test
    void missingCurvePartIsA400Problem() {
        Api.Response r = as(TestAccounts.TECHNICIAN).multipart("POST", "/api/v1/analysis/preview",
                Part.json("specimen", SPECIMEN));
        assertThat(r.status()).isEqualTo(400);
        assertThat(r.contentType()).startsWith("application/problem+json");
        assertThat(r.body()).contains("curve");
    }

    @Test
    void laboratoryRolesMayPreviewCustomersMayNot() {
        byte[] curve = SyntheticCurves.rambergOsgood(200_000, 300, 10, 100, 50, 0.05, 200);
        assertThat(preview(TestAccounts.AUDITOR, curve, SPECIMEN, null).status()).isEqualTo(200);
        assertThat(preview(TestAccounts.CUSTOMER, curve, SPECIMEN, null).status()).isEqualTo(403);
        assertThat(anonymous().multipart("POST", "/api/v1/analysis/preview", Part.file("curve", "c.csv", curve))
                .status()).isEqualTo(401);
    }
}
