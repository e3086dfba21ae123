package org.specimenledger.jobs;

import org.springframework.boot.context.properties.ConfigurationProperties;
import org.springframework.boot.context.properties.bind.DefaultValue;

/**
 * How much bulk work runs at once.
 *
 * @param workers jobs worked on at the same time ({@code ledger.jobs.workers}, default 1: bulk work shares the
 *     machine with interactive requests, and an intake already uses two threads)
 * @param queueCapacity jobs that may wait for a worker ({@code ledger.jobs.queue-capacity}, default 20); a job
 *     submitted beyond it is refused with 409 rather than queued without bound
 */
@ConfigurationProperties("ledger.jobs")
public record JobSettings(@DefaultValue("1") int workers, @DefaultValue("20") int queueCapacity) {

    public JobSettings {
        if (workers < 1 || queueCapacity < 1) {
            throw new IllegalArgumentException("ledger.jobs.workers and queue-capacity must be at least 1, got "
                    + workers + " and " + queueCapacity);
        }
    }
}
