package org.specimenledger.jobs;

import jakarta.persistence.Column;
import jakarta.persistence.Entity;
import jakarta.persistence.EnumType;
import jakarta.persistence.Enumerated;
import jakarta.persistence.Id;
import jakarta.persistence.Table;
import jakarta.persistence.Version;
import java.time.Instant;
import java.util.UUID;
import org.hibernate.annotations.JdbcTypeCode;
import org.hibernate.type.SqlTypes;

/** One background job and its progress. Only the worker running it changes it, through {@link Jobs}. */
@Entity
@Table(name = "job")
class Job {

    @Id
    private UUID id;

    @Column(nullable = false)
    private String kind;

    @Column(nullable = false)
    private String owner;

    @Column(nullable = false)
    private String description;

    @Enumerated(EnumType.STRING)
    @Column(nullable = false)
    private JobState state;

    @Column(nullable = false)
    private int done;

    @Column(nullable = false)
    private int total;

    @Column(nullable = false)
    private int succeeded;

    @Column(nullable = false)
    private int failed;

    @JdbcTypeCode(SqlTypes.JSON)
    @Column(nullable = false, columnDefinition = "jsonb")
    private String summary;

    private String failure;

    @Column(name = "submitted_at", nullable = false)
    private Instant submittedAt;

    @Column(name = "started_at")
    private Instant startedAt;

    @Column(name = "finished_at")
    private Instant finishedAt;

    @Version
    private long version;

    protected Job() {
    }

    Job(String kind, String owner, String description, int total, Instant submittedAt) {
        this.id = UUID.randomUUID();
        this.kind = kind;
        this.owner = owner;
        this.description = description;
        this.state = JobState.QUEUED;
        this.total = total;
        this.summary = "{}";
        this.submittedAt = submittedAt;
    }

    void start(Instant at) {
        if (state != JobState.QUEUED) {
            throw new IllegalStateException("job " + id + " is " + state + ", not QUEUED");
        }
        state = JobState.RUNNING;
        startedAt = at;
    }

    void progress(int done, int total, int succeeded, int failed, String summary) {
        this.done = done;
        this.total = total;
        this.succeeded = succeeded;
        this.failed = failed;
        this.summary = summary;
    }

    void finish(JobState end, String failure, Instant at) {
        if (state.isOver()) {
            throw new IllegalStateException("job " + id + " is already " + state);
        }
        this.state = end;
        this.failure = failure;
        this.finishedAt = at;
    }

    UUID id() { return id; }
    String kind() { return kind; }
    String owner() { return owner; }
    String description() { return description; }
    JobState state() { return state; }
    int done() { return done; }
    int total() { return total; }
    int succeeded() { return succeeded; }
    int failed() { return failed; }
    String summary() { return summary; }
    String failure() { return failure; }
    Instant submittedAt() { return submittedAt; }
    Instant startedAt() { return startedAt; }
    Instant finishedAt() { return finishedAt; }
}
