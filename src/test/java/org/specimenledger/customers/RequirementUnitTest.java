package org.specimenledger.customers;

import static org.assertj.core.api.Assertions.assertThat;

import java.math.BigDecimal;
import java.math.RoundingMode;
import org.junit.jupiter.api.Test;

/**
 * Requirement units against the exact definitions: 1 lbf = 4.4482216152605 N (1 lb = 0.45359237 kg,
 * g_n = 9.80665 m/s²), 1 in = 25.4 mm, so 1 ksi = 6.894757293168… MPa and 1 kip = 4448.2216152605 N.
 */
class RequirementUnitTest {

    @Test
    void limitsConvertToTheStoredUnitExactly() {
        assertThat(RequirementUnit.toStored(new BigDecimal("50"), "ksi").setScale(9, RoundingMode.HALF_UP))
                .isEqualByComparingTo("344.737864658");
        assertThat(RequirementUnit.toStored(BigDecimal.ONE, "kip")).isEqualByComparingTo("4448.2216152605");
        assertThat(RequirementUnit.toStored(BigDecimal.ONE, "lbf")).isEqualByComparingTo("4.4482216152605");
        assertThat(RequirementUnit.toStored(new BigDecimal("205"), "GPa")).isEqualByComparingTo("205000");
        assertThat(RequirementUnit.toStored(new BigDecimal("22"), "%")).isEqualByComparingTo("22");
    }

    @Test
    void storedResultsConvertBackIntoTheRequirementUnit() {
        BigDecimal fiftyKsiInMpa = RequirementUnit.toStored(new BigDecimal("50"), "ksi");
        assertThat(RequirementUnit.fromStored(fiftyKsiInMpa, "ksi").subtract(new BigDecimal("50")).abs())
                .isLessThan(new BigDecimal("1e-30"));
        assertThat(RequirementUnit.fromStored(new BigDecimal("355"), "ksi").setScale(4, RoundingMode.HALF_UP))
                .isEqualByComparingTo("51.4884");
        assertThat(RequirementUnit.known("ksi")).isTrue();
        assertThat(RequirementUnit.known("psi")).isFalse();
    }
}
