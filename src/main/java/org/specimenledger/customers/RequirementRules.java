package org.specimenledger.customers;

import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import java.util.regex.Pattern;
import org.specimenledger.shared.FieldIssue;
import org.specimenledger.shared.RuleViolation;

/**
 * Checks an order's requirements before they are stored: a known ISO 6892-1 property symbol, a unit
 * that property may be written in (SI, or ASTM's customary ksi, lbf, kip; see {@link RequirementUnit}), at least one limit, and ranges that are not upside down. All problems
 * are reported at once.
 */
final class RequirementRules {

    private static final Pattern STRENGTH = Pattern.compile("ReH|ReL|Rm|Rp\\d+(\\.\\d+)?|Rt\\d+(\\.\\d+)?");
    private static final Pattern PERCENT = Pattern.compile("A|Ag|Agt|At|Ae|Z|A\\d+(\\.\\d+)?mm");
    private static final Set<String> STRENGTH_UNITS = Set.of("MPa", "ksi");
    private static final Set<String> MODULUS_UNITS = Set.of("MPa", "GPa", "ksi");
    private static final Set<String> FORCE_UNITS = Set.of("N", "kN", "lbf", "kip");

    private RequirementRules() {
    }

    static List<Requirement> checked(List<CustomerRequests.RequirementRequest> requests) {
        List<FieldIssue> issues = new ArrayList<>();
        List<Requirement> out = new ArrayList<>();
        for (int i = 0; i < requests.size(); i++) {
            CustomerRequests.RequirementRequest r = requests.get(i);
            String at = "/requirements/" + i;
            String property = r.property().trim();
            String unit = r.unit().trim();
            String expected = expectedUnit(property);
            if (expected == null) {
                issues.add(new FieldIssue(at + "/property", "unknown property '" + property
                        + "'; use an ISO 6892-1 symbol such as ReH, ReL, Rp0.2, Rt0.5, Rm, A, Agt, Ag, Z, E, Fm"));
            } else if (!acceptsUnit(property, unit)) {
                issues.add(new FieldIssue(at + "/unit", "unit '" + unit + "' does not fit " + property
                        + "; use " + expected));
            }
            if (r.min() == null && r.max() == null) {
                issues.add(new FieldIssue(at, "a requirement needs a min, a max or both"));
            }
            if (r.min() != null && r.max() != null && r.min().compareTo(r.max()) > 0) {
                issues.add(new FieldIssue(at + "/min", "min " + r.min() + " is above max " + r.max()));
            }
            if (r.thicknessMinMm() != null && r.thicknessMaxMm() != null
                    && r.thicknessMinMm().compareTo(r.thicknessMaxMm()) > 0) {
                issues.add(new FieldIssue(at + "/thicknessMinMm", "thickness range starts at " + r.thicknessMinMm()
                        + " mm, above its end " + r.thicknessMaxMm() + " mm"));
            }
            out.add(new Requirement(property, r.min(), r.max(), unit, r.thicknessMinMm(), r.thicknessMaxMm()));
        }
        if (!issues.isEmpty()) {
            throw new RuleViolation(issues);
        }
        return out;
    }

    private static String expectedUnit(String property) {
        if (STRENGTH.matcher(property).matches()) {
            return "MPa or ksi";
        }
        if (PERCENT.matcher(property).matches()) {
            return "%";
        }
        if (property.equals("E")) {
            return "MPa, GPa or ksi";
        }
        if (property.equals("Fm")) {
            return "N, kN, lbf or kip";
        }
        if (property.equals("W")) {
            return "J";
        }
        return null;
    }

    private static boolean acceptsUnit(String property, String unit) {
        if (property.equals("E")) {
            return MODULUS_UNITS.contains(unit);
        }
        if (property.equals("Fm")) {
            return FORCE_UNITS.contains(unit);
        }
        if (STRENGTH.matcher(property).matches()) {
            return STRENGTH_UNITS.contains(unit);
        }
        return expectedUnit(property).equals(unit);
    }
}
