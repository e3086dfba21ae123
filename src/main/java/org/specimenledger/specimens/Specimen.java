package org.specimenledger.specimens;

import jakarta.persistence.AttributeOverride;
import jakarta.persistence.AttributeOverrides;
import jakarta.persistence.CollectionTable;
import jakarta.persistence.Column;
import jakarta.persistence.ElementCollection;
import jakarta.persistence.Embedded;
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
import java.util.ArrayList;
import java.util.List;
import java.util.UUID;
import org.specimenledger.shared.StateConflict;

/**
 * One test piece: where it comes from (heat, order), how it was taken, its measured geometry with S0 and
 * L0, and, once broken, what was measured on the pieces. Computed values are stored as the decimals of the
 * doubles the computation produced, beside the formula or rule that produced them.
 */
@Entity
@Table(name = "specimen")
class Specimen {

    @Id
    private UUID id;

    @Column(name = "lab_identifier", nullable = false)
    private String labIdentifier;

    @Column(name = "heat_id", nullable = false)
    private UUID heatId;

    @Column(name = "order_id", nullable = false)
    private UUID orderId;

    @Column(name = "customer_id", nullable = false)
    private UUID customerId;

    @Enumerated(EnumType.STRING)
    @Column(nullable = false)
    private Orientation orientation;

    @Column(name = "sampling_position")
    private String samplingPosition;

    @Enumerated(EnumType.STRING)
    @Column(nullable = false)
    private SpecimenShape shape;

    @ElementCollection(fetch = FetchType.EAGER)
    @CollectionTable(name = "specimen_reading", joinColumns = @JoinColumn(name = "specimen_id"))
    @OrderColumn(name = "position")
    private List<Reading> readings = new ArrayList<>();

    @Embedded
    private MeanDimensions means;

    @Column(name = "s0_mm2", nullable = false)
    private BigDecimal s0Mm2;

    @Column(name = "s0_formula", nullable = false)
    private String s0Formula;

    @Column(name = "s0_method")
    private String s0Method;

    @Enumerated(EnumType.STRING)
    @Column(name = "l0_basis", nullable = false)
    private GaugeLength.Basis l0Basis;

    @Column(name = "l0_k")
    private BigDecimal l0K;

    @Column(name = "l0_round_to_five_mm")
    private Boolean l0RoundToFiveMm;

    @Column(name = "l0_calculated_mm", nullable = false)
    private BigDecimal l0CalculatedMm;

    @Column(name = "l0_mm", nullable = false)
    private BigDecimal l0Mm;

    @Column(name = "l0_rule", nullable = false)
    private String l0Rule;

    @Column(name = "le_mm", nullable = false)
    private BigDecimal leMm;

    @Column(name = "lc_mm", nullable = false)
    private BigDecimal lcMm;

    @Column(name = "lu_mm")
    private BigDecimal luMm;

    @ElementCollection(fetch = FetchType.EAGER)
    @CollectionTable(name = "specimen_fracture_reading", joinColumns = @JoinColumn(name = "specimen_id"))
    @OrderColumn(name = "position")
    private List<Reading> fractureReadings = new ArrayList<>();

    @Embedded
    @AttributeOverrides({
            @AttributeOverride(name = "d", column = @Column(name = "mean_du_mm")),
            @AttributeOverride(name = "a", column = @Column(name = "mean_au_mm")),
            @AttributeOverride(name = "b", column = @Column(name = "mean_bu_mm")),
            @AttributeOverride(name = "outerD", column = @Column(name = "mean_outer_du_mm"))})
    private MeanDimensions fractureMeans;

    @Column(name = "su_mm2")
    private BigDecimal suMm2;

    @Column(name = "su_formula")
    private String suFormula;

    @Column(name = "su_method")
    private String suMethod;

    @Column(name = "fracture_distance_mm")
    private BigDecimal fractureDistanceMm;

    @Enumerated(EnumType.STRING)
    @Column(name = "fracture_zone")
    private FractureZone fractureZone;

    @Column(name = "fracture_recorded_at")
    private Instant fractureRecordedAt;

    @Column(name = "created_at", nullable = false, updatable = false)
    private Instant createdAt;

    @Version
    private long version;

    protected Specimen() {
    }

    Specimen(String labIdentifier, UUID heatId, UUID orderId, UUID customerId, Orientation orientation,
            String samplingPosition, Geometry geometry, Instant createdAt) {
        this.id = UUID.randomUUID();
        this.createdAt = createdAt;
        apply(labIdentifier, heatId, orderId, customerId, orientation, samplingPosition, geometry);
    }

    /** Corrects the register data; allowed only before the piece is tested (no after-fracture record yet). */
    void correct(String labIdentifier, UUID heatId, UUID orderId, UUID customerId, Orientation orientation,
            String samplingPosition, Geometry geometry) {
        if (isBroken()) {
            throw new StateConflict("specimen '" + this.labIdentifier + "' has after-fracture measurements since "
                    + fractureRecordedAt + "; its register data can no longer be corrected");
        }
        apply(labIdentifier, heatId, orderId, customerId, orientation, samplingPosition, geometry);
    }

    /** Records (or, with a reason checked by the caller, replaces) what was measured on the broken pieces. */
    void recordAfterFracture(FractureMeasurement m, Instant at) {
        this.luMm = m.luMm();
        this.fractureReadings.clear();
        this.fractureReadings.addAll(m.readings());
        this.fractureMeans = m.crossSection().shape().isMeasured() ? MeanDimensions.of(m.crossSection()) : null;
        this.suMm2 = BigDecimal.valueOf(m.crossSection().areaMm2());
        this.suFormula = m.crossSection().formula();
        this.suMethod = m.suMethod();
        this.fractureDistanceMm = m.fractureDistanceMm();
        this.fractureZone = m.fractureZone();
        this.fractureRecordedAt = at;
    }

    private void apply(String labIdentifier, UUID heatId, UUID orderId, UUID customerId, Orientation orientation,
            String samplingPosition, Geometry g) {
        this.labIdentifier = labIdentifier;
        this.heatId = heatId;
        this.orderId = orderId;
        this.customerId = customerId;
        this.orientation = orientation;
        this.samplingPosition = samplingPosition;
        this.shape = g.shape();
        this.readings.clear();
        this.readings.addAll(g.readings());
        this.means = g.shape().isMeasured() ? MeanDimensions.of(g.crossSection()) : null;
        this.s0Mm2 = BigDecimal.valueOf(g.crossSection().areaMm2());
        this.s0Formula = g.crossSection().formula();
        this.s0Method = g.s0Method();
        GaugeLength l0 = g.gaugeLength();
        this.l0Basis = l0.basis();
        this.l0K = l0.k() == null ? null : BigDecimal.valueOf(l0.k());
        this.l0RoundToFiveMm = l0.roundToFiveMm();
        this.l0CalculatedMm = BigDecimal.valueOf(l0.calculatedMm());
        this.l0Mm = BigDecimal.valueOf(l0.l0Mm());
        this.l0Rule = l0.rule();
        this.leMm = g.leMm();
        this.lcMm = g.lcMm();
    }

    boolean isBroken() {
        return fractureRecordedAt != null;
    }

    UUID id() {
        return id;
    }

    String labIdentifier() {
        return labIdentifier;
    }

    UUID heatId() {
        return heatId;
    }

    UUID orderId() {
        return orderId;
    }

    UUID customerId() {
        return customerId;
    }

    Orientation orientation() {
        return orientation;
    }

    String samplingPosition() {
        return samplingPosition;
    }

    SpecimenShape shape() {
        return shape;
    }

    List<Reading> readings() {
        return List.copyOf(readings);
    }

    MeanDimensions means() {
        return means;
    }

    BigDecimal s0Mm2() {
        return s0Mm2;
    }

    String s0Formula() {
        return s0Formula;
    }

    String s0Method() {
        return s0Method;
    }

    GaugeLength.Basis l0Basis() {
        return l0Basis;
    }

    BigDecimal l0K() {
        return l0K;
    }

    Boolean l0RoundToFiveMm() {
        return l0RoundToFiveMm;
    }

    BigDecimal l0CalculatedMm() {
        return l0CalculatedMm;
    }

    BigDecimal l0Mm() {
        return l0Mm;
    }

    String l0Rule() {
        return l0Rule;
    }

    BigDecimal leMm() {
        return leMm;
    }

    BigDecimal lcMm() {
        return lcMm;
    }

    BigDecimal luMm() {
        return luMm;
    }

    List<Reading> fractureReadings() {
        return List.copyOf(fractureReadings);
    }

    MeanDimensions fractureMeans() {
        return fractureMeans;
    }

    BigDecimal suMm2() {
        return suMm2;
    }

    String suFormula() {
        return suFormula;
    }

    String suMethod() {
        return suMethod;
    }

    BigDecimal fractureDistanceMm() {
        return fractureDistanceMm;
    }

    FractureZone fractureZone() {
        return fractureZone;
    }

    Instant fractureRecordedAt() {
        return fractureRecordedAt;
    }

    Instant createdAt() {
        return createdAt;
    }
}
