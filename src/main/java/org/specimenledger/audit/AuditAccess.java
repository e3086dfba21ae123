package org.specimenledger.audit;

/** Who may read the ledger: the auditor and the lab manager; two ledger facts are public. */
final class AuditAccess {
    static final String READERS = "hasAnyRole('AUDITOR','LAB_MANAGER')";
    /**
     * Anyone, signed in or not: the public key and the latest checkpoint, so that a copy held outside the
     * laboratory can fetch them (also listed in {@code SecurityConfiguration}'s public paths).
     */
    static final String ANYONE = "permitAll()";

    private AuditAccess() {
    }
}
