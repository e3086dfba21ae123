package org.specimenledger.analysis;

/**
 * The measured geometry of one tensile test piece, as the analysis needs it.
 *
 * @param s0Mm2 original cross-sectional area S0 in mm², positive and finite
 * @param leMm extensometer gauge length Le in mm, positive and finite (strain e = ΔL/Le)
 * @param l0Mm original gauge length L0 in mm, positive and finite (used for A from the broken pieces)
 * @param luMm final gauge length after fracture Lu in mm, or {@code null} when not measured
 * @param suMm2 minimum cross-sectional area after fracture Su in mm², or {@code null} when not
 *     measured; must not exceed S0
 * @throws AnalysisRejected when a value is not positive and finite, or Su exceeds S0
 */
public record TensileSpecimen(double s0Mm2, double leMm, double l0Mm, Double luMm, Double suMm2) {

    /** Validates every dimension. */
    public TensileSpecimen {
        requirePositive("S0", s0Mm2, "mm²");
        requirePositive("Le", leMm, "mm");
        requirePositive("L0", l0Mm, "mm");
        if (luMm != null) {
            requirePositive("Lu", luMm, "mm");
        }
        if (suMm2 != null) {
            requirePositive("Su", suMm2, "mm²");
            if (suMm2 > s0Mm2) {
                throw new AnalysisRejected("Su = " + suMm2 + " mm² exceeds S0 = " + s0Mm2 + " mm²");
            }
        }
    }

    private static void requirePositive(String name, double value, String unit) {
        if (!(value > 0) || !Double.isFinite(value)) {
            throw new AnalysisRejected(name + " must be positive and finite, got " + value + " " + unit);
        }
    }
}
