package org.specimenledger.heats;

import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.specimenledger.shared.FieldIssue;
import org.specimenledger.shared.RuleViolation;

/**
 * Checks a heat before it is stored: a finite nominal size and a chemical composition whose keys are
 * element symbols, whose mass percentages lie in [0, 100] and add up to at most 100. All problems are
 * reported at once, each at {@code /composition/<symbol>} (or {@code /composition} for the sum).
 */
final class HeatRules {

    private static final BigDecimal HUNDRED = BigDecimal.valueOf(100);

    private HeatRules() {
    }

    /** The composition to store (never null), or a {@link RuleViolation} listing every problem. */
    static Map<String, BigDecimal> checked(HeatRequests.HeatRequest request) {
        List<FieldIssue> issues = new ArrayList<>();
        BigDecimal size = request.nominalThicknessMm();
        if (size != null && !Double.isFinite(size.doubleValue())) {
            issues.add(new FieldIssue("/nominalThicknessMm", "nominal thickness must be a finite number of mm"));
        }
        Map<String, BigDecimal> composition = new HashMap<>();
        BigDecimal sum = BigDecimal.ZERO;
        if (request.composition() != null) {
            for (Map.Entry<String, BigDecimal> e : request.composition().entrySet()) {
                String symbol = e.getKey();
                String at = "/composition/" + escape(symbol);
                BigDecimal percent = e.getValue();
                if (!ChemicalElements.isSymbol(symbol)) {
                    issues.add(new FieldIssue(at, "'" + symbol + "' is not a chemical element symbol"
                            + ChemicalElements.properCase(symbol).map(s -> "; did you mean '" + s + "'?").orElse("")));
                }
                if (percent == null) {
                    issues.add(new FieldIssue(at, "a mass % is required for " + symbol));
                } else if (percent.signum() < 0 || percent.compareTo(HUNDRED) > 0) {
                    issues.add(new FieldIssue(at, "mass % of " + symbol + " must lie between 0 and 100, got "
                            + percent.toPlainString()));
                } else {
                    sum = sum.add(percent);
                }
                composition.put(symbol, percent);
            }
        }
        if (sum.compareTo(HUNDRED) > 0) {
            issues.add(new FieldIssue("/composition", "the mass percentages add up to " + sum.toPlainString()
                    + " %, more than 100 %"));
        }
        if (!issues.isEmpty()) {
            throw new RuleViolation(issues);
        }
        return composition;
    }

    /** JSON Pointer escaping of one reference token (RFC 6901 §3): {@code ~} → {@code ~0}, {@code /} → {@code ~1}. */
    static String escape(String token) {
        return String.valueOf(token).replace("~", "~0").replace("/", "~1");
    }
}
