package org.specimenledger.analysis;

/**
 * One tensile property as found on a curve.
 *
 * @param symbol ISO 6892-1 symbol, e.g. "Rp0.2", "Rm", "E"
 * @param value full-precision value in {@code unit}; NaN unless {@link PropertyStatus#DETERMINED}
 * @param unit "MPa" for strengths and E, "N" for Fm, "%" for elongations and Z, "J" for energies
 * @param reported the rounded string for the report ({@link ReportedValueRounding}); {@code null}
 *     unless determined
 * @param status whether the value was found
 * @param reason why not determined or not applicable, or how a determined value was found when that
 *     matters (e.g. "from broken pieces"); required when not determined
 * @param evidence point indices, fit window, intersection, as plain data; never {@code null}
 * @param expandedUncertainty expanded uncertainty U (k = 2) in {@code unit}, or {@code null} when
 *     not estimated
 */
public record PropertyResult(String symbol, double value, String unit, String reported, PropertyStatus status,
        String reason, Evidence evidence, Double expandedUncertainty) {

    /** Checks that status, value, reported string and reason agree. */
    public PropertyResult {
        if (symbol == null || unit == null || status == null || evidence == null) {
            throw new IllegalArgumentException("symbol, unit, status and evidence are required");
        }
        if (status == PropertyStatus.DETERMINED) {
            if (!Double.isFinite(value) || reported == null) {
                throw new IllegalArgumentException(symbol + ": a determined value must be finite and reported, got "
                        + value);
            }
        } else if (!Double.isNaN(value) || reported != null || reason == null || reason.isBlank()) {
            throw new IllegalArgumentException(symbol + ": " + status + " needs value NaN, no reported string and a reason");
        }
    }

    /**
     * A determined value, rounded for the report by the given rule.
     *
     * @param symbol ISO symbol
     * @param value full-precision value, finite
     * @param unit unit of the value
     * @param quantity rounding class
     * @param rule rounding rule set
     * @param reason how it was found, or {@code null}
     * @param evidence evidence
     * @param expandedUncertainty U (k = 2) or {@code null}
     * @return the result
     */
    public static PropertyResult determined(String symbol, double value, String unit, ReportedQuantity quantity,
            RoundingRule rule, String reason, Evidence evidence, Double expandedUncertainty) {
        return new PropertyResult(symbol, value, unit, ReportedValueRounding.reported(value, quantity, rule),
                PropertyStatus.DETERMINED, reason, evidence, expandedUncertainty);
    }

    /**
     * A property that does not apply to this behaviour.
     *
     * @param symbol ISO symbol
     * @param unit unit
     * @param reason why it does not apply
     * @return the result
     */
    public static PropertyResult notApplicable(String symbol, String unit, String reason) {
        return new PropertyResult(symbol, Double.NaN, unit, null, PropertyStatus.NOT_APPLICABLE, reason,
                Evidence.EMPTY, null);
    }

    /**
     * A property that this record does not allow to determine.
     *
     * @param symbol ISO symbol
     * @param unit unit
     * @param reason why, e.g. "fracture before 0.2 % plastic extension"
     * @param evidence what was looked at, possibly empty
     * @return the result
     */
    public static PropertyResult notDeterminable(String symbol, String unit, String reason, Evidence evidence) {
        return new PropertyResult(symbol, Double.NaN, unit, null, PropertyStatus.NOT_DETERMINABLE, reason,
                evidence, null);
    }

    /**
     * Whether the value was found.
     *
     * @return {@code status() == DETERMINED}
     */
    public boolean isDetermined() {
        return status == PropertyStatus.DETERMINED;
    }
}
