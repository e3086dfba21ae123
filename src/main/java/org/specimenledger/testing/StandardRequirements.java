package org.specimenledger.testing;

import java.math.BigDecimal;
import java.util.Collection;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.regex.Pattern;
import org.specimenledger.analysis.ControlRateRule;
import org.specimenledger.analysis.ControlRateRules;

/**
 * What each standard asks of the equipment and the test conditions, in one place with the source and
 * the confidence mark of each value ([S] published text, [M] from memory of the standard, to be
 * confirmed against a purchased copy; DOMAIN.md "Equipment and calibration", "Test pieces and
 * conditions"). Pure: no Spring, no I/O.
 *
 * <p>Classes are compared by their number: 0.5 is better than 1, 1 better than 2. A {@code null} class
 * limit means the standard sets no class rule beyond a calibration valid on the test date.
 *
 * <p>The values below are the defaults ({@link #DEFAULTS}); a laboratory replaces any of them through
 * {@link StandardSettings} ({@code ledger.standards.<standard>.*}) once it has confirmed them against its own
 * copy of the standard, and the service uses that table ({@link #with}).
 */
final class StandardRequirements {

    /**
     * The requirements of one standard.
     *
     * @param forceClass worst ISO 7500-1 force class allowed on the range used, or null
     * @param extensometerClassForStrengths worst ISO 9513 extensometer class for ReH, ReL, Rp, Rt, Ae
     *     (and E), or null
     * @param extensometerClassForElongations worst class for Ag, Agt, A, At (and W), or null
     * @param minTemperatureC lowest test temperature in °C, or null (no check)
     * @param maxTemperatureC highest test temperature in °C, or null
     * @param source where the values come from, with their marks
     */
    record Requirement(String forceClass, String extensometerClassForStrengths,
            String extensometerClassForElongations, BigDecimal minTemperatureC, BigDecimal maxTemperatureC,
            String source) {
    }

    private static final Map<TestStandard, Requirement> TABLE = new EnumMap<>(TestStandard.class);

    /** The table as written below, with the sources and marks of its values. */
    static final StandardRequirements DEFAULTS;

    static {
        // ISO 6892-1 asks for a class 1 force-measuring system (ISO 7500-1) [M], extensometer class 1 for
        // ReH, ReL, Rp, Rt, Ae and class 2 for Ag, Agt, A, At (ISO 9513) [M]; 10–35 °C [M for 6892-1; S in
        // ISO 10275 wording].
        TABLE.put(TestStandard.ISO_6892_1, new Requirement("1", "1", "2", new BigDecimal("10"), new BigDecimal("35"),
                "ISO 6892-1 via ISO 7500-1 and ISO 9513 [M]; temperature 10–35 °C [M]"));
        // ASTM E8/E8M: force verified per ASTM E4 to ±1 %, taken as class 1 [M]; extensometer per ASTM E83,
        // taken as class 1 for yield [M] and class 2 for elongation [M]; 10–38 °C [S].
        Requirement astm = new Requirement("1", "1", "2", new BigDecimal("10"), new BigDecimal("38"),
                "ASTM E8/E8M via ASTM E4 (±1 %, as class 1) and ASTM E83 (as class 1 for yield) [M];"
                        + " temperature 10–38 °C [S]");
        TABLE.put(TestStandard.ASTM_E8, astm);
        TABLE.put(TestStandard.ASTM_E8M, astm);
        // ISO 37: no class rule beyond a valid calibration here; the standard laboratory temperature of
        // rubber testing, 23 ± 2 °C (ISO 23529) [M].
        TABLE.put(TestStandard.ISO_37, new Requirement(null, null, null, new BigDecimal("21"), new BigDecimal("25"),
                "ISO 37 with the ISO 23529 laboratory temperature 23 ± 2 °C [M]; no class rule"));
        TABLE.put(TestStandard.OTHER, new Requirement(null, null, null, null, null,
                "other procedure: a valid calibration only, no class or temperature rule"));
        DEFAULTS = new StandardRequirements(TABLE);
    }

    private final Map<TestStandard, Requirement> table;
    private final ControlRateRules rates;

    private StandardRequirements(Map<TestStandard, Requirement> table) {
        this(table, ControlRateRules.defaults());
    }

    private StandardRequirements(Map<TestStandard, Requirement> table, ControlRateRules rates) {
        this.table = Map.copyOf(table);
        this.rates = rates;
    }

    /** The rate rules of the method B and ASTM checks. */
    ControlRateRules rates() {
        return rates;
    }

    private static ControlRateRules rates(ControlRateRules d, Map<String, StandardSettings.Range> given) {
        if (given == null || given.isEmpty()) {
            return d;
        }
        java.util.Map<String, ControlRateRule> byKey = new java.util.LinkedHashMap<>();
        byKey.put("iso-b-elastic-low-modulus", d.isoBElasticLowModulus());
        byKey.put("iso-b-elastic-high-modulus", d.isoBElasticHighModulus());
        byKey.put("iso-b-yield", d.isoBYield());
        byKey.put("iso-b-hardening", d.isoBHardening());
        byKey.put("astm-yield-stressing", d.astmYieldStressing());
        byKey.put("astm-yield-straining", d.astmYieldStraining());
        byKey.put("astm-tensile-strength", d.astmTensileStrength());
        given.forEach((key, range) -> {
            ControlRateRule rule = byKey.get(key);
            if (rule == null) {
                throw new IllegalArgumentException("ledger.standards.rates." + key + " names no rate rule; the rules are "
                        + byKey.keySet());
            }
            byKey.put(key, ControlRateRules.ranged(rule, range.lower() == null ? rule.lower() : range.lower(),
                    range.upper() == null ? rule.upper() : range.upper()));
        });
        return new ControlRateRules(byKey.get("iso-b-elastic-low-modulus"), byKey.get("iso-b-elastic-high-modulus"),
                byKey.get("iso-b-yield"), byKey.get("iso-b-hardening"), byKey.get("astm-yield-stressing"),
                byKey.get("astm-yield-straining"), byKey.get("astm-tensile-strength"));
    }

    /**
     * This table with the laboratory's own values where configured. A class or temperature given as
     * {@code none} removes that rule; the source then says the value was configured.
     */
    StandardRequirements with(StandardSettings settings) {
        Map<TestStandard, Requirement> out = new EnumMap<>(table);
        if (settings == null || (settings.requirements() == null && settings.rates() == null)) {
            return this;
        }
        ControlRateRules configuredRates = rates(rates, settings.rates());
        (settings.requirements() == null ? Map.<TestStandard, StandardSettings.Given>of() : settings.requirements())
                .forEach((standard, given) -> {
            Requirement d = out.get(standard);
            Requirement r = new Requirement(
                    pick(given.forceClass(), d.forceClass()),
                    pick(given.extensometerClassForStrengths(), d.extensometerClassForStrengths()),
                    pick(given.extensometerClassForElongations(), d.extensometerClassForElongations()),
                    decimal(given.minTemperatureC(), d.minTemperatureC()),
                    decimal(given.maxTemperatureC(), d.maxTemperatureC()),
                    "laboratory configuration (ledger.standards) over: " + d.source());
            if (r.equals(new Requirement(d.forceClass(), d.extensometerClassForStrengths(),
                    d.extensometerClassForElongations(), d.minTemperatureC(), d.maxTemperatureC(), r.source()))) {
                return; // nothing actually changed: keep the default's source
            }
            out.put(standard, r);
        });
        return new StandardRequirements(out, configuredRates);
    }

    private static String pick(String given, String fallback) {
        if (given == null || given.isBlank()) {
            return fallback;
        }
        if (given.trim().equalsIgnoreCase("none")) {
            return null;
        }
        new BigDecimal(given.trim()); // a class is a number; refuse anything else at start
        return given.trim();
    }

    private static BigDecimal decimal(String given, BigDecimal fallback) {
        if (given == null || given.isBlank()) {
            return fallback;
        }
        return given.trim().equalsIgnoreCase("none") ? null : new BigDecimal(given.trim());
    }

    /**
     * The extensometer's gauge length must match the specimen's Le within this relative tolerance, in %:
     * the class 1 gauge-length tolerance of ISO 9513 [M]. The analysis divides every extension by Le.
     */
    static final BigDecimal GAUGE_LENGTH_TOLERANCE_PERCENT = new BigDecimal("1");

    /** Properties whose extensometer class is the "strengths" one [M: ISO 6892-1 via ISO 9513]. */
    private static final Pattern STRENGTH_PROPERTIES = Pattern.compile("ReH|ReL|Rp\\d+(\\.\\d+)?|Rt\\d+(\\.\\d+)?|Ae|E");
    /** Properties whose extensometer class is the "elongations" one [M]. */
    private static final Set<String> ELONGATION_PROPERTIES = Set.of("Ag", "Agt", "A", "At", "W");
    /** Properties that need no extensometer class: force, Rm from Fm, Z from the broken pieces. */
    private static final Set<String> FORCE_ONLY_PROPERTIES = Set.of("Fm", "Rm", "Z");

    /** Property symbols a run may name as the ones it is to report. */
    static final List<String> KNOWN_PROPERTIES = List.of("E", "ReH", "ReL", "Rp0.2", "Rt0.5", "Fm", "Rm", "Ae", "Agt",
            "Ag", "At", "A", "Z", "W");

    Requirement of(TestStandard standard) {
        return table.get(standard);
    }

    /** Whether a property symbol is one this laboratory reports (Rp and Rt with any offset). */
    static boolean isKnownProperty(String symbol) {
        return STRENGTH_PROPERTIES.matcher(symbol).matches() || ELONGATION_PROPERTIES.contains(symbol)
                || FORCE_ONLY_PROPERTIES.contains(symbol);
    }

    /**
     * The worst extensometer class allowed for the properties to be reported: the strictest over them,
     * or, when {@code reported} is null, over all properties.
     *
     * @return a class such as "1", or null when the standard or those properties need no class
     */
    String extensometerClassFor(TestStandard standard, Collection<String> reported) {
        Requirement r = of(standard);
        boolean strengths = reported == null || reported.stream().anyMatch(p -> STRENGTH_PROPERTIES.matcher(p).matches());
        boolean elongations = reported == null || reported.stream().anyMatch(ELONGATION_PROPERTIES::contains);
        String needed = null;
        if (elongations) {
            needed = r.extensometerClassForElongations();
        }
        if (strengths) {
            needed = stricter(needed, r.extensometerClassForStrengths());
        }
        return needed;
    }

    /** Whether {@code actual} meets {@code limit} ("class 1 or better"); no limit is always met. */
    static boolean meets(String actual, String limit) {
        if (limit == null) {
            return true;
        }
        return actual != null && new BigDecimal(actual).compareTo(new BigDecimal(limit)) <= 0;
    }

    /** Whether the test temperature lies outside the standard's range (ends included in the range). */
    boolean temperatureOutside(TestStandard standard, BigDecimal temperatureC) {
        Requirement r = of(standard);
        return (r.minTemperatureC() != null && temperatureC.compareTo(r.minTemperatureC()) < 0)
                || (r.maxTemperatureC() != null && temperatureC.compareTo(r.maxTemperatureC()) > 0);
    }

    /** Whether the ISO 6892-1 method A strain-rate ranges apply to a run. */
    static boolean strainRateRangesApply(TestStandard standard, ControlMethod method) {
        return standard == TestStandard.ISO_6892_1 && method != null && method.isStrainRateControlled();
    }

    private static String stricter(String a, String b) {
        if (a == null) {
            return b;
        }
        if (b == null) {
            return a;
        }
        return new BigDecimal(a).compareTo(new BigDecimal(b)) <= 0 ? a : b;
    }
}
