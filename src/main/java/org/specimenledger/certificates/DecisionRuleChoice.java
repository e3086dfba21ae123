package org.specimenledger.certificates;

import org.specimenledger.analysis.conformity.DecisionRule;

/** The decision rules a draft may state (ILAC-G8:09/2019), as named in requests and stored. */
public enum DecisionRuleChoice {
    /** Simple acceptance on the reported, rounded value: the default. */
    SIMPLE_ACCEPTANCE(DecisionRule.simpleAcceptance()),
    /** Simple acceptance on the full-precision value. */
    SIMPLE_ACCEPTANCE_FULL_PRECISION(DecisionRule.simpleAcceptanceOnFullPrecision()),
    /** Guard-banded acceptance with w = U (k = 2): pass, conditional pass, conditional fail, fail. */
    GUARD_BANDED(DecisionRule.guardBanded());

    private final DecisionRule rule;

    DecisionRuleChoice(DecisionRule rule) {
        this.rule = rule;
    }

    public DecisionRule rule() {
        return rule;
    }
}
