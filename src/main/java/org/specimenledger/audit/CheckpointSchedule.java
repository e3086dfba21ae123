package org.specimenledger.audit;

import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.context.annotation.Configuration;
import org.springframework.scheduling.annotation.EnableScheduling;
import org.springframework.scheduling.annotation.Scheduled;

/** Looks every {@code ledger.checkpoints.poll} whether a checkpoint is due, and records it. */
@Configuration(proxyBeanMethods = false)
@EnableScheduling
class CheckpointSchedule {

    private static final Logger log = LoggerFactory.getLogger(CheckpointSchedule.class);

    private final Checkpoints checkpoints;

    CheckpointSchedule(Checkpoints checkpoints) {
        this.checkpoints = checkpoints;
    }

    @Scheduled(initialDelayString = "${ledger.checkpoints.poll:PT30S}", fixedDelayString = "${ledger.checkpoints.poll:PT30S}")
    void recordWhenDue() {
        try {
            checkpoints.recordIfDue().ifPresent(c -> log.info("Checkpoint {}: {} events, root {} ({})", c.id(),
                    c.treeSize(), c.rootHash(), c.reason()));
        } catch (RuntimeException e) {
            // a failed round (database briefly away) must not stop later rounds
            log.warn("Could not record a scheduled checkpoint: {}", e.toString());
        }
    }
}
