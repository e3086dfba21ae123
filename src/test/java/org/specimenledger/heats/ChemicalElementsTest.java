package org.specimenledger.heats;

import static org.assertj.core.api.Assertions.assertThat;

import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.Map;
import org.junit.jupiter.api.Test;

/**
 * The element symbols [S: IUPAC periodic table, 118 elements, names of 113/115/117/118 approved 2016;
 * atomic numbers below recalled from it, M] and the composition rules (mass % in [0, 100], sum ≤ 100 [CP]).
 */
class ChemicalElementsTest {

    @Test
    void holdsTheHundredAndEighteenSymbolsInAtomicOrder() {
        assertThat(ChemicalElements.count()).isEqualTo(118);
        assertThat(ChemicalElements.atomicNumber("H")).isEqualTo(1);
        assertThat(ChemicalElements.atomicNumber("C")).isEqualTo(6);
        assertThat(ChemicalElements.atomicNumber("Mn")).isEqualTo(25);
        assertThat(ChemicalElements.atomicNumber("Fe")).isEqualTo(26);
        assertThat(ChemicalElements.atomicNumber("Nb")).isEqualTo(41);
        assertThat(ChemicalElements.atomicNumber("W")).isEqualTo(74);
        assertThat(ChemicalElements.atomicNumber("U")).isEqualTo(92);
        assertThat(ChemicalElements.atomicNumber("Og")).isEqualTo(118);
    }

    @Test
    void symbolsAreCaseSensitive() {
        assertThat(ChemicalElements.isSymbol("Co")).isTrue();
        assertThat(ChemicalElements.isSymbol("CO")).isFalse();
        assertThat(ChemicalElements.properCase("CO")).contains("Co");
        assertThat(ChemicalElements.isSymbol("Xx")).isFalse();
        assertThat(ChemicalElements.properCase("Xx")).isEmpty();
    }

    @Test
    void ordersAMillCertificateCompositionByAtomicNumber() {
        Map<String, Integer> ordered = ChemicalElements.inAtomicOrder(Map.of("Mn", 1, "S", 2, "C", 3, "P", 4, "Si", 5));
        assertThat(new ArrayList<>(ordered.keySet())).containsExactly("C", "Si", "P", "S", "Mn");
    }

    @Test
    void exactlyHundredPercentIsAllowed() {
        // sum ≤ 100 %, compared exactly in BigDecimal (no floating-point slack)
        var request = new HeatRequests.HeatRequest("X", "P", "G", ProductForm.WIRE, BigDecimal.ONE,
                Map.of("Cu", new BigDecimal("99.99"), "O", new BigDecimal("0.01")), null);
        assertThat(HeatRules.checked(request)).hasSize(2);
    }

    @Test
    void pointerTokensAreEscaped() {
        // RFC 6901 §3: '~' → '~0', '/' → '~1'
        assertThat(HeatRules.escape("a/b~c")).isEqualTo("a~1b~0c");
    }
}
