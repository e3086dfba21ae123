package org.specimenledger.web;

import jakarta.servlet.http.HttpServletResponse;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.UUID;
import org.specimenledger.certificates.CertificateReads;
import org.specimenledger.certificates.CertificateRequests;
import org.specimenledger.certificates.CertificateService;
import org.specimenledger.certificates.CertificateView;
import org.specimenledger.certificates.DecisionRuleChoice;
import org.specimenledger.certificates.DraftPreview;
import org.specimenledger.certificates.DraftView;
import org.specimenledger.certificates.document.CertificateDocument;
import org.specimenledger.customers.CustomerDirectory;
import org.specimenledger.customers.OrderView;
import org.specimenledger.shared.Access;
import org.specimenledger.shared.CurrentUser;
import org.specimenledger.shared.FieldIssue;
import org.specimenledger.shared.RecordNotFound;
import org.specimenledger.shared.RuleViolation;
import org.specimenledger.shared.SignedInUser;
import org.specimenledger.shared.StateConflict;
import org.specimenledger.specimens.SpecimenDirectory;
import org.specimenledger.specimens.SpecimenView;
import org.springframework.http.ResponseEntity;
import org.springframework.security.access.prepost.PreAuthorize;
import org.springframework.stereotype.Controller;
import org.springframework.ui.Model;
import org.springframework.web.bind.annotation.ExceptionHandler;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.servlet.mvc.support.RedirectAttributes;

/**
 * The lab manager's certificate pages: choose an order and its tested specimens, review the draft's lines and
 * verdicts, issue with the password re-entered as the signature, revise or withdraw with a reason. Every write
 * goes through {@link CertificateService} exactly as the API's; the pages decide nothing of their own. The draft page
 * shows the lines table and links to the PDF preview ({@link CertificateService#preview}: rendered on request,
 * marked as a preview on every page, never stored).
 */
@Controller
class CertificateDesk {

    private final CertificateService service;
    private final CertificateReads reads;
    private final CustomerDirectory customers;
    private final SpecimenDirectory specimens;
    private final RequestChecks checks;

    CertificateDesk(CertificateService service, CertificateReads reads, CustomerDirectory customers,
            SpecimenDirectory specimens, RequestChecks checks) {
        this.service = service;
        this.reads = reads;
        this.customers = customers;
        this.specimens = specimens;
        this.checks = checks;
    }

    @GetMapping("/lab/certificates")
    @PreAuthorize(Access.MANAGER)
    String desk(Model model) {
        model.addAttribute("orders", customers.allOrders().stream()
                .sorted(Comparator.comparing(OrderView::createdAt).reversed()).toList());
        model.addAttribute("drafts", reads.drafts(null, "OPEN"));
        model.addAttribute("certificates", reads.list(null, null, null, null, null, 0, 50).certificates());
        return "certificate-desk";
    }

    @GetMapping("/lab/certificates/new")
    @PreAuthorize(Access.MANAGER)
    String newDraft(@RequestParam UUID orderId, Model model) {
        OrderView order = customers.order(orderId).orElseThrow(() -> new RecordNotFound("order", orderId));
        return draftForm(model, order, List.of(), null, null, List.of());
    }

    @PostMapping("/lab/certificates/drafts")
    @PreAuthorize(Access.MANAGER)
    String createDraft(@RequestParam UUID orderId, @RequestParam(required = false) List<UUID> specimenIds,
            @RequestParam(required = false) String decisionRule, @RequestParam(required = false) String productDescription,
            @RequestParam(required = false) String deviations, @RequestParam(required = false) boolean includeCurves,
            Model model, HttpServletResponse response) {
        OrderView order = customers.order(orderId).orElseThrow(() -> new RecordNotFound("order", orderId));
        List<FieldIssue> problems = new ArrayList<>();
        DecisionRuleChoice rule = null;
        try {
            rule = decisionRule == null || decisionRule.isBlank() ? null : DecisionRuleChoice.valueOf(decisionRule);
        } catch (IllegalArgumentException e) {
            problems.add(new FieldIssue("/decisionRule", "not a decision rule: " + decisionRule));
        }
        List<UUID> chosen = specimenIds == null ? List.of() : specimenIds;
        CertificateRequests.DraftRequest request = new CertificateRequests.DraftRequest(orderId, chosen, rule,
                productDescription, deviations, null, includeCurves, null);
        problems.addAll(checks.of(request));
        if (problems.isEmpty()) {
            try {
                return "redirect:/lab/certificates/drafts/" + service.createDraft(request).id();
            } catch (RuleViolation e) {
                problems.addAll(e.issues());
            }
        }
        response.setStatus(200);
        return draftForm(model, order, chosen, productDescription, deviations, problems);
    }

    @GetMapping("/lab/certificates/drafts/{id}")
    @PreAuthorize(Access.MANAGER)
    String draft(@PathVariable UUID id, Model model) {
        return draftPage(model, reads.draft(id), List.of());
    }

    /** The draft's PDF preview, from the same service call as the API's (marked, not stored, no event). */
    @GetMapping("/lab/certificates/drafts/{id}/preview")
    @PreAuthorize(Access.MANAGER)
    ResponseEntity<byte[]> preview(@PathVariable UUID id) {
        return DraftPreview.response(id, service.preview(id));
    }

    /**
     * Only the preview lets a state conflict out (the forms catch theirs and show them on the draft page): a draft
     * that is issued or discarded, or whose lines can no longer be built, gets the problem page with 409.
     */
    @ExceptionHandler(StateConflict.class)
    String conflict(StateConflict e, Model model, HttpServletResponse response) {
        response.setStatus(409);
        model.addAttribute("me", CurrentUser.get().orElse(null));
        model.addAttribute("nav", CurrentUser.get().map(u -> Navigation.of(u.role())).orElse(null));
        model.addAttribute("title", "No preview of this draft");
        model.addAttribute("message", e.getMessage());
        return "problem";
    }

    @PostMapping("/lab/certificates/drafts/{id}/issue")
    @PreAuthorize(Access.MANAGER)
    String issue(@PathVariable UUID id, @RequestParam(required = false) String password,
            @RequestParam(required = false) String signatoryFunction,
            @RequestParam(required = false) String nonConformityStatement, Model model) {
        DraftView draft = reads.draft(id);
        CertificateRequests.IssueRequest request = new CertificateRequests.IssueRequest(password,
                blankToNull(signatoryFunction), blankToNull(nonConformityStatement));
        List<FieldIssue> problems = new ArrayList<>(checks.of(request));
        if (problems.isEmpty()) {
            try {
                String me = CurrentUser.get().map(SignedInUser::username).orElseThrow();
                return "redirect:/lab/certificates/" + service.issue(id, me, request).number();
            } catch (RuleViolation e) {
                problems.addAll(e.issues());
            } catch (StateConflict e) {
                problems.add(new FieldIssue("", e.getMessage()));
            }
        }
        model.addAttribute("nonConformityStatement", nonConformityStatement);
        return draftPage(model, draft, problems);
    }

    /**
     * Saves the open draft again with the same content and a reason: its lines are rebuilt from the current analyses
     * (the way out of the issue's 409 when an analysis or a run's validity changed since the draft was saved).
     */
    @PostMapping("/lab/certificates/drafts/{id}/rebuild")
    @PreAuthorize(Access.MANAGER)
    String rebuild(@PathVariable UUID id, @RequestParam(required = false) String reason, RedirectAttributes redirect) {
        DraftView d = reads.draft(id);
        try {
            service.changeDraft(id, new CertificateRequests.DraftRequest(d.orderId(), d.specimenIds(), d.decisionRule(),
                    d.productDescription(), d.deviations(), d.nonConformityStatement(), d.includeCurves(), reason));
        } catch (RuleViolation e) {
            redirect.addFlashAttribute("problems", e.issues());
        } catch (StateConflict e) {
            redirect.addFlashAttribute("problems", List.of(new FieldIssue("", e.getMessage())));
        }
        return "redirect:/lab/certificates/drafts/" + id;
    }

    @PostMapping("/lab/certificates/drafts/{id}/discard")
    @PreAuthorize(Access.MANAGER)
    String discard(@PathVariable UUID id, @RequestParam(required = false) String reason, RedirectAttributes redirect) {
        try {
            service.discardDraft(id, reason);
            return "redirect:/lab/certificates";
        } catch (RuleViolation e) {
            redirect.addFlashAttribute("problems", e.issues());
        } catch (StateConflict e) {
            redirect.addFlashAttribute("problems", List.of(new FieldIssue("", e.getMessage())));
        }
        return "redirect:/lab/certificates/drafts/" + id;
    }

    @GetMapping("/lab/certificates/{number}")
    @PreAuthorize(Access.MANAGER)
    String certificate(@PathVariable String number, Model model) {
        List<CertificateView> revisions = reads.revisions(number);
        List<CertificateView> newestFirst = new ArrayList<>(revisions);
        java.util.Collections.reverse(newestFirst);
        model.addAttribute("revisions", newestFirst);
        model.addAttribute("c", revisions.get(revisions.size() - 1));
        model.addAttribute("order", customers.order(revisions.get(0).orderId()).orElse(null));
        return "certificate";
    }

    @GetMapping("/lab/certificates/{number}/pdf")
    @PreAuthorize(Access.MANAGER)
    ResponseEntity<byte[]> pdf(@PathVariable String number, @RequestParam(required = false) Integer revision) {
        return CertificatePdf.download(reads.pdf(number, revision));
    }

    @PostMapping("/lab/certificates/{number}/revisions")
    @PreAuthorize(Access.MANAGER)
    String revise(@PathVariable String number, @RequestParam(required = false) String reason,
            RedirectAttributes redirect) {
        try {
            return "redirect:/lab/certificates/drafts/" + service.revise(number, reason).id();
        } catch (RuleViolation e) {
            redirect.addFlashAttribute("problems", e.issues());
        } catch (StateConflict e) {
            redirect.addFlashAttribute("problems", List.of(new FieldIssue("", e.getMessage())));
        }
        return "redirect:/lab/certificates/" + number;
    }

    @PostMapping("/lab/certificates/{number}/withdraw")
    @PreAuthorize(Access.MANAGER)
    String withdraw(@PathVariable String number, @RequestParam(required = false) String reason,
            RedirectAttributes redirect) {
        try {
            service.withdraw(number, reason);
        } catch (RuleViolation e) {
            redirect.addFlashAttribute("problems", e.issues());
        } catch (StateConflict e) {
            redirect.addFlashAttribute("problems", List.of(new FieldIssue("", e.getMessage())));
        }
        return "redirect:/lab/certificates/" + number;
    }

    private String draftForm(Model model, OrderView order, List<UUID> chosen, String productDescription,
            String deviations, List<FieldIssue> problems) {
        List<SpecimenView> ofOrder = specimens.ofOrder(order.id());
        model.addAttribute("order", order);
        model.addAttribute("specimens", ofOrder);
        model.addAttribute("chosen", chosen.isEmpty() ? ofOrder.stream().map(SpecimenView::id).toList() : chosen);
        model.addAttribute("rules", DecisionRuleChoice.values());
        model.addAttribute("productDescription", productDescription);
        model.addAttribute("deviations", deviations);
        model.addAttribute("problems", problems);
        return "certificate-draft-form";
    }

    private String draftPage(Model model, DraftView draft, List<FieldIssue> problems) {
        model.addAttribute("draft", draft);
        model.addAttribute("order", customers.order(draft.orderId()).orElse(null));
        model.addAttribute("signatureMeaning", CertificateDocument.SIGNATURE_MEANING);
        if (!problems.isEmpty() || !model.containsAttribute("problems")) {
            model.addAttribute("problems", problems);
        }
        if (!model.containsAttribute("nonConformityStatement")) {
            model.addAttribute("nonConformityStatement", draft.nonConformityStatement());
        }
        return "certificate-draft";
    }

    private static String blankToNull(String s) {
        return s == null || s.isBlank() ? null : s;
    }
}
