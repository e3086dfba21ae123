package org.specimenledger.testing;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.time.Clock;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.List;
import java.util.UUID;
import org.specimenledger.audit.Ledger;
import org.specimenledger.curve.CurveReader;
import org.specimenledger.curve.RawCurve;
import org.specimenledger.shared.CurrentUser;
import org.specimenledger.shared.RecordNotFound;
import org.specimenledger.shared.RuleViolation;
import org.specimenledger.shared.StateConflict;
import org.springframework.security.access.AccessDeniedException;
import org.springframework.stereotype.Service;
import org.springframework.transaction.PlatformTransactionManager;
import org.springframework.transaction.support.TransactionTemplate;

/**
 * Takes in a test run's raw curve file: refuses it before reading when it is announced above the limit,
 * reads it once (parsed, fingerprinted and copied on the way), refuses a malformed file or bytes already
 * stored for another run, then stores the bytes with their description and the first analysis in one
 * transaction. Nothing of a refused upload is stored or ledgered. The file is read before the transaction
 * begins, so no database connection waits on the network.
 */
@Service
public class CurveIntake {

    static final String ENTITY = "raw-curve";

    private final TestRunRepository runs;
    private final CurveFileRepository files;
    private final CurveContentStore store;
    private final TestRunService testRuns;
    private final AnalysisService analyses;
    private final CurveSettings settings;
    private final Ledger ledger;
    private final Clock clock;
    private final TransactionTemplate transaction;
    private final TransactionTemplate readOnly;

    CurveIntake(TestRunRepository runs, CurveFileRepository files, CurveContentStore store, TestRunService testRuns,
            AnalysisService analyses, CurveSettings settings, Ledger ledger, Clock clock,
            PlatformTransactionManager transactions) {
        this.runs = runs;
        this.files = files;
        this.store = store;
        this.testRuns = testRuns;
        this.analyses = analyses;
        this.settings = settings;
        this.ledger = ledger;
        this.clock = clock;
        this.transaction = new TransactionTemplate(transactions);
        this.readOnly = new TransactionTemplate(transactions);
        this.readOnly.setReadOnly(true);
    }

    /** The stored curve's description and the analysis made from it. */
    public record Received(RawCurveView curve, AnalysisRunView analysis) {
    }

    /** A stored curve file: its description and its exact bytes. */
    record Download(RawCurveView curve, byte[] bytes) {
    }

    /** How an upload arrived. */
    record Upload(InputStream body, long contentLength, String mediaType, String originalName,
            boolean confirmDuplicate, String reason) {
    }

    /**
     * Receives a curve file given as bytes, in the caller's transaction if there is one (the demo
     * laboratory seeds its runs this way).
     */
    public Received receive(UUID testRunId, byte[] bytes, String mediaType, String originalName) {
        return receive(testRunId, new Upload(new java.io.ByteArrayInputStream(bytes), bytes.length, mediaType,
                originalName, false, null));
    }

    Received receive(UUID testRunId, Upload upload) {
        readOnly.executeWithoutResult(t -> refuseSecondCurve(testRunId));
        long limit = settings.maxSize().toBytes();
        if (upload.contentLength() > limit) {
            throw new CurveTooLarge(upload.contentLength(), limit);
        }
        CapturedUpload captured = new CapturedUpload(upload.body(), upload.contentLength(), limit);
        RawCurve raw = new CurveReader(settings.limits()).read(captured);
        try {
            captured.drain();
        } catch (IOException e) {
            throw new UncheckedIOException("reading the upload failed", e);
        }
        byte[] bytes = captured.bytes();
        return transaction.execute(t -> store(testRunId, upload, raw, bytes));
    }

    private Received store(UUID testRunId, Upload upload, RawCurve raw, byte[] bytes) {
        TestRun run = refuseSecondCurve(testRunId);
        List<CurveFile> same = files.findAllBySha256AndTestRunIdNotOrderByReceivedAtAsc(raw.sha256(), testRunId);
        UUID duplicateOf = null;
        String duplicateReason = null;
        if (!same.isEmpty()) {
            UUID other = same.get(0).testRunId();
            if (!upload.confirmDuplicate()) {
                throw new DuplicateCurve(other, raw.sha256(), "the same bytes (SHA-256 " + raw.sha256()
                        + ") are already the raw curve of test run " + other + "; if this run really produced an "
                        + "identical file, upload it again with confirmDuplicate=true and a reason");
            }
            duplicateReason = blankToNull(upload.reason());
            if (duplicateReason == null) {
                throw new RuleViolation("reason", "storing the same bytes as test run " + other
                        + " needs a reason (query parameter reason)");
            }
            duplicateOf = other;
        }
        Instant now = clock.instant().truncatedTo(ChronoUnit.MICROS);
        String actor = TestRunService.actor();
        CurveFile file = files.saveAndFlush(new CurveFile(testRunId, raw.sha256(), bytes.length,
                mediaType(upload.mediaType()), name(upload.originalName()), raw.size(), duplicateOf, duplicateReason,
                now, actor));
        store.put(file.id(), raw.sha256(), bytes);
        RawCurveView view = RawCurveView.of(file);
        ledger.record("curve.received", ENTITY, file.id(), duplicateReason, null, view);
        AnalysisRunView analysis = analyses.recordFirst(run, file, raw);
        return new Received(view, analysis);
    }

    /** The stored file, for laboratory roles and the auditor; a customer gets 404 for others' and 403 for their own. */
    Download download(UUID testRunId) {
        return readOnly.execute(t -> {
            TestRun run = testRuns.visible(testRunId);
            if (CurrentUser.customerOrganisation().isPresent()) {
                throw new AccessDeniedException("raw data is for the laboratory and its auditors");
            }
            CurveFile file = files.findByTestRunId(run.id())
                    .orElseThrow(() -> new RecordNotFound("raw curve of test run", testRunId));
            return new Download(RawCurveView.of(file), store.get(file.id()));
        });
    }

    private TestRun refuseSecondCurve(UUID testRunId) {
        TestRun run = runs.findById(testRunId).orElseThrow(() -> new RecordNotFound(TestRunService.ENTITY, testRunId));
        files.findByTestRunId(testRunId).ifPresent(existing -> {
            throw new StateConflict("test run " + testRunId + " already has its raw curve (SHA-256 " + existing.sha256()
                    + ", received " + existing.receivedAt() + "); a raw record is never replaced: a corrected file "
                    + "needs a new test run");
        });
        return run;
    }

    private static String mediaType(String given) {
        String m = blankToNull(given);
        return m == null ? "application/octet-stream" : m;
    }

    /** Keeps the file's own name, without any folder a client may have sent, at most 255 characters. */
    private static String name(String given) {
        String n = blankToNull(given);
        if (n == null) {
            return null;
        }
        n = n.substring(Math.max(n.lastIndexOf('/'), n.lastIndexOf('\\')) + 1);
        return n.isBlank() ? null : n.length() > 255 ? n.substring(0, 255) : n;
    }

    private static String blankToNull(String s) {
        return s == null || s.isBlank() ? null : s.trim();
    }
}
