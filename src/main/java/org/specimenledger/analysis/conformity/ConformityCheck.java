package org.specimenledger.analysis.conformity;

import java.math.BigDecimal;
import java.util.List;
import java.util.Objects;
import java.util.Set;
import org.specimenledger.analysis.PropertyStatus;

/**
 * Decides the conformity of one result with one requirement under a {@link DecisionRule}. All
 * comparisons are exact decimal comparisons ({@link BigDecimal}); a full-precision double is taken at
 * its exact binary value. Immutable and thread-safe.
 *
 * <p>Order of checks: a result that is not determined gives {@link Verdict#NOT_DETERMINED}; one carrying a
 * blocking flag gives {@link Verdict#FLAGGED}; under the guard-banded rule a result without U gives
 * {@link Verdict#NOT_DECIDABLE}; otherwise each limit is compared and, with two limits, the worse
 * outcome is returned.
 */
public final class ConformityCheck {

    private final DecisionRule rule;
    private final Set<String> blockingFlags;

    /**
     * @param rule          the decision rule stated on the certificate
     * @param blockingFlags flags that forbid a decision on the value they are attached to
     */
    public ConformityCheck(DecisionRule rule, Set<String> blockingFlags) {
        this.rule = Objects.requireNonNull(rule, "rule");
        this.blockingFlags = Set.copyOf(blockingFlags);
    }

    /** A check under {@code rule} with no blocking flags. */
    public ConformityCheck(DecisionRule rule) {
        this(rule, Set.of());
    }

    /**
     * The verdict for {@code result} against {@code requirement}.
     *
     * @throws IllegalArgumentException when the result is for another property than the requirement
     */
    public ConformityDecision decide(Requirement requirement, MeasuredResult result) {
        if (!requirement.property().equals(result.property())) {
            throw new IllegalArgumentException("requirement on " + requirement.property()
                    + " checked against a result for " + result.property());
        }
        String statement = rule.statement();
        String property = requirement.property();
        if (result.status() != PropertyStatus.DETERMINED) {
            return new ConformityDecision(Verdict.NOT_DETERMINED, property + " is required ("
                    + requirement.printable() + ") but was " + describe(result.status()), statement);
        }
        List<String> blocking = result.flags().stream().filter(blockingFlags::contains).toList();
        if (!blocking.isEmpty()) {
            return new ConformityDecision(Verdict.FLAGGED, property + " carries blocking flag(s) "
                    + String.join(", ", blocking) + "; no conformity decision", statement);
        }
        BigDecimal value = rule.compared() == DecisionRule.ComparedValue.REPORTED
                ? result.reported().orElseThrow()
                : new BigDecimal(result.value());
        BigDecimal u = BigDecimal.ZERO;
        if (rule.kind() == DecisionRule.Kind.GUARD_BANDED) {
            if (result.expandedUncertainty().isEmpty()) {
                return new ConformityDecision(Verdict.NOT_DECIDABLE, property
                        + ": the guard-banded rule needs the expanded uncertainty U, which was not estimated",
                        statement);
            }
            u = result.expandedUncertainty().get();
        }
        Verdict verdict = Verdict.PASS;
        StringBuilder reason = new StringBuilder(property).append(' ').append(value.toPlainString());
        if (requirement.min().isPresent()) {
            BigDecimal low = requirement.min().get();
            Verdict lower = againstLower(value, low, u);
            verdict = Verdict.worse(verdict, lower);
            reason.append(lowerText(lower, low));
        }
        if (requirement.max().isPresent()) {
            BigDecimal high = requirement.max().get();
            Verdict upper = againstUpper(value, high, u);
            verdict = Verdict.worse(verdict, upper);
            reason.append(upperText(upper, high));
        }
        if (rule.kind() == DecisionRule.Kind.GUARD_BANDED) {
            reason.append(" (guard band U = ").append(u.toPlainString()).append(')');
        }
        return new ConformityDecision(verdict, reason.toString(), statement);
    }

    /** Lower limit L: ≥ L + U pass; [L, L + U) conditional pass; (L − U, L) conditional fail; ≤ L − U fail. */
    private Verdict againstLower(BigDecimal value, BigDecimal low, BigDecimal u) {
        if (value.compareTo(low.add(u)) >= 0) {
            return Verdict.PASS;
        }
        if (value.compareTo(low) >= 0) {
            return Verdict.CONDITIONAL_PASS;
        }
        if (value.compareTo(low.subtract(u)) > 0) {
            return Verdict.CONDITIONAL_FAIL;
        }
        return Verdict.FAIL;
    }

    /** Upper limit M, mirrored: ≤ M − U pass; (M − U, M] conditional pass; (M, M + U) conditional fail; ≥ M + U fail. */
    private Verdict againstUpper(BigDecimal value, BigDecimal high, BigDecimal u) {
        if (value.compareTo(high.subtract(u)) <= 0) {
            return Verdict.PASS;
        }
        if (value.compareTo(high) <= 0) {
            return Verdict.CONDITIONAL_PASS;
        }
        if (value.compareTo(high.add(u)) < 0) {
            return Verdict.CONDITIONAL_FAIL;
        }
        return Verdict.FAIL;
    }

    private static String lowerText(Verdict v, BigDecimal low) {
        return switch (v) {
            case PASS -> ", meets minimum " + low.toPlainString();
            case CONDITIONAL_PASS -> ", meets minimum " + low.toPlainString() + " by less than U";
            case CONDITIONAL_FAIL -> ", below minimum " + low.toPlainString() + " by less than U";
            default -> ", below minimum " + low.toPlainString();
        };
    }

    private static String upperText(Verdict v, BigDecimal high) {
        return switch (v) {
            case PASS -> ", within maximum " + high.toPlainString();
            case CONDITIONAL_PASS -> ", within maximum " + high.toPlainString() + " by less than U";
            case CONDITIONAL_FAIL -> ", above maximum " + high.toPlainString() + " by less than U";
            default -> ", above maximum " + high.toPlainString();
        };
    }

    private static String describe(PropertyStatus status) {
        return status == PropertyStatus.NOT_APPLICABLE ? "not applicable to this curve" : "not determinable";
    }
}
