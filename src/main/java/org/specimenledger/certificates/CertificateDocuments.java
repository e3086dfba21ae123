package org.specimenledger.certificates;

import java.math.BigDecimal;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.UUID;
import java.util.stream.Collectors;
import org.specimenledger.analysis.conformity.Verdict;
import org.specimenledger.analysis.units.ReportingUnits;
import org.specimenledger.certificates.document.CertificateDocument;
import org.specimenledger.certificates.document.StressStrainCurve;
import org.specimenledger.curve.RawCurve;
import org.specimenledger.customers.CustomerView;
import org.specimenledger.customers.OrderView;
import org.specimenledger.heats.HeatView;
import org.specimenledger.specimens.SpecimenView;
import org.specimenledger.testing.AnalysisRunView;
import org.specimenledger.testing.CalibrationUsed;
import org.specimenledger.testing.TestRunView;

/**
 * Maps what an issue stores (the certificate row and its lines) and the records it refers to into the printed
 * {@link CertificateDocument}; a draft preview goes through the same mapping with the draft row instead. Every printed result is the line's stored reported text, never recomputed here.
 */
final class CertificateDocuments {

    /** Appendix curves are thinned to at most this many points: the page cannot show more. */
    static final int CURVE_POINTS = 1500;

    private CertificateDocuments() {
    }

    /** The records one certificate prints, gathered by the service. */
    record Sources(CertificateSettings settings, CustomerView customer, OrderView order,
            Map<UUID, SpecimenView> specimens, Map<UUID, HeatView> heats, Map<UUID, TestRunView> runs,
            Map<UUID, AnalysisRunView> analyses, Map<UUID, RawCurve> curves, Optional<CertificateDocument.Replacement>
            replaces, Optional<String> checkpoint) {
    }

    /** What the certificate row (or, for a preview, the draft row) says in its own words. */
    record Printed(String productDescription, String decisionRuleStatement, String deviations,
            String nonConformityStatement) {
    }

    /** The issued certificate's document: its number, issue date, signatory and audit-trail position. */
    static CertificateDocument of(CertificateStore.Issued c, List<CertificateLine> lines, Sources s) {
        return document(new CertificateDocument.Identification(c.number(), c.revision(), s.replaces(),
                        Optional.empty(), c.issueDate()),
                new Printed(c.productDescription(), c.decisionRuleStatement(), c.deviations(),
                        c.nonConformityStatement()), lines, s,
                Optional.of(new CertificateDocument.Signatory(c.signatoryName(), c.signatoryFunction(),
                        c.issueDate())),
                Optional.of(new CertificateDocument.Verification(c.verificationCode(), c.ledgerSeq(), c.ledgerHash(),
                        s.checkpoint())));
    }

    /**
     * A draft's preview: the same document from the same lines and records, with the revision it would get, and
     * no number, issue date, signatory or verification (none exists before issue).
     */
    static CertificateDocument preview(CertificateStore.Draft d, int revision, List<CertificateLine> lines,
            Sources s) {
        return document(CertificateDocument.Identification.preview(revision, s.replaces()),
                new Printed(d.productDescription(), d.decisionRule().rule().statement(), d.deviations(),
                        d.nonConformityStatement()), lines, s, Optional.empty(), Optional.empty());
    }

    private static CertificateDocument document(CertificateDocument.Identification identification, Printed c,
            List<CertificateLine> lines, Sources s, Optional<CertificateDocument.Signatory> signatory,
            Optional<CertificateDocument.Verification> verification) {
        List<UUID> specimenOrder = lines.stream().map(CertificateLine::specimenId).distinct().toList();
        List<CertificateDocument.Heat> heats = specimenOrder.stream().map(id -> s.specimens().get(id).heatId())
                .distinct().map(s.heats()::get).map(CertificateDocuments::heat).toList();
        List<CertificateDocument.Specimen> specimens = specimenOrder.stream()
                .map(id -> specimen(s.specimens().get(id), s.heats().get(s.specimens().get(id).heatId()), units(s.order())))
                .toList();
        List<TestRunView> runs = lines.stream().map(CertificateLine::testRunId).distinct().map(s.runs()::get).toList();
        List<AnalysisRunView> analyses = lines.stream().map(CertificateLine::analysisRunId).distinct()
                .map(s.analyses()::get).toList();
        List<CertificateDocument.CurveAppendix> appendix = new ArrayList<>();
        for (UUID id : specimenOrder) {
            RawCurve curve = s.curves().get(id);
            if (curve != null) {
                appendix.add(new CertificateDocument.CurveAppendix(s.specimens().get(id).labIdentifier(),
                        curve(curve, s.specimens().get(id), lines.stream().filter(l -> l.specimenId().equals(id))
                                .toList())));
            }
        }
        return new CertificateDocument(
                new CertificateDocument.Laboratory(s.settings().laboratoryName(), s.settings().laboratoryAddress()),
                identification,
                new CertificateDocument.Customer(s.customer().name(), s.customer().address(),
                        s.order().purchaseOrder()),
                new CertificateDocument.Product(c.productDescription(), s.order().materialSpecification()),
                heats, specimens, conditions(runs, s.order()), lines.stream().map(l -> row(l, units(s.order()))).toList(),
                c.decisionRuleStatement(), deviations(c, lines),
                equipment(analyses), software(analyses), signatory, verification, appendix);
    }

    private static CertificateDocument.Heat heat(HeatView h) {
        return new CertificateDocument.Heat(h.heatNumber(), h.producer(), h.grade(), h.productForm().name()
                .toLowerCase().replace('_', ' '), h.nominalThicknessMm() == null ? "not stated"
                        : h.nominalThicknessMm().stripTrailingZeros().toPlainString() + " mm");
    }

    private static ReportingUnits units(OrderView order) {
        return order.reportingUnits() == null ? ReportingUnits.SI : order.reportingUnits();
    }

    private static CertificateDocument.Specimen specimen(SpecimenView s, HeatView heat, ReportingUnits units) {
        String dimensions = s.meansMm().entrySet().stream()
                .map(e -> e.getKey() + " = " + LineUnits.length(e.getValue(), 2, units))
                .collect(Collectors.joining(", "));
        return new CertificateDocument.Specimen(s.labIdentifier(), heat.heatNumber(),
                s.orientation().name().toLowerCase(), s.shape().name().toLowerCase(),
                dimensions.isEmpty() ? "see S0" : dimensions, LineUnits.area(s.s0Mm2(), 2, units),
                LineUnits.length(s.l0Mm(), 1, units), LineUnits.length(s.leMm(), 1, units));
    }


    private static CertificateDocument.TestConditions conditions(List<TestRunView> runs, OrderView order) {
        Set<String> standards = new LinkedHashSet<>();
        Set<String> methods = new LinkedHashSet<>();
        Set<String> temperatures = new LinkedHashSet<>();
        LocalDate first = null;
        LocalDate last = null;
        for (TestRunView r : runs) {
            standards.add(r.standardReference() != null ? r.standardReference() : r.standard().title());
            methods.add(r.method() == null ? "tensile test" : "tensile test, method " + r.method().name());
            temperatures.add(r.temperatureC().stripTrailingZeros().toPlainString() + " °C");
            first = first == null || r.testDate().isBefore(first) ? r.testDate() : first;
            last = last == null || r.testDate().isAfter(last) ? r.testDate() : last;
        }
        String dates = first == null ? "–" : first.equals(last) ? first.toString() : first + " to " + last;
        return new CertificateDocument.TestConditions(String.join("; ", standards), String.join("; ", methods),
                dates, String.join(", ", temperatures),
                order.receivedOn() == null ? "not recorded" : order.receivedOn().toString());
    }

    static CertificateDocument.ResultRow row(CertificateLine l) {
        return row(l, ReportingUnits.SI);
    }

    /** A results-table row; determined values in the order's units (SI, US customary or both, SI first). */
    static CertificateDocument.ResultRow row(CertificateLine l, ReportingUnits units) {
        LineUnits.Printed printed = l.reported() != null && "DETERMINED".equals(l.status())
                ? LineUnits.printed(l, units) : new LineUnits.Printed(null, l.unit());
        String value = printed.value() != null ? printed.value()
                : switch (l.status()) {
                    case "NOT_APPLICABLE" -> "not applicable";
                    case "MISSING" -> "not reported";
                    default -> "not determinable";
                };
        String requirement = "–";
        if (l.requirementUnit() != null) {
            String limits = l.requirementMin() != null && l.requirementMax() != null
                    ? l.requirementMin().toPlainString() + " … " + l.requirementMax().toPlainString()
                    : l.requirementMin() != null ? "≥ " + l.requirementMin().toPlainString()
                    : "≤ " + l.requirementMax().toPlainString();
            requirement = l.requirementUnit().isEmpty() ? limits : limits + " " + l.requirementUnit();
        }
        String verdict = l.verdict() == null ? "no requirement" : Verdict.valueOf(l.verdict()).printable();
        return new CertificateDocument.ResultRow(l.specimenLabel(), l.property(), value, printed.unit(), requirement,
                verdict, String.join(", ", l.flags()));
    }

    /**
     * Deviations as entered, then the non-conformity statement and each line that is not a pass. A draft may not
     * have its statement yet (it can be given at issue): its preview says so instead of printing one.
     */
    private static String deviations(Printed c, List<CertificateLine> lines) {
        StringBuilder out = new StringBuilder();
        out.append(c.deviations() == null || c.deviations().isBlank() ? "No deviations from the test method."
                : c.deviations().trim());
        List<CertificateLine> open = lines.stream().filter(l -> !l.passes()).toList();
        if (!open.isEmpty()) {
            out.append("\nNON-CONFORMITY: ").append(c.nonConformityStatement() == null
                    ? "(no statement yet: issuing needs one)" : c.nonConformityStatement().trim());
            for (CertificateLine l : open) {
                out.append("\n- ").append(l.specimenLabel()).append(' ').append(l.property()).append(": ")
                        .append(Verdict.valueOf(l.verdict()).printable()).append(" (").append(l.verdictReason())
                        .append(')');
            }
        }
        return out.toString();
    }

    private static List<CertificateDocument.Equipment> equipment(List<AnalysisRunView> analyses) {
        Map<String, CertificateDocument.Equipment> out = new LinkedHashMap<>();
        for (AnalysisRunView a : analyses) {
            for (CalibrationUsed c : a.calibrations()) {
                if (c.calibratedOn() == null || c.dueOn() == null) {
                    continue; // no calibration existed; the run's CALIBRATION_OVERRIDE flag is printed on its lines
                }
                String kind = c.role().name().toLowerCase().replace('_', ' ')
                        + (c.rangeN() != null ? ", range " + c.rangeN().stripTrailingZeros().toPlainString() + " N" : "");
                out.putIfAbsent(c.equipmentId() + "/" + c.calibrationId() + "/" + kind,
                        new CertificateDocument.Equipment(c.assetId() + " " + c.description(), kind,
                                c.certificateReference() + (c.calibratingBody() == null ? "" : ", "
                                        + c.calibratingBody()), c.calibratedOn(), c.dueOn(),
                                c.accuracyClass() == null ? "–" : c.accuracyClass()));
            }
        }
        return List.copyOf(out.values());
    }

    private static CertificateDocument.Software software(List<AnalysisRunView> analyses) {
        return new CertificateDocument.Software(
                analyses.stream().map(AnalysisRunView::softwareVersion).distinct().collect(Collectors.joining(", ")),
                analyses.stream().map(AnalysisRunView::softwareCommit).distinct().collect(Collectors.joining(", ")),
                analyses.stream().map(AnalysisRunView::methodVersion).distinct().collect(Collectors.joining(", ")));
    }

    /**
     * Engineering stress (F/S0, MPa) against strain (ΔL/Le, %), thinned to {@link #CURVE_POINTS} points keeping the
     * maximum force; the strengths on the certificate are marked at the first point reaching their value.
     */
    static StressStrainCurve curve(RawCurve raw, SpecimenView specimen, List<CertificateLine> lines) {
        double[] force = raw.forceN();
        double[] extension = raw.extensionMm();
        double s0 = specimen.s0Mm2().doubleValue();
        double le = specimen.leMm().doubleValue();
        int step = Math.max(1, (int) Math.ceil(force.length / (double) CURVE_POINTS));
        int max = 0;
        for (int i = 1; i < force.length; i++) {
            if (force[i] > force[max]) {
                max = i;
            }
        }
        List<Integer> kept = new ArrayList<>();
        for (int i = 0; i < force.length; i += step) {
            kept.add(i);
        }
        if (!kept.contains(max)) {
            kept.add(max);
            kept.sort(null);
        }
        double[] strain = new double[kept.size()];
        double[] stress = new double[kept.size()];
        for (int k = 0; k < kept.size(); k++) {
            strain[k] = 100 * extension[kept.get(k)] / le;
            stress[k] = force[kept.get(k)] / s0;
        }
        List<StressStrainCurve.MarkedPoint> points = new ArrayList<>();
        for (CertificateLine l : lines) {
            if (l.value() == null || !"MPa".equals(l.unit())) {
                continue;
            }
            if (l.property().equals("Rm")) {
                points.add(new StressStrainCurve.MarkedPoint("Rm", 100 * extension[max] / le, force[max] / s0));
                continue;
            }
            for (int i = 0; i <= max; i++) {
                if (force[i] / s0 >= l.value()) {
                    points.add(new StressStrainCurve.MarkedPoint(l.property(), 100 * extension[i] / le, l.value()));
                    break;
                }
            }
        }
        return new StressStrainCurve(strain, stress, points, List.of());
    }
}
