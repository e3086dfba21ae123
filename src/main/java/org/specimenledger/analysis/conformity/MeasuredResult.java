package org.specimenledger.analysis.conformity;

import java.math.BigDecimal;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import org.specimenledger.analysis.PropertyStatus;

/**
 * One property's result as the conformity decision sees it.
 *
 * @param property            ISO 6892-1 symbol, the same as the requirement's
 * @param value               full-precision value in the requirement's unit; ignored unless determined
 * @param reported            the rounded value as printed on the certificate; present when determined
 * @param status              determined, not applicable or not determinable
 * @param flags               analysis flags or warnings attached to the value (codes or short texts)
 * @param expandedUncertainty expanded uncertainty U at k = 2, in the same unit, when estimated
 */
public record MeasuredResult(String property, double value, Optional<BigDecimal> reported, PropertyStatus status,
                             List<String> flags, Optional<BigDecimal> expandedUncertainty) {

    /** Checks consistency: a determined result has a finite value and a reported value; U is not negative. */
    public MeasuredResult {
        Objects.requireNonNull(property, "property");
        Objects.requireNonNull(reported, "reported");
        Objects.requireNonNull(status, "status");
        flags = List.copyOf(flags);
        Objects.requireNonNull(expandedUncertainty, "expandedUncertainty");
        if (status == PropertyStatus.DETERMINED && (!Double.isFinite(value) || reported.isEmpty())) {
            throw new IllegalArgumentException(property + " is determined but its value " + value
                    + " or reported value " + reported + " is missing");
        }
        if (expandedUncertainty.isPresent() && expandedUncertainty.get().signum() < 0) {
            throw new IllegalArgumentException(property + ": expanded uncertainty " + expandedUncertainty.get()
                    + " is negative");
        }
    }

    /** A determined result without flags. */
    public static MeasuredResult determined(String property, double value, String reported, String uncertainty) {
        return new MeasuredResult(property, value, Optional.of(new BigDecimal(reported)), PropertyStatus.DETERMINED,
                List.of(), Optional.ofNullable(uncertainty).map(BigDecimal::new));
    }

    /** A result that could not be determined or does not apply. */
    public static MeasuredResult missing(String property, PropertyStatus status) {
        return new MeasuredResult(property, Double.NaN, Optional.empty(), status, List.of(), Optional.empty());
    }

    /** This result with {@code flag} added. */
    public MeasuredResult withFlag(String flag) {
        List<String> more = new java.util.ArrayList<>(flags);
        more.add(flag);
        return new MeasuredResult(property, value, reported, status, more, expandedUncertainty);
    }
}
