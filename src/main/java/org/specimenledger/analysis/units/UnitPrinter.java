package org.specimenledger.analysis.units;

import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;
import org.specimenledger.analysis.AnalysisRejected;
import org.specimenledger.analysis.ReportedQuantity;
import org.specimenledger.analysis.ReportedValueRounding;
import org.specimenledger.analysis.RoundingRule;

/**
 * Turns a stored SI value into the string printed in a chosen unit system.
 *
 * <p>The SI value is converted first, in decimal with 34 significant digits, and only then rounded to
 * an increment of the printed unit: rounding 356 MPa first and converting would print 51.6 ksi for a
 * value of 51.67 ksi, and the two columns of a report could disagree in their last digit for no reason.
 *
 * <p>US customary increments:
 * <ul>
 *   <li>strength under {@link RoundingRule#ASTM_PRACTICE} [M, ASTM E8/E8M rounding of test data]:
 *       0.1 ksi below 50 ksi, 0.5 ksi from 50 to below 100 ksi, 1 ksi from 100 ksi up; under
 *       {@link RoundingRule#ISO_6892_1}, which has no customary rule, 0.1 ksi [CP] (about 0.7 MPa, the
 *       closest step to ISO's 1 MPa);</li>
 *   <li>modulus 10 ksi, force 1 lbf, energy four significant figures in ft·lbf, lengths 0.001 in,
 *       areas 0.0001 in² [CP];</li>
 *   <li>percentages are the same in both systems and rounded by {@link ReportedValueRounding}.</li>
 * </ul>
 * SI lengths are printed to 0.01 mm and areas to 0.01 mm² [CP]; other SI values follow
 * {@link ReportedValueRounding}. Halves round away from zero in every case, as there.
 */
public final class UnitPrinter {

    private static final MathContext CONVERSION = MathContext.DECIMAL128;
    private static final int ENERGY_SIGNIFICANT_FIGURES = 4;

    private UnitPrinter() {
    }

    /**
     * Prints a stored SI value.
     *
     * @param siValue the stored value in its SI unit (MPa, N, %, J, mm, mm²); must be finite
     * @param quantity what the value is
     * @param system the unit system to print in
     * @param rule the rounding rule set of the report
     * @return the rounded digits with their unit
     * @throws AnalysisRejected when the value is NaN or infinite
     */
    public static PrintedValue print(double siValue, PrintedQuantity quantity, UnitSystem system, RoundingRule rule) {
        if (!Double.isFinite(siValue)) {
            throw new AnalysisRejected("cannot print a non-finite value: " + siValue);
        }
        String digits = system == UnitSystem.SI ? siDigits(siValue, quantity, rule) : customaryDigits(siValue, quantity, rule);
        return new PrintedValue(digits, quantity.unit(system), system);
    }

    /**
     * Converts a stored SI value to the US customary unit of its quantity, unrounded.
     *
     * @param siValue the SI value (must be finite)
     * @param quantity what the value is
     * @return the value in ksi, lbf, ft·lbf, in or in² (percentages unchanged), to 34 significant digits
     */
    public static BigDecimal toCustomary(double siValue, PrintedQuantity quantity) {
        BigDecimal si = BigDecimal.valueOf(siValue);
        switch (quantity) {
            case STRENGTH:
            case MODULUS:
                // 1 ksi = 1000 lbf / in² = (1000 · N per lbf) / (mm² per in²) MPa
                return si.multiply(CustomaryFactors.MM2_PER_SQUARE_INCH).divide(CustomaryFactors.KSI_NUMERATOR_N, CONVERSION);
            case FORCE:
                return si.divide(CustomaryFactors.NEWTONS_PER_LBF, CONVERSION);
            case ENERGY:
                return si.divide(CustomaryFactors.JOULES_PER_FOOT_LBF, CONVERSION);
            case LENGTH:
                return si.divide(CustomaryFactors.MM_PER_INCH, CONVERSION);
            case AREA:
                return si.divide(CustomaryFactors.MM2_PER_SQUARE_INCH, CONVERSION);
            default:
                return si;
        }
    }

    private static String siDigits(double value, PrintedQuantity quantity, RoundingRule rule) {
        switch (quantity) {
            case LENGTH:
            case AREA:
                return toIncrement(BigDecimal.valueOf(value), new BigDecimal("0.01"));
            default:
                return ReportedValueRounding.reported(value, analysisQuantity(quantity), rule);
        }
    }

    private static String customaryDigits(double siValue, PrintedQuantity quantity, RoundingRule rule) {
        if (quantity.dimensionless()) {
            return ReportedValueRounding.reported(siValue, analysisQuantity(quantity), rule);
        }
        BigDecimal converted = toCustomary(siValue, quantity);
        switch (quantity) {
            case STRENGTH:
                return toIncrement(converted, strengthIncrementKsi(converted.abs(), rule));
            case MODULUS:
                return toIncrement(converted, BigDecimal.TEN);
            case FORCE:
                return toIncrement(converted, BigDecimal.ONE);
            case ENERGY:
                BigDecimal r = converted.round(new MathContext(ENERGY_SIGNIFICANT_FIGURES, RoundingMode.HALF_UP));
                return r.scale() < 0 ? r.setScale(0, RoundingMode.UNNECESSARY).toPlainString() : r.toPlainString();
            case LENGTH:
                return toIncrement(converted, new BigDecimal("0.001"));
            case AREA:
                return toIncrement(converted, new BigDecimal("0.0001"));
            default:
                throw new IllegalStateException("unhandled quantity " + quantity);
        }
    }

    private static BigDecimal strengthIncrementKsi(BigDecimal magnitudeKsi, RoundingRule rule) {
        if (rule != RoundingRule.ASTM_PRACTICE || magnitudeKsi.compareTo(BigDecimal.valueOf(50)) < 0) {
            return new BigDecimal("0.1");
        }
        return magnitudeKsi.compareTo(BigDecimal.valueOf(100)) < 0 ? new BigDecimal("0.5") : BigDecimal.ONE;
    }

    private static String toIncrement(BigDecimal value, BigDecimal step) {
        BigDecimal steps = value.divide(step, 0, RoundingMode.HALF_UP);
        return steps.multiply(step).setScale(Math.max(0, step.scale()), RoundingMode.UNNECESSARY).toPlainString();
    }

    private static ReportedQuantity analysisQuantity(PrintedQuantity quantity) {
        switch (quantity) {
            case STRENGTH:
                return ReportedQuantity.STRENGTH;
            case MODULUS:
                return ReportedQuantity.MODULUS;
            case FORCE:
                return ReportedQuantity.FORCE;
            case YIELD_POINT_EXTENSION:
                return ReportedQuantity.YIELD_POINT_EXTENSION;
            case ELONGATION:
                return ReportedQuantity.ELONGATION;
            case REDUCTION_OF_AREA:
                return ReportedQuantity.REDUCTION_OF_AREA;
            case ENERGY:
                return ReportedQuantity.ENERGY;
            default:
                throw new IllegalStateException("no analysis quantity for " + quantity);
        }
    }
}
