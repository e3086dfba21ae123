package org.specimenledger.shared;

import java.util.UUID;

/**
 * Who is making the request: their account, role and, for a customer, the one organisation whose
 * records they may see.
 */
public record SignedInUser(UUID accountId, String username, Role role, UUID organisationId) {

    public boolean isCustomer() {
        return role == Role.CUSTOMER;
    }

    /** Implemented by the security principal so that features can read the user without knowing it. */
    public interface Holder {
        SignedInUser signedInUser();
    }
}
