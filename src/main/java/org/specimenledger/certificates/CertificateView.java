package org.specimenledger.certificates;

import java.time.Instant;
import java.time.LocalDate;
import java.util.List;
import java.util.UUID;

/**
 * An issued certificate as the API returns it and the ledger records it. Nothing here changes after issue but
 * {@code status} and its details, which come from append-only status rows.
 *
 * @param status          VALID, SUPERSEDED or WITHDRAWN
 * @param replaces        the revision this one replaces, null for revision 0
 * @param supersededBy    the revision that replaced this one, null unless superseded
 * @param ledgerSeq       the issue event's position in the audit trail
 * @param ledgerHash      the issue event's hash
 * @param checkpointId    the signed checkpoint recorded at issue, covering the issue event (its tree size is
 *                        {@code ledgerSeq})
 * @param pdfSha256       lower-case hex SHA-256 of the stored PDF bytes
 */
public record CertificateView(UUID id, String number, int revision, String status, UUID orderId, UUID customerId,
        Reference replaces, String revisionReason, Reference supersededBy, String statusReason,
        Instant statusChangedAt, DecisionRuleChoice decisionRule, String decisionRuleStatement,
        String productDescription, String deviations, String nonConformityStatement, boolean allLinesPass,
        Instant issuedAt, LocalDate issueDate, String issuedBy, Signature signature, String verificationCode,
        long ledgerSeq, String ledgerHash, long checkpointId, String checkpointRoot, String pdfSha256, int pdfBytes,
        UUID draftId, List<CertificateLine> lines) {

    public static final String VALID = "VALID";
    public static final String SUPERSEDED = "SUPERSEDED";
    public static final String WITHDRAWN = "WITHDRAWN";

    /** Another revision of the same certificate. */
    public record Reference(UUID id, String number, int revision) {
    }

    /** The authorised signatory and what the signature means. */
    public record Signature(String name, String function, String meaning) {
    }

    /** This view with status details, for ledger records of a status change. */
    CertificateView withStatus(String newStatus, Reference by, String reason, Instant at) {
        return new CertificateView(id, number, revision, newStatus, orderId, customerId, replaces, revisionReason, by,
                reason, at, decisionRule, decisionRuleStatement, productDescription, deviations,
                nonConformityStatement, allLinesPass, issuedAt, issueDate, issuedBy, signature, verificationCode,
                ledgerSeq, ledgerHash, checkpointId, checkpointRoot, pdfSha256, pdfBytes, draftId, lines);
    }
}
