package org.specimenledger.web;

import java.util.List;
import java.util.Optional;
import java.util.UUID;
import org.specimenledger.audit.CheckpointView;
import org.specimenledger.audit.Checkpoints;
import org.specimenledger.certificates.CertificateDirectory;
import org.specimenledger.certificates.CertificateLine;
import org.specimenledger.certificates.CertificateView;
import org.specimenledger.shared.Access;
import org.specimenledger.shared.RecordNotFound;
import org.specimenledger.testing.TestRunDirectory;
import org.specimenledger.trace.TraceLine;
import org.specimenledger.trace.TraceRoot;
import org.specimenledger.trace.TraceService;
import org.springframework.http.ContentDisposition;
import org.springframework.http.HttpHeaders;
import org.springframework.http.MediaType;
import org.springframework.http.ResponseEntity;
import org.springframework.security.access.prepost.PreAuthorize;
import org.springframework.stereotype.Controller;
import org.springframework.ui.Model;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.RequestParam;

/**
 * The auditor's trace of a certificate as a page: one expandable branch per printed line, down to the raw curve
 * (SHA-256 and the bytes), the instruments with the calibration valid on the test date, every record's ledger
 * events and the replay of the analysis, beside the latest signed checkpoint. Built from {@link TraceService}
 * exactly as the trace API; reading it records nothing (the replay is computed, not ledgered).
 */
@Controller
class TracePage {

    private final CertificateDirectory certificates;
    private final TraceService traces;
    private final Checkpoints checkpoints;
    private final TestRunDirectory testRuns;

    TracePage(CertificateDirectory certificates, TraceService traces, Checkpoints checkpoints,
            TestRunDirectory testRuns) {
        this.certificates = certificates;
        this.traces = traces;
        this.checkpoints = checkpoints;
        this.testRuns = testRuns;
    }

    @GetMapping("/audit-desk/trace")
    @PreAuthorize(Access.AUDIT_READERS)
    String trace(@RequestParam(required = false) String number, @RequestParam(required = false) Integer revision,
            Model model) {
        Optional<CheckpointView> latest = checkpoints.latest();
        model.addAttribute("latestCheckpoint", latest.orElse(null));
        model.addAttribute("number", number);
        if (number == null || number.isBlank()) {
            return "trace";
        }
        CertificateView c = certificates.find(number.trim(), revision)
                .orElseThrow(() -> new RecordNotFound("certificate", number.trim()));
        List<TraceLine> lines = c.lines().stream().map(l -> new TraceLine(label(l), l.analysisRunId())).toList();
        model.addAttribute("c", c);
        if (!lines.isEmpty()) {
            model.addAttribute("trace", traces.trace(lines, new TraceRoot(c.number(), null, c.ledgerSeq())));
        }
        return "trace";
    }

    /** The raw curve of a test run, byte for byte as uploaded. */
    @GetMapping("/audit-desk/trace/curves/{testRunId}")
    @PreAuthorize(Access.AUDIT_READERS)
    ResponseEntity<byte[]> curve(@PathVariable UUID testRunId) {
        byte[] bytes = testRuns.curveBytes(testRunId);
        return ResponseEntity.ok().contentType(MediaType.APPLICATION_OCTET_STREAM)
                .header(HttpHeaders.CONTENT_DISPOSITION,
                        ContentDisposition.attachment().filename("curve-" + testRunId + ".csv").build().toString())
                .body(bytes);
    }

    /** As the certificate prints the line, and as the trace API labels it. */
    private static String label(CertificateLine l) {
        return "line " + l.position() + ": " + l.specimenLabel() + " " + l.property();
    }
}
