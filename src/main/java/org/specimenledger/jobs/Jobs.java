package org.specimenledger.jobs;

import jakarta.annotation.PreDestroy;
import java.time.Clock;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.EnumSet;
import java.util.Map;
import java.util.UUID;
import java.util.concurrent.ArrayBlockingQueue;
import java.util.concurrent.RejectedExecutionException;
import java.util.concurrent.ThreadPoolExecutor;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicInteger;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.specimenledger.audit.Ledger;
import org.specimenledger.shared.CurrentUser;
import org.specimenledger.shared.RecordNotFound;
import org.specimenledger.shared.Role;
import org.specimenledger.shared.SignedInUser;
import org.springframework.boot.context.event.ApplicationReadyEvent;
import org.springframework.context.event.EventListener;
import org.springframework.data.domain.Page;
import org.springframework.data.domain.PageRequest;
import org.springframework.data.domain.Sort;
import org.springframework.security.core.Authentication;
import org.springframework.security.core.context.SecurityContext;
import org.springframework.security.core.context.SecurityContextHolder;
import org.springframework.stereotype.Service;
import org.springframework.transaction.PlatformTransactionManager;
import org.springframework.transaction.support.TransactionTemplate;
import tools.jackson.databind.json.JsonMapper;

/**
 * Runs bulk work in the background on a bounded executor ({@link JobSettings}) and keeps each job's state and
 * progress in PostgreSQL, so that a user can leave and come back. The submission and the end of a job are
 * ledgered (actions {@code job.submitted}, {@code job.finished}, {@code job.failed}); progress is not, since
 * every write the work makes is ledgered where it happens. A job runs signed in as its submitter, so those
 * events name the person who asked for the work.
 */
@Service
public class Jobs {

    private static final Logger log = LoggerFactory.getLogger(Jobs.class);
    static final JsonMapper JSON = JsonMapper.builder().build();
    static final String ENTITY = "job";

    private final JobRepository repository;
    private final Ledger ledger;
    private final Clock clock;
    private final TransactionTemplate transaction;
    private final ThreadPoolExecutor workers;
    private final int queueCapacity;

    Jobs(JobRepository repository, Ledger ledger, Clock clock, PlatformTransactionManager transactions,
            JobSettings settings) {
        this.repository = repository;
        this.ledger = ledger;
        this.clock = clock;
        this.transaction = new TransactionTemplate(transactions);
        this.queueCapacity = settings.queueCapacity();
        AtomicInteger n = new AtomicInteger();
        this.workers = new ThreadPoolExecutor(settings.workers(), settings.workers(), 0, TimeUnit.MILLISECONDS,
                new ArrayBlockingQueue<>(settings.queueCapacity()), r -> {
                    Thread t = new Thread(r, "job-worker-" + n.incrementAndGet());
                    t.setDaemon(true);
                    return t;
                });
    }

    /**
     * Records a job as queued and hands it to a worker once that is committed.
     *
     * @param kind what sort of work, e.g. {@code curve-batch}
     * @param description one line a person reads in a job list
     * @param total items the work expects (0 when not known yet)
     * @param reason why, as the submission event's reason (may be null)
     * @throws JobQueueFull when as many jobs as the queue holds are already waiting
     */
    public JobView submit(String kind, String description, int total, String reason, JobWork work) {
        if (workers.getQueue().remainingCapacity() == 0) {
            throw new JobQueueFull(queueCapacity);
        }
        SecurityContext submitter = SecurityContextHolder.getContext();
        Authentication auth = submitter.getAuthentication();
        String owner = auth == null ? "system" : auth.getName();
        JobView queued = transaction.execute(t -> {
            Job job = repository.saveAndFlush(new Job(kind, owner, description, total, now()));
            JobView view = JobView.of(job);
            ledger.record("job.submitted", ENTITY, job.id(), reason, null, view.ledgered());
            return view;
        });
        try {
            workers.execute(() -> runAs(auth, queued.id(), total, work));
        } catch (RejectedExecutionException e) {
            end(queued.id(), JobState.FAILED, "the job queue was full; submit the job again later");
            throw new JobQueueFull(queueCapacity);
        }
        return queued;
    }

    private void runAs(Authentication auth, UUID id, int total, JobWork work) {
        SecurityContext context = SecurityContextHolder.createEmptyContext();
        context.setAuthentication(auth);
        SecurityContextHolder.setContext(context);
        try {
            transaction.executeWithoutResult(t -> repository.findById(id).orElseThrow().start(now()));
            JobProgress progress = new JobProgress(this, id, total);
            Map<String, Object> answer;
            try {
                answer = work.run(progress);
            } catch (Exception | Error fault) {
                log.warn("job {} stopped", id, fault);
                end(id, JobState.FAILED, fault.getMessage() == null ? fault.getClass().getSimpleName()
                        : fault.getMessage());
                return;
            }
            progress.write(answer);
            end(id, JobState.FINISHED, null);
        } catch (RuntimeException bookkeeping) {
            log.error("job {} could not record its state", id, bookkeeping);
        } finally {
            SecurityContextHolder.clearContext();
        }
    }

    void progress(UUID id, int done, int total, int succeeded, int failed, Map<String, Object> summary) {
        String json = JSON.writeValueAsString(summary);
        transaction.executeWithoutResult(t -> repository.findById(id).orElseThrow()
                .progress(done, total, succeeded, failed, json));
    }

    private void end(UUID id, JobState state, String failure) {
        transaction.executeWithoutResult(t -> {
            Job job = repository.findById(id).orElseThrow();
            job.finish(state, failure, now());
            repository.flush();
            JobView view = JobView.of(job);
            ledger.record(state == JobState.FINISHED ? "job.finished" : "job.failed", ENTITY, id, failure, null,
                    view.ledgered());
        });
    }

    /**
     * Jobs that were queued or running when the service last stopped will not resume: they end FAILED with
     * that reason, so nobody waits on them. Items they completed stay stored.
     */
    @EventListener(ApplicationReadyEvent.class)
    void closeInterrupted() {
        for (Job job : transaction.execute(t -> repository.findAllByStateIn(EnumSet.of(JobState.QUEUED,
                JobState.RUNNING)))) {
            end(job.id(), JobState.FAILED, "the service stopped before the job ended; items already through stay "
                    + "stored, submit the rest again");
        }
    }

    /** One job: a technician sees their own, the lab manager and the auditor every job. */
    public JobView get(UUID id) {
        return transaction.execute(t -> repository.findById(id).filter(Jobs::visible).map(JobView::of)
                .orElseThrow(() -> new RecordNotFound(ENTITY, id)));
    }

    /** Newest first, then by id (a stable order for paging). */
    public JobPage list(int page, int size) {
        PageRequest request = PageRequest.of(page, size, Sort.by(Sort.Order.desc("submittedAt"), Sort.Order.asc("id")));
        return transaction.execute(t -> {
            Page<Job> found = seesAll() ? repository.findAll(request)
                    : repository.findAllByOwner(CurrentUser.get().map(SignedInUser::username).orElse(""), request);
            return new JobPage(found.map(JobView::of).getContent(), page, size, found.getTotalElements());
        });
    }

    /** A page of jobs with the total count. */
    public record JobPage(java.util.List<JobView> items, int page, int size, long total) {
    }

    private static boolean visible(Job job) {
        return seesAll() || CurrentUser.get().map(u -> u.username().equals(job.owner())).orElse(false);
    }

    private static boolean seesAll() {
        return CurrentUser.get().map(u -> u.role() == Role.LAB_MANAGER || u.role() == Role.AUDITOR).orElse(false);
    }

    private Instant now() {
        return clock.instant().truncatedTo(ChronoUnit.MICROS);
    }

    @PreDestroy
    void stop() {
        workers.shutdownNow();
    }
}
