package org.specimenledger.shared;

/**
 * The role matrix, as the expressions each endpoint declares with {@code @PreAuthorize}. Every
 * endpoint names one of these; a test fails the build for an endpoint that names none.
 */
public final class Access {

    /** Everyone who can sign in; customers are further limited to their own organisation. */
    public static final String ANY_SIGNED_IN = "hasAnyRole('TECHNICIAN','LAB_MANAGER','AUDITOR','CUSTOMER')";
    /** The laboratory's people and the auditor: read access to laboratory records. */
    public static final String LAB_READERS = "hasAnyRole('TECHNICIAN','LAB_MANAGER','AUDITOR')";
    /** Those who do the laboratory's daily work: register and measure. */
    public static final String LAB_WORKERS = "hasAnyRole('TECHNICIAN','LAB_MANAGER')";
    /** The lab manager alone: customers, orders, equipment, accounts, release. */
    public static final String MANAGER = "hasRole('LAB_MANAGER')";
    /** Readers of the ledger. */
    public static final String AUDIT_READERS = "hasAnyRole('AUDITOR','LAB_MANAGER')";

    private Access() {
    }
}
