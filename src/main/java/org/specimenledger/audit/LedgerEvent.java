package org.specimenledger.audit;

import java.time.Instant;
import tools.jackson.databind.JsonNode;

/**
 * One recorded change, as stored. {@code canonical} is the exact text whose SHA-256 is {@code hash};
 * it carries every other field and {@code previousHash}, so the chain can be checked with any SHA-256
 * tool.
 *
 * @param seq position in the chain, from 1, without gaps
 */
public record LedgerEvent(
        long seq,
        Instant occurredAt,
        String actor,
        String role,
        String action,
        String entityType,
        String entityId,
        String reason,
        JsonNode before,
        JsonNode after,
        String previousHash,
        String hash,
        String canonical) {
}
