package org.specimenledger.trace;

import io.swagger.v3.oas.annotations.Operation;
import io.swagger.v3.oas.annotations.tags.Tag;
import java.util.List;
import java.util.Map;
import org.specimenledger.audit.LedgerEvent;
import org.specimenledger.audit.LedgerEvidence;
import org.specimenledger.certificates.CertificateDirectory;
import org.specimenledger.certificates.CertificateLine;
import org.specimenledger.certificates.CertificateView;
import org.specimenledger.shared.Access;
import org.specimenledger.shared.CurrentUser;
import org.specimenledger.shared.RecordNotFound;
import org.springframework.http.ContentDisposition;
import org.springframework.http.HttpHeaders;
import org.springframework.http.ResponseEntity;
import org.springframework.security.access.prepost.PreAuthorize;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.RequestMapping;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.bind.annotation.RestController;
import org.springframework.web.servlet.mvc.method.annotation.StreamingResponseBody;

/**
 * The trace and audit bundle with an issued certificate at the root: one trace line per certificate line
 * (labelled as the certificate prints it), the certificate's own issue facts beside the tree. A customer
 * reaches only their own organisation's certificates (404 otherwise); the bundle holds raw curves and is
 * for the laboratory roles and the auditor, as for test runs.
 */
@RestController
@RequestMapping("/api/v1/trace/certificates")
@Tag(name = "trace")
class CertificateTraceController {

    private final CertificateDirectory certificates;
    private final TraceService traces;
    private final AuditBundleWriter writer;
    private final LedgerEvidence evidence;

    CertificateTraceController(CertificateDirectory certificates, TraceService traces, AuditBundleWriter writer,
            LedgerEvidence evidence) {
        this.certificates = certificates;
        this.traces = traces;
        this.writer = writer;
        this.evidence = evidence;
    }

    /**
     * The certificate's issue facts and the trace of its lines.
     *
     * @param ledgerSeq the issue event, the certificate's printed ledger position
     * @param pdfEventSeq the event that recorded the PDF's SHA-256, the one the bundle's check reads
     */
    record CertificateTrace(String number, int revision, String status, String pdfSha256, long ledgerSeq,
            String ledgerHash, long checkpointId, String checkpointRoot, long pdfEventSeq, TraceView trace) {
    }

    @GetMapping("/{number}")
    @PreAuthorize(Access.ANY_SIGNED_IN)
    @Operation(summary = "Trace every line of a certificate (latest revision unless ?revision=) down to its raw "
            + "curve, records and ledger events, with the replay of each analysis (records no event)")
    CertificateTrace certificate(@PathVariable String number, @RequestParam(required = false) Integer revision) {
        CertificateView c = visible(number, revision);
        return view(c, linesOf(c, null));
    }

    @GetMapping("/{number}/lines/{position}")
    @PreAuthorize(Access.ANY_SIGNED_IN)
    @Operation(summary = "Trace one line of a certificate (its position as printed, from 1)")
    CertificateTrace line(@PathVariable String number, @PathVariable int position,
            @RequestParam(required = false) Integer revision) {
        CertificateView c = visible(number, revision);
        return view(c, linesOf(c, position));
    }

    @GetMapping("/{number}/bundle")
    @PreAuthorize(Access.LAB_READERS)
    @Operation(summary = "Audit bundle (zip) of a certificate: its PDF, every raw curve, records, ledger events with "
            + "inclusion proofs, the covering signed checkpoint, the public key and VERIFY.txt")
    ResponseEntity<StreamingResponseBody> bundle(@PathVariable String number,
            @RequestParam(required = false) Integer revision) {
        CertificateView c = visible(number, revision);
        byte[] pdf = certificates.pdf(c.id()).orElseThrow(() -> new RecordNotFound("certificate", number));
        AuditBundle bundle = traces.bundle(linesOf(c, null), new TraceRoot(c.number(), pdf, pdfEventSeq(c)),
                "audit bundle of certificate " + c.number() + " revision " + c.revision());
        HttpHeaders headers = new HttpHeaders();
        headers.setContentType(TraceController.ZIP);
        headers.setContentDisposition(ContentDisposition.attachment()
                .filename("audit-bundle-" + c.number() + "-r" + c.revision() + ".zip").build());
        return ResponseEntity.ok().headers(headers).body(out -> writer.write(bundle, out));
    }

    private CertificateTrace view(CertificateView c, List<TraceLine> lines) {
        long pdfEventSeq = pdfEventSeq(c);
        TraceView trace = traces.trace(lines, new TraceRoot(c.number(), null, pdfEventSeq));
        return new CertificateTrace(c.number(), c.revision(), c.status(), c.pdfSha256(), c.ledgerSeq(), c.ledgerHash(),
                c.checkpointId(), c.checkpointRoot(), pdfEventSeq, trace);
    }

    /** A customer asking for another organisation's certificate gets the same 404 as for one that does not exist. */
    private CertificateView visible(String number, Integer revision) {
        return certificates.find(number, revision)
                .filter(c -> CurrentUser.customerOrganisation().map(org -> org.equals(c.customerId())).orElse(true))
                .orElseThrow(() -> new RecordNotFound("certificate", number));
    }

    private static List<TraceLine> linesOf(CertificateView c, Integer position) {
        List<TraceLine> out = c.lines().stream()
                .filter(l -> position == null || l.position() == position)
                .map(l -> new TraceLine(label(l), l.analysisRunId())).toList();
        if (out.isEmpty()) {
            throw new RecordNotFound("certificate line", c.number() + " line " + position);
        }
        return out;
    }

    private static String label(CertificateLine l) {
        return "line " + l.position() + ": " + l.specimenLabel() + " " + l.property();
    }

    /** The {@code certificate.pdf-stored} event, whose canonical text holds the PDF's SHA-256; else the issue event. */
    private long pdfEventSeq(CertificateView c) {
        LedgerEvidence.Entity entity = new LedgerEvidence.Entity("certificate", c.id().toString());
        Map<LedgerEvidence.Entity, List<LedgerEvent>> events = evidence.eventsOf(List.of(entity));
        return events.getOrDefault(entity, List.of()).stream()
                .filter(e -> e.action().equals("certificate.pdf-stored") && e.canonical().contains(c.pdfSha256()))
                .mapToLong(LedgerEvent::seq).findFirst().orElse(c.ledgerSeq());
    }
}
