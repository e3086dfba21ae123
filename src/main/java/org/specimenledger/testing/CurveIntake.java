package org.specimenledger.testing;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.time.Clock;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.List;
import java.util.UUID;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
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
 * takes it into memory (at most the limit), refuses bytes already stored for another run or a malformed
 * file, and stores the bytes with their description and the first analysis in one transaction. Nothing of
 * a refused upload is stored or ledgered. The file is taken in before the transaction begins, so no database
 * connection waits on the network.
 */
@Service
public class CurveIntake {

    private static final Logger log = LoggerFactory.getLogger(CurveIntake.class);

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
        long t0 = System.nanoTime();
        readOnly.executeWithoutResult(t -> refuseSecondCurve(testRunId));
        long limit = settings.maxSize().toBytes();
        if (upload.contentLength() > limit) {
            throw new CurveTooLarge(upload.contentLength(), limit);
        }
        CapturedUpload captured = new CapturedUpload(upload.body(), upload.contentLength(), limit);
        try {
            captured.drain();
        } catch (IOException e) {
            throw new UncheckedIOException("reading the upload failed", e);
        }
        byte[] bytes = captured.bytes();
        String sha256 = captured.sha256();
        long t1 = System.nanoTime();
        Received received = transaction.execute(t -> store(testRunId, upload, bytes, sha256));
        log.debug("curve of test run {}: {} bytes received in {} ms, read, stored and analysed in {} ms", testRunId,
                bytes.length, (t1 - t0) / 1_000_000, (System.nanoTime() - t1) / 1_000_000);
        return received;
    }

    /**
     * Fingerprints the bytes, refuses a duplicate, reads what the analysis needs from the registers, then
     * stores the bytes while the reader parses them and the engine analyses them (the write takes about as
     * long as both), and only then writes the description, the analysis and the ledger events. Any refusal
     * rolls the whole transaction back, bytes included.
     */
    private Received store(UUID testRunId, Upload upload, byte[] bytes, String sha256) {
        TestRun run = refuseSecondCurve(testRunId);
        List<CurveFile> same = files.findAllBySha256AndTestRunIdNotOrderByReceivedAtAsc(sha256, testRunId);
        UUID duplicateOf = null;
        String duplicateReason = null;
        if (!same.isEmpty()) {
            UUID other = same.get(0).testRunId();
            if (!upload.confirmDuplicate()) {
                throw new DuplicateCurve(other, sha256, "the same bytes (SHA-256 " + sha256
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
        UUID curveId = UUID.randomUUID();
        // everything the analysis reads from the registers, before the bytes occupy the connection
        AnalysisService.Inputs inputs = analyses.inputsFor(run, null);
        long t0 = System.nanoTime();
        CurveContentStore.Pending write = store.put(curveId, sha256, bytes);
        RawCurve raw;
        AnalysisService.Computed computed;
        long t1;
        try {
            raw = new CurveReader(settings.limits()).read(bytes);
            t1 = System.nanoTime();
            // the computation needs no database, so it runs while the bytes are still being written
            computed = analyses.compute(run, inputs, raw);
        } catch (RuntimeException refused) {
            write.abandon();
            throw refused;
        }
        long t2 = System.nanoTime();
        write.await();
        long t3 = System.nanoTime();
        if (!raw.sha256().equals(sha256)) {
            throw new IllegalStateException("the reader's fingerprint " + raw.sha256() + " differs from " + sha256);
        }
        Instant now = clock.instant().truncatedTo(ChronoUnit.MICROS);
        String actor = TestRunService.actor();
        CurveFile file = files.saveAndFlush(new CurveFile(curveId, testRunId, sha256, bytes.length,
                mediaType(upload.mediaType()), name(upload.originalName()), raw.size(), duplicateOf, duplicateReason,
                now, actor));
        RawCurveView view = RawCurveView.of(file);
        ledger.record("curve.received", ENTITY, file.id(), duplicateReason, null, view);
        AnalysisRunView analysis = analyses.store(run, file, computed, null, null);
        log.debug("curve of test run {}: parsed in {} ms, analysed in {} ms, bytes stored {} ms after that, "
                + "description, analysis and ledger stored in {} ms", testRunId, (t1 - t0) / 1_000_000,
                (t2 - t1) / 1_000_000, (t3 - t2) / 1_000_000, (System.nanoTime() - t3) / 1_000_000);
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
