package org.specimenledger.testing;

import java.util.Map;
import org.springframework.boot.context.properties.ConfigurationProperties;

/**
 * The laboratory's own values for the requirement table of {@link StandardRequirements}, for values it has
 * confirmed against its copy of a standard (most defaults are marked [M]). Only what is given replaces a
 * default; {@code none} removes a rule. Example:
 *
 * <pre>
 * ledger.standards.requirements.ISO_6892_1.force-class=1
 * ledger.standards.requirements.ISO_6892_1.max-temperature-c=35
 * ledger.standards.requirements.ISO_37.force-class=2
 * ledger.standards.rates.iso-b-yield.upper=0.0025
 * </pre>
 *
 * @param requirements by standard; classes as numbers ("0.5", "1", "2") or "none", temperatures in °C or "none"
 * @param rates rate ranges of the method B and ASTM checks by rule: {@code iso-b-elastic-low-modulus},
 *     {@code iso-b-elastic-high-modulus} (MPa/s), {@code iso-b-yield}, {@code iso-b-hardening} (s⁻¹),
 *     {@code astm-yield-stressing} (MPa/s), {@code astm-yield-straining}, {@code astm-tensile-strength} (s⁻¹);
 *     a bound not given keeps its default
 */
@ConfigurationProperties("ledger.standards")
public record StandardSettings(Map<TestStandard, Given> requirements, Map<String, Range> rates) {

    /** A rate range; null keeps the default bound. */
    public record Range(Double lower, Double upper) {
    }

    /** The values given for one standard; null keeps the default. */
    public record Given(String forceClass, String extensometerClassForStrengths,
            String extensometerClassForElongations, String minTemperatureC, String maxTemperatureC) {
    }
}
