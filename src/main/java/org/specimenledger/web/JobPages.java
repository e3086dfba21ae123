package org.specimenledger.web;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.UUID;
import org.specimenledger.customers.CustomerDirectory;
import org.specimenledger.customers.OrderView;
import org.specimenledger.jobs.Jobs;
import org.specimenledger.jobs.LedgerVerificationJobs;
import org.specimenledger.shared.Access;
import org.specimenledger.shared.FieldIssue;
import org.specimenledger.shared.RuleViolation;
import org.specimenledger.testing.ReanalysisJobs;
import org.springframework.security.access.prepost.PreAuthorize;
import org.springframework.stereotype.Controller;
import org.springframework.ui.Model;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.servlet.mvc.support.RedirectAttributes;

/**
 * Long-running work started from the pages: re-analysis of an order's test runs and verification of the whole
 * ledger chain, each submitted to the jobs feature exactly as through the API. A job's page shows a progress bar
 * that {@code ledger.js} refreshes from {@link JobProgressFeed}; the job runs on whether the page is open or not,
 * so a person can leave and come back from the list.
 */
@Controller
class JobPages {

    private final Jobs jobs;
    private final ReanalysisJobs reanalyses;
    private final LedgerVerificationJobs verifications;
    private final CustomerDirectory customers;
    private final RequestChecks checks;

    JobPages(Jobs jobs, ReanalysisJobs reanalyses, LedgerVerificationJobs verifications, CustomerDirectory customers,
            RequestChecks checks) {
        this.jobs = jobs;
        this.reanalyses = reanalyses;
        this.verifications = verifications;
        this.customers = customers;
        this.checks = checks;
    }

    @GetMapping("/lab/jobs")
    @PreAuthorize(Access.LAB_READERS)
    String list(Model model) {
        model.addAttribute("jobs", jobs.list(0, 50).items());
        model.addAttribute("orders", customers.allOrders().stream()
                .sorted(Comparator.comparing(OrderView::createdAt).reversed()).toList());
        if (!model.containsAttribute("problems")) {
            model.addAttribute("problems", List.of());
        }
        return "jobs";
    }

    @GetMapping("/lab/jobs/{id}")
    @PreAuthorize(Access.LAB_READERS)
    String job(@PathVariable UUID id, Model model) {
        model.addAttribute("job", jobs.get(id));
        return "job";
    }

    @PostMapping("/lab/jobs/ledger-verification")
    @PreAuthorize(Access.AUDIT_READERS)
    String verifyLedger() {
        return "redirect:/lab/jobs/" + verifications.start().id();
    }

    @PostMapping("/lab/jobs/reanalysis")
    @PreAuthorize(Access.LAB_WORKERS)
    String reanalyse(@RequestParam(required = false) UUID orderId,
            @RequestParam(required = false) boolean onlyOlderMethod, @RequestParam(required = false) String reason,
            RedirectAttributes redirect) {
        ReanalysisJobs.ReanalysisRequest request = new ReanalysisJobs.ReanalysisRequest(null, orderId, null, null,
                null, false, onlyOlderMethod, null, reason);
        List<FieldIssue> problems = new ArrayList<>(checks.of(request));
        if (orderId == null) {
            problems.add(new FieldIssue("/orderId", "choose the order whose test runs are re-analysed"));
        }
        if (problems.isEmpty()) {
            try {
                return "redirect:/lab/jobs/" + reanalyses.submit(request).id();
            } catch (RuleViolation e) {
                problems.addAll(e.issues());
            }
        }
        redirect.addFlashAttribute("problems", problems);
        return "redirect:/lab/jobs";
    }
}
