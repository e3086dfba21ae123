package org.specimenledger.testing;

import java.math.BigDecimal;
import java.util.List;

/**
 * Standard uncertainty of a dimension from its repeated readings, by the GUM (JCGM 100:2008) [S]:
 *
 * <pre>
 *   type A  u_A = s / √n                  s the experimental standard deviation of the n readings (GUM 4.2.2–4.2.3);
 *                                         0 for a single reading, which says nothing of the spread
 *   type B  u_B = δ / (2·√3)              δ the resolution of the indication, a rectangular distribution of
 *                                         half-width δ/2 (GUM F.2.2.1, 4.3.7)
 *   u       = √(u_A² + u_B²)              (GUM 5.1.2, uncorrelated)
 * </pre>
 *
 * The resolution is taken from the readings themselves: the step of their last written digit (10.01 mm →
 * δ = 0.01 mm), since the register keeps the digits as the technician gave them [CP: a reading is written to
 * the resolution of the instrument]. Calibration error of the micrometer and temperature are not included.
 */
final class DimensionUncertainty {

    /** u of a mean of readings, its two components, and δ; all in mm. */
    record Estimate(double meanMm, double typeAMm, double typeBMm, double resolutionMm, double standardMm) {
    }

    private DimensionUncertainty() {
    }

    /** The estimate for one dimension's readings; null when there are none. */
    static Estimate of(List<BigDecimal> readings) {
        if (readings == null || readings.isEmpty()) {
            return null;
        }
        int n = readings.size();
        double mean = 0;
        int scale = 0;
        for (BigDecimal r : readings) {
            mean += r.doubleValue();
            scale = Math.max(scale, r.scale());
        }
        mean /= n;
        double typeA = 0;
        if (n > 1) {
            double ss = 0;
            for (BigDecimal r : readings) {
                double d = r.doubleValue() - mean;
                ss += d * d;
            }
            typeA = Math.sqrt(ss / (n - 1)) / Math.sqrt(n);
        }
        double resolution = Math.pow(10, -scale);
        double typeB = resolution / (2 * Math.sqrt(3));
        return new Estimate(mean, typeA, typeB, resolution, Math.hypot(typeA, typeB));
    }
}
