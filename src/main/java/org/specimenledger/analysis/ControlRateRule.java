package org.specimenledger.analysis;

/**
 * One range a standard sets for the rate at which a test phase is run, in the quantity it controls.
 *
 * @param name short name of the rule as reported, e.g. {@code ISO 6892-1 method B, elastic range}
 * @param phase the phase it governs
 * @param quantity {@link Quantity#STRESS_RATE} in MPa/s or {@link Quantity#STRAIN_RATE} in s⁻¹
 * @param lower lowest allowed rate (0 for "not above"), in the quantity's unit
 * @param upper highest allowed rate, in the quantity's unit
 * @param source the clause with its confidence mark ([S] published text, [M] from memory)
 */
public record ControlRateRule(String name, StrainRatePhase phase, Quantity quantity, double lower, double upper,
        String source) {

    /** What a rule controls. */
    public enum Quantity {
        /** Rate of stressing, MPa/s: least-squares slope of F/S0 on time. */
        STRESS_RATE("MPa/s"),
        /** Rate of straining, s⁻¹: least-squares slope of ΔL/Le on time. */
        STRAIN_RATE("s⁻¹");

        private final String unit;

        Quantity(String unit) {
            this.unit = unit;
        }

        /** The unit rates of this quantity are in. */
        public String unit() {
            return unit;
        }
    }

    /** Validates the range. */
    public ControlRateRule {
        if (!(lower >= 0) || !(upper > lower) || !Double.isFinite(upper)) {
            throw new IllegalArgumentException("rate range of '" + name + "' must have 0 ≤ lower < upper, got "
                    + lower + "–" + upper);
        }
    }
}
