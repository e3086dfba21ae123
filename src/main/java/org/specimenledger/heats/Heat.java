package org.specimenledger.heats;

import jakarta.persistence.CollectionTable;
import jakarta.persistence.Column;
import jakarta.persistence.ElementCollection;
import jakarta.persistence.Entity;
import jakarta.persistence.EnumType;
import jakarta.persistence.Enumerated;
import jakarta.persistence.FetchType;
import jakarta.persistence.Id;
import jakarta.persistence.JoinColumn;
import jakarta.persistence.MapKeyColumn;
import jakarta.persistence.Table;
import jakarta.persistence.Version;
import java.math.BigDecimal;
import java.time.Instant;
import java.util.HashMap;
import java.util.Map;
import java.util.UUID;

/** One heat (cast) of one producer, as its mill certificate identifies it. */
@Entity
@Table(name = "heat")
class Heat {

    @Id
    private UUID id;

    @Column(name = "heat_number", nullable = false)
    private String heatNumber;

    @Column(nullable = false)
    private String producer;

    @Column(nullable = false)
    private String grade;

    @Enumerated(EnumType.STRING)
    @Column(name = "product_form", nullable = false)
    private ProductForm productForm;

    @Column(name = "nominal_thickness_mm", nullable = false)
    private BigDecimal nominalThicknessMm;

    /** Element symbol → mass %, as the producer reported it (digits kept as given). */
    @ElementCollection(fetch = FetchType.EAGER)
    @CollectionTable(name = "heat_composition", joinColumns = @JoinColumn(name = "heat_id"))
    @MapKeyColumn(name = "element")
    @Column(name = "mass_percent", nullable = false)
    private Map<String, BigDecimal> composition = new HashMap<>();

    @Column(name = "created_at", nullable = false, updatable = false)
    private Instant createdAt;

    @Version
    private long version;

    protected Heat() {
    }

    Heat(String heatNumber, String producer, String grade, ProductForm productForm, BigDecimal nominalThicknessMm,
            Map<String, BigDecimal> composition, Instant createdAt) {
        this.id = UUID.randomUUID();
        this.createdAt = createdAt;
        correct(heatNumber, producer, grade, productForm, nominalThicknessMm, composition);
    }

    void correct(String heatNumber, String producer, String grade, ProductForm productForm,
            BigDecimal nominalThicknessMm, Map<String, BigDecimal> composition) {
        this.heatNumber = heatNumber;
        this.producer = producer;
        this.grade = grade;
        this.productForm = productForm;
        this.nominalThicknessMm = nominalThicknessMm;
        this.composition.clear();
        this.composition.putAll(composition);
    }

    UUID id() {
        return id;
    }

    String heatNumber() {
        return heatNumber;
    }

    String producer() {
        return producer;
    }

    String grade() {
        return grade;
    }

    ProductForm productForm() {
        return productForm;
    }

    BigDecimal nominalThicknessMm() {
        return nominalThicknessMm;
    }

    Map<String, BigDecimal> composition() {
        return Map.copyOf(composition);
    }

    Instant createdAt() {
        return createdAt;
    }
}
