package org.specimenledger.analysis;

import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;

/**
 * Rounds a stored value to the string shown on a report. Rounding is applied only to the reported
 * string; the stored value keeps full precision.
 *
 * <p>Arithmetic is decimal ({@link BigDecimal}): the double is first read as its shortest decimal
 * representation ({@link BigDecimal#valueOf(double)}, so 22.35 is 22.35, not 22.349999…), divided by
 * the increment, rounded to an integer with {@link RoundingMode#HALF_UP} (halves away from zero, the
 * common practice [CP]) and multiplied back. So 22.25 % to 0.5 % gives "22.5" exactly and −0.25 gives
 * "−0.5". The string has as many decimals as the increment (0.5 → one decimal, 5 → none).
 *
 * <p>Rules [M, DOMAIN.md "Rounding of reported values"]: see {@link RoundingRule}. Modulus, force and
 * energy have no rule in DOMAIN.md; see {@link ReportedQuantity} for the [CP] choices.
 */
public final class ReportedValueRounding {

    private static final int ENERGY_SIGNIFICANT_FIGURES = 4;

    private ReportedValueRounding() {
    }

    /**
     * Rounds a value for the report.
     *
     * @param value the stored value in the quantity's unit (MPa, N, %, J); must be finite
     * @param quantity what the value is
     * @param rule the rule set
     * @return the reported string, e.g. "356", "22.5", "1230"
     * @throws AnalysisRejected when the value is NaN or infinite
     */
    public static String reported(double value, ReportedQuantity quantity, RoundingRule rule) {
        if (!Double.isFinite(value)) {
            throw new AnalysisRejected("cannot round a non-finite value: " + value);
        }
        BigDecimal exact = BigDecimal.valueOf(value);
        if (quantity == ReportedQuantity.ENERGY) {
            BigDecimal r = exact.round(new MathContext(ENERGY_SIGNIFICANT_FIGURES, RoundingMode.HALF_UP));
            return r.scale() < 0 ? r.setScale(0, RoundingMode.UNNECESSARY).toPlainString() : r.toPlainString();
        }
        BigDecimal step = increment(value, quantity, rule);
        BigDecimal steps = exact.divide(step, 0, RoundingMode.HALF_UP);
        return steps.multiply(step).setScale(Math.max(0, step.scale()), RoundingMode.UNNECESSARY).toPlainString();
    }

    /**
     * The rounding increment for a value, in the quantity's unit.
     *
     * @param value the stored value (its magnitude selects the ASTM step); must be finite
     * @param quantity what the value is; not {@link ReportedQuantity#ENERGY} (significant figures)
     * @param rule the rule set
     * @return the increment, e.g. 1, 0.5, 5
     * @throws AnalysisRejected for {@link ReportedQuantity#ENERGY}, which has no fixed increment
     */
    public static BigDecimal increment(double value, ReportedQuantity quantity, RoundingRule rule) {
        double magnitude = Math.abs(value);
        switch (quantity) {
            case STRENGTH:
                if (rule == RoundingRule.ASTM_PRACTICE) {
                    return magnitude < 500 ? BigDecimal.ONE : magnitude <= 1000 ? BigDecimal.valueOf(5) : BigDecimal.TEN;
                }
                return BigDecimal.ONE;
            case MODULUS:
                return BigDecimal.valueOf(100);
            case FORCE:
                return BigDecimal.ONE;
            case YIELD_POINT_EXTENSION:
                return rule == RoundingRule.ASTM_PRACTICE ? elongationAstm(magnitude) : new BigDecimal("0.1");
            case ELONGATION:
                return rule == RoundingRule.ASTM_PRACTICE ? elongationAstm(magnitude) : new BigDecimal("0.5");
            case REDUCTION_OF_AREA:
                return rule == RoundingRule.ASTM_PRACTICE ? elongationAstm(magnitude) : BigDecimal.ONE;
            default:
                throw new AnalysisRejected("energy is rounded to significant figures, not to an increment");
        }
    }

    private static BigDecimal elongationAstm(double magnitude) {
        return magnitude < 10 ? new BigDecimal("0.5") : BigDecimal.ONE;
    }
}
