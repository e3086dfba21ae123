package org.specimenledger.analysis.conformity;

import java.util.Objects;

/**
 * A verdict with its reason and the printable statement of the decision rule that produced it
 * (ISO/IEC 17025:2017 7.8.6 asks a conformity statement to name the rule applied).
 */
public record ConformityDecision(Verdict verdict, String reason, String ruleStatement) {

    public ConformityDecision {
        Objects.requireNonNull(verdict, "verdict");
        Objects.requireNonNull(reason, "reason");
        Objects.requireNonNull(ruleStatement, "ruleStatement");
    }
}
