package org.specimenledger.certificates;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.ZoneId;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicLong;
import org.junit.jupiter.api.Test;

/**
 * The verification rate limit at its edges, with stepped time instead of waiting: exactly {@code verify-capacity}
 * requests pass in a burst, the next is told how long to wait, one token comes back every
 * 60 s / {@code verify-per-minute}, and a long idle never gives more than the capacity. (The over-HTTP 429 problem
 * is checked in {@code CertificateRevisionApiTest}.)
 */
class VerificationRateLimitTest {

    private final AtomicLong now = new AtomicLong(1_000_000_000L);
    // 5 in a burst, 2 per minute back: one token every 30 s
    private final VerificationRateLimit limit = new VerificationRateLimit(
            new CertificateSettings("IC", ZoneId.of("UTC"), "Lab", "Address", 5, 2), now::get);

    private void advanceMillis(long millis) {
        now.addAndGet(TimeUnit.MILLISECONDS.toNanos(millis));
    }

    @Test
    void exactlyTheCapacityPassesThenTheWaitIsOneRefillPeriod() {
        for (int i = 0; i < 5; i++) {
            assertThat(limit.secondsToWait("192.0.2.1")).as("request %d of the burst", i + 1).isZero();
        }
        assertThat(limit.secondsToWait("192.0.2.1")).as("request 6").isEqualTo(30);
        assertThat(limit.secondsToWait("192.0.2.1")).as("a refused request takes no token").isEqualTo(30);
    }

    @Test
    void otherClientsHaveTheirOwnAllowance() {
        for (int i = 0; i < 5; i++) {
            limit.secondsToWait("192.0.2.1");
        }
        assertThat(limit.secondsToWait("192.0.2.1")).isPositive();
        assertThat(limit.secondsToWait("198.51.100.7")).isZero();
    }

    @Test
    void oneTokenComesBackPerRefillPeriodNotBefore() {
        for (int i = 0; i < 5; i++) {
            limit.secondsToWait("192.0.2.1");
        }
        advanceMillis(29_900);
        assertThat(limit.secondsToWait("192.0.2.1")).as("0.1 s before the token is back").isEqualTo(1);
        advanceMillis(100);
        assertThat(limit.secondsToWait("192.0.2.1")).as("the token is back").isZero();
        assertThat(limit.secondsToWait("192.0.2.1")).as("and only one").isEqualTo(30);
    }

    @Test
    void aLongIdleRefillsToTheCapacityAndNoFurther() {
        for (int i = 0; i < 5; i++) {
            limit.secondsToWait("192.0.2.1");
        }
        advanceMillis(3_600_000);
        for (int i = 0; i < 5; i++) {
            assertThat(limit.secondsToWait("192.0.2.1")).as("request %d after an hour", i + 1).isZero();
        }
        assertThat(limit.secondsToWait("192.0.2.1")).isEqualTo(30);
    }
}
