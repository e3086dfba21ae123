package org.specimenledger.testing;

import jakarta.validation.constraints.NotBlank;
import jakarta.validation.constraints.NotNull;
import jakarta.validation.constraints.Positive;
import jakarta.validation.constraints.Size;
import java.math.BigDecimal;
import java.time.OffsetDateTime;
import java.util.List;
import java.util.Map;
import java.util.UUID;

/** Request bodies of the test runs feature. Public so that the demo laboratory is seeded through the same checks. */
public final class TestRunRequests {

    private TestRunRequests() {
    }

    /**
     * A test run as registered.
     *
     * @param forceRangeN      the transducer range used, by its upper limit in N; one of the transducer's ranges
     * @param operator         username of the technician or lab manager who ran the test; the signed-in user
     *                         when left out
     * @param testedAt         date and time of the test with the offset where it was run, e.g.
     *                         {@code 2026-11-20T09:30:00+01:00}; the calendar day at that offset is the test
     *                         date the calibrations are checked on
     * @param temperatureC     the test temperature in °C
     * @param method           ISO 6892-1 only: A1, A2 or B
     * @param standardReference the edition or, for OTHER, the procedure followed (required for OTHER)
     * @param reportedProperties the property symbols this run is to report (e.g. {@code ["Rm", "A"]}); sets the
     *                         extensometer class needed; all properties when left out
     * @param calibrationOverrideReason lab manager only: accept a run the calibration gate refuses, and why
     * @param retestReason     needed when the specimen already has a valid run: that run is invalidated with
     *                         this reason and the new one becomes the valid one
     */
    public record TestRunRequest(
            @NotNull UUID specimenId,
            @NotNull UUID machineId,
            @NotNull UUID forceTransducerId,
            @NotNull @Positive BigDecimal forceRangeN,
            @NotNull UUID extensometerId,
            @Size(max = 64) String operator,
            @NotNull OffsetDateTime testedAt,
            @NotNull BigDecimal temperatureC,
            @NotNull TestStandard standard,
            ControlMethod method,
            @Size(max = 300) String standardReference,
            @Positive BigDecimal nominalStrainRatePerS,
            @Positive BigDecimal nominalStressRateMPaPerS,
            @Positive BigDecimal crossheadSpeedMmPerMin,
            @NotNull TestMode mode,
            @Size(max = 4000) String remarks,
            @Size(max = 30) List<@NotBlank @Size(max = 20) String> reportedProperties,
            @Size(max = 2000) String calibrationOverrideReason,
            @Size(max = 2000) String retestReason) {
    }

    /** A state change that must say why: invalidating or reinstating a run. */
    public record ReasonRequest(@Size(max = 2000) String reason) {
    }

    /**
     * A new analysis of a stored curve with other parameters; it becomes the run's current analysis and
     * the previous one stays.
     *
     * @param parameters engine parameters to change, by the keys of the stored parameter set (for a tensile
     *                   run e.g. {@code {"proofOffsetsPercent": [0.2, 1.0]}}); the others keep the run's
     *                   defaults
     */
    public record AnalysisRequest(@Size(max = 100) Map<String, Object> parameters, @Size(max = 2000) String reason) {
    }

    /** Points the run back at one of its earlier analyses. */
    public record CurrentAnalysisRequest(@NotNull UUID analysisId, @Size(max = 2000) String reason) {
    }
}
