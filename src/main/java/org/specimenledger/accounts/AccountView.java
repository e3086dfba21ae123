package org.specimenledger.accounts;

import java.time.Instant;
import java.util.UUID;
import org.specimenledger.shared.Role;

/** An account as the API shows it and the ledger records it: never the password hash. */
public record AccountView(UUID id, String username, String displayName, Role role, UUID organisationId,
        boolean enabled, Instant createdAt) {

    static AccountView of(Account a) {
        return new AccountView(a.id(), a.username(), a.displayName(), a.role(), a.organisationId(), a.enabled(),
                a.createdAt());
    }
}
