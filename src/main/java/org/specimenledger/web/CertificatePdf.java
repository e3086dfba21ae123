package org.specimenledger.web;

import java.util.Base64;
import java.util.HexFormat;
import org.specimenledger.certificates.CertificateReads;
import org.specimenledger.certificates.CertificateView;
import org.springframework.http.ContentDisposition;
import org.springframework.http.HttpHeaders;
import org.springframework.http.MediaType;
import org.springframework.http.ResponseEntity;

/** A stored certificate PDF as a download from a page: the bytes exactly as issued, status and hash in headers. */
final class CertificatePdf {

    private CertificatePdf() {
    }

    static ResponseEntity<byte[]> download(CertificateReads.Pdf pdf) {
        CertificateView c = pdf.certificate();
        return ResponseEntity.ok().contentType(MediaType.APPLICATION_PDF)
                .header(HttpHeaders.CONTENT_DISPOSITION, ContentDisposition.attachment()
                        .filename(c.number() + "-rev" + c.revision() + ".pdf").build().toString())
                .header("Certificate-Status", c.status().toLowerCase())
                .header("Repr-Digest", "sha-256=:" + Base64.getEncoder()
                        .encodeToString(HexFormat.of().parseHex(c.pdfSha256())) + ":")
                .body(pdf.bytes());
    }
}
