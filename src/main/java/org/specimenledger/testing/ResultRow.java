package org.specimenledger.testing;

import java.time.Instant;
import java.time.LocalDate;
import java.util.List;
import java.util.Map;
import java.util.UUID;

/**
 * One test run with its current analysis, as the results queries list it: the reported values without the
 * evidence (which {@code GET /api/v1/analyses/{id}} gives).
 *
 * @param properties tensile runs: ISO symbol → value, unit, reported string, status, expanded uncertainty
 * @param cycles     cyclic runs: the number of complete loading cycles
 */
public record ResultRow(UUID testRunId, UUID specimenId, String labIdentifier, UUID heatId, UUID orderId,
        Instant testedAt, LocalDate testDate, TestStandard standard, TestMode mode, Validity validity, UUID analysisId,
        String softwareVersion, String softwareCommit, String methodVersion, String inputSha256,
        Map<String, Value> properties, Integer cycles, List<ResultFlag> flags) {

    /** One reported property; {@code value} and {@code reported} are null unless determined. */
    public record Value(Double value, String unit, String reported, String status, Double expandedUncertainty) {
    }
}
