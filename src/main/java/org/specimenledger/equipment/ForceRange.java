package org.specimenledger.equipment;

import jakarta.persistence.Column;
import jakarta.persistence.Embeddable;
import java.math.BigDecimal;

/**
 * One range of a force transducer, named by its upper limit in N; verified from {@code lowerLimitN}
 * upward (ISO 7500-1 verifies from 20 % of the range [from memory]).
 */
@Embeddable
record ForceRange(
        @Column(name = "upper_limit_n", nullable = false) BigDecimal upperLimitN,
        @Column(name = "lower_limit_n", nullable = false) BigDecimal lowerLimitN) {

    /** Same range whatever the number of trailing zeros the user typed. */
    boolean sameLimitsAs(ForceRange other) {
        return upperLimitN.compareTo(other.upperLimitN) == 0 && lowerLimitN.compareTo(other.lowerLimitN) == 0;
    }

    boolean hasUpperLimit(BigDecimal n) {
        return upperLimitN.compareTo(n) == 0;
    }
}
