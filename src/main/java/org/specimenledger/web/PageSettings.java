package org.specimenledger.web;

import java.time.Duration;
import org.springframework.boot.context.properties.ConfigurationProperties;
import org.springframework.boot.context.properties.bind.DefaultValue;

/**
 * Settings of the pages' sign-in.
 *
 * @param freeAttempts   failed sign-ins for one user name that are answered at once
 * @param firstDelay     the wait after the first failure beyond the free ones; it doubles with each further one
 * @param longestDelay   the longest wait
 */
@ConfigurationProperties("ledger.pages")
record PageSettings(@DefaultValue("5") int freeAttempts,
        @DefaultValue("PT30S") Duration firstDelay, @DefaultValue("PT15M") Duration longestDelay) {
}
