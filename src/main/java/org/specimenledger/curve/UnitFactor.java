package org.specimenledger.curve;

import java.math.BigDecimal;

/**
 * Converts a value in one unit to the channel's canonical unit (N, mm or s), as close to the exact
 * product as a double allows.
 *
 * <p>Exact factors (1000, 60) and exact divisors (1000) are one correctly rounded operation. A
 * factor with no exact binary form (4.4482216152605, 25.4) is split into a double-double
 * {@code hi + lo} and applied with one fused multiply-add, so the result is within 1 ulp of the exact
 * decimal product of the parsed value and the factor as defined.
 */
final class UnitFactor {

    static final UnitFactor ONE = new UnitFactor(1.0, 0.0, 1.0);

    private final double hi;
    private final double lo;
    private final double divisor;

    private UnitFactor(double hi, double lo, double divisor) {
        this.hi = hi;
        this.lo = lo;
        this.divisor = divisor;
    }

    /** Multiply by a factor given as its exact decimal definition, e.g. {@code "4.4482216152605"}. */
    static UnitFactor times(String exactDecimal) {
        BigDecimal exact = new BigDecimal(exactDecimal);
        double hi = exact.doubleValue();
        double lo = exact.subtract(new BigDecimal(hi)).doubleValue();
        return new UnitFactor(hi, lo, 1.0);
    }

    /** Divide by an exactly representable divisor (1000 for ms and µm): one correctly rounded division. */
    static UnitFactor dividedBy(double exactDivisor) {
        return new UnitFactor(1.0, 0.0, exactDivisor);
    }

    double toCanonical(double value) {
        if (divisor != 1.0) {
            return value / divisor;
        }
        if (lo == 0.0) {
            return value * hi;
        }
        return Math.fma(value, hi, value * lo);
    }
}
