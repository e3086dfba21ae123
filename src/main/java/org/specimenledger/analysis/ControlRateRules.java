package org.specimenledger.analysis;

/**
 * The rate rules {@link StrainRates} checks method B and ASTM E8/E8M runs against; {@link #defaults()} are the
 * constants of {@link StrainRates} with their sources and marks. A laboratory that has confirmed other values
 * against its copy of a standard passes its own.
 */
public record ControlRateRules(ControlRateRule isoBElasticLowModulus, ControlRateRule isoBElasticHighModulus,
        ControlRateRule isoBYield, ControlRateRule isoBHardening, ControlRateRule astmYieldStressing,
        ControlRateRule astmYieldStraining, ControlRateRule astmTensileStrength) {

    /** The rules as {@link StrainRates} states them. */
    public static ControlRateRules defaults() {
        return new ControlRateRules(StrainRates.ISO_B_ELASTIC_LOW_MODULUS, StrainRates.ISO_B_ELASTIC_HIGH_MODULUS,
                StrainRates.ISO_B_YIELD, StrainRates.ISO_B_HARDENING, StrainRates.ASTM_YIELD_STRESSING,
                StrainRates.ASTM_YIELD_STRAINING, StrainRates.ASTM_TENSILE_STRENGTH);
    }

    /** The same rule with another range; the source then says the range was configured. */
    public static ControlRateRule ranged(ControlRateRule rule, double lower, double upper) {
        return new ControlRateRule(rule.name(), rule.phase(), rule.quantity(), lower, upper,
                "laboratory configuration over " + rule.source());
    }
}
