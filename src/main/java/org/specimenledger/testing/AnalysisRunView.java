package org.specimenledger.testing;

import com.fasterxml.jackson.annotation.JsonIgnore;
import java.time.Instant;
import java.util.List;
import java.util.Map;
import java.util.UUID;

/**
 * One stored analysis as the API returns it, the ledger records it and the certificates feature reads it.
 * Immutable: a re-analysis is another run that names this one in {@code replacesId}.
 *
 * @param sequence        1 for the analysis made on upload, then 2, 3... within the test run
 * @param inputSha256     SHA-256 of the raw curve bytes the analysis read
 * @param softwareVersion application version from the build
 * @param softwareCommit  source commit from the build ({@code -dirty} appended when built from a modified tree)
 * @param methodVersion   the engine's method version, e.g. {@code tensile/1.0.0}
 * @param parameters      the complete parameter set (engine keys), enough to rebuild it
 * @param input           what the reader found: points, channels, metadata, reader warnings
 * @param results         the engine's results with evidence (tensile: {@code properties} by ISO symbol, each
 *                        with value, unit, reported, status, reason, expandedUncertainty, evidence; cyclic:
 *                        {@code cycles}); undetermined values are null, never NaN
 * @param calibrations    the instruments and their calibrations on the test date, as seen when computed
 * @param geometry        the specimen geometry used (S0, Le, L0, Lu, Su, fracture zone...)
 * @param flags           conditions a reviewer must see with the results
 */
public record AnalysisRunView(UUID id, UUID testRunId, int sequence, UUID rawCurveId, String inputSha256,
        TestMode mode, String softwareVersion, String softwareCommit, String methodVersion,
        Map<String, Object> parameters, Map<String, Object> input, Map<String, Object> results,
        List<CalibrationUsed> calibrations, Map<String, Object> geometry, List<ResultFlag> flags, UUID replacesId,
        String reason, Instant createdAt, String createdBy) {

    /**
     * The tensile properties by ISO 6892-1 symbol (empty for a cyclic run), each a map with value, unit,
     * reported, status, reason, expandedUncertainty and evidence.
     */
    @JsonIgnore
    @SuppressWarnings("unchecked")
    public Map<String, Map<String, Object>> properties() {
        Object p = results.get("properties");
        return p instanceof Map<?, ?> m ? (Map<String, Map<String, Object>>) m : Map.of();
    }
}
