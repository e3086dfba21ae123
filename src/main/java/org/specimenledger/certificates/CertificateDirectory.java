package org.specimenledger.certificates;

import java.util.List;
import java.util.Optional;
import java.util.UUID;
import org.springframework.stereotype.Component;
import org.springframework.transaction.annotation.Transactional;

/**
 * What other features (trace, audit bundles) may ask of issued certificates, by number and revision, without the
 * visibility rules of the API. A {@link CertificateView} carries the id, status, customer and order, the PDF's
 * SHA-256, the issue event's ledger sequence and hash, the covering checkpoint, and the lines (specimen, test run,
 * analysis run, property, value, unit, reported text, requirement, verdict).
 */
@Component
public class CertificateDirectory {

    private final CertificateStore store;
    private final CertificateReads reads;

    CertificateDirectory(CertificateStore store, CertificateReads reads) {
        this.store = store;
        this.reads = reads;
    }

    /** One revision of a certificate; the latest when {@code revision} is null. */
    @Transactional(readOnly = true)
    public Optional<CertificateView> find(String number, Integer revision) {
        return number == null ? Optional.empty() : store.issued(number, revision).map(reads::view);
    }

    @Transactional(readOnly = true)
    public Optional<CertificateView> find(UUID certificateId) {
        return certificateId == null ? Optional.empty() : store.issued(certificateId).map(reads::view);
    }

    /** Every revision of a number, oldest first (empty for an unknown number). */
    @Transactional(readOnly = true)
    public List<CertificateView> revisions(String number) {
        return store.revisions(number).stream().map(reads::view).toList();
    }

    /** The PDF bytes exactly as issued (their SHA-256 is {@link CertificateView#pdfSha256()}). */
    @Transactional(readOnly = true)
    public Optional<byte[]> pdf(UUID certificateId) {
        return certificateId == null ? Optional.empty() : store.pdf(certificateId);
    }
}
