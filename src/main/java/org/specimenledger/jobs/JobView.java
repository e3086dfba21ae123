package org.specimenledger.jobs;

import java.time.Instant;
import java.util.UUID;
import tools.jackson.databind.JsonNode;

/**
 * A job as the API shows it: what it is, whose, where it stands and, as it runs, the outcome of each item
 * ({@code summary.items}) and, at the end, its own answer.
 *
 * @param done items through so far, of {@code total}
 * @param failure why the job itself stopped (state FAILED), or null
 */
public record JobView(UUID id, String kind, String owner, String description, JobState state, int done, int total,
        int succeeded, int failed, JsonNode summary, String failure, Instant submittedAt, Instant startedAt,
        Instant finishedAt) {

    static JobView of(Job j) {
        return new JobView(j.id(), j.kind(), j.owner(), j.description(), j.state(), j.done(), j.total(),
                j.succeeded(), j.failed(), Jobs.JSON.readTree(j.summary()), j.failure(), j.submittedAt(),
                j.startedAt(), j.finishedAt());
    }

    /** What the ledger records of a job: everything but the per-item details, which the work ledgers itself. */
    Object ledgered() {
        return new Ledgered(id, kind, owner, description, state, done, total, succeeded, failed, failure);
    }

    record Ledgered(UUID id, String kind, String owner, String description, JobState state, int done, int total,
            int succeeded, int failed, String failure) {
    }
}
