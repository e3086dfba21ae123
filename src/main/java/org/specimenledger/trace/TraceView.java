package org.specimenledger.trace;

import java.time.Instant;
import java.util.List;
import org.specimenledger.audit.CheckpointView;
import org.specimenledger.equipment.CalibrationView;
import org.specimenledger.equipment.EquipmentView;
import org.specimenledger.heats.HeatView;
import org.specimenledger.specimens.SpecimenView;
import org.specimenledger.testing.AnalysisRunView;
import org.specimenledger.testing.CalibrationUsed;
import org.specimenledger.testing.RawCurveView;
import org.specimenledger.testing.ReplayView;
import org.specimenledger.testing.TestRunView;

/**
 * Everything the traced values rest on, one branch per line, each record with the ledger events that
 * created and changed it.
 *
 * @param document       the root document, or null when the trace starts at analysis runs
 * @param ledgerPosition the highest sequence number among the events shown
 * @param checkpoint     the latest signed checkpoint covering {@code ledgerPosition}, or null when none does yet
 * @param replayRecorded always false: a trace recomputes each analysis but records no replay event
 *                       ({@code POST /api/v1/analyses/{id}/replay} does)
 */
public record TraceView(Document document, List<LineTrace> lines, long ledgerPosition, CheckpointView checkpoint,
        boolean replayRecorded, Instant tracedAt) {

    /** The root document as its issuer described it: number, SHA-256 and size of the PDF, issue event. */
    public record Document(String number, String pdfSha256, Long pdfSizeBytes, EventRef issueEvent) {
    }

    /** One record as it stands now, with its events in chain order. */
    public record Traced<T>(T record, List<EventRef> events) {
    }

    /** The raw curve: description, where to download the bytes, and its events. */
    public record Curve(RawCurveView record, String download, List<EventRef> events) {
    }

    /**
     * One instrument of the test run: the calibration snapshotted into the analysis when it was computed,
     * and what the equipment register answers today for the test date (they differ only when a record was
     * withdrawn or added afterwards).
     */
    public record Instrument(String role, Traced<EquipmentView> equipment, CalibrationUsed calibrationAtAnalysis,
            Traced<CalibrationView> calibrationOnTestDate, boolean validOnTestDate, String reasonNotValid) {
    }

    /** One traced line: the analysis and everything below it, and whether a replay reproduces it. */
    public record LineTrace(String label, Traced<AnalysisRunView> analysis, Curve rawCurve,
            Traced<TestRunView> testRun, Traced<SpecimenView> specimen, Traced<HeatView> heat,
            List<Instrument> instruments, ReplayView replay) {
    }

    /** One ledger event, by position: who did what, when, why, and its hash. */
    public record EventRef(long seq, Instant occurredAt, String actor, String role, String action, String reason,
            String hash) {
    }
}
