package org.specimenledger.certificates;

import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.security.SecureRandom;
import java.time.Clock;
import java.time.Instant;
import java.time.LocalDate;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.HexFormat;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.UUID;
import java.util.stream.Collectors;
import org.specimenledger.accounts.AccountDirectory;
import org.specimenledger.accounts.AccountView;
import org.specimenledger.audit.CheckpointView;
import org.specimenledger.audit.Checkpoints;
import org.specimenledger.audit.Ledger;
import org.specimenledger.audit.LedgerEvent;
import org.specimenledger.certificates.document.CertificateDocument;
import org.specimenledger.certificates.document.CertificateRenderer;
import org.specimenledger.curve.RawCurve;
import org.specimenledger.customers.CustomerDirectory;
import org.specimenledger.customers.OrderView;
import org.specimenledger.shared.ChangeReason;
import org.specimenledger.shared.FieldIssue;
import org.specimenledger.shared.RecordNotFound;
import org.specimenledger.shared.Role;
import org.specimenledger.shared.RuleViolation;
import org.specimenledger.shared.StateConflict;
import org.specimenledger.testing.TestRunDirectory;
import org.springframework.beans.factory.ObjectProvider;
import org.springframework.stereotype.Service;
import org.springframework.transaction.annotation.Transactional;

/**
 * Drafts, issues, revises and withdraws certificates. Each write is in the ledger in the same transaction.
 *
 * <p>Issue, in one transaction: the draft row is locked (a second issue of the same draft waits, then finds it
 * issued); the lines are rebuilt and must equal the saved ones; the number comes from the year's counter row,
 * locked until commit (gap-free); the issue event is recorded and then a signed checkpoint, whose tree size is the
 * issue event's sequence number; the PDF printing that position is rendered, stored with its SHA-256 and a second
 * event records the hash. Any failure rolls all of it back, the number included.
 *
 * <p>Preview ({@link #preview}): the same lines and the same document mapping and renderer as issue, read-only, with
 * no number, signatory or verification; it stores nothing, records no event and takes no lock.
 */
@Service
public class CertificateService {

    static final String DRAFT = "certificate-draft";
    static final String CERTIFICATE = "certificate";
    static final String DEFAULT_FUNCTION = "Laboratory manager";
    private static final SecureRandom RANDOM = new SecureRandom();
    private static final HexFormat HEX = HexFormat.of();

    private final CertificateStore store;
    private final CertificateLines lineBuilder;
    private final CertificateReads reads;
    private final CustomerDirectory customers;
    private final TestRunDirectory testRuns;
    private final AccountDirectory accounts;
    private final Ledger ledger;
    private final Checkpoints checkpoints;
    private final ObjectProvider<CertificateRenderer> renderer;
    private final CertificateSettings settings;
    private final Clock clock;

    CertificateService(CertificateStore store, CertificateLines lineBuilder, CertificateReads reads,
            CustomerDirectory customers, TestRunDirectory testRuns,
            AccountDirectory accounts, Ledger ledger, Checkpoints checkpoints, ObjectProvider<CertificateRenderer> renderer,
            CertificateSettings settings, Clock clock) {
        this.store = store;
        this.lineBuilder = lineBuilder;
        this.reads = reads;
        this.customers = customers;
        this.testRuns = testRuns;
        this.accounts = accounts;
        this.ledger = ledger;
        this.checkpoints = checkpoints;
        this.renderer = renderer;
        this.settings = settings;
        this.clock = clock;
    }

    // ---- drafts ----

    /** A new draft for one order: lines built from the chosen specimens' valid runs and current analyses. */
    @Transactional
    public DraftView createDraft(CertificateRequests.DraftRequest request) {
        OrderView order = customers.order(request.orderId())
                .orElseThrow(() -> new RuleViolation("/orderId", "no order " + request.orderId()));
        DecisionRuleChoice rule = request.decisionRule() == null ? DecisionRuleChoice.SIMPLE_ACCEPTANCE
                : request.decisionRule();
        List<CertificateLine> lines = lineBuilder.build(order, request.specimenIds(), rule);
        Instant now = now();
        CertificateStore.Draft draft = new CertificateStore.Draft(UUID.randomUUID(), order.id(), order.customerId(),
                List.copyOf(request.specimenIds()), rule, request.productDescription().trim(),
                blankToNull(request.deviations()), blankToNull(request.nonConformityStatement()),
                Boolean.TRUE.equals(request.includeCurves()), lines, null, null, "OPEN", null, now, actor(), now, 0);
        store.insertDraft(draft);
        DraftView view = reads.draftView(draft);
        ledger.record("certificate-draft.created", DRAFT, draft.id(), blankToNull(request.reason()), null, view);
        return view;
    }

    /** Replaces an open draft's content (reason required); its lines are rebuilt from the current analyses. */
    @Transactional
    public DraftView changeDraft(UUID id, CertificateRequests.DraftRequest request) {
        String reason = ChangeReason.required(request.reason());
        CertificateStore.Draft draft = openDraft(id);
        if (!draft.orderId().equals(request.orderId())) {
            throw new RuleViolation("/orderId", "a draft stays with its order " + draft.orderId()
                    + "; start a new draft for another order");
        }
        OrderView order = customers.order(draft.orderId()).orElseThrow();
        DecisionRuleChoice rule = request.decisionRule() == null ? DecisionRuleChoice.SIMPLE_ACCEPTANCE
                : request.decisionRule();
        List<CertificateLine> lines = lineBuilder.build(order, request.specimenIds(), rule);
        DraftView before = reads.draftView(draft);
        CertificateStore.Draft changed = new CertificateStore.Draft(draft.id(), draft.orderId(), draft.customerId(),
                List.copyOf(request.specimenIds()), rule, request.productDescription().trim(),
                blankToNull(request.deviations()), blankToNull(request.nonConformityStatement()),
                Boolean.TRUE.equals(request.includeCurves()), lines, draft.revisesCertificateId(),
                draft.revisionReason(), "OPEN", null, draft.createdAt(), draft.createdBy(), now(), draft.version() + 1);
        store.updateDraft(changed);
        DraftView after = reads.draftView(changed);
        ledger.record("certificate-draft.changed", DRAFT, id, reason, before, after);
        return after;
    }

    /** Discards an open draft (reason required); it stays stored, marked DISCARDED. */
    @Transactional
    public DraftView discardDraft(UUID id, String reasonText) {
        String reason = ChangeReason.required(reasonText);
        CertificateStore.Draft draft = openDraft(id);
        DraftView before = reads.draftView(draft);
        CertificateStore.Draft discarded = withState(draft, "DISCARDED", null);
        store.updateDraft(discarded);
        DraftView after = reads.draftView(discarded);
        ledger.record("certificate-draft.discarded", DRAFT, id, reason, before, after);
        return after;
    }

    // ---- preview ----

    /**
     * The PDF a draft would print, marked on every page as a preview and not a certificate. Built from the draft's
     * lines exactly as {@link #issue} builds them (the lines must still equal the saved ones, as there), mapped and
     * rendered by the same code. Read-only: nothing stored, no ledger event, no number taken, no lock on the draft,
     * the counter or the ledger head.
     *
     * @throws RecordNotFound when there is no such draft
     * @throws StateConflict  when the draft is issued or discarded, when its lines can no longer be built, or when
     *                        the results behind them changed since it was saved
     */
    @Transactional(readOnly = true)
    public byte[] preview(UUID draftId) {
        CertificateStore.Draft draft = store.draft(draftId).orElseThrow(() -> new RecordNotFound(DRAFT, draftId));
        requireOpen(draft);
        OrderView order = customers.order(draft.orderId()).orElseThrow();
        CertificateLines.Built built;
        try {
            built = lineBuilder.buildWithRecords(order, draft.specimenIds(), draft.decisionRule());
        } catch (RuleViolation e) {
            throw new StateConflict("the lines of draft " + draftId + " can no longer be built: " + e.issues().stream()
                    .map(FieldIssue::detail).collect(Collectors.joining("; "))
                    + "; change the draft's specimens before previewing or issuing it");
        }
        requireUnchanged(draft.lines(), built.lines());
        Optional<CertificateStore.Issued> replaced = Optional.ofNullable(draft.revisesCertificateId())
                .flatMap(store::issued);
        replaced.ifPresent(r -> store.statusChange(r.id()).ifPresent(change -> {
            throw new StateConflict("certificate " + r.number() + " revision " + r.revision() + " is already "
                    + change.status().toLowerCase() + "; this revision draft can no longer be issued");
        }));
        int revision = replaced.map(r -> r.revision() + 1).orElse(0);
        CertificateDocuments.Sources sources = sources(built, order, draft.includeCurves(),
                replaced.map(r -> new CertificateDocument.Replacement(r.number(), r.revision(), draft.revisionReason())),
                Optional.empty());
        return renderer.getObject().render(CertificateDocuments.preview(draft, revision, built.lines(), sources));
    }

    // ---- issue ----

    /**
     * Issues a draft, signed by {@code signatoryUsername}, whose password is re-entered in the request. The
     * signatory must be an enabled lab manager. Lines that fail or were not decided need a non-conformity statement
     * (printed with each such line).
     */
    @Transactional
    public CertificateView issue(UUID draftId, String signatoryUsername, CertificateRequests.IssueRequest request) {
        AccountView signatory = accounts.findByUsername(signatoryUsername).filter(a -> a.role() == Role.LAB_MANAGER)
                .orElseThrow(() -> new RuleViolation("/password", "only a lab manager can sign a certificate"));
        if (!accounts.passwordMatches(signatoryUsername, request.password())) {
            throw new RuleViolation("/password", "the password does not match the signing account "
                    + signatoryUsername + "; nothing was issued");
        }
        CertificateStore.Draft draft = openDraft(draftId);
        OrderView order = customers.order(draft.orderId()).orElseThrow();
        CertificateLines.Built built = lineBuilder.buildWithRecords(order, draft.specimenIds(), draft.decisionRule());
        List<CertificateLine> lines = built.lines();
        requireUnchanged(draft.lines(), lines);
        boolean allPass = lines.stream().allMatch(CertificateLine::passes);
        String statement = blankToNull(request.nonConformityStatement()) != null
                ? request.nonConformityStatement().trim() : draft.nonConformityStatement();
        if (!allPass && statement == null) {
            List<String> open = lines.stream().filter(l -> !l.passes())
                    .map(l -> l.specimenLabel() + " " + l.property()).toList();
            throw new RuleViolation("/nonConformityStatement", "lines " + String.join(", ", open)
                    + " do not pass; issuing needs a non-conformity statement, which is printed on the certificate");
        }

        Instant now = now();
        LocalDate issueDate = LocalDate.ofInstant(now, settings.zone());
        CertificateStore.Issued replaced = null;
        String number;
        int revision;
        int year;
        int serial;
        if (draft.revisesCertificateId() != null) {
            replaced = store.issued(draft.revisesCertificateId()).orElseThrow();
            store.lockNumber(replaced.number());
            if (store.statusChange(replaced.id()).isPresent()) {
                throw new StateConflict("certificate " + replaced.number() + " revision " + replaced.revision()
                        + " is already " + store.statusChange(replaced.id()).get().status().toLowerCase()
                        + "; this revision draft can no longer be issued");
            }
            number = replaced.number();
            revision = replaced.revision() + 1;
            year = replaced.numberYear();
            serial = replaced.numberSerial();
        } else {
            year = issueDate.getYear();
            serial = store.nextSerial(year);
            number = String.format("%s-%d-%05d", settings.numberPrefix(), year, serial);
            revision = 0;
        }
        UUID id = UUID.randomUUID();
        String code = verificationCode();
        String function = blankToNull(request.signatoryFunction()) == null ? DEFAULT_FUNCTION
                : request.signatoryFunction().trim();
        DecisionRuleChoice rule = draft.decisionRule();

        if (replaced != null) {
            CertificateView old = reads.view(replaced);
            ledger.record("certificate.superseded", CERTIFICATE, replaced.id(), draft.revisionReason(), old,
                    old.withStatus(CertificateView.SUPERSEDED, new CertificateView.Reference(id, number, revision),
                            draft.revisionReason(), now));
        }
        Map<String, Object> issued = new LinkedHashMap<>();
        issued.put("number", number);
        issued.put("revision", revision);
        issued.put("draftId", draft.id());
        issued.put("orderId", draft.orderId());
        issued.put("customerId", draft.customerId());
        issued.put("replacesId", replaced == null ? null : replaced.id());
        issued.put("revisionReason", draft.revisionReason());
        issued.put("decisionRule", rule.name());
        issued.put("decisionRuleStatement", rule.rule().statement());
        issued.put("nonConformityStatement", allPass ? null : statement);
        issued.put("allLinesPass", allPass);
        issued.put("issuedAt", now.toString());
        issued.put("signatory", Map.of("username", signatory.username(), "name", signatory.displayName(),
                "function", function));
        issued.put("signatureMeaning", CertificateDocument.SIGNATURE_MEANING);
        issued.put("verificationCode", code);
        issued.put("lines", lines);
        LedgerEvent event = ledger.record("certificate.issued", CERTIFICATE, id,
                "signed by " + signatory.username() + ": " + CertificateDocument.SIGNATURE_MEANING, null, issued);
        CheckpointView checkpoint = checkpoints.record("certificate " + number + " revision " + revision + " issued");
        if (checkpoint.treeSize() != event.seq()) {
            throw new IllegalStateException("checkpoint of size " + checkpoint.treeSize()
                    + " does not end at the issue event " + event.seq());
        }

        CertificateStore.Issued unsigned = new CertificateStore.Issued(id, number, revision, year, serial, draft.id(),
                draft.orderId(), draft.customerId(), replaced == null ? null : replaced.id(), draft.revisionReason(),
                rule, rule.rule().statement(), draft.productDescription(), draft.deviations(),
                allPass ? null : statement, allPass, now, issueDate, signatory.username(), signatory.displayName(),
                function, CertificateDocument.SIGNATURE_MEANING, code, event.seq(), event.hash(), checkpoint.id(),
                checkpoint.rootHash(), "0".repeat(64), 1);
        byte[] pdf = render(unsigned, built, order, draft.includeCurves(), replaced, checkpoint);
        String sha256 = sha256(pdf);
        CertificateStore.Issued row = new CertificateStore.Issued(id, number, revision, year, serial, draft.id(),
                draft.orderId(), draft.customerId(), unsigned.replacesId(), unsigned.revisionReason(), rule,
                unsigned.decisionRuleStatement(), unsigned.productDescription(), unsigned.deviations(),
                unsigned.nonConformityStatement(), allPass, now, issueDate, unsigned.issuedBy(),
                unsigned.signatoryName(), function, unsigned.signatureMeaning(), code, event.seq(), event.hash(),
                checkpoint.id(), checkpoint.rootHash(), sha256, pdf.length);
        store.insertIssued(row, lines, pdf);
        if (replaced != null) {
            store.insertStatusChange(new CertificateStore.StatusChange(replaced.id(), CertificateView.SUPERSEDED, id,
                    draft.revisionReason(), now, actor()));
        }
        store.updateDraft(withState(draft, "ISSUED", id));
        ledger.record("certificate.pdf-stored", CERTIFICATE, id, null, null,
                Map.of("number", number, "revision", revision, "pdfSha256", sha256, "pdfBytes", pdf.length));
        return reads.view(row);
    }

    // ---- after issue ----

    /**
     * Opens a revision draft of the current revision of {@code number}: same order, specimens and settings, lines
     * rebuilt from the current analyses. Issuing it supersedes the revision it names (ISO/IEC 17025:2017 7.8.8).
     */
    @Transactional
    public DraftView revise(String number, String reasonText) {
        String reason = ChangeReason.required(reasonText);
        CertificateStore.Issued current = store.issued(number, null).orElseThrow(() -> new RecordNotFound(CERTIFICATE, number));
        store.statusChange(current.id()).ifPresent(s -> {
            throw new StateConflict("certificate " + number + " revision " + current.revision() + " is "
                    + s.status().toLowerCase() + "; only a valid certificate can be revised");
        });
        CertificateStore.Draft old = store.draft(current.draftId()).orElseThrow();
        OrderView order = customers.order(current.orderId()).orElseThrow();
        List<CertificateLine> lines = lineBuilder.build(order, old.specimenIds(), old.decisionRule());
        Instant now = now();
        CertificateStore.Draft draft = new CertificateStore.Draft(UUID.randomUUID(), old.orderId(), old.customerId(),
                old.specimenIds(), old.decisionRule(), old.productDescription(), old.deviations(),
                old.nonConformityStatement(), old.includeCurves(), lines, current.id(), reason, "OPEN", null, now,
                actor(), now, 0);
        store.insertDraft(draft);
        DraftView view = reads.draftView(draft);
        ledger.record("certificate-draft.created", DRAFT, draft.id(), reason, null, view);
        return view;
    }

    /** Withdraws the current revision of {@code number} (reason required); it stays downloadable, marked withdrawn. */
    @Transactional
    public CertificateView withdraw(String number, String reasonText) {
        String reason = ChangeReason.required(reasonText);
        store.lockNumber(number);
        CertificateStore.Issued current = store.issued(number, null).orElseThrow(() -> new RecordNotFound(CERTIFICATE, number));
        store.statusChange(current.id()).ifPresent(s -> {
            throw new StateConflict("certificate " + number + " revision " + current.revision() + " is already "
                    + s.status().toLowerCase());
        });
        CertificateView before = reads.view(current);
        Instant now = now();
        store.insertStatusChange(new CertificateStore.StatusChange(current.id(), CertificateView.WITHDRAWN, null,
                reason, now, actor()));
        CertificateView after = reads.view(current);
        ledger.record("certificate.withdrawn", CERTIFICATE, current.id(), reason, before, after);
        return after;
    }

    // ---- helpers ----

    private CertificateStore.Draft openDraft(UUID id) {
        CertificateStore.Draft draft = store.lockDraft(id).orElseThrow(() -> new RecordNotFound(DRAFT, id));
        requireOpen(draft);
        return draft;
    }

    private void requireOpen(CertificateStore.Draft draft) {
        if (!"OPEN".equals(draft.state())) {
            String detail = "ISSUED".equals(draft.state())
                    ? " as " + store.issued(draft.issuedCertificateId()).map(c -> c.number() + " revision "
                            + c.revision()).orElse("a certificate") + "; a change needs a revision of the certificate"
                    : "";
            throw new StateConflict("certificate draft " + draft.id() + " is " + draft.state().toLowerCase() + detail);
        }
    }

    private static void requireUnchanged(List<CertificateLine> saved, List<CertificateLine> now) {
        List<String> moved = new ArrayList<>();
        for (int i = 0; i < Math.max(saved.size(), now.size()); i++) {
            if (i >= saved.size() || i >= now.size() || !saved.get(i).sameAs(now.get(i))) {
                CertificateLine l = i < now.size() ? now.get(i) : saved.get(i);
                moved.add(l.specimenLabel() + " " + l.property());
            }
        }
        if (!moved.isEmpty()) {
            throw new StateConflict("the results behind this draft changed since it was saved (" + String.join(", ",
                    moved) + "); save the draft again and review the new lines before issuing");
        }
    }

    /** Renders from the records the lines were built from (same transaction), plus each specimen's stored curve. */
    private byte[] render(CertificateStore.Issued c, CertificateLines.Built built, OrderView order, boolean curves,
            CertificateStore.Issued replaced, CheckpointView checkpoint) {
        CertificateDocuments.Sources sources = sources(built, order, curves,
                Optional.ofNullable(replaced).map(r -> new CertificateDocument.Replacement(r.number(), r.revision(),
                        c.revisionReason())),
                Optional.of("checkpoint " + checkpoint.id() + ": tree size " + checkpoint.treeSize() + ", root "
                        + checkpoint.rootHash() + ", key " + checkpoint.keyId().substring(0, 16)));
        return renderer.getObject().render(CertificateDocuments.of(c, built.lines(), sources));
    }

    /** What a certificate or a preview prints besides its lines: the records read with them and the curves. */
    private CertificateDocuments.Sources sources(CertificateLines.Built built, OrderView order, boolean curves,
            Optional<CertificateDocument.Replacement> replaces, Optional<String> checkpoint) {
        Map<UUID, RawCurve> curveData = new HashMap<>();
        if (curves) {
            for (CertificateLine l : built.lines()) {
                if (!curveData.containsKey(l.specimenId())) {
                    testRuns.curveOf(l.testRunId()).ifPresent(curve -> curveData.put(l.specimenId(), curve));
                }
            }
        }
        return new CertificateDocuments.Sources(settings, customers.customer(order.customerId()).orElseThrow(), order,
                built.specimens(), built.heats(), built.runs(), built.analyses(), curveData, replaces, checkpoint);
    }

    private static CertificateStore.Draft withState(CertificateStore.Draft d, String state, UUID issued) {
        return new CertificateStore.Draft(d.id(), d.orderId(), d.customerId(), d.specimenIds(), d.decisionRule(),
                d.productDescription(), d.deviations(), d.nonConformityStatement(), d.includeCurves(), d.lines(),
                d.revisesCertificateId(), d.revisionReason(), state, issued, d.createdAt(), d.createdBy(), d.changedAt(),
                d.version());
    }

    /** 128 random bits as 32 lower-case hex digits: guessing one is hopeless. */
    private static String verificationCode() {
        byte[] bytes = new byte[16];
        RANDOM.nextBytes(bytes);
        return HEX.formatHex(bytes);
    }

    static String sha256(byte[] bytes) {
        try {
            return HEX.formatHex(MessageDigest.getInstance("SHA-256").digest(bytes));
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException(e);
        }
    }

    private Instant now() {
        return clock.instant().truncatedTo(ChronoUnit.MICROS);
    }

    private static String actor() {
        return org.specimenledger.shared.CurrentUser.get().map(u -> u.username())
                .orElseGet(() -> {
                    var auth = org.springframework.security.core.context.SecurityContextHolder.getContext()
                            .getAuthentication();
                    return auth == null ? "system" : auth.getName();
                });
    }

    private static String blankToNull(String s) {
        return s == null || s.isBlank() ? null : s.trim();
    }

}
