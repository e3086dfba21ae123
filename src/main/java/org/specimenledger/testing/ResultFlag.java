package org.specimenledger.testing;

import java.util.List;

/**
 * Something a reviewer must see beside the results of an analysis: a condition outside the standard's
 * range or a value obtained in a way the report must state.
 *
 * @param code       stable name, e.g. {@code CALIBRATION_OVERRIDE}, {@code TEMPERATURE_OUTSIDE_RANGE}
 * @param message    what and why, with the values
 * @param properties the property symbols it concerns, or null when it concerns every result of the run
 */
public record ResultFlag(String code, String message, List<String> properties) {

    public static final String CALIBRATION_OVERRIDE = "CALIBRATION_OVERRIDE";
    public static final String CALIBRATION_NO_LONGER_VALID = "CALIBRATION_NO_LONGER_VALID";
    public static final String TEMPERATURE_OUTSIDE_RANGE = "TEMPERATURE_OUTSIDE_RANGE";
    public static final String STRAIN_RATE_OUTSIDE_RANGE = "STRAIN_RATE_OUTSIDE_RANGE";
    public static final String STRESS_RATE_OUTSIDE_RANGE = "STRESS_RATE_OUTSIDE_RANGE";
    public static final String FRACTURE_OUTSIDE_VALID_ZONE = "FRACTURE_OUTSIDE_VALID_ZONE";
    public static final String ELONGATION_FROM_EXTENSOMETER = "ELONGATION_FROM_EXTENSOMETER";
    public static final String FORCE_OUTSIDE_CALIBRATED_RANGE = "FORCE_OUTSIDE_CALIBRATED_RANGE";
    public static final String TOE_COMPENSATED = "TOE_COMPENSATED";
    public static final String EXTENSION_FROM_CROSSHEAD = "EXTENSION_FROM_CROSSHEAD";
    public static final String CROSSHEAD_ONLY = "CROSSHEAD_ONLY";
    public static final String UNLOAD_RELOAD_LOOP = "UNLOAD_RELOAD_LOOP";
    /** Data-quality findings of the engine; the engine's warning code is the flag's code. */
    public static final List<String> DATA_QUALITY = List.of("DUPLICATED_TIME_STAMPS", "FORCE_RESOLUTION_COARSE",
            "FORCE_CLIPPED", "YIELD_DROP_UNDER_SAMPLED", "EXTENSOMETER_FROZEN", "COMPLIANCE_NOT_GIVEN");
}
