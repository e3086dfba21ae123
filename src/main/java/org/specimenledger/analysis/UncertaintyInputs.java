package org.specimenledger.analysis;

/**
 * Inputs to the GUM uncertainty budget of strengths (DOMAIN.md "Uncertainty" [S: GUM combination in
 * quadrature as in the UNCERT code of practice]; class limits [M: ISO 7500-1, ISO 9513]).
 *
 * <p>Assumption, common practice [CP]: a class limit is the half-width of a rectangular distribution,
 * so its standard uncertainty is limit/√3. Only the relative accuracy error of the force class is used
 * (repeatability is taken as covered by it).
 *
 * @param forceClassPercent force-measuring system class per ISO 7500-1 as its relative accuracy error
 *     limit in % (class 1 → 1.0) [M]; ≥ 0
 * @param extensometerClassPercent extensometer class per ISO 9513 as its relative bias limit in %
 *     (class 1 → 1.0) [M]; ≥ 0
 * @param extensometerBiasLimitUm absolute bias limit of that class in µm (class 1 → 3 µm); the larger
 *     of the relative and absolute limit applies [M]; ≥ 0
 * @param crossSection how u(S0) is obtained
 * @param firstDimensionMm d (round), a (flat thickness) or a (tube wall) in mm; 0 for DIRECT
 * @param secondDimensionMm b (flat width) or D (tube outer diameter) in mm; 0 otherwise
 * @param uFirstDimensionMm standard uncertainty of the first dimension in mm; ≥ 0
 * @param uSecondDimensionMm standard uncertainty of the second dimension in mm; ≥ 0
 * @param uS0Mm2 standard uncertainty of S0 in mm² for DIRECT; ≥ 0 (0 = not given)
 * @param uLeMm standard uncertainty of the extensometer gauge length Le in mm; ≥ 0
 * @throws AnalysisRejected when a value is negative or not finite, or dimensions are missing
 */
public record UncertaintyInputs(double forceClassPercent, double extensometerClassPercent,
        double extensometerBiasLimitUm, CrossSectionShape crossSection, double firstDimensionMm,
        double secondDimensionMm, double uFirstDimensionMm, double uSecondDimensionMm, double uS0Mm2,
        double uLeMm) {

    /** Validates the inputs. */
    public UncertaintyInputs {
        nonNegative("forceClassPercent", forceClassPercent);
        nonNegative("extensometerClassPercent", extensometerClassPercent);
        nonNegative("extensometerBiasLimitUm", extensometerBiasLimitUm);
        nonNegative("firstDimensionMm", firstDimensionMm);
        nonNegative("secondDimensionMm", secondDimensionMm);
        nonNegative("uFirstDimensionMm", uFirstDimensionMm);
        nonNegative("uSecondDimensionMm", uSecondDimensionMm);
        nonNegative("uS0Mm2", uS0Mm2);
        nonNegative("uLeMm", uLeMm);
        if (crossSection == null) {
            throw new AnalysisRejected("uncertainty crossSection is required");
        }
        if (crossSection != CrossSectionShape.DIRECT && !(firstDimensionMm > 0)) {
            throw new AnalysisRejected(crossSection + " cross-section needs firstDimensionMm > 0, got " + firstDimensionMm);
        }
        if ((crossSection == CrossSectionShape.FLAT || crossSection == CrossSectionShape.TUBE)
                && !(secondDimensionMm > 0)) {
            throw new AnalysisRejected(crossSection + " cross-section needs secondDimensionMm > 0, got " + secondDimensionMm);
        }
        if (crossSection == CrossSectionShape.TUBE && !(secondDimensionMm > 2 * firstDimensionMm)) {
            throw new AnalysisRejected("tube outer diameter " + secondDimensionMm + " mm must exceed twice the wall "
                    + firstDimensionMm + " mm");
        }
    }

    /**
     * Defaults: force class 1 and extensometer class 1 (1 %, 3 µm), the classes ISO 6892-1 calls for
     * [M]; no cross-section or gauge-length uncertainty given.
     *
     * @return the defaults
     */
    public static UncertaintyInputs defaults() {
        return new UncertaintyInputs(1.0, 1.0, 3.0, CrossSectionShape.DIRECT, 0, 0, 0, 0, 0, 0);
    }

    /**
     * The same inputs with a cross-section uncertainty from dimensions.
     *
     * @param shape ROUND, FLAT or TUBE (DIRECT: use {@link #withS0Uncertainty})
     * @param first first dimension in mm
     * @param uFirst its standard uncertainty in mm
     * @param second second dimension in mm (0 for ROUND)
     * @param uSecond its standard uncertainty in mm
     * @return new inputs
     */
    public UncertaintyInputs withCrossSection(CrossSectionShape shape, double first, double uFirst, double second,
            double uSecond) {
        return new UncertaintyInputs(forceClassPercent, extensometerClassPercent, extensometerBiasLimitUm, shape,
                first, second, uFirst, uSecond, 0, uLeMm);
    }

    /**
     * The same inputs with u(S0) given directly.
     *
     * @param uS0 standard uncertainty of S0 in mm²
     * @return new inputs
     */
    public UncertaintyInputs withS0Uncertainty(double uS0) {
        return new UncertaintyInputs(forceClassPercent, extensometerClassPercent, extensometerBiasLimitUm,
                CrossSectionShape.DIRECT, 0, 0, 0, 0, uS0, uLeMm);
    }

    /**
     * Relative standard uncertainty of S0 by the sensitivity coefficients of the S0 formula (GUM).
     * For ROUND, FLAT and TUBE the nominal S0 is recomputed from the dimensions, so the relative value
     * does not depend on small differences between it and the specimen's S0.
     *
     * @param s0Mm2 the specimen's S0 in mm² (used for DIRECT)
     * @return u(S0)/S0, dimensionless; 0 when not given
     */
    public double relativeS0Uncertainty(double s0Mm2) {
        double a = firstDimensionMm;
        double b = secondDimensionMm;
        switch (crossSection) {
            case ROUND:
                return 2 * uFirstDimensionMm / a;
            case FLAT:
                return Math.hypot(uFirstDimensionMm / a, uSecondDimensionMm / b);
            case TUBE:
                double s = Math.PI * a * (b - a);
                return Math.hypot(Math.PI * (b - 2 * a) * uFirstDimensionMm, Math.PI * a * uSecondDimensionMm) / s;
            default:
                return uS0Mm2 / s0Mm2;
        }
    }

    private static void nonNegative(String name, double v) {
        if (!(v >= 0) || !Double.isFinite(v)) {
            throw new AnalysisRejected("uncertainty " + name + " must be finite and ≥ 0, got " + v);
        }
    }
}
