package org.specimenledger.customers;

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
import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.UUID;
import org.specimenledger.analysis.units.ReportingUnits;

/** A customer's purchase order for testing, with the requirements its material specification sets. */
@Entity
@Table(name = "customer_order")
class CustomerOrder {

    @Id
    private UUID id;

    @Column(name = "customer_id", nullable = false, updatable = false)
    private UUID customerId;

    @Column(name = "purchase_order", nullable = false)
    private String purchaseOrder;

    @Column(name = "material_specification", nullable = false)
    private String materialSpecification;

    @Column(name = "received_on")
    private LocalDate receivedOn;

    @ElementCollection(fetch = FetchType.EAGER)
    @CollectionTable(name = "order_requirement", joinColumns = @JoinColumn(name = "order_id"))
    @OrderColumn(name = "position")
    private List<Requirement> requirements = new ArrayList<>();

    @Enumerated(EnumType.STRING)
    @Column(name = "reporting_units", nullable = false)
    private ReportingUnits reportingUnits = ReportingUnits.SI;

    @Column(name = "created_at", nullable = false, updatable = false)
    private Instant createdAt;

    @Version
    private long version;

    protected CustomerOrder() {
    }

    CustomerOrder(UUID customerId, String purchaseOrder, String materialSpecification, LocalDate receivedOn,
            List<Requirement> requirements, ReportingUnits reportingUnits, Instant createdAt) {
        this.id = UUID.randomUUID();
        this.customerId = customerId;
        this.createdAt = createdAt;
        revise(purchaseOrder, materialSpecification, receivedOn, requirements, reportingUnits);
    }

    void revise(String purchaseOrder, String materialSpecification, LocalDate receivedOn,
            List<Requirement> requirements, ReportingUnits reportingUnits) {
        this.reportingUnits = reportingUnits;
        this.purchaseOrder = purchaseOrder;
        this.materialSpecification = materialSpecification;
        this.receivedOn = receivedOn;
        this.requirements.clear();
        this.requirements.addAll(requirements);
    }

    UUID id() {
        return id;
    }

    UUID customerId() {
        return customerId;
    }

    String purchaseOrder() {
        return purchaseOrder;
    }

    String materialSpecification() {
        return materialSpecification;
    }

    LocalDate receivedOn() {
        return receivedOn;
    }

    List<Requirement> requirements() {
        return List.copyOf(requirements);
    }

    ReportingUnits reportingUnits() {
        return reportingUnits;
    }

    Instant createdAt() {
        return createdAt;
    }
}
