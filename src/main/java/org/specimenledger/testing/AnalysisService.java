package org.specimenledger.testing;

import java.time.Clock;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.UUID;
import org.specimenledger.audit.Ledger;
import org.specimenledger.curve.RawCurve;
import org.specimenledger.equipment.EquipmentDirectory;
import org.specimenledger.equipment.EquipmentView;
import org.specimenledger.shared.ChangeReason;
import org.specimenledger.shared.RecordNotFound;
import org.specimenledger.shared.RuleViolation;
import org.specimenledger.specimens.SpecimenDirectory;
import org.springframework.stereotype.Service;
import org.springframework.transaction.annotation.Propagation;
import org.springframework.transaction.annotation.Transactional;

/**
 * Records analysis runs — on upload, and on request with other parameters — and moves the test run's
 * pointer to its current analysis. An analysis is never changed: a new one names the one it replaces and
 * why. Each analysis takes the specimen geometry and the calibrations as the registers give them at that
 * moment, and stores them with the result.
 */
@Service
public class AnalysisService {

    private static final org.slf4j.Logger log = org.slf4j.LoggerFactory.getLogger(AnalysisService.class);

    static final String ENTITY = "analysis";

    private final AnalysisArchive archive;
    private final TestRunRepository runs;
    private final CurveFileRepository files;
    private final CurveContentStore store;
    private final TestRunService testRuns;
    private final SpecimenDirectory specimens;
    private final EquipmentDirectory equipment;
    private final SoftwareBuild build;
    private final CurveSettings settings;
    private final StandardRequirements requirements;
    private final Ledger ledger;
    private final Clock clock;

    AnalysisService(AnalysisArchive archive, TestRunRepository runs, CurveFileRepository files, CurveContentStore store,
            TestRunService testRuns, SpecimenDirectory specimens, EquipmentDirectory equipment, SoftwareBuild build,
            CurveSettings settings, Ledger ledger, Clock clock, StandardRequirements requirements) {
        this.requirements = requirements;
        this.archive = archive;
        this.runs = runs;
        this.files = files;
        this.store = store;
        this.testRuns = testRuns;
        this.specimens = specimens;
        this.equipment = equipment;
        this.build = build;
        this.settings = settings;
        this.ledger = ledger;
        this.clock = clock;
    }

    /**
     * A new analysis of the stored curve with other parameters (reason required). It becomes the run's
     * current analysis; the one it replaces stays.
     */
    @Transactional
    public AnalysisRunView reanalyse(UUID testRunId, TestRunRequests.AnalysisRequest request) {
        String reason = ChangeReason.required(request.reason());
        TestRun run = runs.findById(testRunId).orElseThrow(() -> new RecordNotFound(TestRunService.ENTITY, testRunId));
        CurveFile file = files.findByTestRunId(testRunId).orElseThrow(() -> new org.specimenledger.shared.StateConflict(
                "test run " + testRunId + " has no raw curve yet; upload it first"));
        RawCurve raw = StoredCurves.read(store.get(file.id()), settings);
        return record(run, file, raw, request.parameters(), run.currentAnalysisId(), reason);
    }

    /** Points the run back at one of its own analyses (reason required). */
    @Transactional
    AnalysisRunView pointCurrent(UUID testRunId, TestRunRequests.CurrentAnalysisRequest request) {
        String reason = ChangeReason.required(request.reason());
        TestRun run = runs.findById(testRunId).orElseThrow(() -> new RecordNotFound(TestRunService.ENTITY, testRunId));
        AnalysisArchive.Row row = archive.find(request.analysisId())
                .filter(r -> r.testRunId().equals(testRunId))
                .orElseThrow(() -> new RuleViolation("/analysisId", "test run " + testRunId + " has no analysis "
                        + request.analysisId()));
        if (row.id().equals(run.currentAnalysisId())) {
            throw new org.specimenledger.shared.StateConflict("analysis " + row.id() + " is already current");
        }
        TestRunView before = testRuns.view(run);
        run.pointAt(row.id());
        runs.saveAndFlush(run);
        ledger.record("test-run.analysis-changed", TestRunService.ENTITY, run.id(), reason, before, testRuns.view(run));
        return row.view();
    }

    @Transactional(readOnly = true)
    AnalysisRunView get(UUID id) {
        return visibleRow(id).view();
    }

    @Transactional(readOnly = true)
    List<AnalysisRunView> ofTestRun(UUID testRunId) {
        testRuns.visible(testRunId);
        return archive.ofTestRun(testRunId).stream().map(AnalysisArchive.Row::view).toList();
    }

    /** The stored row, if the caller may see its test run (a customer only their own organisation's). */
    AnalysisArchive.Row visibleRow(UUID id) {
        AnalysisArchive.Row row = archive.find(id).orElseThrow(() -> new RecordNotFound(ENTITY, id));
        try {
            testRuns.visible(row.testRunId());
        } catch (RecordNotFound e) {
            throw new RecordNotFound(ENTITY, id);
        }
        return row;
    }

    private AnalysisRunView record(TestRun run, CurveFile file, RawCurve raw, Map<String, Object> requested,
            UUID replaces, String reason) {
        return store(run, file, compute(run, inputsFor(run, requested), raw), replaces, reason);
    }

    /** What an analysis takes from the registers: the geometry, the calibrations and the full parameter set. */
    record Inputs(GeometryUsed geometry, List<CalibrationUsed> calibrations, Map<String, Object> parameters) {
    }

    /** An analysis computed and not yet stored. */
    record Computed(Inputs inputs, AnalysisComputation.Outcome outcome) {
    }

    /**
     * Reads what the analysis of a run needs (database reads on the caller's transaction). The intake calls it
     * before the curve's bytes occupy the connection, so that the computation can run beside the write.
     */
    Inputs inputsFor(TestRun run, Map<String, Object> requested) {
        org.specimenledger.specimens.SpecimenView specimen = specimens.find(run.specimenId())
                .orElseThrow(() -> new IllegalStateException("specimen " + run.specimenId() + " of a test run is gone"));
        GeometryUsed geometry = GeometryUsed.of(specimen);
        List<CalibrationUsed> calibrations = calibrationsOn(run);
        Map<String, Object> parameters = AnalysisComputation.merged(AnalysisComputation.defaults(run.mode(),
                run.standard(), calibrations, specimen.shape().name(), specimen.readings()), requested);
        return new Inputs(geometry, calibrations, parameters);
    }

    /** The computation alone: no database, no clock; safe while another thread writes on the connection. */
    Computed compute(TestRun run, Inputs in, RawCurve raw) {
        long t0 = System.nanoTime();
        AnalysisComputation.Outcome o = AnalysisComputation.compute(raw, run.mode(), in.parameters(), in.geometry(),
                RunConditions.of(run), in.calibrations(), requirements);
        log.debug("analysis of test run {} computed in {} ms", run.id(), (System.nanoTime() - t0) / 1_000_000);
        return new Computed(in, o);
    }

    /** Stores a computed analysis, makes it the run's current one and writes both ledger events. */
    @Transactional(propagation = Propagation.MANDATORY)
    AnalysisRunView store(TestRun run, CurveFile file, Computed c, UUID replaces, String reason) {
        AnalysisComputation.Outcome o = c.outcome();
        Instant now = clock.instant().truncatedTo(ChronoUnit.MICROS);
        AnalysisArchive.Row row = new AnalysisArchive.Row(UUID.randomUUID(), run.id(), archive.nextSequence(run.id()),
                file.id(), file.sha256(), run.mode(), build.version(), build.commit(), o.methodVersion(),
                StoredJson.text(o.parameters()), StoredJson.text(o.input()), StoredJson.text(o.results()),
                StoredJson.text(c.inputs().calibrations()), StoredJson.text(c.inputs().geometry()),
                StoredJson.text(o.flags()), replaces, reason, now, TestRunService.actor());
        archive.insert(row);
        AnalysisRunView view = row.view();
        ledger.record("analysis.recorded", ENTITY, row.id(), reason, null, view);
        TestRunView before = testRuns.view(run);
        run.pointAt(row.id());
        runs.saveAndFlush(run);
        ledger.record("test-run.analysis-changed", TestRunService.ENTITY, run.id(), reason, before, testRuns.view(run));
        return view;
    }

    /** The instruments of the run with the calibration that governs the test date now. */
    List<CalibrationUsed> calibrationsOn(TestRun run) {
        List<CalibrationUsed> out = new ArrayList<>();
        out.add(used(InstrumentRole.TESTING_MACHINE, run.machineId(), run));
        out.add(used(InstrumentRole.FORCE_TRANSDUCER, run.forceTransducerId(), run));
        out.add(used(InstrumentRole.EXTENSOMETER, run.extensometerId(), run));
        return out;
    }

    private CalibrationUsed used(InstrumentRole role, UUID id, TestRun run) {
        EquipmentView instrument = equipment.find(id)
                .orElseThrow(() -> new IllegalStateException("instrument " + id + " of a test run is gone"));
        return CalibrationSnapshot.of(role, instrument, equipment.calibrationOn(id, run.testDate()), run.forceRangeN());
    }
}
