package org.specimenledger.specimens;

import java.util.Objects;

/**
 * The original gauge length L0 of a test piece and the rule that gave it.
 *
 * <p>Proportional test pieces: L0 = k·√S0 with k = 5.65 or 11.3 [S: ISO 6892-1 via its national
 * adoption]. With k = 5.65 the calculated L0 must be at least 15 mm; below that the standard points to
 * k = 11.3 or a non-proportional piece [S, same source]. L0 may be rounded to the nearest multiple of
 * 5 mm when the difference between the calculated and the rounded length is less than 10 % of L0 [S,
 * same source]; rounding is optional here (on by default) and ties (… 2.5 mm past a multiple) go up
 * [CP: the standard does not say]. The 15 mm minimum is checked on the calculated value, before rounding.
 *
 * <p>Non-proportional (fixed) pieces: L0 is given, e.g. 50 mm for the ASTM E8M sheet-type piece [S].
 *
 * @param basis        proportional or fixed
 * @param k            the coefficient for a proportional piece; null for a fixed one
 * @param roundToFiveMm whether rounding to 5 mm was asked for; null for a fixed piece
 * @param calculatedMm k·√S0 in mm (for a fixed piece, the given length)
 * @param l0Mm         the gauge length to mark and use, in mm
 * @param rule         the rule applied, as text for the record
 */
public record GaugeLength(Basis basis, Double k, Boolean roundToFiveMm, double calculatedMm, double l0Mm,
        String rule) {

    /** How L0 was chosen. */
    public enum Basis {
        PROPORTIONAL,
        FIXED
    }

    /** The internationally adopted coefficient, L0 = 5.65·√S0 (≈ 5·d for a round piece). */
    public static final double K_SHORT = 5.65;
    /** The alternative coefficient, L0 = 11.3·√S0 (≈ 10·d for a round piece). */
    public static final double K_LONG = 11.3;
    /** Smallest calculated L0 allowed with k = 5.65, in mm. */
    public static final double MIN_SHORT_PROPORTIONAL_MM = 15.0;
    /** Rounding step, in mm. */
    public static final double ROUNDING_STEP_MM = 5.0;
    /** Rounding is allowed while the change stays below this fraction of L0. */
    public static final double ROUNDING_LIMIT = 0.10;

    public GaugeLength {
        Objects.requireNonNull(basis, "basis");
        Objects.requireNonNull(rule, "rule");
    }

    /**
     * A proportional gauge length.
     *
     * @param k      5.65 or 11.3
     * @param s0Mm2  the original cross-section, finite and positive
     * @throws GeometryRefused at {@code k} for another coefficient or for k = 5.65 giving L0 below 15 mm;
     *                         at {@code S0} for an unusable area
     */
    public static GaugeLength proportional(double k, double s0Mm2, boolean roundToFiveMm) {
        if (k != K_SHORT && k != K_LONG) {
            throw new GeometryRefused("k", "k must be 5.65 or 11.3 (ISO 6892-1 proportional test pieces), got " + k);
        }
        if (!Double.isFinite(s0Mm2) || s0Mm2 <= 0) {
            throw new GeometryRefused("S0", "S0 must be a finite positive area, got " + s0Mm2);
        }
        double calculated = k * Math.sqrt(s0Mm2);
        String kText = k == K_SHORT ? "5.65" : "11.3";
        String formula = "L0 = " + kText + "·√S0 = " + kText + "·√" + CrossSection.shown(s0Mm2) + " = "
                + CrossSection.shown(calculated) + " mm";
        if (k == K_SHORT && calculated < MIN_SHORT_PROPORTIONAL_MM) {
            throw new GeometryRefused("k", "ISO 6892-1: with k = 5.65 the original gauge length must be at least "
                    + "15 mm, but " + formula + "; use k = 11.3 or a fixed (non-proportional) gauge length");
        }
        if (!roundToFiveMm) {
            return new GaugeLength(Basis.PROPORTIONAL, k, false, calculated, calculated,
                    formula + ", used as calculated (rounding to 5 mm not asked for)");
        }
        double rounded = Math.floor(calculated / ROUNDING_STEP_MM + 0.5) * ROUNDING_STEP_MM;
        double difference = Math.abs(calculated - rounded);
        double limit = ROUNDING_LIMIT * calculated;
        if (rounded > 0 && difference < limit) {
            return new GaugeLength(Basis.PROPORTIONAL, k, true, calculated, rounded,
                    formula + ", rounded to " + CrossSection.shown(rounded) + " mm (ISO 6892-1: nearest multiple of "
                            + "5 mm, difference " + CrossSection.shown(difference) + " mm below 10 % of L0 = "
                            + CrossSection.shown(limit) + " mm)");
        }
        return new GaugeLength(Basis.PROPORTIONAL, k, true, calculated, calculated,
                formula + ", not rounded: the nearest multiple of 5 mm (" + CrossSection.shown(rounded)
                        + " mm) differs by " + CrossSection.shown(difference) + " mm, not below 10 % of L0 = "
                        + CrossSection.shown(limit) + " mm (ISO 6892-1)");
    }

    /**
     * A fixed (non-proportional) gauge length.
     *
     * @throws GeometryRefused at {@code L0} unless finite and positive
     */
    public static GaugeLength fixed(double l0Mm) {
        if (!Double.isFinite(l0Mm) || l0Mm <= 0) {
            throw new GeometryRefused("L0", "a fixed L0 must be a finite positive length in mm, got " + l0Mm);
        }
        return new GaugeLength(Basis.FIXED, null, null, l0Mm, l0Mm,
                "L0 = " + CrossSection.shown(l0Mm) + " mm fixed (non-proportional test piece)");
    }
}
