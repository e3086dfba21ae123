package org.specimenledger.certificates;

import java.time.LocalDate;
import java.util.List;
import java.util.Optional;
import java.util.UUID;
import org.specimenledger.shared.CurrentUser;
import org.specimenledger.shared.RecordNotFound;
import org.springframework.stereotype.Component;
import org.springframework.transaction.annotation.Transactional;

/**
 * Reads of drafts and certificates for the API and the web pages. A customer sees only their own organisation's
 * certificates: any other number is "not found", never "forbidden". Drafts are the laboratory's own.
 */
@Component
public class CertificateReads {

    private final CertificateStore store;

    CertificateReads(CertificateStore store) {
        this.store = store;
    }

    /** A page of certificates: {@code page} counts from 0, {@code total} is every match (counted in SQL). */
    public record Page(List<CertificateView> certificates, int page, int size, long total) {
    }

    /**
     * What to search for; each part is off when null. {@code orderIds} and {@code heatIds} match any of theirs, and
     * an empty list matches nothing: a purchase order or heat number that names nothing finds nothing.
     */
    public record Search(String number, List<UUID> orderIds, List<UUID> heatIds, LocalDate from, LocalDate to) {
        public Search {
            number = number == null || number.isBlank() ? null : number.trim();
            orderIds = orderIds == null ? null : List.copyOf(orderIds);
            heatIds = heatIds == null ? null : List.copyOf(heatIds);
        }
    }

    /** Certificates matching the filters (each optional), newest first; a customer's list is their own. */
    @Transactional(readOnly = true)
    public Page list(String number, UUID orderId, UUID heatId, LocalDate from, LocalDate to, int page, int size) {
        return search(new Search(number, orderId == null ? null : List.of(orderId),
                heatId == null ? null : List.of(heatId), from, to), page, size);
    }

    /**
     * One page of the certificates matching {@code search}, newest first, sliced and counted by the database; a
     * customer's search is always within their own organisation.
     */
    @Transactional(readOnly = true)
    public Page search(Search search, int page, int size) {
        if (page < 0 || size < 1) {
            throw new IllegalArgumentException("page from 0 and size from 1, were " + page + " and " + size);
        }
        CertificateStore.Filter filter = new CertificateStore.Filter(CurrentUser.customerOrganisation().orElse(null),
                search.number(), search.orderIds(), search.heatIds(), search.from(), search.to());
        List<CertificateView> found = store.search(filter, (long) page * size, size).stream().map(this::view)
                .toList();
        return new Page(found, page, size, store.count(filter));
    }

    /** One revision (the latest when {@code revision} is null) that the signed-in user may see. */
    @Transactional(readOnly = true)
    public CertificateView get(String number, Integer revision) {
        return view(visible(number, revision));
    }

    /** Every revision of a number the signed-in user may see, oldest first. */
    @Transactional(readOnly = true)
    public List<CertificateView> revisions(String number) {
        List<CertificateStore.Issued> all = store.revisions(number);
        if (all.isEmpty() || !visibleTo(all.get(0))) {
            throw new RecordNotFound(CertificateService.CERTIFICATE, number);
        }
        return all.stream().map(this::view).toList();
    }

    /** The stored PDF bytes of one revision, with its view (for status and hash headers). */
    public record Pdf(CertificateView certificate, byte[] bytes) {
    }

    @Transactional(readOnly = true)
    public Pdf pdf(String number, Integer revision) {
        CertificateStore.Issued c = visible(number, revision);
        return new Pdf(view(c), store.pdf(c.id()).orElseThrow());
    }

    @Transactional(readOnly = true)
    public DraftView draft(UUID id) {
        return draftView(store.draft(id).orElseThrow(() -> new RecordNotFound(CertificateService.DRAFT, id)));
    }

    /** Drafts, newest first (at most 500), optionally of one customer and in one state. */
    @Transactional(readOnly = true)
    public List<DraftView> drafts(UUID customerId, String state) {
        return store.drafts(customerId, state == null ? null : state.trim().toUpperCase()).stream()
                .map(this::draftView).toList();
    }

    private CertificateStore.Issued visible(String number, Integer revision) {
        return store.issued(number, revision).filter(this::visibleTo)
                .orElseThrow(() -> new RecordNotFound(CertificateService.CERTIFICATE,
                        revision == null ? number : number + " revision " + revision));
    }

    private boolean visibleTo(CertificateStore.Issued c) {
        return CurrentUser.customerOrganisation().map(org -> org.equals(c.customerId())).orElse(true);
    }

    CertificateView view(CertificateStore.Issued c) {
        Optional<CertificateStore.StatusChange> change = store.statusChange(c.id());
        CertificateView.Reference replaces = c.replacesId() == null ? null
                : new CertificateView.Reference(c.replacesId(), c.number(), c.revision() - 1);
        CertificateView.Reference supersededBy = change.map(CertificateStore.StatusChange::supersededBy)
                .map(id -> new CertificateView.Reference(id, c.number(), c.revision() + 1)).orElse(null);
        return new CertificateView(c.id(), c.number(), c.revision(),
                change.map(CertificateStore.StatusChange::status).orElse(CertificateView.VALID), c.orderId(),
                c.customerId(), replaces, c.revisionReason(), supersededBy,
                change.map(CertificateStore.StatusChange::reason).orElse(null),
                change.map(CertificateStore.StatusChange::changedAt).orElse(null), c.decisionRule(),
                c.decisionRuleStatement(), c.productDescription(), c.deviations(), c.nonConformityStatement(),
                c.allLinesPass(), c.issuedAt(), c.issueDate(), c.issuedBy(),
                new CertificateView.Signature(c.signatoryName(), c.signatoryFunction(), c.signatureMeaning()),
                c.verificationCode(), c.ledgerSeq(), c.ledgerHash(), c.checkpointId(), c.checkpointRoot(),
                c.pdfSha256(), c.pdfBytes(), c.draftId(), store.lines(c.id()));
    }

    DraftView draftView(CertificateStore.Draft d) {
        DraftView.Revises revises = d.revisesCertificateId() == null ? null : store.issued(d.revisesCertificateId())
                .map(c -> new DraftView.Revises(c.id(), c.number(), c.revision(), d.revisionReason())).orElse(null);
        return new DraftView(d.id(), d.orderId(), d.customerId(), d.specimenIds(), d.decisionRule(),
                d.decisionRule().rule().statement(), d.productDescription(), d.deviations(),
                d.nonConformityStatement(), d.includeCurves(), d.lines(),
                d.lines().stream().allMatch(CertificateLine::passes), revises, d.state(), d.issuedCertificateId(),
                d.createdAt(), d.createdBy(), d.changedAt(), d.version());
    }
}
