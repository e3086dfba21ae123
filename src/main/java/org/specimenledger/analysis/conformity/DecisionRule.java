package org.specimenledger.analysis.conformity;

import java.util.Objects;

/**
 * How a result is compared with a specification limit (ILAC-G8:09/2019 §4.2 [M: section numbers from
 * memory]).
 *
 * <ul>
 *   <li>{@link Kind#SIMPLE_ACCEPTANCE} (the default): no guard band; at the limit the risk of a false
 *       accept can reach 50 %. By default the REPORTED, rounded value is compared with the limit, as is
 *       usual for tensile reports [CP]: a reported 355 MPa meets "ReH ≥ 355 MPa" even if the computed
 *       value was 354.6. {@link #simpleAcceptanceOnFullPrecision()} compares the unrounded value.</li>
 *   <li>{@link Kind#GUARD_BANDED}: guard band w = U (k = 2), giving a non-binary statement; for a lower
 *       limit L: value ≥ L + U pass; L ≤ value &lt; L + U conditional pass; L − U &lt; value &lt; L
 *       conditional fail; value ≤ L − U fail; mirrored for an upper limit. Without U no decision is
 *       made.</li>
 * </ul>
 *
 * @param kind     which rule
 * @param compared whether the reported (rounded) or the full-precision value is compared
 */
public record DecisionRule(Kind kind, ComparedValue compared) {

    /** The rule family. */
    public enum Kind { SIMPLE_ACCEPTANCE, GUARD_BANDED }

    /** Which value is compared with the limits. */
    public enum ComparedValue {
        /** The rounded value as printed on the certificate. */
        REPORTED,
        /** The unrounded value as computed. */
        FULL_PRECISION
    }

    public DecisionRule {
        Objects.requireNonNull(kind, "kind");
        Objects.requireNonNull(compared, "compared");
    }

    /** The default: simple acceptance on the reported, rounded value. */
    public static DecisionRule simpleAcceptance() {
        return new DecisionRule(Kind.SIMPLE_ACCEPTANCE, ComparedValue.REPORTED);
    }

    /** Simple acceptance on the full-precision value. */
    public static DecisionRule simpleAcceptanceOnFullPrecision() {
        return new DecisionRule(Kind.SIMPLE_ACCEPTANCE, ComparedValue.FULL_PRECISION);
    }

    /** Guard-banded acceptance, w = U, on the reported value. */
    public static DecisionRule guardBanded() {
        return new DecisionRule(Kind.GUARD_BANDED, ComparedValue.REPORTED);
    }

    /** The rule as printed on a certificate. */
    public String statement() {
        String value = compared == ComparedValue.REPORTED
                ? "the reported value, rounded as printed,"
                : "the computed value at full precision (before rounding)";
        if (kind == Kind.SIMPLE_ACCEPTANCE) {
            return "Simple acceptance (ILAC-G8:09/2019, 4.2.1): " + value
                    + " is compared with each specification limit; no guard band is applied, so a value at a"
                    + " limit passes.";
        }
        return "Guard-banded acceptance (ILAC-G8:09/2019, 4.2.3): " + value
                + " is compared with each specification limit using a guard band equal to the expanded"
                + " uncertainty U (k = 2): pass, conditional pass, conditional fail or fail.";
    }
}
