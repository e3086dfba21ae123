package org.specimenledger.system;

import java.time.Clock;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;

/** One clock for the whole service, in UTC, so that tests can fix time where they need to. */
@Configuration(proxyBeanMethods = false)
class ClockConfiguration {

    @Bean
    Clock clock() {
        // PostgreSQL keeps microseconds: a clock that ticks in microseconds makes what is stored, what is
        // returned and what the ledger records the same instant.
        return Clock.tick(Clock.systemUTC(), java.time.Duration.ofNanos(1_000));
    }
}
