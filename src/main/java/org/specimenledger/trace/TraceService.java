package org.specimenledger.trace;

import java.time.Clock;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.HexFormat;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.UUID;
import org.specimenledger.audit.CheckpointView;
import org.specimenledger.audit.LedgerEvent;
import org.specimenledger.audit.LedgerEvidence;
import org.specimenledger.audit.LedgerEvidence.Entity;
import org.specimenledger.audit.LedgerQueries;
import org.specimenledger.equipment.CalibrationOnDate;
import org.specimenledger.equipment.CalibrationView;
import org.specimenledger.equipment.EquipmentDirectory;
import org.specimenledger.equipment.EquipmentView;
import org.specimenledger.heats.HeatDirectory;
import org.specimenledger.heats.HeatView;
import org.specimenledger.shared.CurrentUser;
import org.specimenledger.shared.RecordNotFound;
import org.specimenledger.shared.StateConflict;
import org.specimenledger.specimens.SpecimenDirectory;
import org.specimenledger.specimens.SpecimenView;
import org.specimenledger.testing.AnalysisRunView;
import org.specimenledger.testing.CalibrationUsed;
import org.specimenledger.testing.ReplayView;
import org.specimenledger.testing.TestRunDirectory;
import org.specimenledger.testing.TestRunView;
import org.specimenledger.trace.TraceView.EventRef;
import org.specimenledger.trace.TraceView.Traced;
import org.springframework.stereotype.Service;
import org.springframework.transaction.annotation.Transactional;

/**
 * Builds traces and audit bundles for a list of lines (label → analysis run), with optional facts about
 * the document at the root. This is the one entry point: the analysis and test-run endpoints call it with
 * one line and no root; the certificates feature will call it with one line per certificate line and the
 * issued document.
 *
 * <p>Visibility: a customer may trace only analyses of their own organisation's specimens; any other line
 * is answered as not found, so a customer cannot learn that a record of another organisation exists.
 */
@Service
public class TraceService {

    static final String ANALYSIS = "analysis";
    static final String RAW_CURVE = "raw-curve";
    static final String TEST_RUN = "test-run";
    static final String SPECIMEN = "specimen";
    static final String HEAT = "heat";
    static final String EQUIPMENT = "equipment";
    static final String CALIBRATION = "calibration";

    private final TestRunDirectory tests;
    private final SpecimenDirectory specimens;
    private final HeatDirectory heats;
    private final EquipmentDirectory equipment;
    private final LedgerEvidence evidence;
    private final LedgerQueries queries;
    private final Clock clock;

    TraceService(TestRunDirectory tests, SpecimenDirectory specimens, HeatDirectory heats, EquipmentDirectory equipment,
            LedgerEvidence evidence, LedgerQueries queries, Clock clock) {
        this.tests = tests;
        this.specimens = specimens;
        this.heats = heats;
        this.equipment = equipment;
        this.evidence = evidence;
        this.queries = queries;
        this.clock = clock;
    }

    /** The trace of the given lines (see the type's description for who may see what). */
    @Transactional(readOnly = true)
    public TraceView trace(List<TraceLine> lines, TraceRoot root) {
        return gather(lines, root).view();
    }

    /**
     * Everything an audit bundle holds, read in one transaction: the trace, every event involved, a signed
     * checkpoint covering them all (recorded now with {@code reason} when the latest does not), each event's
     * inclusion proof against it, the public key and the raw curve bytes.
     */
    @Transactional
    public AuditBundle bundle(List<TraceLine> lines, TraceRoot root, String reason) {
        Gathered g = gather(lines, root);
        CheckpointView checkpoint = evidence.checkpointCovering(Math.max(1, g.view().ledgerPosition()), reason);
        Map<Long, LedgerEvent> events = new java.util.TreeMap<>();
        g.events().values().forEach(list -> list.forEach(e -> events.put(e.seq(), e)));
        g.rootEvent().ifPresent(e -> events.put(e.seq(), e));
        List<AuditBundle.ProvenEvent> proven = new ArrayList<>();
        for (LedgerEvent e : events.values()) {
            proven.add(new AuditBundle.ProvenEvent(e, evidence.inclusion(e.seq(), checkpoint.treeSize())));
        }
        List<AuditBundle.Record> records = new ArrayList<>();
        for (Map.Entry<Entity, List<LedgerEvent>> r : g.events().entrySet()) {
            latestState(r.getValue()).ifPresent(s -> records.add(new AuditBundle.Record(r.getKey().type(),
                    r.getKey().id(), s.event().seq(), s.json())));
        }
        Map<UUID, byte[]> curves = new LinkedHashMap<>();
        for (TraceView.LineTrace line : g.view().lines()) {
            UUID id = line.rawCurve().record().id();
            curves.computeIfAbsent(id, tests::rawCurveBytes);
        }
        return new AuditBundle(g.view(), root, checkpoint, evidence.publicKeyPem(), evidence.keyId(), proven, records,
                curves);
    }

    /** The line of a test run: its current analysis, labelled with the specimen's identifier. */
    @Transactional(readOnly = true)
    public List<TraceLine> linesOfTestRun(UUID testRunId) {
        TestRunView run = tests.find(testRunId).filter(this::visible)
                .orElseThrow(() -> new RecordNotFound(TEST_RUN, testRunId));
        if (run.currentAnalysisId() == null) {
            throw new StateConflict("test run " + testRunId + " has no analysis to trace yet: upload its curve first");
        }
        String label = specimens.find(run.specimenId()).map(SpecimenView::labIdentifier).orElse(run.id().toString());
        return List.of(new TraceLine(label, run.currentAnalysisId()));
    }

    private boolean visible(TestRunView run) {
        Optional<UUID> scope = CurrentUser.customerOrganisation();
        return scope.isEmpty() || scope.equals(specimens.find(run.specimenId()).map(SpecimenView::customerId));
    }

    /** The trace and the raw events behind it. */
    record Gathered(TraceView view, Map<Entity, List<LedgerEvent>> events, Optional<LedgerEvent> rootEvent) {
    }

    /** A record's latest state as the ledger holds it: the {@code after} text of its latest recording event. */
    record LedgerState(LedgerEvent event, String json) {
    }

    static Optional<LedgerState> latestState(List<LedgerEvent> events) {
        for (int i = events.size() - 1; i >= 0; i--) {
            LedgerEvent e = events.get(i);
            if (e.action().equals("analysis.replayed")) {
                continue; // its after is the replay's answer, not the analysis
            }
            String after = CanonicalText.after(e.canonical());
            if (after != null && !after.equals("null")) {
                return Optional.of(new LedgerState(e, after));
            }
        }
        return Optional.empty();
    }

    private Gathered gather(List<TraceLine> lines, TraceRoot root) {
        Optional<UUID> scope = CurrentUser.customerOrganisation();
        record Found(TraceLine line, AnalysisRunView analysis, TestRunView run, SpecimenView specimen, HeatView heat,
                List<Found.Tool> tools) {
            record Tool(CalibrationUsed used, EquipmentView equipment, CalibrationOnDate onDate) {
            }
        }
        List<Found> found = new ArrayList<>();
        Set<Entity> entities = new LinkedHashSet<>();
        for (TraceLine line : lines) {
            AnalysisRunView analysis = tests.analysis(line.analysisId())
                    .orElseThrow(() -> new RecordNotFound(ANALYSIS, line.analysisId()));
            TestRunView run = tests.find(analysis.testRunId())
                    .orElseThrow(() -> new IllegalStateException("analysis without its test run " + analysis.id()));
            SpecimenView specimen = specimens.find(run.specimenId())
                    .orElseThrow(() -> new IllegalStateException("test run without its specimen " + run.id()));
            if (scope.isPresent() && !scope.get().equals(specimen.customerId())) {
                throw new RecordNotFound(ANALYSIS, line.analysisId());
            }
            HeatView heat = heats.find(specimen.heatId()).orElse(null);
            List<Found.Tool> tools = new ArrayList<>();
            for (CalibrationUsed used : analysis.calibrations()) {
                EquipmentView eq = equipment.find(used.equipmentId()).orElse(null);
                CalibrationOnDate onDate = eq == null ? null : equipment.calibrationOn(used.equipmentId(), run.testDate());
                tools.add(new Found.Tool(used, eq, onDate));
                entities.add(new Entity(EQUIPMENT, used.equipmentId().toString()));
                if (used.calibrationId() != null) {
                    entities.add(new Entity(CALIBRATION, used.calibrationId().toString()));
                }
                if (onDate != null && onDate.calibration() != null) {
                    entities.add(new Entity(CALIBRATION, onDate.calibration().id().toString()));
                }
            }
            entities.add(new Entity(ANALYSIS, analysis.id().toString()));
            entities.add(new Entity(RAW_CURVE, analysis.rawCurveId().toString()));
            entities.add(new Entity(TEST_RUN, run.id().toString()));
            entities.add(new Entity(SPECIMEN, specimen.id().toString()));
            if (heat != null) {
                entities.add(new Entity(HEAT, heat.id().toString()));
            }
            found.add(new Found(line, analysis, run, specimen, heat, tools));
        }
        Map<Entity, List<LedgerEvent>> events = evidence.eventsOf(entities);
        long position = 0;
        for (List<LedgerEvent> list : events.values()) {
            for (LedgerEvent e : list) {
                position = Math.max(position, e.seq());
            }
        }

        TraceView.Document document = null;
        Optional<LedgerEvent> rootEvent = Optional.empty();
        if (root != null && (root.documentNumber() != null || root.documentPdf() != null
                || root.issueEventSeq() != null)) {
            if (root.issueEventSeq() != null) {
                rootEvent = queries.search(new LedgerQueries.EventFilter(null, null, null, null, null, null),
                        root.issueEventSeq() - 1, 1).stream().filter(e -> e.seq() == root.issueEventSeq()).findFirst();
                position = Math.max(position, root.issueEventSeq());
            }
            byte[] pdf = root.documentPdf();
            document = new TraceView.Document(root.documentNumber(), pdf == null ? null : Hashes.sha256Hex(pdf),
                    pdf == null ? null : (long) pdf.length, rootEvent.map(TraceService::ref).orElse(null));
        }

        List<TraceView.LineTrace> traced = new ArrayList<>();
        for (Found f : found) {
            List<TraceView.Instrument> instruments = new ArrayList<>();
            for (Found.Tool t : f.tools()) {
                CalibrationView cal = t.onDate() == null ? null : t.onDate().calibration();
                instruments.add(new TraceView.Instrument(t.used().role().name(),
                        t.equipment() == null ? null : traced(t.equipment(), events, EQUIPMENT, t.used().equipmentId()),
                        t.used(), cal == null ? null : traced(cal, events, CALIBRATION, cal.id()),
                        t.onDate() != null && t.onDate().valid(), t.onDate() == null ? null : t.onDate().reason()));
            }
            UUID curveId = f.analysis().rawCurveId();
            ReplayView replay = tests.replayWithoutRecording(f.analysis().id()).orElse(null);
            traced.add(new TraceView.LineTrace(f.line().label(),
                    traced(f.analysis(), events, ANALYSIS, f.analysis().id()),
                    new TraceView.Curve(f.run().rawCurve(), "/api/v1/tests/" + f.run().id() + "/curve",
                            refs(events.get(new Entity(RAW_CURVE, curveId.toString())))),
                    traced(f.run(), events, TEST_RUN, f.run().id()),
                    traced(f.specimen(), events, SPECIMEN, f.specimen().id()),
                    f.heat() == null ? null : traced(f.heat(), events, HEAT, f.heat().id()),
                    instruments, replay));
        }
        CheckpointView checkpoint = position == 0 ? null : evidence.coveringCheckpoint(position).orElse(null);
        TraceView view = new TraceView(document, traced, position, checkpoint, false,
                clock.instant().truncatedTo(ChronoUnit.MICROS));
        return new Gathered(view, events, rootEvent);
    }

    private static <T> Traced<T> traced(T record, Map<Entity, List<LedgerEvent>> events, String type, UUID id) {
        return new Traced<>(record, refs(events.get(new Entity(type, id.toString()))));
    }

    private static List<EventRef> refs(List<LedgerEvent> events) {
        return events == null ? List.of() : events.stream().map(TraceService::ref).toList();
    }

    private static EventRef ref(LedgerEvent e) {
        return new EventRef(e.seq(), e.occurredAt(), e.actor(), e.role(), e.action(), e.reason(), e.hash());
    }

    /** SHA-256 in lower-case hex, as {@code sha256sum} prints it. */
    static final class Hashes {
        private Hashes() {
        }

        static String sha256Hex(byte[] bytes) {
            try {
                return HexFormat.of().formatHex(java.security.MessageDigest.getInstance("SHA-256").digest(bytes));
            } catch (java.security.NoSuchAlgorithmException e) {
                throw new IllegalStateException("every Java platform has SHA-256", e);
            }
        }
    }
}
