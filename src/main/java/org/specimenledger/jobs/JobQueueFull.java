package org.specimenledger.jobs;

import org.specimenledger.shared.StateConflict;

/** As many jobs as the queue holds are already waiting for a worker. 409: submit again when one has ended. */
public class JobQueueFull extends StateConflict {

    JobQueueFull(int capacity) {
        super("the job queue is full (" + capacity + " jobs waiting); submit again when a job has ended");
    }
}
