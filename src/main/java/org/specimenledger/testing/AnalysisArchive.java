package org.specimenledger.testing;

import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Timestamp;
import java.time.Instant;
import java.util.List;
import java.util.Optional;
import java.util.UUID;
import org.springframework.jdbc.core.simple.JdbcClient;
import org.springframework.stereotype.Component;
import org.springframework.transaction.annotation.Propagation;
import org.springframework.transaction.annotation.Transactional;
import tools.jackson.core.type.TypeReference;

/**
 * Stored analysis runs ({@code analysis_run}). Insert and read only: the rows are immutable, and the
 * database refuses UPDATE, DELETE and TRUNCATE. Written with plain SQL because the row is mostly
 * {@code jsonb} documents written once, in the stored JSON form of {@link StoredJson}.
 */
@Component
class AnalysisArchive {

    private static final String COLUMNS = "id, test_run_id, sequence, raw_curve_id, input_sha256, mode, "
            + "software_version, software_commit, method_version, parameters::text, input_summary::text, "
            + "results::text, calibration_snapshot::text, geometry_snapshot::text, flags::text, replaces_id, reason, "
            + "created_at, created_by";

    private final JdbcClient jdbc;

    AnalysisArchive(JdbcClient jdbc) {
        this.jdbc = jdbc;
    }

    /** What is stored of one analysis, the JSON documents as their stored text. */
    record Row(UUID id, UUID testRunId, int sequence, UUID rawCurveId, String inputSha256, TestMode mode,
            String softwareVersion, String softwareCommit, String methodVersion, String parameters, String input,
            String results, String calibrations, String geometry, String flags, UUID replacesId, String reason,
            Instant createdAt, String createdBy) {

        AnalysisRunView view() {
            return new AnalysisRunView(id, testRunId, sequence, rawCurveId, inputSha256, mode, softwareVersion,
                    softwareCommit, methodVersion, StoredJson.map(parameters), StoredJson.map(input),
                    StoredJson.map(results), calibrationList(), StoredJson.map(geometry),
                    StoredJson.list(flags, new TypeReference<List<ResultFlag>>() { }), replacesId, reason, createdAt,
                    createdBy);
        }

        List<CalibrationUsed> calibrationList() {
            return StoredJson.list(calibrations, new TypeReference<List<CalibrationUsed>>() { });
        }

        GeometryUsed geometryUsed() {
            return StoredJson.value(geometry, GeometryUsed.class);
        }
    }

    @Transactional(propagation = Propagation.MANDATORY)
    void insert(Row r) {
        jdbc.sql("""
                INSERT INTO analysis_run (id, test_run_id, sequence, raw_curve_id, input_sha256, mode, software_version,
                    software_commit, method_version, parameters, input_summary, results, calibration_snapshot,
                    geometry_snapshot, flags, replaces_id, reason, created_at, created_by)
                VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, CAST(? AS jsonb), CAST(? AS jsonb), CAST(? AS jsonb), CAST(? AS jsonb),
                    CAST(? AS jsonb), CAST(? AS jsonb), ?, ?, ?, ?)
                """)
                .params(r.id(), r.testRunId(), r.sequence(), r.rawCurveId(), r.inputSha256(), r.mode().name(),
                        r.softwareVersion(), r.softwareCommit(), r.methodVersion(), r.parameters(), r.input(),
                        r.results(), r.calibrations(), r.geometry(), r.flags(), r.replacesId(), r.reason(),
                        Timestamp.from(r.createdAt()), r.createdBy())
                .update();
    }

    @Transactional(readOnly = true)
    Optional<Row> find(UUID id) {
        return jdbc.sql("SELECT " + COLUMNS + " FROM analysis_run WHERE id = ?").param(id).query(AnalysisArchive::row)
                .optional();
    }

    @Transactional(readOnly = true)
    List<Row> ofTestRun(UUID testRunId) {
        return jdbc.sql("SELECT " + COLUMNS + " FROM analysis_run WHERE test_run_id = ? ORDER BY sequence")
                .param(testRunId).query(AnalysisArchive::row).list();
    }

    @Transactional(readOnly = true)
    int nextSequence(UUID testRunId) {
        return jdbc.sql("SELECT coalesce(max(sequence), 0) + 1 FROM analysis_run WHERE test_run_id = ?")
                .param(testRunId).query(Integer.class).single();
    }

    private static Row row(ResultSet rs, int n) throws SQLException {
        return new Row(rs.getObject(1, UUID.class), rs.getObject(2, UUID.class), rs.getInt(3),
                rs.getObject(4, UUID.class), rs.getString(5), TestMode.valueOf(rs.getString(6)), rs.getString(7),
                rs.getString(8), rs.getString(9), rs.getString(10), rs.getString(11), rs.getString(12),
                rs.getString(13), rs.getString(14), rs.getString(15), rs.getObject(16, UUID.class), rs.getString(17),
                rs.getTimestamp(18).toInstant(), rs.getString(19));
    }
}
