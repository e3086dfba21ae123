package org.specimenledger.analysis;

/**
 * Expanded uncertainty (k = 2) of a strength by the GUM combination in quadrature [S: GUM, as in the
 * UNCERT code of practice for tensile testing; DOMAIN.md "Uncertainty"]:
 *
 * <pre>
 *   u_F/F   = class_F / √3                      (force class limit as a rectangular half-width [CP])
 *   u_S0/S0 = from the dimensions' uncertainties by the sensitivity coefficients of the S0 formula
 *   u(R)/R  = √((u_F/F)² + (u_S0/S0)²)          for ReH, ReL, Rm
 *   U       = 2·u(R)
 * </pre>
 *
 * For Rp a strain term is added [CP, documented simplification]: the extensometer reading at the
 * intersection strain e* is taken as uncertain by u(e) = √((δ/√3)² + (e*·u(Le)/Le)²), with δ the
 * class bias limit, the larger of class_e·e* and bias_µm/1000/Le (ISO 9513 [M]); it moves the stress
 * read off the curve by the local slope k of the curve at e* (secant over ±0.05 % strain), so
 * u_e(Rp) = k·u(e). Repeatability, resolution, temperature and alignment are not included.
 */
final class StrengthUncertainty {

    /** Half-width of the strain interval for the local slope at a proof point (fraction). */
    static final double LOCAL_SLOPE_HALF_WIDTH = 0.0005;

    private StrengthUncertainty() {
    }

    static double relativeForceAndArea(TensileParameters p, TensileSpecimen s) {
        double uF = p.uncertainty().forceClassPercent() / 100 / Math.sqrt(3);
        double uS = p.uncertainty().relativeS0Uncertainty(s.s0Mm2());
        return Math.hypot(uF, uS);
    }

    /** U (k = 2) in MPa of a force-over-area strength. */
    static double expanded(double strength, TensileParameters p, TensileSpecimen s) {
        return 2 * strength * relativeForceAndArea(p, s);
    }

    /**
     * U (k = 2) in MPa of a proof strength at intersection strain e (fraction, from the corrected
     * origin) where the curve's local slope is k (MPa per unit strain).
     */
    static double expandedProof(double strength, double strain, double localSlope, TensileParameters p,
            TensileSpecimen s) {
        UncertaintyInputs u = p.uncertainty();
        double relative = Math.abs(strain) * u.extensometerClassPercent() / 100;
        double absolute = u.extensometerBiasLimitUm() / 1000 / s.leMm();
        double uStrain = Math.hypot(Math.max(relative, absolute) / Math.sqrt(3), strain * u.uLeMm() / s.leMm());
        double uExt = Math.abs(localSlope) * uStrain;
        double uForceArea = strength * relativeForceAndArea(p, s);
        return 2 * Math.hypot(uForceArea, uExt);
    }

    /** Secant slope of stress on strain over [e − h, e + h], interpolated, within [from, to]. */
    static double localSlope(double[] stress, double[] strain, int from, int to, double e) {
        double lo = e - LOCAL_SLOPE_HALF_WIDTH;
        double hi = e + LOCAL_SLOPE_HALF_WIDTH;
        double sLo = stressAt(stress, strain, from, to, lo);
        double sHi = stressAt(stress, strain, from, to, hi);
        return (sHi - sLo) / (hi - lo);
    }

    /** Stress where strain first reaches e in [from, to], linearly interpolated; NaN if never. */
    static double stressAt(double[] stress, double[] strain, int from, int to, double e) {
        if (strain[from] >= e) {
            return stress[from];
        }
        for (int i = from + 1; i <= to; i++) {
            if (strain[i] >= e) {
                double t = (e - strain[i - 1]) / (strain[i] - strain[i - 1]);
                return stress[i - 1] + t * (stress[i] - stress[i - 1]);
            }
        }
        return Double.NaN;
    }
}
