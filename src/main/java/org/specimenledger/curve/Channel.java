package org.specimenledger.curve;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;
import java.util.Set;

/**
 * A measured quantity a curve file may carry, with the units accepted for it in the header row.
 *
 * <p>Unit symbols are matched case-sensitively as SI writes them. Conversion factors are exact by
 * definition: 1 lbf = 4.4482216152605 N (1 lb = 0.45359237 kg, 1959 international yard and pound
 * agreement; standard gravity 9.80665 m/s², 3rd CGPM 1901; listed in NIST SP 811, appendix B),
 * 1 kip = 1000 lbf, 1 in = 25.4 mm (1959 agreement; NIST SP 811).
 */
public enum Channel {

    /** Elapsed test time, canonical unit s; accepts s, ms, min. Optional. */
    TIME("time", "s", false, "s, ms or min", units(
            "s", UnitFactor.ONE,
            "ms", UnitFactor.dividedBy(1000.0),
            "min", UnitFactor.times("60"))),

    /** Force on the test piece, canonical unit N; accepts N, kN, lbf, kip. Required. */
    FORCE("force", "N", true, "N, kN, lbf or kip", units(
            "N", UnitFactor.ONE,
            "kN", UnitFactor.times("1000"),
            "lbf", UnitFactor.times("4.4482216152605"),
            "kip", UnitFactor.times("4448.2216152605"))),

    /**
     * Extensometer extension, canonical unit mm; accepts mm, µm (either micro sign), um, in. Required,
     * except that a crosshead channel may stand in for it (a record without extensometer), and with a
     * crosshead channel its cells may end (the extensometer was removed during the test).
     */
    EXTENSION("extension", "mm", true, "mm, µm (or um) or in", lengthUnits()),

    /** Crosshead displacement, canonical unit mm; same units as extension. Optional. */
    CROSSHEAD("crosshead", "mm", false, "mm, µm (or um) or in", lengthUnits());

    private final String label;
    private final String canonicalUnit;
    private final boolean required;
    private final String unitHint;
    private final Map<String, UnitFactor> factors;

    Channel(String label, String canonicalUnit, boolean required, String unitHint, Map<String, UnitFactor> factors) {
        this.label = label;
        this.canonicalUnit = canonicalUnit;
        this.required = required;
        this.unitHint = unitHint;
        this.factors = factors;
    }

    /**
     * The channel name as written in a header cell (matched case-insensitively).
     *
     * @return the lower-case name, e.g. {@code "force"}
     */
    public String label() {
        return label;
    }

    /**
     * The unit of the arrays in {@link RawCurve}.
     *
     * @return {@code "N"}, {@code "mm"} or {@code "s"}
     */
    public String canonicalUnit() {
        return canonicalUnit;
    }

    /**
     * Whether every curve file must carry this channel.
     *
     * @return true for force and extension
     */
    public boolean required() {
        return required;
    }

    /**
     * The unit symbols accepted in the header, in the order they are documented.
     *
     * @return an unmodifiable ordered set of symbols
     */
    public Set<String> acceptedUnits() {
        return Collections.unmodifiableSet(factors.keySet());
    }

    /**
     * Finds the channel named in a header cell.
     *
     * @param name the name without unit; surrounding spaces and letter case are ignored
     * @return the channel, or null when the name is not a known channel
     */
    public static Channel byLabel(String name) {
        String wanted = name.strip().toLowerCase(Locale.ROOT);
        for (Channel channel : values()) {
            if (channel.label.equals(wanted)) {
                return channel;
            }
        }
        return null;
    }

    String unitHint() {
        return unitHint;
    }

    UnitFactor factorFor(String unit) {
        return factors.get(unit);
    }

    private static Map<String, UnitFactor> lengthUnits() {
        UnitFactor micro = UnitFactor.dividedBy(1000.0);
        return units(
                "mm", UnitFactor.ONE,
                "\u00B5m", micro, // MICRO SIGN
                "\u03BCm", micro, // GREEK SMALL LETTER MU
                "um", micro,
                "in", UnitFactor.times("25.4"));
    }

    private static Map<String, UnitFactor> units(Object... symbolsAndFactors) {
        Map<String, UnitFactor> map = new LinkedHashMap<>();
        for (int i = 0; i < symbolsAndFactors.length; i += 2) {
            map.put((String) symbolsAndFactors[i], (UnitFactor) symbolsAndFactors[i + 1]);
        }
        return Collections.unmodifiableMap(map);
    }
}
