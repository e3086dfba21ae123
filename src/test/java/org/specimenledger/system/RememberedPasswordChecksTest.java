package org.specimenledger.system;

import static org.assertj.core.api.Assertions.assertThat;

import com.github.benmanes.caffeine.cache.Ticker;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.concurrent.atomic.AtomicLong;
import org.junit.jupiter.api.Test;
import org.springframework.security.crypto.bcrypt.BCryptPasswordEncoder;
import org.springframework.security.crypto.password.PasswordEncoder;

/** The memory of matched password checks: what it saves, and what it must never do. */
class RememberedPasswordChecksTest {

    /** bcrypt at strength 4 (fast), counting the comparisons it really makes. */
    private static final class Counting implements PasswordEncoder {
        final BCryptPasswordEncoder bcrypt = new BCryptPasswordEncoder(4);
        final AtomicInteger comparisons = new AtomicInteger();

        @Override
        public String encode(CharSequence raw) {
            return bcrypt.encode(raw);
        }

        @Override
        public boolean matches(CharSequence raw, String encoded) {
            comparisons.incrementAndGet();
            return bcrypt.matches(raw, encoded);
        }
    }

    @Test
    void aMatchedPasswordIsComparedOnceWithinTheMemoryTime() {
        Counting bcrypt = new Counting();
        RememberedPasswordChecks checks = new RememberedPasswordChecks(bcrypt, Duration.ofMinutes(5), 100);
        String hash = bcrypt.encode("correct horse battery");
        for (int i = 0; i < 10; i++) {
            assertThat(checks.matches("correct horse battery", hash)).isTrue();
        }
        assertThat(bcrypt.comparisons).hasValue(1);
    }

    @Test
    void aWrongPasswordAlwaysCostsAFullComparison() {
        Counting bcrypt = new Counting();
        RememberedPasswordChecks checks = new RememberedPasswordChecks(bcrypt, Duration.ofMinutes(5), 100);
        String hash = bcrypt.encode("correct horse battery");
        checks.matches("correct horse battery", hash);
        for (int i = 0; i < 5; i++) {
            assertThat(checks.matches("wrong guess " + i, hash)).isFalse();
            assertThat(checks.matches("wrong guess", hash)).isFalse();
        }
        assertThat(bcrypt.comparisons).hasValue(11);
    }

    @Test
    void aChangedPasswordHashIsNotMatchedFromMemory() {
        Counting bcrypt = new Counting();
        RememberedPasswordChecks checks = new RememberedPasswordChecks(bcrypt, Duration.ofMinutes(5), 100);
        String old = bcrypt.encode("first password here");
        assertThat(checks.matches("first password here", old)).isTrue();
        String changed = bcrypt.encode("second password here");
        assertThat(checks.matches("first password here", changed)).isFalse();
        assertThat(checks.matches("second password here", changed)).isTrue();
        assertThat(bcrypt.comparisons).hasValue(3);
    }

    @Test
    void zeroMemoryTimeTurnsTheMemoryOff() {
        Counting bcrypt = new Counting();
        RememberedPasswordChecks checks = new RememberedPasswordChecks(bcrypt, Duration.ZERO, 100);
        String hash = bcrypt.encode("correct horse battery");
        checks.matches("correct horse battery", hash);
        checks.matches("correct horse battery", hash);
        assertThat(bcrypt.comparisons).hasValue(2);
        assertThat(checks.size()).isZero();
    }

    @Test
    void theMemoryIsBounded() {
        Counting bcrypt = new Counting();
        RememberedPasswordChecks checks = new RememberedPasswordChecks(bcrypt, Duration.ofMinutes(5), 3);
        for (int i = 0; i < 10; i++) {
            String password = "password number " + i;
            checks.matches(password, bcrypt.encode(password));
        }
        assertThat(checks.size()).isLessThanOrEqualTo(3);
    }

    @Test
    void encodingIsNeverRemembered() {
        Counting bcrypt = new Counting();
        RememberedPasswordChecks checks = new RememberedPasswordChecks(bcrypt, Duration.ofMinutes(5), 100);
        assertThat(checks.encode("same password twice")).isNotEqualTo(checks.encode("same password twice"));
    }

    /** Compares in clear text (fast, for many entries), counting the comparisons; can hold each one open. */
    private static final class PlainText implements PasswordEncoder {
        final AtomicInteger comparisons = new AtomicInteger();
        final CountDownLatch release;

        PlainText(CountDownLatch release) {
            this.release = release;
        }

        @Override
        public String encode(CharSequence raw) {
            return "plain:" + raw;
        }

        @Override
        public boolean matches(CharSequence raw, String encoded) {
            comparisons.incrementAndGet();
            try {
                release.await();
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
            }
            return encoded.equals(encode(raw));
        }
    }

    @Test
    void concurrentChecksOfTheSameCredentialsShareOneComparison() throws Exception {
        CountDownLatch release = new CountDownLatch(1);
        PlainText slow = new PlainText(release);
        RememberedPasswordChecks checks = new RememberedPasswordChecks(slow, Duration.ofMinutes(5), 100);
        String hash = slow.encode("correct horse battery");
        List<Thread> callers = new ArrayList<>();
        AtomicInteger matched = new AtomicInteger();
        for (int i = 0; i < 8; i++) {
            Thread caller = new Thread(() -> {
                if (checks.matches("correct horse battery", hash)) {
                    matched.incrementAndGet();
                }
            });
            caller.start();
            callers.add(caller);
        }
        // all eight are parked (one in the comparison, seven waiting for it) before the comparison may end
        while (callers.stream().anyMatch(t -> t.getState() != Thread.State.WAITING)) {
            Thread.sleep(5);
        }
        release.countDown();
        for (Thread t : callers) {
            t.join();
        }
        assertThat(matched).hasValue(8);
        assertThat(slow.comparisons).hasValue(1);
    }

    @Test
    void entriesWrittenTogetherExpireSpreadOverTheLastQuarterOfTheMemoryTime() {
        PlainText plain = new PlainText(new CountDownLatch(0));
        AtomicLong now = new AtomicLong();
        Ticker clock = now::get;
        RememberedPasswordChecks checks = new RememberedPasswordChecks(plain, Duration.ofSeconds(100), 1000, clock);
        int n = 200;
        for (int i = 0; i < n; i++) {
            checks.matches("password " + i, plain.encode("password " + i));
        }
        assertThat(plain.comparisons).hasValue(n);

        now.set(Duration.ofMillis(74_900).toNanos()); // before three quarters: every check is still remembered
        assertThat(comparisonsToCheckAll(checks, plain, n)).isZero();

        now.set(Duration.ofMillis(87_500).toNanos()); // mid-way through the last quarter: some expired, not all
        int expired = comparisonsToCheckAll(checks, plain, n);
        assertThat(expired).isBetween(1, n - 1);

        now.set(Duration.ofMillis(100_000).toNanos() + 1 + Duration.ofMillis(87_500).toNanos());
        // the ones checked again at 87.5 s were remembered anew then; 100 s after that, all have expired
        assertThat(comparisonsToCheckAll(checks, plain, n)).isEqualTo(n);
    }

    private static int comparisonsToCheckAll(RememberedPasswordChecks checks, PlainText plain, int n) {
        int before = plain.comparisons.get();
        for (int i = 0; i < n; i++) {
            assertThat(checks.matches("password " + i, plain.encode("password " + i))).isTrue();
        }
        return plain.comparisons.get() - before;
    }
}
