package org.specimenledger.analysis.conformity;

import java.math.BigDecimal;
import java.util.Objects;
import java.util.Optional;

/**
 * A specification limit on one property: a minimum, a maximum or both, in {@code unit} (the unit of
 * the result it is checked against; the caller converts).
 *
 * @param property ISO 6892-1 symbol, e.g. "ReH", "Rm", "A"
 */
public record Requirement(String property, Optional<BigDecimal> min, Optional<BigDecimal> max, String unit) {

    /** Checks that at least one limit is given and that min does not exceed max. */
    public Requirement {
        Objects.requireNonNull(property, "property");
        Objects.requireNonNull(min, "min");
        Objects.requireNonNull(max, "max");
        Objects.requireNonNull(unit, "unit");
        if (min.isEmpty() && max.isEmpty()) {
            throw new IllegalArgumentException("requirement on " + property + " has neither a minimum nor a maximum");
        }
        if (min.isPresent() && max.isPresent() && min.get().compareTo(max.get()) > 0) {
            throw new IllegalArgumentException("requirement on " + property + ": minimum " + min.get()
                    + " exceeds maximum " + max.get());
        }
    }

    /** A lower limit only, e.g. ReH ≥ 355 MPa. */
    public static Requirement atLeast(String property, String min, String unit) {
        return new Requirement(property, Optional.of(new BigDecimal(min)), Optional.empty(), unit);
    }

    /** An upper limit only. */
    public static Requirement atMost(String property, String max, String unit) {
        return new Requirement(property, Optional.empty(), Optional.of(new BigDecimal(max)), unit);
    }

    /** Both limits, e.g. Rm 470 … 630 MPa. */
    public static Requirement between(String property, String min, String max, String unit) {
        return new Requirement(property, Optional.of(new BigDecimal(min)), Optional.of(new BigDecimal(max)), unit);
    }

    /** The requirement as printed, e.g. "≥ 355 MPa", "≤ 0.85", "470 … 630 MPa". */
    public String printable() {
        String limits;
        if (min.isPresent() && max.isPresent()) {
            limits = min.get().toPlainString() + " … " + max.get().toPlainString();
        } else if (min.isPresent()) {
            limits = "≥ " + min.get().toPlainString();
        } else {
            limits = "≤ " + max.get().toPlainString();
        }
        return unit.isEmpty() ? limits : limits + " " + unit;
    }
}
