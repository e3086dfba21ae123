package org.specimenledger.certificates;

import java.time.Instant;
import java.util.List;
import java.util.UUID;

/**
 * A certificate draft as the API returns it and the ledger records it.
 *
 * @param lines             the lines as built at the last change (issuing rebuilds them and refuses if they moved)
 * @param allLinesPass      false when a line fails or was not decided: issuing then needs a non-conformity statement
 * @param revises           the certificate a revision draft will replace, null for a first issue
 * @param state             OPEN, ISSUED or DISCARDED
 */
public record DraftView(UUID id, UUID orderId, UUID customerId, List<UUID> specimenIds, DecisionRuleChoice decisionRule,
        String decisionRuleStatement, String productDescription, String deviations, String nonConformityStatement,
        boolean includeCurves, List<CertificateLine> lines, boolean allLinesPass, Revises revises, String state,
        UUID issuedCertificateId, Instant createdAt, String createdBy, Instant changedAt, long version) {

    /** The certificate a revision draft replaces, and why. */
    public record Revises(UUID certificateId, String number, int revision, String reason) {
    }
}
