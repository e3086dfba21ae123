package org.specimenledger.audit;

import java.time.Duration;
import org.springframework.boot.context.properties.ConfigurationProperties;
import org.springframework.boot.context.properties.bind.DefaultValue;

/**
 * When checkpoints are recorded on their own: once {@code everyEvents} events were appended since the
 * last one, or once {@code every} has passed and the tree grew. {@code poll} is how often the schedule
 * looks.
 */
@ConfigurationProperties("ledger.checkpoints")
record CheckpointSettings(@DefaultValue("1000") long everyEvents, @DefaultValue("PT1H") Duration every,
        @DefaultValue("PT30S") Duration poll) {
}
