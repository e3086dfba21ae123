package org.specimenledger.analysis.conformity;

/**
 * The outcome of checking one result against one requirement. The first four are the statements of
 * ILAC-G8:09/2019 (pass, conditional pass, conditional fail, fail), ordered from best to worst; the
 * others say why no comparison was made. Only {@link #PASS} and {@link #CONDITIONAL_PASS} are passes.
 */
public enum Verdict {
    /** Inside the acceptance zone. */
    PASS("pass"),
    /** Guard-banded rule only: within the limit but closer to it than U. */
    CONDITIONAL_PASS("conditional pass"),
    /** Guard-banded rule only: outside the limit but by less than U. */
    CONDITIONAL_FAIL("conditional fail"),
    /** Outside the limit (by U or more under the guard-banded rule). */
    FAIL("fail"),
    /** The property is required but was not determined (not applicable or not determinable). */
    NOT_DETERMINED("not determined"),
    /** The property was determined with a flag the laboratory treats as blocking a decision. */
    FLAGGED("not decided: flagged"),
    /** The decision rule needs a quantity the result does not have (U under the guard-banded rule). */
    NOT_DECIDABLE("not decidable");

    private final String printable;

    Verdict(String printable) {
        this.printable = printable;
    }

    /** The verdict as printed in the results table. */
    public String printable() {
        return printable;
    }

    /** True for a pass or a conditional pass; never for a result that was not compared. */
    public boolean isPass() {
        return this == PASS || this == CONDITIONAL_PASS;
    }

    /** The worse of two comparison outcomes (used with two-sided requirements). */
    static Verdict worse(Verdict a, Verdict b) {
        return a.ordinal() >= b.ordinal() ? a : b;
    }
}
