package org.specimenledger.analysis;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.api.Test;

/** Rounding of reported values, examples straight from DOMAIN.md's rules (each rule [M]). */
class ReportedValueRoundingTest {

    @ParameterizedTest(name = "{0} {1} {2} -> {3}")
    @CsvSource({
        // ISO 6892-1 [M]: strengths to 1 MPa, Ae to 0.1 %, other elongations to 0.5 %, Z to 1 %.
        "ISO_6892_1, STRENGTH, 355.5, 356",
        "ISO_6892_1, STRENGTH, 355.49, 355",
        "ISO_6892_1, ELONGATION, 22.25, 22.5",
        "ISO_6892_1, ELONGATION, 22.24, 22.0",
        "ISO_6892_1, ELONGATION, 0.25, 0.5",
        "ISO_6892_1, ELONGATION, -0.25, -0.5",
        "ISO_6892_1, YIELD_POINT_EXTENSION, 1.85, 1.9",
        "ISO_6892_1, YIELD_POINT_EXTENSION, 1.84, 1.8",
        "ISO_6892_1, REDUCTION_OF_AREA, 57.5, 58",
        "ISO_6892_1, REDUCTION_OF_AREA, 57.49, 57",
        // ASTM practice [M]: strength 1 MPa below 500, 5 MPa to 1000, 10 MPa above; elongation and Z
        // 0.5 % below 10 %, 1 % above.
        "ASTM_PRACTICE, STRENGTH, 499.5, 500",
        "ASTM_PRACTICE, STRENGTH, 512.4, 510",
        "ASTM_PRACTICE, STRENGTH, 512.5, 515",
        "ASTM_PRACTICE, STRENGTH, 1234, 1230",
        "ASTM_PRACTICE, STRENGTH, 1235, 1240",
        "ASTM_PRACTICE, ELONGATION, 9.74, 9.5",
        "ASTM_PRACTICE, ELONGATION, 9.75, 10.0",
        "ASTM_PRACTICE, ELONGATION, 22.5, 23",
        "ASTM_PRACTICE, REDUCTION_OF_AREA, 57.4, 57",
        // [CP] choices of this engine: E to 100 MPa, Fm to 1 N, energies to 4 significant figures.
        "ISO_6892_1, MODULUS, 205349.9, 205300",
        "ISO_6892_1, FORCE, 47471.5, 47472",
        "ISO_6892_1, ENERGY, 123.456, 123.5",
        "ISO_6892_1, ENERGY, 0.0012345, 0.001235",
        "ISO_6892_1, ENERGY, 123456, 123500",
    })
    void roundsHalfUpAwayFromZeroToTheRuleIncrement(RoundingRule rule, ReportedQuantity q, double value, String reported) {
        assertThat(ReportedValueRounding.reported(value, q, rule)).isEqualTo(reported);
    }

    @Test
    void decimalReadingAvoidsBinaryRepresentationTraps() {
        // 22.35 is stored as 22.35000000000000142…; read as the decimal 22.35 it rounds to 0.1 as 22.4.
        assertThat(ReportedValueRounding.reported(22.35, ReportedQuantity.YIELD_POINT_EXTENSION, RoundingRule.ISO_6892_1))
                .isEqualTo("22.4");
        assertThat(ReportedValueRounding.reported(2.675, ReportedQuantity.YIELD_POINT_EXTENSION, RoundingRule.ISO_6892_1))
                .isEqualTo("2.7");
    }

    @Test
    void rejectsNaN() {
        assertThatThrownBy(() -> ReportedValueRounding.reported(Double.NaN, ReportedQuantity.STRENGTH, RoundingRule.ISO_6892_1))
                .isInstanceOf(AnalysisRejected.class).hasMessageContaining("NaN");
    }
}
