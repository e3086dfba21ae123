package org.specimenledger.testing;

import jakarta.persistence.Column;
import jakarta.persistence.Entity;
import jakarta.persistence.EnumType;
import jakarta.persistence.Enumerated;
import jakarta.persistence.Id;
import jakarta.persistence.Table;
import jakarta.persistence.Version;
import java.math.BigDecimal;
import java.time.Instant;
import java.time.LocalDate;
import java.util.Arrays;
import java.util.List;
import java.util.UUID;
import org.specimenledger.shared.StateConflict;

/**
 * One pull of one specimen: the instruments and their governing calibrations, the operator, when and
 * under which conditions and standard. After registration only its validity and its pointer to the current
 * analysis change (the database refuses anything else).
 */
@Entity
@Table(name = "test_run")
class TestRun {

    @Id
    private UUID id;

    @Column(name = "specimen_id", nullable = false, updatable = false)
    private UUID specimenId;

    @Column(name = "machine_id", nullable = false, updatable = false)
    private UUID machineId;

    @Column(name = "force_transducer_id", nullable = false, updatable = false)
    private UUID forceTransducerId;

    @Column(name = "force_range_n", nullable = false, updatable = false)
    private BigDecimal forceRangeN;

    @Column(name = "extensometer_id", nullable = false, updatable = false)
    private UUID extensometerId;

    @Column(name = "machine_calibration_id", updatable = false)
    private UUID machineCalibrationId;

    @Column(name = "transducer_calibration_id", updatable = false)
    private UUID transducerCalibrationId;

    @Column(name = "extensometer_calibration_id", updatable = false)
    private UUID extensometerCalibrationId;

    @Column(nullable = false, updatable = false)
    private String operator;

    @Column(name = "tested_at", nullable = false, updatable = false)
    private Instant testedAt;

    @Column(name = "test_date", nullable = false, updatable = false)
    private LocalDate testDate;

    @Column(name = "temperature_c", nullable = false, updatable = false)
    private BigDecimal temperatureC;

    @Enumerated(EnumType.STRING)
    @Column(nullable = false, updatable = false)
    private TestStandard standard;

    @Enumerated(EnumType.STRING)
    @Column(name = "control_method", updatable = false)
    private ControlMethod method;

    @Column(name = "standard_reference", updatable = false)
    private String standardReference;

    @Column(name = "nominal_strain_rate_per_s", updatable = false)
    private BigDecimal nominalStrainRatePerS;

    @Column(name = "nominal_stress_rate_mpa_per_s", updatable = false)
    private BigDecimal nominalStressRateMPaPerS;

    @Column(name = "crosshead_speed_mm_per_min", updatable = false)
    private BigDecimal crossheadSpeedMmPerMin;

    @Enumerated(EnumType.STRING)
    @Column(nullable = false, updatable = false)
    private TestMode mode;

    @Column(updatable = false)
    private String remarks;

    /** Comma-separated property symbols, or null for all. */
    @Column(name = "reported_properties", updatable = false)
    private String reportedProperties;

    @Enumerated(EnumType.STRING)
    @Column(nullable = false)
    private Validity validity;

    @Column(name = "invalidation_reason")
    private String invalidationReason;

    @Column(name = "invalidated_at")
    private Instant invalidatedAt;

    @Column(name = "invalidated_by")
    private String invalidatedBy;

    @Column(name = "calibration_override_reason", updatable = false)
    private String calibrationOverrideReason;

    @Column(name = "calibration_override_by", updatable = false)
    private String calibrationOverrideBy;

    @Column(name = "calibration_override_findings", updatable = false)
    private String calibrationOverrideFindings;

    @Column(name = "current_analysis_id")
    private UUID currentAnalysisId;

    @Column(name = "created_at", nullable = false, updatable = false)
    private Instant createdAt;

    @Column(name = "created_by", nullable = false, updatable = false)
    private String createdBy;

    @Version
    private long version;

    protected TestRun() {
    }

    /** The registered facts; checked by the caller ({@link TestRunRules}, {@link CalibrationGate}). */
    record Facts(UUID specimenId, UUID machineId, UUID forceTransducerId, BigDecimal forceRangeN, UUID extensometerId,
            UUID machineCalibrationId, UUID transducerCalibrationId, UUID extensometerCalibrationId, String operator,
            Instant testedAt, LocalDate testDate, BigDecimal temperatureC, TestStandard standard, ControlMethod method,
            String standardReference, BigDecimal nominalStrainRatePerS, BigDecimal nominalStressRateMPaPerS,
            BigDecimal crossheadSpeedMmPerMin, TestMode mode, String remarks, List<String> reportedProperties) {
    }

    TestRun(Facts f, String overrideReason, String overrideBy, String overrideFindings, Instant createdAt,
            String createdBy) {
        this.id = UUID.randomUUID();
        this.specimenId = f.specimenId();
        this.machineId = f.machineId();
        this.forceTransducerId = f.forceTransducerId();
        this.forceRangeN = f.forceRangeN();
        this.extensometerId = f.extensometerId();
        this.machineCalibrationId = f.machineCalibrationId();
        this.transducerCalibrationId = f.transducerCalibrationId();
        this.extensometerCalibrationId = f.extensometerCalibrationId();
        this.operator = f.operator();
        this.testedAt = f.testedAt();
        this.testDate = f.testDate();
        this.temperatureC = f.temperatureC();
        this.standard = f.standard();
        this.method = f.method();
        this.standardReference = f.standardReference();
        this.nominalStrainRatePerS = f.nominalStrainRatePerS();
        this.nominalStressRateMPaPerS = f.nominalStressRateMPaPerS();
        this.crossheadSpeedMmPerMin = f.crossheadSpeedMmPerMin();
        this.mode = f.mode();
        this.remarks = f.remarks();
        this.reportedProperties = f.reportedProperties() == null ? null : String.join(",", f.reportedProperties());
        this.calibrationOverrideReason = overrideReason;
        this.calibrationOverrideBy = overrideReason == null ? null : overrideBy;
        this.calibrationOverrideFindings = overrideReason == null ? null : overrideFindings;
        this.validity = Validity.VALID;
        this.createdAt = createdAt;
        this.createdBy = createdBy;
    }

    /** Takes the run out of count; it stays with its curve and analyses. */
    void invalidate(String reason, Instant at, String by) {
        if (validity == Validity.INVALID) {
            throw new StateConflict("test run " + id + " is already invalid (" + invalidationReason + ")");
        }
        this.validity = Validity.INVALID;
        this.invalidationReason = reason;
        this.invalidatedAt = at;
        this.invalidatedBy = by;
    }

    /** Makes an invalidated run the valid one again (the caller invalidates the specimen's other valid run). */
    void reinstate() {
        if (validity == Validity.VALID) {
            throw new StateConflict("test run " + id + " is already the valid run of its specimen");
        }
        this.validity = Validity.VALID;
        this.invalidationReason = null;
        this.invalidatedAt = null;
        this.invalidatedBy = null;
    }

    void pointAt(UUID analysisId) {
        this.currentAnalysisId = analysisId;
    }

    UUID id() {
        return id;
    }

    UUID specimenId() {
        return specimenId;
    }

    UUID machineId() {
        return machineId;
    }

    UUID forceTransducerId() {
        return forceTransducerId;
    }

    BigDecimal forceRangeN() {
        return forceRangeN;
    }

    UUID extensometerId() {
        return extensometerId;
    }

    UUID machineCalibrationId() {
        return machineCalibrationId;
    }

    UUID transducerCalibrationId() {
        return transducerCalibrationId;
    }

    UUID extensometerCalibrationId() {
        return extensometerCalibrationId;
    }

    String operator() {
        return operator;
    }

    Instant testedAt() {
        return testedAt;
    }

    LocalDate testDate() {
        return testDate;
    }

    BigDecimal temperatureC() {
        return temperatureC;
    }

    TestStandard standard() {
        return standard;
    }

    ControlMethod method() {
        return method;
    }

    String standardReference() {
        return standardReference;
    }

    BigDecimal nominalStrainRatePerS() {
        return nominalStrainRatePerS;
    }

    BigDecimal nominalStressRateMPaPerS() {
        return nominalStressRateMPaPerS;
    }

    BigDecimal crossheadSpeedMmPerMin() {
        return crossheadSpeedMmPerMin;
    }

    TestMode mode() {
        return mode;
    }

    String remarks() {
        return remarks;
    }

    List<String> reportedProperties() {
        return reportedProperties == null ? null : Arrays.asList(reportedProperties.split(","));
    }

    Validity validity() {
        return validity;
    }

    String invalidationReason() {
        return invalidationReason;
    }

    Instant invalidatedAt() {
        return invalidatedAt;
    }

    String invalidatedBy() {
        return invalidatedBy;
    }

    String calibrationOverrideReason() {
        return calibrationOverrideReason;
    }

    String calibrationOverrideBy() {
        return calibrationOverrideBy;
    }

    String calibrationOverrideFindings() {
        return calibrationOverrideFindings;
    }

    boolean calibrationOverridden() {
        return calibrationOverrideReason != null;
    }

    UUID currentAnalysisId() {
        return currentAnalysisId;
    }

    Instant createdAt() {
        return createdAt;
    }

    String createdBy() {
        return createdBy;
    }
}
