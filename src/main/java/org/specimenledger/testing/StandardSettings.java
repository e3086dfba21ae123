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
 * </pre>
 *
 * @param requirements by standard; classes as numbers ("0.5", "1", "2") or "none", temperatures in °C or "none"
 */
@ConfigurationProperties("ledger.standards")
public record StandardSettings(Map<TestStandard, Given> requirements) {

    /** The values given for one standard; null keeps the default. */
    public record Given(String forceClass, String extensometerClassForStrengths,
            String extensometerClassForElongations, String minTemperatureC, String maxTemperatureC) {
    }
}
