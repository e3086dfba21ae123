package org.specimenledger.audit;

/** Who may read the ledger: the auditor and the lab manager. */
final class AuditAccess {
    static final String READERS = "hasAnyRole('AUDITOR','LAB_MANAGER')";

    private AuditAccess() {
    }
}
