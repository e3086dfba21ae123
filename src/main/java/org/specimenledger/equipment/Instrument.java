package org.specimenledger.equipment;

import jakarta.persistence.CollectionTable;
import jakarta.persistence.Column;
import jakarta.persistence.ElementCollection;
import jakarta.persistence.Entity;
import jakarta.persistence.EnumType;
import jakarta.persistence.Enumerated;
import jakarta.persistence.FetchType;
import jakarta.persistence.Id;
import jakarta.persistence.JoinColumn;
import jakarta.persistence.OrderColumn;
import jakarta.persistence.Table;
import jakarta.persistence.Version;
import java.math.BigDecimal;
import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Set;
import java.util.UUID;
import org.specimenledger.shared.StateConflict;

/**
 * One instrument of the laboratory, known by its asset identifier (such as {@code TM-01}). Never
 * deleted: an instrument that can no longer be used is retired from a date.
 */
@Entity
@Table(name = "instrument")
class Instrument {

    @Id
    private UUID id;

    @Column(name = "asset_id", nullable = false)
    private String assetId;

    @Enumerated(EnumType.STRING)
    @Column(nullable = false, updatable = false)
    private InstrumentKind kind;

    @Column(nullable = false)
    private String description;

    @Column
    private String maker;

    @Column
    private String model;

    @Column(name = "serial_number")
    private String serialNumber;

    @Column
    private String location;

    /**
     * A set, not a list: a range is a row keyed by its upper limit, so adding one range inserts one row
     * and leaves the rows that calibrations refer to untouched.
     */
    @ElementCollection(fetch = FetchType.EAGER)
    @CollectionTable(name = "force_range", joinColumns = @JoinColumn(name = "instrument_id"))
    private Set<ForceRange> forceRanges = new LinkedHashSet<>();

    @Column(name = "gauge_length_mm")
    private BigDecimal gaugeLengthMm;

    @Column(name = "travel_mm")
    private BigDecimal travelMm;

    @ElementCollection(fetch = FetchType.EAGER)
    @CollectionTable(name = "instrument_builtin_transducer", joinColumns = @JoinColumn(name = "instrument_id"))
    @OrderColumn(name = "position")
    @Column(name = "transducer_id", nullable = false)
    private List<UUID> builtInTransducerIds = new ArrayList<>();

    @Column(name = "retired_on")
    private LocalDate retiredOn;

    @Column(name = "retirement_reason")
    private String retirementReason;

    @Column(name = "created_at", nullable = false, updatable = false)
    private Instant createdAt;

    @Version
    private long version;

    protected Instrument() {
    }

    Instrument(InstrumentKind kind, Instant createdAt) {
        this.id = UUID.randomUUID();
        this.kind = kind;
        this.createdAt = createdAt;
    }

    void describe(String assetId, String description, String maker, String model, String serialNumber,
            String location) {
        this.assetId = assetId;
        this.description = description;
        this.maker = maker;
        this.model = model;
        this.serialNumber = serialNumber;
        this.location = location;
    }

    /**
     * Makes the ranges those given. A range whose limits are unchanged keeps its stored row (so a
     * calibration's reference to it stays intact); the caller has checked that no referenced range goes.
     */
    void setForceRanges(List<ForceRange> wanted) {
        forceRanges.removeIf(have -> wanted.stream().noneMatch(have::sameLimitsAs));
        for (ForceRange range : wanted) {
            if (forceRanges.stream().noneMatch(range::sameLimitsAs)) {
                forceRanges.add(range);
            }
        }
    }

    void setExtensometerData(BigDecimal gaugeLengthMm, BigDecimal travelMm) {
        this.gaugeLengthMm = gaugeLengthMm;
        this.travelMm = travelMm;
    }

    void setBuiltInTransducers(List<UUID> ids) {
        if (!builtInTransducerIds.equals(ids)) {
            builtInTransducerIds.clear();
            builtInTransducerIds.addAll(ids);
        }
    }

    /** No longer usable from {@code from} on; an instrument is retired once. */
    void retire(LocalDate from, String reason) {
        if (retiredOn != null) {
            throw new StateConflict("instrument " + assetId + " was already retired on " + retiredOn);
        }
        this.retiredOn = from;
        this.retirementReason = reason;
    }

    UUID id() {
        return id;
    }

    String assetId() {
        return assetId;
    }

    InstrumentKind kind() {
        return kind;
    }

    String description() {
        return description;
    }

    String maker() {
        return maker;
    }

    String model() {
        return model;
    }

    String serialNumber() {
        return serialNumber;
    }

    String location() {
        return location;
    }

    /** The ranges, smallest first. */
    List<ForceRange> forceRanges() {
        return forceRanges.stream().sorted(Comparator.comparing(ForceRange::upperLimitN)).toList();
    }

    BigDecimal gaugeLengthMm() {
        return gaugeLengthMm;
    }

    BigDecimal travelMm() {
        return travelMm;
    }

    List<UUID> builtInTransducerIds() {
        return List.copyOf(builtInTransducerIds);
    }

    LocalDate retiredOn() {
        return retiredOn;
    }

    String retirementReason() {
        return retirementReason;
    }

    Instant createdAt() {
        return createdAt;
    }
}
