package org.specimenledger.certificates;

import static org.assertj.core.api.Assertions.assertThat;

import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.specimenledger.certificates.document.PdfReadBack;
import tools.jackson.databind.JsonNode;

/**
 * US customary reporting on a certificate. The expected ksi figures are computed here from the exact
 * definitions (1 lbf = 0.45359237 kg × 9.80665 m/s² = 4.4482216152605 N, 1 in = 25.4 mm; so
 * 1 ksi = 4448.2216152605 N / 645.16 mm² = 6.894757293168… MPa), independently of the code's factors.
 */
class CertificateUnitsApiTest extends CertificateTesting {

    private static final BigDecimal MPA_PER_KSI = new BigDecimal("4448.2216152605")
            .divide(new BigDecimal("645.16"), MathContext.DECIMAL128);

    @Test
    void certificatePrintsSiAndKsiAndDecidesLimitsWrittenInKsi() throws Exception {
        // the bench's curve: Rp0.2 = 300 MPa (43.5 ksi), Rm about 414 MPa (60 ksi)
        CertificateBench.Order order = bench().order(customerId(), List.of(
                CertificateBench.requirement("Rp0.2", "40", null, "ksi"),
                CertificateBench.requirement("Rm", "55", "70", "ksi")), 1, "SI_AND_US_CUSTOMARY");
        JsonNode draft = draft(order, order.specimenIds(), null, false);
        for (JsonNode line : draft.get("lines")) {
            assertThat(line.get("verdict").asString()).as(line.toString()).isEqualTo("PASS");
            assertThat(line.get("unit").asString()).as("stored values stay SI").isEqualTo("MPa");
            assertThat(line.get("requirementUnit").asString()).isEqualTo("ksi");
        }
        JsonNode c = issued(draft.get("id").asString());
        String text = PdfReadBack.text(manager().getBytes("/api/v1/certificates/" + c.get("number").asString() + "/pdf")
                .body()).replace(" ", "");
        for (JsonNode line : c.get("lines")) {
            String ksi = BigDecimal.valueOf(line.get("value").asDouble()).divide(MPA_PER_KSI, MathContext.DECIMAL128)
                    .setScale(1, RoundingMode.HALF_UP).toPlainString();
            assertThat(text).as("line %s", line).contains(line.get("property").asString()
                    + line.get("reported").asString() + "(" + ksi + ")MPa(ksi)");
        }
        assertThat(text).contains("≥40ksi", "55…70ksi", "in²)");
    }

    @Test
    void aLimitInKsiIsDecidedOnTheKsiFigure() {
        // 43.5 ksi is the bench's Rp0.2 (300 MPa = 43.511 ksi): a 43.6 ksi minimum fails, 43.5 passes
        CertificateBench.Order fails = bench().order(customerId(), List.of(
                CertificateBench.requirement("Rp0.2", "43.6", null, "ksi")), 1, "US_CUSTOMARY");
        JsonNode line = draft(fails, fails.specimenIds(), null, false).get("lines").get(0);
        assertThat(line.get("verdict").asString()).as(line.toString()).isEqualTo("FAIL");
        CertificateBench.Order passes = bench().order(customerId(), List.of(
                CertificateBench.requirement("Rp0.2", "43.5", null, "ksi")), 1, "US_CUSTOMARY");
        line = draft(passes, passes.specimenIds(), null, false).get("lines").get(0);
        assertThat(line.get("verdict").asString()).as(line.toString()).isEqualTo("PASS");
    }
}
