package org.specimenledger.analysis;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * The outcome of one tensile analysis: everything needed to report, draw and reproduce it.
 *
 * @param methodVersion {@link TensileAnalysis#METHOD_VERSION} of the code that produced it
 * @param parameters the parameters used
 * @param yielding the yielding behaviour found
 * @param properties ordered by key: E, ReH, ReL, Rp (one per offset), Rt (one per total extension),
 *     Fm, Rm, Ae, Agt, Ag, At, A, Z, W, Welastic; every key always present with a status
 * @param warnings things a reviewer should look at, in the order found
 * @param strainRates one check per {@link StrainRatePhase}, in enum order
 */
public record TensileResult(String methodVersion, TensileParameters parameters, Yielding yielding,
        Map<String, PropertyResult> properties, List<AnalysisWarning> warnings, List<StrainRateCheck> strainRates) {

    /** Freezes the collections, keeping the property order. */
    public TensileResult {
        properties = Collections.unmodifiableMap(new LinkedHashMap<>(properties));
        warnings = List.copyOf(warnings);
        strainRates = List.copyOf(strainRates);
    }

    /**
     * One property by its ISO symbol.
     *
     * @param symbol e.g. "Rp0.2"
     * @return the property
     * @throws IllegalArgumentException when the symbol is not among the keys
     */
    public PropertyResult property(String symbol) {
        PropertyResult r = properties.get(symbol);
        if (r == null) {
            throw new IllegalArgumentException("no property " + symbol + "; keys are " + properties.keySet());
        }
        return r;
    }

    /**
     * Whether a warning with this code was raised.
     *
     * @param code warning code
     * @return true when present
     */
    public boolean hasWarning(String code) {
        return warnings.stream().anyMatch(w -> w.code().equals(code));
    }
}
