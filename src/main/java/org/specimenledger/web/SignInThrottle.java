package org.specimenledger.web;

import java.time.Clock;
import java.time.Duration;
import java.time.Instant;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.ConcurrentHashMap;
import org.springframework.stereotype.Component;

/**
 * A growing wait after repeated failed sign-ins for one user name: the first {@code freeAttempts}
 * failures cost nothing, then each further one locks the name for {@code firstDelay}, doubling up to
 * {@code longestDelay}. A success clears the count. Keyed by user name (not address) so that guessing
 * one account's password is slowed wherever it comes from; the wait is short enough that the owner is
 * not locked out for long. Held in memory: per application node, and forgotten on restart, which is
 * acceptable for a delay (not for an audit record; sign-ins are not ledger events).
 */
@Component
class SignInThrottle {

    private record Failures(int count, Instant lockedUntil) {
    }

    private final Map<String, Failures> failures = new ConcurrentHashMap<>();
    private final PageSettings settings;
    private final Clock clock;

    SignInThrottle(PageSettings settings, Clock clock) {
        this.settings = settings;
        this.clock = clock;
    }

    /** How long the name is still locked, if it is. */
    Optional<Duration> lockedFor(String username) {
        Failures f = failures.get(key(username));
        if (f == null || f.lockedUntil() == null) {
            return Optional.empty();
        }
        Duration left = Duration.between(clock.instant(), f.lockedUntil());
        return left.isNegative() || left.isZero() ? Optional.empty() : Optional.of(left);
    }

    void failed(String username) {
        failures.compute(key(username), (k, f) -> {
            int count = f == null ? 1 : f.count() + 1;
            int beyond = count - settings.freeAttempts();
            if (beyond <= 0) {
                return new Failures(count, null);
            }
            Duration wait = settings.firstDelay().multipliedBy(1L << Math.min(beyond - 1, 20));
            if (wait.compareTo(settings.longestDelay()) > 0) {
                wait = settings.longestDelay();
            }
            return new Failures(count, clock.instant().plus(wait));
        });
    }

    void succeeded(String username) {
        failures.remove(key(username));
    }

    private static String key(String username) {
        return username == null ? "" : username.trim().toLowerCase(Locale.ROOT);
    }
}
