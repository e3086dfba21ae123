package org.specimenledger.testing;

import java.util.List;
import java.util.Optional;
import org.specimenledger.curve.RawCurve;
import java.util.UUID;
import org.springframework.stereotype.Component;
import org.springframework.transaction.annotation.Transactional;

/**
 * What other features (certificates, trace) may ask of test runs, by identifier, without the visibility
 * rules of the API: a specimen's valid run and the current analysis of a run, with its reported values,
 * flags, uncertainties, calibration and geometry snapshots.
 */
@Component
public class TestRunDirectory {

    private final TestRunRepository runs;
    private final TestRunService service;
    private final AnalysisArchive archive;
    private final CurveFileRepository files;
    private final CurveContentStore contents;
    private final CurveSettings curveSettings;
    private final AnalysisReplay replay;
    private final AnalysisService analyses;
    private final CurveIntake intake;

    TestRunDirectory(TestRunRepository runs, TestRunService service, AnalysisArchive archive,
            CurveFileRepository files, CurveContentStore contents, CurveSettings curveSettings, AnalysisReplay replay,
            AnalysisService analyses, CurveIntake intake) {
        this.runs = runs;
        this.service = service;
        this.archive = archive;
        this.files = files;
        this.contents = contents;
        this.curveSettings = curveSettings;
        this.replay = replay;
        this.analyses = analyses;
        this.intake = intake;
    }

    /** A run's raw curve read again from its stored bytes (for drawing it), when uploaded. */
    @Transactional(readOnly = true)
    public Optional<RawCurve> curveOf(UUID testRunId) {
        return files.findByTestRunId(testRunId).map(f -> StoredCurves.read(contents.get(f.id()), curveSettings));
    }

    /** A specimen's valid test run with its current analysis, when both exist. */
    public record ReportedResult(TestRunView run, AnalysisRunView analysis) {
    }

    @Transactional(readOnly = true)
    public Optional<TestRunView> find(UUID testRunId) {
        return testRunId == null ? Optional.empty() : runs.findById(testRunId).map(service::view);
    }

    /** The run that counts for a specimen (at most one), if any. */
    @Transactional(readOnly = true)
    public Optional<TestRunView> validRunOf(UUID specimenId) {
        return runs.findBySpecimenIdAndValidity(specimenId, Validity.VALID).map(service::view);
    }

    /** Every run of a specimen, retests and invalidated ones included, oldest first. */
    @Transactional(readOnly = true)
    public List<TestRunView> runsOf(UUID specimenId) {
        return runs.findAllBySpecimenIdOrderByCreatedAtAsc(specimenId).stream().map(service::view).toList();
    }

    /** The analysis whose results count for a run; empty before the curve is uploaded. */
    @Transactional(readOnly = true)
    public Optional<AnalysisRunView> currentAnalysisOf(UUID testRunId) {
        return runs.findById(testRunId).map(TestRun::currentAnalysisId).flatMap(archive::find)
                .map(AnalysisArchive.Row::view);
    }

    @Transactional(readOnly = true)
    public Optional<AnalysisRunView> analysis(UUID analysisId) {
        return analysisId == null ? Optional.empty() : archive.find(analysisId).map(AnalysisArchive.Row::view);
    }

    /** The specimen's valid run and its current analysis: what a certificate reports for the specimen. */
    @Transactional(readOnly = true)
    public Optional<ReportedResult> reportedResultOf(UUID specimenId) {
        return validRunOf(specimenId).flatMap(run -> currentAnalysisOf(run.id())
                .map(analysis -> new ReportedResult(run, analysis)));
    }

    /**
     * Recomputes a stored analysis from its stored bytes and parameters and compares bit for bit, like
     * {@code POST /analyses/{id}/replay}, but records nothing: for reads (trace, audit bundle) that must not
     * grow the ledger. Empty for an unknown analysis.
     */
    @Transactional(readOnly = true)
    public Optional<ReplayView> replayWithoutRecording(UUID analysisId) {
        return analysisId == null ? Optional.empty() : archive.find(analysisId).map(replay::remembered);
    }

    /** The stored bytes of a raw curve, exactly as uploaded. */
    @Transactional(readOnly = true)
    public byte[] rawCurveBytes(UUID rawCurveId) {
        return contents.get(rawCurveId);
    }

    /** Every analysis of a run, oldest first. */
    @Transactional(readOnly = true)
    public List<AnalysisRunView> analysesOf(UUID testRunId) {
        return analyses.ofTestRun(testRunId);
    }

    /** The run's raw curve bytes exactly as uploaded (404 before upload). */
    public byte[] curveBytes(UUID testRunId) {
        return intake.download(testRunId).bytes();
    }
}
