package org.specimenledger.jobs;

/** Where a job is: waiting for a worker, being worked on, or at its end. */
public enum JobState {
    /** Accepted and waiting for a free worker. */
    QUEUED,
    /** A worker is on it; {@code done} of {@code total} items are through. */
    RUNNING,
    /** Every item was tried; items may still have failed one by one (see the summary). */
    FINISHED,
    /** The job itself stopped: an unexpected fault, or the service stopped while it was queued or running. */
    FAILED;

    boolean isOver() {
        return this == FINISHED || this == FAILED;
    }
}
