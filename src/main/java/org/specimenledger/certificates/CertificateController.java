package org.specimenledger.certificates;

import io.swagger.v3.oas.annotations.Operation;
import jakarta.validation.Valid;
import jakarta.validation.constraints.Max;
import jakarta.validation.constraints.Min;
import java.time.LocalDate;
import java.util.List;
import java.util.UUID;
import org.specimenledger.shared.Access;
import org.specimenledger.shared.CurrentUser;
import org.specimenledger.shared.SignedInUser;
import org.springframework.format.annotation.DateTimeFormat;
import org.springframework.http.ContentDisposition;
import org.springframework.http.HttpHeaders;
import org.springframework.http.HttpStatus;
import org.springframework.http.MediaType;
import org.springframework.http.ResponseEntity;
import org.springframework.security.access.prepost.PreAuthorize;
import org.springframework.validation.annotation.Validated;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.PutMapping;
import org.springframework.web.bind.annotation.RequestBody;
import org.springframework.web.bind.annotation.RequestMapping;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.bind.annotation.ResponseStatus;
import org.springframework.web.bind.annotation.RestController;

/**
 * Certificates: drafts (lab manager writes, laboratory reads), issue (lab manager, password re-entered),
 * revision and withdrawal (lab manager), and reads and PDF downloads (customers: their own organisation only).
 */
@RestController
@RequestMapping("/api/v1/certificates")
@Validated
class CertificateController {

    private final CertificateService service;
    private final CertificateReads reads;

    CertificateController(CertificateService service, CertificateReads reads) {
        this.service = service;
        this.reads = reads;
    }

    @PostMapping("/drafts")
    @ResponseStatus(HttpStatus.CREATED)
    @PreAuthorize(Access.MANAGER)
    @Operation(summary = "Start a certificate draft for an order from chosen specimens")
    DraftView createDraft(@Valid @RequestBody CertificateRequests.DraftRequest request) {
        return service.createDraft(request);
    }

    @GetMapping("/drafts")
    @PreAuthorize(Access.LAB_READERS)
    @Operation(summary = "List drafts, optionally of one customer and in one state (OPEN, ISSUED, DISCARDED)")
    List<DraftView> drafts(@RequestParam(required = false) UUID customerId,
            @RequestParam(required = false) String state) {
        return reads.drafts(customerId, state);
    }

    @GetMapping("/drafts/{id}")
    @PreAuthorize(Access.LAB_READERS)
    DraftView draft(@PathVariable UUID id) {
        return reads.draft(id);
    }

    @GetMapping(path = "/drafts/{id}/preview", produces = MediaType.APPLICATION_PDF_VALUE)
    @PreAuthorize(Access.LAB_READERS)
    @Operation(summary = "The PDF an open draft would print, marked as a preview: no number, signature or"
            + " verification; stores nothing and writes no audit event")
    ResponseEntity<byte[]> preview(@PathVariable UUID id) {
        return DraftPreview.response(id, service.preview(id));
    }

    @PutMapping("/drafts/{id}")
    @PreAuthorize(Access.MANAGER)
    @Operation(summary = "Change an open draft (reason required); its lines are rebuilt")
    DraftView changeDraft(@PathVariable UUID id, @Valid @RequestBody CertificateRequests.DraftRequest request) {
        return service.changeDraft(id, request);
    }

    @PostMapping("/drafts/{id}/discard")
    @PreAuthorize(Access.MANAGER)
    @Operation(summary = "Discard an open draft (reason required)")
    DraftView discard(@PathVariable UUID id, @Valid @RequestBody CertificateRequests.ReasonRequest request) {
        return service.discardDraft(id, request.reason());
    }

    @PostMapping("/drafts/{id}/issue")
    @ResponseStatus(HttpStatus.CREATED)
    @PreAuthorize(Access.MANAGER)
    @Operation(summary = "Issue a draft: re-enter your password as the signature")
    CertificateView issue(@PathVariable UUID id, @Valid @RequestBody CertificateRequests.IssueRequest request) {
        return service.issue(id, CurrentUser.get().map(SignedInUser::username).orElse(null), request);
    }

    @GetMapping
    @PreAuthorize(Access.ANY_SIGNED_IN)
    @Operation(summary = "List certificates by number, order, heat and issue date, newest first, paged")
    CertificateReads.Page list(@RequestParam(required = false) String number,
            @RequestParam(required = false) UUID orderId, @RequestParam(required = false) UUID heatId,
            @RequestParam(required = false) @DateTimeFormat(iso = DateTimeFormat.ISO.DATE) LocalDate from,
            @RequestParam(required = false) @DateTimeFormat(iso = DateTimeFormat.ISO.DATE) LocalDate to,
            @RequestParam(defaultValue = "0") @Min(0) int page,
            @RequestParam(defaultValue = "50") @Min(1) @Max(500) int size) {
        return reads.list(number, orderId, heatId, from, to, page, size);
    }

    @GetMapping("/{number}")
    @PreAuthorize(Access.ANY_SIGNED_IN)
    @Operation(summary = "One certificate (the latest revision unless ?revision= is given)")
    CertificateView get(@PathVariable String number, @RequestParam(required = false) @Min(0) Integer revision) {
        return reads.get(number, revision);
    }

    @GetMapping("/{number}/revisions")
    @PreAuthorize(Access.ANY_SIGNED_IN)
    @Operation(summary = "Every revision of a certificate, oldest first")
    List<CertificateView> revisions(@PathVariable String number) {
        return reads.revisions(number);
    }

    @GetMapping(path = "/{number}/pdf", produces = MediaType.APPLICATION_PDF_VALUE)
    @PreAuthorize(Access.ANY_SIGNED_IN)
    @Operation(summary = "The PDF exactly as issued (superseded and withdrawn ones too; the status is in a header)")
    ResponseEntity<byte[]> pdf(@PathVariable String number, @RequestParam(required = false) @Min(0) Integer revision) {
        CertificateReads.Pdf pdf = reads.pdf(number, revision);
        CertificateView c = pdf.certificate();
        return ResponseEntity.ok().contentType(MediaType.APPLICATION_PDF)
                .header(HttpHeaders.CONTENT_DISPOSITION, ContentDisposition.attachment()
                        .filename(c.number() + "-rev" + c.revision() + ".pdf").build().toString())
                .header("Certificate-Status", c.status().toLowerCase())
                .header("Certificate-SHA256", c.pdfSha256())
                .header("Repr-Digest", "sha-256=:" + java.util.Base64.getEncoder()
                        .encodeToString(java.util.HexFormat.of().parseHex(c.pdfSha256())) + ":")
                .body(pdf.bytes());
    }

    @PostMapping("/{number}/revisions")
    @ResponseStatus(HttpStatus.CREATED)
    @PreAuthorize(Access.MANAGER)
    @Operation(summary = "Open a revision draft of the current revision (reason required)")
    DraftView revise(@PathVariable String number, @Valid @RequestBody CertificateRequests.ReasonRequest request) {
        return service.revise(number, request.reason());
    }

    @PostMapping("/{number}/withdraw")
    @PreAuthorize(Access.MANAGER)
    @Operation(summary = "Withdraw the current revision (reason required)")
    CertificateView withdraw(@PathVariable String number,
            @Valid @RequestBody CertificateRequests.ReasonRequest request) {
        return service.withdraw(number, request.reason());
    }
}
