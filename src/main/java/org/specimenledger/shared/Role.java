package org.specimenledger.shared;

/**
 * What a signed-in person may do. The auditor reads everything and changes nothing; a customer sees
 * only the records of their own organisation.
 */
public enum Role {
    TECHNICIAN,
    LAB_MANAGER,
    AUDITOR,
    CUSTOMER;

    /** The authority name Spring Security checks, {@code ROLE_} + name. */
    public String authority() {
        return "ROLE_" + name();
    }
}
