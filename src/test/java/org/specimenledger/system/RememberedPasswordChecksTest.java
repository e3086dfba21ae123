package org.specimenledger.system;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.Duration;
import java.util.concurrent.atomic.AtomicInteger;
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
}
