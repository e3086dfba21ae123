package org.specimenledger.customers;

import java.math.BigDecimal;
import java.math.MathContext;
import java.util.Map;
import org.specimenledger.analysis.units.CustomaryFactors;

/**
 * The units a requirement's limits may be written in, and their exact factor to the unit results are
 * stored in (MPa for strengths and E, N for Fm, % and J unchanged). A specification written in ksi is
 * kept in ksi, as its author wrote it; comparisons convert the result, not the limit, so that a limit of
 * 50 ksi stays exactly 50 ksi.
 *
 * <p>Factors: GPa = 1000 MPa, kN = 1000 N (SI prefixes); ksi = 1000 lbf/in², lbf = 4.4482216152605 N,
 * kip = 1000 lbf, from the exact definitions in {@link CustomaryFactors}.
 */
public final class RequirementUnit {

    private static final MathContext PRECISION = MathContext.DECIMAL128;

    /** Stored-unit value of one of each unit, as an exact fraction numerator / denominator. */
    private static final Map<String, BigDecimal[]> FACTORS = Map.of(
            "MPa", new BigDecimal[] {BigDecimal.ONE, BigDecimal.ONE},
            "GPa", new BigDecimal[] {BigDecimal.valueOf(1000), BigDecimal.ONE},
            "ksi", new BigDecimal[] {CustomaryFactors.KSI_NUMERATOR_N, CustomaryFactors.MM2_PER_SQUARE_INCH},
            "N", new BigDecimal[] {BigDecimal.ONE, BigDecimal.ONE},
            "kN", new BigDecimal[] {BigDecimal.valueOf(1000), BigDecimal.ONE},
            "lbf", new BigDecimal[] {CustomaryFactors.NEWTONS_PER_LBF, BigDecimal.ONE},
            "kip", new BigDecimal[] {CustomaryFactors.KSI_NUMERATOR_N, BigDecimal.ONE},
            "%", new BigDecimal[] {BigDecimal.ONE, BigDecimal.ONE},
            "J", new BigDecimal[] {BigDecimal.ONE, BigDecimal.ONE});

    private RequirementUnit() {
    }

    /** @return true when limits may be written in this unit */
    public static boolean known(String unit) {
        return FACTORS.containsKey(unit);
    }

    /**
     * Converts a stored result (MPa, N, %, J) into a requirement's unit, for comparing with its limits.
     *
     * @param stored the stored value
     * @param unit the requirement's unit
     * @return the value in that unit, to 34 significant digits
     */
    public static BigDecimal fromStored(BigDecimal stored, String unit) {
        BigDecimal[] f = factor(unit);
        return stored.multiply(f[1]).divide(f[0], PRECISION);
    }

    /**
     * Converts a limit into the stored unit.
     *
     * @param limit the limit in the requirement's unit
     * @param unit the requirement's unit
     * @return the limit in MPa, N, % or J, to 34 significant digits
     */
    public static BigDecimal toStored(BigDecimal limit, String unit) {
        BigDecimal[] f = factor(unit);
        return limit.multiply(f[0]).divide(f[1], PRECISION);
    }

    private static BigDecimal[] factor(String unit) {
        BigDecimal[] f = FACTORS.get(unit);
        if (f == null) {
            throw new IllegalArgumentException("unknown requirement unit '" + unit + "'");
        }
        return f;
    }
}
