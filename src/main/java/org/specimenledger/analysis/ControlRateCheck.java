package org.specimenledger.analysis;

/**
 * A phase's measured control rate against one {@link ControlRateRule}.
 *
 * @param rule the rule checked
 * @param status DETERMINED when measured; NOT_APPLICABLE (e.g. no yield range on continuous yielding) or
 *     NOT_DETERMINABLE (no time channel, too few points, E unknown where the range depends on it)
 * @param measured the measured rate in the rule's unit; NaN unless determined
 * @param withinRange whether {@code lower ≤ measured ≤ upper}; {@code null} unless determined
 * @param firstIndex first point of the phase, or −1
 * @param lastIndex last point of the phase, or −1
 * @param reason why not determined, or {@code null}
 */
public record ControlRateCheck(ControlRateRule rule, PropertyStatus status, double measured, Boolean withinRange,
        int firstIndex, int lastIndex, String reason) {
}
