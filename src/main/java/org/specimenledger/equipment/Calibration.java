package org.specimenledger.equipment;

import jakarta.persistence.CollectionTable;
import jakarta.persistence.Column;
import jakarta.persistence.ElementCollection;
import jakarta.persistence.Entity;
import jakarta.persistence.FetchType;
import jakarta.persistence.Id;
import jakarta.persistence.JoinColumn;
import jakarta.persistence.OrderColumn;
import jakarta.persistence.Table;
import jakarta.persistence.Version;
import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.UUID;
import org.specimenledger.shared.StateConflict;

/**
 * One calibration (verification) of an instrument, as its certificate states it. Append-only: a wrong
 * record is withdrawn with a reason, never edited, and the database refuses any other change.
 */
@Entity
@Table(name = "calibration")
class Calibration {

    @Id
    private UUID id;

    @Column(name = "instrument_id", nullable = false, updatable = false)
    private UUID instrumentId;

    @Column(name = "calibrated_on", nullable = false, updatable = false)
    private LocalDate calibratedOn;

    @Column(name = "due_on", nullable = false, updatable = false)
    private LocalDate dueOn;

    @Column(name = "calibrating_body", nullable = false, updatable = false)
    private String calibratingBody;

    @Column(name = "certificate_reference", nullable = false, updatable = false)
    private String certificateReference;

    /** Extensometer (ISO 9513) or testing machine (ISO 7500-1); null for a force transducer. */
    @Column(name = "accuracy_class", updatable = false)
    private String accuracyClass;

    @ElementCollection(fetch = FetchType.EAGER)
    @CollectionTable(name = "calibration_range_class", joinColumns = @JoinColumn(name = "calibration_id"))
    @OrderColumn(name = "position")
    private List<RangeClass> rangeClasses = new ArrayList<>();

    @Column(name = "recorded_at", nullable = false, updatable = false)
    private Instant recordedAt;

    @Column(name = "withdrawn_at")
    private Instant withdrawnAt;

    @Column(name = "withdrawal_reason")
    private String withdrawalReason;

    @Version
    private long version;

    protected Calibration() {
    }

    Calibration(UUID instrumentId, LocalDate calibratedOn, LocalDate dueOn, String calibratingBody,
            String certificateReference, String accuracyClass, List<RangeClass> rangeClasses, Instant recordedAt) {
        this.id = UUID.randomUUID();
        this.instrumentId = instrumentId;
        this.calibratedOn = calibratedOn;
        this.dueOn = dueOn;
        this.calibratingBody = calibratingBody;
        this.certificateReference = certificateReference;
        this.accuracyClass = accuracyClass;
        this.rangeClasses.addAll(rangeClasses);
        this.recordedAt = recordedAt;
    }

    /** Takes the record out of force; it stays in the history with the reason. */
    void withdraw(String reason, Instant at) {
        if (withdrawnAt != null) {
            throw new StateConflict("calibration " + certificateReference + " was already withdrawn at " + withdrawnAt
                    + ": " + withdrawalReason);
        }
        this.withdrawnAt = at;
        this.withdrawalReason = reason;
    }

    UUID id() {
        return id;
    }

    UUID instrumentId() {
        return instrumentId;
    }

    LocalDate calibratedOn() {
        return calibratedOn;
    }

    LocalDate dueOn() {
        return dueOn;
    }

    String calibratingBody() {
        return calibratingBody;
    }

    String certificateReference() {
        return certificateReference;
    }

    String accuracyClass() {
        return accuracyClass;
    }

    List<RangeClass> rangeClasses() {
        return List.copyOf(rangeClasses);
    }

    Instant recordedAt() {
        return recordedAt;
    }

    Instant withdrawnAt() {
        return withdrawnAt;
    }

    String withdrawalReason() {
        return withdrawalReason;
    }
}
