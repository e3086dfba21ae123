package org.specimenledger.analysis;

/**
 * The measured strain rate of one test phase against the method A range it calls for.
 *
 * @param phase the phase
 * @param status DETERMINED when measured, NOT_APPLICABLE (e.g. yield phase on continuous yielding) or
 *     NOT_DETERMINABLE (e.g. no time channel); the reason says why
 * @param measuredPerS least-squares slope of strain (ΔL/Le) on time over the phase in s⁻¹; NaN unless
 *     determined
 * @param nominalPerS the method A nominal rate compared with (the allowed one nearest to the measured
 *     rate), s⁻¹; NaN unless determined
 * @param lowerPerS lower limit of that range (nominal × (1 − tolerance)), s⁻¹; NaN unless determined
 * @param upperPerS upper limit (nominal × (1 + tolerance)), s⁻¹; NaN unless determined
 * @param withinRange whether the measured rate lies in [lower, upper]; {@code null} unless determined
 * @param firstIndex first point of the phase, or −1
 * @param lastIndex last point of the phase, or −1
 * @param reason why not determined, or {@code null}
 */
public record StrainRateCheck(StrainRatePhase phase, PropertyStatus status, double measuredPerS, double nominalPerS,
        double lowerPerS, double upperPerS, Boolean withinRange, int firstIndex, int lastIndex, String reason) {

    static StrainRateCheck notAvailable(StrainRatePhase phase, PropertyStatus status, String reason) {
        return new StrainRateCheck(phase, status, Double.NaN, Double.NaN, Double.NaN, Double.NaN, null, -1, -1,
                reason);
    }
}
