package org.specimenledger.testing;

import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.time.Clock;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.HexFormat;
import java.util.List;
import java.util.UUID;
import org.specimenledger.analysis.AnalysisRejected;
import org.specimenledger.audit.Ledger;
import org.specimenledger.curve.CurveRejected;
import org.specimenledger.curve.RawCurve;
import org.specimenledger.shared.RecordNotFound;
import org.specimenledger.shared.RuleViolation;
import org.springframework.stereotype.Service;
import org.springframework.transaction.annotation.Transactional;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.node.ObjectNode;
import tools.jackson.databind.node.StringNode;

/**
 * Replays a stored analysis: re-reads the stored raw bytes, rebuilds the parameters from the stored set,
 * recomputes with the running software through the same {@link AnalysisComputation} path, and compares
 * every stored value with the recomputed one bit for bit ({@link ResultComparison}). The replay is itself
 * recorded in the ledger ({@code analysis.replayed}), whoever asks — an auditor included: it adds to the
 * audit trail and changes no record.
 */
@Service
class AnalysisReplay {

    static final int LISTED_DIFFERENCES = 200;

    private final AnalysisService analyses;
    private final TestRunRepository runs;
    private final CurveContentStore store;
    private final SoftwareBuild build;
    private final CurveSettings settings;
    private final StandardRequirements requirements;
    private final Ledger ledger;
    private final Clock clock;

    AnalysisReplay(AnalysisService analyses, TestRunRepository runs, CurveContentStore store, SoftwareBuild build,
            CurveSettings settings, Ledger ledger, Clock clock, StandardRequirements requirements) {
        this.requirements = requirements;
        this.analyses = analyses;
        this.runs = runs;
        this.store = store;
        this.build = build;
        this.settings = settings;
        this.ledger = ledger;
        this.clock = clock;
    }

    @Transactional
    ReplayView replay(UUID analysisId) {
        ReplayView view = compute(analyses.visibleRow(analysisId));
        ledger.record("analysis.replayed", AnalysisService.ENTITY, view.analysisId(), null, null, view);
        return view;
    }

    /**
     * The same comparison without recording it: for reads that must not write, such as a trace. The caller
     * has already decided that the analysis may be seen.
     */
    @Transactional(readOnly = true)
    ReplayView compute(AnalysisArchive.Row row) {
        TestRun run = runs.findById(row.testRunId())
                .orElseThrow(() -> new RecordNotFound(TestRunService.ENTITY, row.testRunId()));
        byte[] bytes = store.get(row.rawCurveId());
        String bytesSha256 = sha256(bytes);
        boolean fingerprint = bytesSha256.equals(row.inputSha256());
        return compute(row, run, bytes, fingerprint);
    }

    /**
     * The replay of a row, remembered by everything it depends on: the analysis id, the SHA-256 of the stored
     * bytes as the database hashes them now, and the SHA-256 of every stored input of the
     * computation as read now (reader output, results, flags, parameters, method version, mode, geometry and
     * calibration snapshots, run conditions). The running software is fixed for the life of the process and
     * the computation is deterministic, so a remembered answer is the answer a recomputation would give; a
     * changed byte anywhere (a tampered row) is a different key and is recomputed. Only the time and the
     * person asking are taken fresh. Used for reads (traces), never for the recorded replay.
     */
    ReplayView remembered(AnalysisArchive.Row row) {
        TestRun run = runs.findById(row.testRunId())
                .orElseThrow(() -> new RecordNotFound(TestRunService.ENTITY, row.testRunId()));
        // The database hashes the bytes it holds now; they are fetched only when no answer is remembered for them.
        String bytesSha256 = store.sha256OfStored(row.rawCurveId());
        String inputs = sha256(String.join("\u0000", row.input(), row.results(), row.flags(), row.parameters(),
                row.methodVersion(), row.mode().name(), String.valueOf(row.geometryUsed()),
                String.valueOf(row.calibrationList()), String.valueOf(RunConditions.of(run)))
                .getBytes(java.nio.charset.StandardCharsets.UTF_8));
        ReplayView known = outcomes.get(new OutcomeKey(row.id(), bytesSha256, inputs),
                k -> computeFromStore(row, run));
        return new ReplayView(known.analysisId(), known.testRunId(), known.identical(), known.inputSha256(),
                known.inputFingerprintMatches(), known.stored(), known.replayed(), known.comparedValues(),
                known.differenceCount(), known.differences(), known.failure(),
                clock.instant().truncatedTo(ChronoUnit.MICROS), TestRunService.actor());
    }

    /** A fresh read and hash of the stored bytes, so the computed answer rests on what it computed from. */
    private ReplayView computeFromStore(AnalysisArchive.Row row, TestRun run) {
        byte[] bytes = store.get(row.rawCurveId());
        return compute(row, run, bytes, sha256(bytes).equals(row.inputSha256()));
    }

    private record OutcomeKey(UUID analysisId, String bytesSha256, String inputsSha256) {
    }

    /** At most a few thousand small answers; an entry is only ever a shortcut, never the source of truth. */
    private final com.github.benmanes.caffeine.cache.Cache<OutcomeKey, ReplayView> outcomes =
            com.github.benmanes.caffeine.cache.Caffeine.newBuilder().maximumSize(5_000).build();

    private ReplayView compute(AnalysisArchive.Row row, TestRun run, byte[] bytes, boolean fingerprint) {

        ObjectNode stored = StoredJson.MAPPER.createObjectNode();
        stored.set("input", StoredJson.parse(row.input()));
        stored.set("results", StoredJson.parse(row.results()));
        stored.set("flags", StoredJson.parse(row.flags()));
        stored.set("parameters", StoredJson.parse(row.parameters()));
        stored.set("methodVersion", StringNode.valueOf(row.methodVersion()));

        String failure = null;
        String replayedMethod = null;
        ResultComparison.Outcome comparison;
        try {
            RawCurve raw = StoredCurves.read(bytes, settings);
            AnalysisComputation.Outcome o = AnalysisComputation.compute(raw, row.mode(),
                    StoredJson.map(row.parameters()), row.geometryUsed(), RunConditions.of(run), row.calibrationList(),
                    requirements);
            replayedMethod = o.methodVersion();
            ObjectNode replayed = (ObjectNode) o.comparable();
            replayed.set("parameters", o.parameters());
            replayed.set("methodVersion", StringNode.valueOf(o.methodVersion()));
            comparison = ResultComparison.compare(stored, replayed);
        } catch (CurveRejected | AnalysisRejected | RuleViolation e) {
            failure = "the running software refuses the stored input: " + e.getMessage();
            comparison = new ResultComparison.Outcome(List.of(new ResultComparison.Difference("", null, null)), 0);
        }
        List<ReplayView.Difference> listed = new ArrayList<>();
        for (ResultComparison.Difference d : comparison.differences()) {
            if (listed.size() == LISTED_DIFFERENCES) {
                break;
            }
            listed.add(new ReplayView.Difference(d.pointer(), plain(d.stored()), plain(d.replayed())));
        }
        ReplayView view = new ReplayView(row.id(), row.testRunId(), fingerprint && comparison.identical(),
                row.inputSha256(), fingerprint,
                new ReplayView.Software(row.softwareVersion(), row.softwareCommit(), row.methodVersion()),
                new ReplayView.Software(build.version(), build.commit(), replayedMethod), comparison.comparedValues(),
                comparison.differences().size(), listed, failure,
                clock.instant().truncatedTo(ChronoUnit.MICROS), TestRunService.actor());
        return view;
    }

    private static Object plain(JsonNode node) {
        return node == null ? null : StoredJson.MAPPER.treeToValue(node, Object.class);
    }

    static String sha256(byte[] bytes) {
        try {
            return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(bytes));
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("every Java platform has SHA-256", e);
        }
    }
}
