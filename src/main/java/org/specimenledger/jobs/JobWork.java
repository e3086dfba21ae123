package org.specimenledger.jobs;

import java.util.Map;

/**
 * The work of one job. It runs on a job worker, signed in as the user who submitted it, outside any
 * transaction: each write it makes opens its own transaction (with its own ledger event), so items already
 * through stay stored when a later one fails.
 */
@FunctionalInterface
public interface JobWork {

    /**
     * Does the work, reporting each item through {@code progress}.
     *
     * @return the job's own answer, kept in the summary beside the items (may be empty)
     * @throws Exception a fault that stops the whole job (it ends FAILED with the message); a failure of a
     *     single item is reported with {@link JobProgress#failed} instead
     */
    Map<String, Object> run(JobProgress progress) throws Exception;
}
