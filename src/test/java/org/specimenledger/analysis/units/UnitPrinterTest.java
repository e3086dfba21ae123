package org.specimenledger.analysis.units;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;
import org.junit.jupiter.api.Test;
import org.specimenledger.analysis.AnalysisRejected;
import org.specimenledger.analysis.RoundingRule;

/**
 * Unit conversion for printing, against the exact defining factors: 1 in = 25.4 mm and 1 lb =
 * 0.45359237 kg (international yard and pound agreement, 1959), g_n = 9.80665 m/s² (3rd CGPM, 1901);
 * hence 1 lbf = 4.4482216152605 N and 1 ksi = 6.894757293168… MPa (NIST SP 811, appendix B, lists the
 * same factors rounded).
 */
class UnitPrinterTest {

    /** 1 ksi in MPa from the definitions, by a route other than the code's: Pa per psi, times 1000, over 10⁶. */
    private static final BigDecimal MPA_PER_KSI = new BigDecimal("4.4482216152605")
            .divide(new BigDecimal("0.0254").pow(2), MathContext.DECIMAL128)
            .multiply(BigDecimal.valueOf(1000)).movePointLeft(6);

    @Test
    void factorsAreTheExactDefinedOnes() {
        assertThat(CustomaryFactors.NEWTONS_PER_LBF).isEqualByComparingTo("4.4482216152605");
        assertThat(CustomaryFactors.MM_PER_INCH).isEqualByComparingTo("25.4");
        assertThat(CustomaryFactors.MM2_PER_SQUARE_INCH).isEqualByComparingTo("645.16");
        assertThat(CustomaryFactors.JOULES_PER_FOOT_LBF).isEqualByComparingTo("1.35581794833140040");
        // the stated factor, 1 ksi = 6.894757293168 MPa, to its twelve decimals
        assertThat(MPA_PER_KSI.setScale(12, RoundingMode.HALF_UP)).isEqualByComparingTo("6.894757293168");
    }

    @Test
    void oneKsiWorthOfMegapascalsConvertsToOneKsi() {
        BigDecimal ksi = UnitPrinter.toCustomary(MPA_PER_KSI.doubleValue(), PrintedQuantity.STRENGTH);
        assertThat(ksi.subtract(BigDecimal.ONE).abs()).isLessThan(new BigDecimal("1e-15"));
    }

    @Test
    void everyTenthOfAKsiSurvivesStorageInMegapascalsAndPrintsBack() {
        // a value stored in MPa (as a double) and printed in ksi to 0.1 ksi must give back the ksi value
        for (int tenths = 100; tenths <= 3000; tenths++) {
            BigDecimal ksi = BigDecimal.valueOf(tenths, 1);
            double storedMpa = ksi.multiply(MPA_PER_KSI).doubleValue();
            PrintedValue printed = UnitPrinter.print(storedMpa, PrintedQuantity.STRENGTH, UnitSystem.US_CUSTOMARY, RoundingRule.ISO_6892_1);
            assertThat(printed.digits()).as("%s ksi", ksi).isEqualTo(ksi.toPlainString());
            assertThat(printed.unit()).isEqualTo("ksi");
        }
    }

    @Test
    void astmStrengthStepsGrowWithTheValue() {
        // [M] ASTM E8/E8M rounding of test data: 0.1 ksi below 50, 0.5 ksi to below 100, 1 ksi from 100
        assertThat(ksi(49.94, RoundingRule.ASTM_PRACTICE)).isEqualTo("49.9");
        assertThat(ksi(50.2, RoundingRule.ASTM_PRACTICE)).isEqualTo("50.0");
        assertThat(ksi(75.26, RoundingRule.ASTM_PRACTICE)).isEqualTo("75.5");
        assertThat(ksi(99.7, RoundingRule.ASTM_PRACTICE)).isEqualTo("99.5");
        assertThat(ksi(100.4, RoundingRule.ASTM_PRACTICE)).isEqualTo("100");
        assertThat(ksi(100.6, RoundingRule.ASTM_PRACTICE)).isEqualTo("101");
        assertThat(ksi(100.4, RoundingRule.ISO_6892_1)).isEqualTo("100.4");
    }

    @Test
    void conversionHappensBeforeRounding() {
        // 356.4 MPa is 51.691 ksi; converting the rounded 356 MPa instead would give 51.633, printed 51.6
        assertThat(UnitPrinter.print(356.4, PrintedQuantity.STRENGTH, UnitSystem.US_CUSTOMARY, RoundingRule.ISO_6892_1).digits())
                .isEqualTo("51.7");
        assertThat(UnitPrinter.print(356.4, PrintedQuantity.STRENGTH, UnitSystem.SI, RoundingRule.ISO_6892_1).text())
                .isEqualTo("356 MPa");
    }

    @Test
    void forceLengthAreaAndEnergy() {
        assertThat(UnitPrinter.print(4448.2216152605, PrintedQuantity.FORCE, UnitSystem.US_CUSTOMARY, RoundingRule.ISO_6892_1).text())
                .isEqualTo("1000 lbf");
        assertThat(UnitPrinter.print(25.4, PrintedQuantity.LENGTH, UnitSystem.US_CUSTOMARY, RoundingRule.ISO_6892_1).text())
                .isEqualTo("1.000 in");
        // 50 mm = 1.968503… in
        assertThat(UnitPrinter.print(50.0, PrintedQuantity.LENGTH, UnitSystem.US_CUSTOMARY, RoundingRule.ISO_6892_1).digits())
                .isEqualTo("1.969");
        assertThat(UnitPrinter.print(645.16, PrintedQuantity.AREA, UnitSystem.US_CUSTOMARY, RoundingRule.ISO_6892_1).text())
                .isEqualTo("1.0000 in²");
        assertThat(UnitPrinter.print(1.3558179483314004, PrintedQuantity.ENERGY, UnitSystem.US_CUSTOMARY, RoundingRule.ISO_6892_1).text())
                .isEqualTo("1.000 ft·lbf");
        // E of a steel, 200 GPa = 29 007.55 ksi, printed to 10 ksi
        assertThat(UnitPrinter.print(200_000, PrintedQuantity.MODULUS, UnitSystem.US_CUSTOMARY, RoundingRule.ISO_6892_1).digits())
                .isEqualTo("29010");
        assertThat(UnitPrinter.print(78.539816, PrintedQuantity.AREA, UnitSystem.SI, RoundingRule.ISO_6892_1).text())
                .isEqualTo("78.54 mm²");
    }

    @Test
    void percentagesAreTheSameInBothSystems() {
        for (UnitSystem system : UnitSystem.values()) {
            PrintedValue a = UnitPrinter.print(22.25, PrintedQuantity.ELONGATION, system, RoundingRule.ISO_6892_1);
            assertThat(a.text()).isEqualTo("22.5 %");
        }
    }

    @Test
    void orderChoicesListWhatIsPrinted() {
        assertThat(ReportingUnits.SI_AND_US_CUSTOMARY.printed()).containsExactly(UnitSystem.SI, UnitSystem.US_CUSTOMARY);
        assertThat(ReportingUnits.US_CUSTOMARY.printed()).containsExactly(UnitSystem.US_CUSTOMARY);
    }

    @Test
    void nonFiniteValuesAreRefused() {
        assertThatThrownBy(() -> UnitPrinter.print(Double.NaN, PrintedQuantity.STRENGTH, UnitSystem.US_CUSTOMARY, RoundingRule.ISO_6892_1))
                .isInstanceOf(AnalysisRejected.class);
    }

    private static String ksi(double ksi, RoundingRule rule) {
        double mpa = BigDecimal.valueOf(ksi).multiply(MPA_PER_KSI).doubleValue();
        return UnitPrinter.print(mpa, PrintedQuantity.STRENGTH, UnitSystem.US_CUSTOMARY, rule).digits();
    }
}
