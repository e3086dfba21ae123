package org.specimenledger.shared;

import java.util.List;

/**
 * A well-formed request that breaks a rule of the laboratory (min above max, calibration due before
 * it was made, unknown heat...). 422, with each broken rule and where.
 */
public class RuleViolation extends RuntimeException {

    private final List<FieldIssue> issues;

    public RuleViolation(String pointer, String detail) {
        this(List.of(new FieldIssue(pointer, detail)));
    }

    public RuleViolation(List<FieldIssue> issues) {
        super(issues.isEmpty() ? "request breaks a rule" : issues.get(0).detail());
        if (issues.isEmpty()) {
            throw new IllegalArgumentException("a rule violation needs at least one issue");
        }
        this.issues = List.copyOf(issues);
    }

    public List<FieldIssue> issues() {
        return issues;
    }
}
