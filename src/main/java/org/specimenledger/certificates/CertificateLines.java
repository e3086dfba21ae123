package org.specimenledger.certificates;

import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.UUID;
import org.specimenledger.analysis.PropertyStatus;
import org.specimenledger.analysis.conformity.ConformityCheck;
import org.specimenledger.analysis.conformity.ConformityDecision;
import org.specimenledger.analysis.conformity.MeasuredResult;
import org.specimenledger.analysis.conformity.Requirement;
import org.specimenledger.analysis.conformity.Verdict;
import org.specimenledger.customers.OrderView;
import org.specimenledger.heats.HeatDirectory;
import org.specimenledger.heats.HeatView;
import org.specimenledger.shared.FieldIssue;
import org.specimenledger.shared.RuleViolation;
import org.specimenledger.specimens.SpecimenDirectory;
import org.specimenledger.specimens.SpecimenView;
import org.specimenledger.testing.AnalysisRunView;
import org.specimenledger.testing.ResultFlag;
import org.specimenledger.testing.TestMode;
import org.specimenledger.testing.TestRunDirectory;
import org.specimenledger.testing.TestRunView;
import org.springframework.stereotype.Component;
import org.springframework.transaction.annotation.Transactional;

/**
 * Builds a certificate's lines for chosen specimens of one order: each specimen's valid test run and its current
 * analysis, one line per required property (the first requirement of the order whose thickness range holds the
 * heat's nominal thickness), then the run's further reported properties without a requirement. The verdict comes
 * from {@link ConformityCheck} under the draft's rule; every flag attached to a property blocks a pass
 * ("determined with a flag is never a pass"). Every problem with the choice is collected and refused at once.
 */
@Component
class CertificateLines {

    private final SpecimenDirectory specimens;
    private final HeatDirectory heats;
    private final TestRunDirectory testRuns;

    CertificateLines(SpecimenDirectory specimens, HeatDirectory heats, TestRunDirectory testRuns) {
        this.specimens = specimens;
        this.heats = heats;
        this.testRuns = testRuns;
    }

    /** The lines, and the records they were built from (by id), which the printed document shows as well. */
    record Built(List<CertificateLine> lines, Map<UUID, SpecimenView> specimens, Map<UUID, HeatView> heats,
            Map<UUID, TestRunView> runs, Map<UUID, AnalysisRunView> analyses) {
    }

    @Transactional(readOnly = true)
    List<CertificateLine> build(OrderView order, List<UUID> specimenIds, DecisionRuleChoice rule) {
        return buildWithRecords(order, specimenIds, rule).lines();
    }

    /**
     * As {@link #build}, keeping what was read: issuing renders the document in the same transaction from the
     * very records its lines were decided on, instead of reading them all a second time.
     */
    @Transactional(readOnly = true)
    Built buildWithRecords(OrderView order, List<UUID> specimenIds, DecisionRuleChoice rule) {
        List<FieldIssue> issues = new ArrayList<>();
        List<Chosen> chosen = new ArrayList<>();
        Set<UUID> seen = new HashSet<>();
        for (int i = 0; i < specimenIds.size(); i++) {
            String at = "/specimenIds/" + i;
            UUID id = specimenIds.get(i);
            if (!seen.add(id)) {
                issues.add(new FieldIssue(at, "specimen " + id + " is chosen twice"));
                continue;
            }
            Optional<SpecimenView> specimen = specimens.find(id);
            if (specimen.isEmpty()) {
                issues.add(new FieldIssue(at, "no specimen " + id));
                continue;
            }
            SpecimenView s = specimen.get();
            if (!order.id().equals(s.orderId())) {
                issues.add(new FieldIssue(at, "specimen " + s.labIdentifier() + " belongs to another order"));
                continue;
            }
            Optional<TestRunDirectory.ReportedResult> reported = testRuns.reportedResultOf(id);
            if (reported.isEmpty()) {
                issues.add(new FieldIssue(at, "specimen " + s.labIdentifier()
                        + " has no valid test run with an analysed curve"));
                continue;
            }
            if (reported.get().run().mode() != TestMode.TENSILE) {
                issues.add(new FieldIssue(at, "specimen " + s.labIdentifier()
                        + " was tested in cyclic mode; a certificate reports tensile properties"));
                continue;
            }
            HeatView heat = heats.find(s.heatId()).orElseThrow();
            chosen.add(new Chosen(s, heat, reported.get()));
        }
        if (!issues.isEmpty()) {
            throw new RuleViolation(issues);
        }
        List<CertificateLine> lines = new ArrayList<>();
        ConformityCheckFactory checks = new ConformityCheckFactory(rule);
        List<FieldIssue> empty = new ArrayList<>();
        for (int ci = 0; ci < chosen.size(); ci++) {
            Chosen c = chosen.get(ci);
            int linesBefore = lines.size();
            Map<String, OrderView.RequirementView> required = requirementsFor(order, c.heat());
            Map<String, Object> seenProperties = new LinkedHashMap<>();
            for (OrderView.RequirementView r : order.requirements()) {
                if (seenProperties.containsKey(r.property())) {
                    continue;
                }
                seenProperties.put(r.property(), r);
                OrderView.RequirementView applicable = required.get(r.property());
                lines.add(line(lines.size() + 1, c, r.property(), applicable, applicable == null ? r : null, checks));
            }
            List<String> extra = c.result().run().reportedProperties();
            if (extra != null) {
                for (String property : extra) {
                    if (!seenProperties.containsKey(property)) {
                        seenProperties.put(property, property);
                        lines.add(line(lines.size() + 1, c, property, null, null, checks));
                    }
                }
            }
            if (lines.size() == linesBefore) {
                // a certificate that reports nothing for a specimen would still look like a statement about it
                empty.add(new FieldIssue("/specimenIds/" + specimenIds.indexOf(c.specimen().id()), "nothing to report for "
                        + c.specimen().labIdentifier() + ": the order states no requirement and its test run names no "
                        + "reported properties"));
            }
        }
        if (!empty.isEmpty()) {
            throw new RuleViolation(empty);
        }
        Map<UUID, SpecimenView> specimenViews = new LinkedHashMap<>();
        Map<UUID, HeatView> heatViews = new LinkedHashMap<>();
        Map<UUID, TestRunView> runViews = new LinkedHashMap<>();
        Map<UUID, AnalysisRunView> analysisViews = new LinkedHashMap<>();
        for (Chosen c : chosen) {
            specimenViews.put(c.specimen().id(), c.specimen());
            heatViews.put(c.heat().id(), c.heat());
            runViews.put(c.result().run().id(), c.result().run());
            analysisViews.put(c.result().analysis().id(), c.result().analysis());
        }
        return new Built(List.copyOf(lines), Map.copyOf(specimenViews), Map.copyOf(heatViews), Map.copyOf(runViews),
                Map.copyOf(analysisViews));
    }

    /** The first requirement per property whose thickness range holds the heat's nominal thickness. */
    private static Map<String, OrderView.RequirementView> requirementsFor(OrderView order, HeatView heat) {
        Map<String, OrderView.RequirementView> out = new LinkedHashMap<>();
        BigDecimal t = heat.nominalThicknessMm();
        for (OrderView.RequirementView r : order.requirements()) {
            boolean ranged = r.thicknessMinMm() != null || r.thicknessMaxMm() != null;
            boolean holds = !ranged || t != null
                    && (r.thicknessMinMm() == null || t.compareTo(r.thicknessMinMm()) >= 0)
                    && (r.thicknessMaxMm() == null || t.compareTo(r.thicknessMaxMm()) <= 0);
            if (holds) {
                out.putIfAbsent(r.property(), r);
            }
        }
        return out;
    }

    /**
     * @param requirement  the applicable requirement, null for an informative line or an unresolved one
     * @param unresolved   a requirement on the property whose thickness range could not be matched
     */
    private static CertificateLine line(int position, Chosen c, String property,
            OrderView.RequirementView requirement, OrderView.RequirementView unresolved, ConformityCheckFactory checks) {
        AnalysisRunView analysis = c.result().analysis();
        Map<String, Object> p = analysis.properties().get(property);
        String status = p == null ? "MISSING" : String.valueOf(p.get("status"));
        Double value = p == null ? null : number(p.get("value"));
        String unit = p == null ? (requirement != null ? requirement.unit() : "") : String.valueOf(p.get("unit"));
        String reported = p == null || p.get("reported") == null ? null : String.valueOf(p.get("reported"));
        Double u = p == null ? null : number(p.get("expandedUncertainty"));
        Object rounding = analysis.parameters().get("rounding");
        List<String> flags = flagsOf(analysis, property);

        String verdict = null;
        String reason = null;
        OrderView.RequirementView shown = requirement != null ? requirement : unresolved;
        if (requirement != null) {
            Optional<LineUnits.InUnit> converted = p != null && !unit.equals(requirement.unit())
                    && "DETERMINED".equals(status) && value != null && reported != null
                    ? LineUnits.inRequirementUnit(property, value, reported, u, unit, requirement.unit(),
                            rounding == null ? null : rounding.toString())
                    : Optional.empty();
            if (converted.isPresent()) {
                // limits written in another unit (ksi, GPa, kip...): decide in the requirement's unit, on the
                // result rounded as that unit prints it, so the limit keeps exactly the value its author wrote
                LineUnits.InUnit c2 = converted.get();
                ConformityDecision d = checks.check(flags).decide(
                        new Requirement(property, Optional.ofNullable(requirement.min()),
                                Optional.ofNullable(requirement.max()), requirement.unit()),
                        new MeasuredResult(property, c2.value(), Optional.of(c2.reported()), PropertyStatus.DETERMINED,
                                flags, Optional.ofNullable(c2.expandedUncertainty())));
                verdict = d.verdict().name();
                reason = d.reason();
            } else if (p != null && !unit.equals(requirement.unit()) && "DETERMINED".equals(status)) {
                verdict = Verdict.NOT_DECIDABLE.name();
                reason = property + " is reported in " + unit + " but required in " + requirement.unit();
            } else {
                ConformityDecision d = checks.check(flags).decide(
                        new Requirement(property, Optional.ofNullable(requirement.min()),
                                Optional.ofNullable(requirement.max()), requirement.unit()),
                        measured(property, status, value, reported, u, flags));
                verdict = d.verdict().name();
                reason = d.reason();
            }
        } else if (unresolved != null) {
            verdict = Verdict.NOT_DECIDABLE.name();
            reason = property + ": the order's requirement depends on the nominal thickness, which heat "
                    + c.heat().heatNumber() + " does not have within any of the order's ranges";
        }
        return new CertificateLine(position, c.specimen().id(), c.specimen().labIdentifier(), c.heat().id(),
                c.heat().heatNumber(), c.result().run().id(), analysis.id(), property, status, value, unit, reported,
                rounding == null ? null : rounding.toString(), u, shown == null ? null : shown.min(),
                shown == null ? null : shown.max(), shown == null ? null : shown.unit(),
                shown == null ? null : shown.thicknessMinMm(), shown == null ? null : shown.thicknessMaxMm(),
                verdict, reason, flags);
    }

    private static MeasuredResult measured(String property, String status, Double value, String reported, Double u,
            List<String> flags) {
        PropertyStatus s = switch (status) {
            case "DETERMINED" -> PropertyStatus.DETERMINED;
            case "NOT_APPLICABLE" -> PropertyStatus.NOT_APPLICABLE;
            default -> PropertyStatus.NOT_DETERMINABLE;
        };
        if (s == PropertyStatus.DETERMINED && (value == null || reported == null)) {
            s = PropertyStatus.NOT_DETERMINABLE;
        }
        if (s != PropertyStatus.DETERMINED) {
            return new MeasuredResult(property, Double.NaN, Optional.empty(), s, flags, Optional.empty());
        }
        return new MeasuredResult(property, value, Optional.of(new BigDecimal(reported)), s, flags,
                Optional.ofNullable(u).map(BigDecimal::new));
    }

    private static List<String> flagsOf(AnalysisRunView analysis, String property) {
        List<String> out = new ArrayList<>();
        for (ResultFlag f : analysis.flags()) {
            if ((f.properties() == null || f.properties().contains(property)) && !out.contains(f.code())) {
                out.add(f.code());
            }
        }
        return out;
    }

    private static Double number(Object o) {
        return o instanceof Number n ? n.doubleValue() : null;
    }

    private record Chosen(SpecimenView specimen, HeatView heat, TestRunDirectory.ReportedResult result) {
    }

    /** Every flag on a property blocks its decision. */
    private record ConformityCheckFactory(DecisionRuleChoice rule) {
        ConformityCheck check(List<String> flags) {
            return new ConformityCheck(rule.rule(), Set.copyOf(flags));
        }
    }
}
