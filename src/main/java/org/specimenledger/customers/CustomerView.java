package org.specimenledger.customers;

import java.time.Instant;
import java.util.UUID;

/** A customer as the API returns it and as the ledger records it. */
public record CustomerView(UUID id, String name, String address, Instant createdAt) {

    static CustomerView of(Customer c) {
        return new CustomerView(c.id(), c.name(), c.address(), c.createdAt());
    }
}
