package org.specimenledger.analysis;

import java.util.List;

/**
 * Strain rate per phase against ISO 6892-1 method A [M, DOMAIN.md]: the least-squares slope of
 * strain (ΔL/Le, extensometer) on time over the phase's points, compared with each allowed nominal
 * rate ± the tolerance; the nearest allowed rate is reported.
 */
final class StrainRates {

    private StrainRates() {
    }

    static StrainRateCheck measure(CurveArrays c, StrainRatePhase phase, int first, int last, List<Double> allowed,
            double tolerancePercent) {
        if (c.time == null) {
            return StrainRateCheck.notAvailable(phase, PropertyStatus.NOT_DETERMINABLE, "no time channel in the record");
        }
        if (first < 0 || last - first + 1 < 3) {
            return StrainRateCheck.notAvailable(phase, PropertyStatus.NOT_DETERMINABLE,
                    "fewer than 3 points in the " + phase.name().toLowerCase() + " phase");
        }
        if (!(c.time[last] > c.time[first])) {
            return StrainRateCheck.notAvailable(phase, PropertyStatus.NOT_DETERMINABLE,
                    "time does not advance over the " + phase.name().toLowerCase() + " phase");
        }
        double rate = StraightLineFit.of(c.time, c.strain, first, last).slope();
        double tol = tolerancePercent / 100;
        double nominal = allowed.get(0);
        if (rate > 0) {
            for (double r : allowed) {
                if (Math.abs(Math.log(rate / r)) < Math.abs(Math.log(rate / nominal))) {
                    nominal = r;
                }
            }
        }
        double lower = nominal * (1 - tol);
        double upper = nominal * (1 + tol);
        boolean within = rate >= lower && rate <= upper;
        return new StrainRateCheck(phase, PropertyStatus.DETERMINED, rate, nominal, lower, upper, within, first, last,
                null);
    }
}
