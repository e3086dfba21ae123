package org.specimenledger.audit;

import io.swagger.v3.oas.annotations.Operation;
import jakarta.validation.constraints.Max;
import jakarta.validation.constraints.Min;
import java.time.Instant;
import java.util.List;
import org.specimenledger.shared.RuleViolation;
import org.springframework.security.access.prepost.PreAuthorize;
import org.springframework.validation.annotation.Validated;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.RequestMapping;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.bind.annotation.RestController;

/** Read access to the ledger for auditors and the lab manager. */
@RestController
@RequestMapping("/api/v1/audit")
@Validated
class AuditEventsController {

    private final LedgerQueries queries;
    private final ChainVerifier verifier;

    AuditEventsController(LedgerQueries queries, ChainVerifier verifier) {
        this.queries = queries;
        this.verifier = verifier;
    }

    /**
     * A page of events in chain order, after sequence number {@code after}, optionally only those of one
     * record, actor or action, or with {@code from ≤ occurredAt < to} (ISO-8601 instants).
     */
    @GetMapping("/events")
    @PreAuthorize(AuditAccess.READERS)
    @Operation(summary = "Search ledger events in chain order by record, actor, action and time")
    EventPage events(@RequestParam(defaultValue = "0") @Min(0) long after,
            @RequestParam(defaultValue = "100") @Min(1) @Max(1000) int limit,
            @RequestParam(required = false) String entityType,
            @RequestParam(required = false) String entityId,
            @RequestParam(required = false) String actor,
            @RequestParam(required = false) String action,
            @RequestParam(required = false) Instant from,
            @RequestParam(required = false) Instant to) {
        if (from != null && to != null && !to.isAfter(from)) {
            throw new RuleViolation("to", "to (" + to + ") must be after from (" + from + ")");
        }
        List<LedgerEvent> events = queries.search(
                new LedgerQueries.EventFilter(entityType, entityId, actor, action, from, to), after, limit);
        Long next = events.size() == limit ? events.get(events.size() - 1).seq() : null;
        return new EventPage(events, next);
    }

    /** Recomputes the whole chain and says whether it holds, or where it first breaks. */
    @GetMapping("/verify")
    @PreAuthorize(AuditAccess.READERS)
    @Operation(summary = "Recompute the hash chain and report the first event that does not verify")
    ChainVerification verify() {
        return verifier.verify();
    }

    /** @param nextAfter pass as {@code after} for the next page; null on the last page */
    record EventPage(List<LedgerEvent> events, Long nextAfter) {
    }
}
