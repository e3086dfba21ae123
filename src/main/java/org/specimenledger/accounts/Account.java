package org.specimenledger.accounts;

import jakarta.persistence.Column;
import jakarta.persistence.Entity;
import jakarta.persistence.EnumType;
import jakarta.persistence.Enumerated;
import jakarta.persistence.Id;
import jakarta.persistence.Table;
import jakarta.persistence.Version;
import java.time.Instant;
import java.util.UUID;
import org.specimenledger.shared.Role;

/** One person's sign-in: a unique username, an adaptive password hash, one role. */
@Entity
@Table(name = "account")
class Account {

    @Id
    private UUID id;

    @Column(nullable = false, updatable = false)
    private String username;

    @Column(name = "display_name", nullable = false)
    private String displayName;

    @Column(name = "password_hash", nullable = false)
    private String passwordHash;

    @Enumerated(EnumType.STRING)
    @Column(nullable = false)
    private Role role;

    @Column(name = "organisation_id")
    private UUID organisationId;

    @Column(nullable = false)
    private boolean enabled = true;

    @Column(name = "created_at", nullable = false, updatable = false)
    private Instant createdAt;

    @Version
    private long version;

    protected Account() {
    }

    Account(String username, String displayName, String passwordHash, Role role, UUID organisationId,
            Instant createdAt) {
        this.id = UUID.randomUUID();
        this.username = username;
        this.displayName = displayName;
        this.passwordHash = passwordHash;
        this.role = role;
        this.organisationId = organisationId;
        this.createdAt = createdAt;
    }

    void disable() {
        this.enabled = false;
    }

    UUID id() {
        return id;
    }

    String username() {
        return username;
    }

    String displayName() {
        return displayName;
    }

    String passwordHash() {
        return passwordHash;
    }

    Role role() {
        return role;
    }

    UUID organisationId() {
        return organisationId;
    }

    boolean enabled() {
        return enabled;
    }

    Instant createdAt() {
        return createdAt;
    }
}
