package org.specimenledger.certificates;

import io.swagger.v3.oas.annotations.Operation;
import jakarta.servlet.http.HttpServletRequest;
import java.io.IOException;
import java.io.InputStream;
import java.net.URI;
import java.security.DigestInputStream;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.time.LocalDate;
import java.util.HexFormat;
import java.util.Optional;
import org.specimenledger.shared.RecordNotFound;
import org.springframework.http.HttpStatus;
import org.springframework.http.MediaType;
import org.springframework.http.ProblemDetail;
import org.springframework.security.access.prepost.PreAuthorize;
import org.springframework.transaction.annotation.Transactional;
import org.springframework.web.ErrorResponseException;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestPart;
import org.springframework.web.bind.annotation.RestController;
import org.springframework.web.multipart.MultipartFile;

/**
 * Anonymous verification of a certificate, from the code printed on it or from a PDF file. Answers only what the
 * certificate itself shows publicly: number, revision, status, issue date, laboratory and the PDF's SHA-256.
 * Unknown codes are a plain 404; both endpoints are rate-limited per client address (429 with Retry-After).
 */
@RestController
class VerificationController {

    static final String ANYONE = "permitAll()";

    private final CertificateStore store;
    private final CertificateSettings settings;
    private final VerificationRateLimit limit;

    VerificationController(CertificateStore store, CertificateSettings settings, VerificationRateLimit limit) {
        this.store = store;
        this.settings = settings;
        this.limit = limit;
    }

    /** What verification answers, and nothing more. */
    record Verified(String number, int revision, String status, LocalDate issueDate, String laboratory,
            String pdfSha256) {
    }

    /** The answer to an uploaded PDF. */
    record PdfCheck(boolean identical, String sha256, Verified certificate) {
    }

    @GetMapping("/verify/{code}")
    @PreAuthorize(ANYONE)
    @Operation(summary = "Verify a certificate from the code printed on it (no sign-in)")
    @Transactional(readOnly = true)
    Verified verify(@PathVariable String code, HttpServletRequest request) {
        throttle(request);
        String normalised = code.trim().toLowerCase();
        if (!normalised.matches("[0-9a-f]{32}")) {
            throw new RecordNotFound("certificate", code);
        }
        return store.byVerificationCode(normalised).map(this::verified)
                .orElseThrow(() -> new RecordNotFound("certificate", code));
    }

    @PostMapping(path = "/verify", consumes = MediaType.MULTIPART_FORM_DATA_VALUE)
    @PreAuthorize(ANYONE)
    @Operation(summary = "Check whether a PDF file is byte-identical to an issued certificate (no sign-in)")
    @Transactional(readOnly = true)
    PdfCheck verifyPdf(@RequestPart("pdf") MultipartFile pdf, HttpServletRequest request) throws IOException {
        throttle(request);
        String sha256 = sha256(pdf);
        Optional<CertificateStore.Issued> found = store.byPdfSha256(sha256);
        return new PdfCheck(found.isPresent(), sha256, found.map(this::verified).orElse(null));
    }

    private Verified verified(CertificateStore.Issued c) {
        String status = store.statusChange(c.id()).map(CertificateStore.StatusChange::status)
                .orElse(CertificateView.VALID);
        return new Verified(c.number(), c.revision(), status.toLowerCase(), c.issueDate(), settings.laboratoryName(),
                c.pdfSha256());
    }

    private void throttle(HttpServletRequest request) {
        long wait = limit.secondsToWait(request.getRemoteAddr());
        if (wait > 0) {
            ProblemDetail problem = ProblemDetail.forStatusAndDetail(HttpStatus.TOO_MANY_REQUESTS,
                    "too many verification requests from this address; try again in " + wait + " s");
            problem.setType(URI.create("urn:specimen-ledger:problem:rate-limited"));
            problem.setTitle("Too many requests");
            ErrorResponseException e = new ErrorResponseException(HttpStatus.TOO_MANY_REQUESTS, problem, null);
            e.getHeaders().set("Retry-After", Long.toString(wait));
            throw e;
        }
    }

    private static String sha256(MultipartFile file) throws IOException {
        try (InputStream in = new DigestInputStream(file.getInputStream(), MessageDigest.getInstance("SHA-256"))) {
            in.transferTo(java.io.OutputStream.nullOutputStream());
            return HexFormat.of().formatHex(((DigestInputStream) in).getMessageDigest().digest());
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException(e);
        }
    }
}
