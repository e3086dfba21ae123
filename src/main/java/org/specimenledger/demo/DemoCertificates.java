package org.specimenledger.demo;

import java.util.List;
import java.util.UUID;
import org.specimenledger.certificates.CertificateRequests.DraftRequest;
import org.specimenledger.certificates.CertificateRequests.IssueRequest;
import org.specimenledger.certificates.CertificateService;
import org.specimenledger.certificates.CertificateView;
import org.specimenledger.certificates.DecisionRuleChoice;
import org.specimenledger.certificates.DraftView;
import org.springframework.stereotype.Component;

/**
 * The demo laboratory's certificates, drafted and issued through the ordinary service and signed by the demo lab
 * manager with the demo password: the plate certificate issued and then revised, the pins and the brackets issued,
 * and the aluminium tube issued with its non-conformity stated (its elongation is flagged, so it is never a pass).
 * Every text here is invented.
 */
@Component
class DemoCertificates {

    private static final String SIGNATORY = "demo-manager";

    private final CertificateService certificates;

    DemoCertificates(CertificateService certificates) {
        this.certificates = certificates;
    }

    void seed(DemoTestRuns.Orders orders, DemoTestRuns.Tested tested) {
        CertificateView plate = issue(orders.structuralSteel(), tested.structuralSteel(), "Hot-rolled plate",
                DecisionRuleChoice.SIMPLE_ACCEPTANCE, null,
                "A value on this certificate is outside the order's requirement or carries a flag; see the lines"
                        + " marked. The material is reported as tested.");
        DraftView revision = certificates.revise(plate.number(),
                "the customer asked for the plate thickness in the product description");
        certificates.changeDraft(revision.id(), new DraftRequest(revision.orderId(), revision.specimenIds(),
                revision.decisionRule(), "Hot-rolled plate, 12 mm, normalised", revision.deviations(),
                revision.nonConformityStatement(), revision.includeCurves(), "product description completed"));
        certificates.issue(revision.id(), SIGNATORY, new IssueRequest(DemoRecords.PASSWORD, null, null));

        issue(orders.alloyPins(), tested.alloyPins(), "Quenched and tempered bar for pins, 40 mm",
                DecisionRuleChoice.GUARD_BANDED, null,
                "Elongation A was taken from the extensometer record because the broken piece was not measured;"
                        + " it is reported without a conformity decision.");
        issue(orders.castBrackets(), tested.castBrackets(), "Cast brackets, test bar cast on",
                DecisionRuleChoice.SIMPLE_ACCEPTANCE, null,
                "A required property could not be decided; see the lines marked.");
        issue(orders.aluminium(), tested.aluminium(), "Extruded tube 20 × 2 mm",
                DecisionRuleChoice.SIMPLE_ACCEPTANCE, "Retest after an extensometer slip on the first pull.",
                "The tube broke outside the middle third of the gauge length, so its elongation A is flagged and"
                        + " not decided; the customer is asked whether a further piece should be tested.");
    }

    /** Drafts one specimen's certificate with curves and issues it, with the statement when a line does not pass. */
    private CertificateView issue(UUID order, UUID specimen, String product, DecisionRuleChoice rule, String deviations,
            String statementIfNeeded) {
        DraftView draft = certificates.createDraft(new DraftRequest(order, List.of(specimen), rule, product,
                deviations, null, true, null));
        return certificates.issue(draft.id(), SIGNATORY, new IssueRequest(DemoRecords.PASSWORD, null,
                draft.allLinesPass() ? null : statementIfNeeded));
    }
}
