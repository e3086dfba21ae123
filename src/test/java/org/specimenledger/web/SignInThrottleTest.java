package org.specimenledger.web;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.Clock;
import java.time.Duration;
import java.time.Instant;
import java.time.ZoneId;
import java.time.ZoneOffset;
import org.junit.jupiter.api.Test;

/**
 * The sign-in delay at its edges, with stepped time: {@code free-attempts} failures cost nothing, the next locks
 * the name for {@code first-delay}, each further failure doubles the wait up to {@code longest-delay}, a success
 * clears the count, and names are counted without regard to case or surrounding blanks. (Over HTTP, with the page's
 * redirect, in {@code PageSecurityTest}.)
 */
class SignInThrottleTest {

    /** A clock the test moves by hand. */
    private static final class SteppedClock extends Clock {
        private Instant now = Instant.parse("2026-03-02T08:00:00Z");

        void step(Duration d) {
            now = now.plus(d);
        }

        @Override
        public ZoneId getZone() {
            return ZoneOffset.UTC;
        }

        @Override
        public Clock withZone(ZoneId zone) {
            return this;
        }

        @Override
        public Instant instant() {
            return now;
        }
    }

    private final SteppedClock clock = new SteppedClock();
    private final SignInThrottle throttle = new SignInThrottle(
            new PageSettings(3, Duration.ofSeconds(30), Duration.ofMinutes(2)), clock);

    @Test
    void theFreeAttemptsCostNothingAndTheNextFailureLocksForTheFirstDelay() {
        for (int i = 0; i < 3; i++) {
            throttle.failed("technician-a");
            assertThat(throttle.lockedFor("technician-a")).as("after failure %d", i + 1).isEmpty();
        }
        throttle.failed("technician-a");
        assertThat(throttle.lockedFor("technician-a")).contains(Duration.ofSeconds(30));
        clock.step(Duration.ofSeconds(29));
        assertThat(throttle.lockedFor("technician-a")).contains(Duration.ofSeconds(1));
        clock.step(Duration.ofSeconds(1));
        assertThat(throttle.lockedFor("technician-a")).as("exactly at the end of the wait").isEmpty();
    }

    @Test
    void eachFurtherFailureDoublesTheWaitUpToTheLongest() {
        for (int i = 0; i < 4; i++) {
            throttle.failed("technician-a");
        }
        Duration[] expected = {Duration.ofSeconds(60), Duration.ofSeconds(120), Duration.ofSeconds(120)};
        for (Duration wait : expected) {
            clock.step(Duration.ofMinutes(10)); // the lock has run out; the count has not
            throttle.failed("technician-a");
            assertThat(throttle.lockedFor("technician-a")).contains(wait);
        }
    }

    @Test
    void aSuccessClearsTheCountAndNamesAreCountedWithoutCaseOrBlanks() {
        throttle.failed("Technician-A");
        throttle.failed(" technician-a ");
        throttle.failed("TECHNICIAN-A");
        throttle.failed("technician-a");
        assertThat(throttle.lockedFor("technician-a")).isPresent();
        assertThat(throttle.lockedFor("technician-b")).as("another name").isEmpty();
        throttle.succeeded("technician-a");
        assertThat(throttle.lockedFor("technician-a")).isEmpty();
        for (int i = 0; i < 3; i++) {
            throttle.failed("technician-a");
        }
        assertThat(throttle.lockedFor("technician-a")).as("the count started again").isEmpty();
    }
}
