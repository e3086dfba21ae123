package org.specimenledger.customers;

import jakarta.persistence.Column;
import jakarta.persistence.Entity;
import jakarta.persistence.Id;
import jakarta.persistence.Table;
import jakarta.persistence.Version;
import java.time.Instant;
import java.util.UUID;

/** An organisation the laboratory tests for; its people sign in to the portal as customers. */
@Entity
@Table(name = "customer")
class Customer {

    @Id
    private UUID id;

    @Column(nullable = false)
    private String name;

    @Column(nullable = false)
    private String address;

    @Column(name = "created_at", nullable = false, updatable = false)
    private Instant createdAt;

    @Version
    private long version;

    protected Customer() {
    }

    Customer(String name, String address, Instant createdAt) {
        this.id = UUID.randomUUID();
        this.name = name;
        this.address = address;
        this.createdAt = createdAt;
    }

    void rename(String name, String address) {
        this.name = name;
        this.address = address;
    }

    UUID id() {
        return id;
    }

    String name() {
        return name;
    }

    String address() {
        return address;
    }

    Instant createdAt() {
        return createdAt;
    }
}
