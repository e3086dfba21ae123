package org.specimenledger.analysis.units;

import java.math.BigDecimal;

/**
 * Exact defining factors between SI and US customary units, as decimals.
 *
 * <p>Sources: the international inch is exactly 25.4 mm and the international pound exactly
 * 0.45359237 kg (international yard and pound agreement, 1959); standard gravity is exactly
 * 9.80665 m/s² (3rd CGPM, 1901); so one pound-force is exactly 0.45359237 × 9.80665 =
 * 4.4482216152605 N. NIST SP 811 (2008), appendix B, lists the same factors. Every other factor here is
 * derived from those three by multiplication only, so each is an exact, terminating decimal; the one
 * division (MPa to ksi) happens where a value is converted, with 34 significant digits.
 */
public final class CustomaryFactors {

    /** Millimetres in one inch (exact). */
    public static final BigDecimal MM_PER_INCH = new BigDecimal("25.4");
    /** Square millimetres in one square inch (exact: 25.4²). */
    public static final BigDecimal MM2_PER_SQUARE_INCH = MM_PER_INCH.multiply(MM_PER_INCH);
    /** Newtons in one pound-force (exact: 0.45359237 kg × 9.80665 m/s²). */
    public static final BigDecimal NEWTONS_PER_LBF = new BigDecimal("0.45359237").multiply(new BigDecimal("9.80665"));
    /** Newtons per square millimetre (MPa) in one ksi = 1000 lbf/in², as the exact fraction's numerator. */
    public static final BigDecimal KSI_NUMERATOR_N = NEWTONS_PER_LBF.multiply(BigDecimal.valueOf(1000));
    /** Joules in one foot pound-force (exact: 0.3048 m × 4.4482216152605 N). */
    public static final BigDecimal JOULES_PER_FOOT_LBF = new BigDecimal("0.3048").multiply(NEWTONS_PER_LBF);

    private CustomaryFactors() {
    }
}
