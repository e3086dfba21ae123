package org.specimenledger.system;

import com.github.benmanes.caffeine.cache.Cache;
import com.github.benmanes.caffeine.cache.Caffeine;
import com.github.benmanes.caffeine.cache.Expiry;
import com.github.benmanes.caffeine.cache.Ticker;
import java.nio.charset.StandardCharsets;
import java.security.GeneralSecurityException;
import java.security.SecureRandom;
import java.time.Duration;
import java.util.HexFormat;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.ThreadLocalRandom;
import javax.crypto.Mac;
import javax.crypto.spec.SecretKeySpec;
import org.springframework.security.crypto.password.PasswordEncoder;

/**
 * Remembers, for a short time, that a password matched a stored hash, so that a client sending HTTP Basic
 * credentials with every request pays for bcrypt once per {@code ttl} instead of on every request.
 *
 * <p>What is remembered is a keyed hash, HMAC-SHA256 under a key drawn at start and held only in memory,
 * of (stored hash ‖ 0x00 ‖ password): never the password. Because the stored hash is part of the key, a
 * changed password stops matching at once. The account itself is still loaded on every request, so a
 * disabled account is refused at once too. Only successful checks are remembered: a wrong password always
 * costs a full bcrypt comparison (only callers sending the very same guess at the same moment share one), so
 * guessing is not made cheaper. The cache is bounded ({@code maxEntries}, least recently used evicted) and
 * entries expire between three quarters of {@code ttl} and {@code ttl} after they were written.
 *
 * <p>Why the full comparisons are kept from arriving together (with a fixed lifetime and no sharing, they
 * stalled the service for seconds under load, docs/RELIABILITY.md §4): clients that signed in at the same
 * moment, say after a restart, would all expire at the same moment and run bcrypt at once, so each entry's
 * lifetime is drawn at random from that last quarter; and a client whose entry has just expired typically
 * has several requests in flight, so concurrent checks of the same password against the same hash share one
 * comparison instead of each running its own.
 *
 * <p>Trade-off, accepted: someone able to read this process's memory could test guesses against a
 * remembered entry at HMAC speed rather than bcrypt speed for up to {@code ttl}. Such a reader could as
 * well read passwords off incoming requests, so the exposure is small; set {@code ttl} to zero to turn
 * the memory off.
 */
final class RememberedPasswordChecks implements PasswordEncoder {

    private static final String MAC = "HmacSHA256";

    private final PasswordEncoder delegate;
    private final Cache<String, Boolean> matched;
    /** Comparisons under way, by fingerprint: a second caller with the same credentials waits for the first. */
    private final ConcurrentHashMap<String, CompletableFuture<Boolean>> inFlight = new ConcurrentHashMap<>();
    private final SecretKeySpec key;
    private final boolean enabled;

    RememberedPasswordChecks(PasswordEncoder delegate, Duration ttl, long maxEntries) {
        this(delegate, ttl, maxEntries, Ticker.systemTicker());
    }

    /** With the cache's clock given, so that tests can move time on. */
    RememberedPasswordChecks(PasswordEncoder delegate, Duration ttl, long maxEntries, Ticker ticker) {
        this.delegate = delegate;
        this.enabled = !ttl.isZero() && !ttl.isNegative() && maxEntries > 0;
        long lifetimeNanos = enabled ? ttl.toNanos() : Duration.ofSeconds(1).toNanos();
        this.matched = Caffeine.newBuilder()
                .expireAfter(Expiry.<String, Boolean>creating((fingerprint, ok) -> Duration.ofNanos(
                        lifetimeNanos - ThreadLocalRandom.current().nextLong(lifetimeNanos / 4 + 1))))
                .ticker(ticker)
                .maximumSize(Math.max(1, maxEntries)).build();
        byte[] secret = new byte[32];
        new SecureRandom().nextBytes(secret);
        this.key = new SecretKeySpec(secret, MAC);
    }

    @Override
    public String encode(CharSequence rawPassword) {
        return delegate.encode(rawPassword);
    }

    @Override
    public boolean matches(CharSequence rawPassword, String encodedPassword) {
        if (!enabled || rawPassword == null || encodedPassword == null) {
            return delegate.matches(rawPassword, encodedPassword);
        }
        String fingerprint = fingerprint(rawPassword, encodedPassword);
        if (matched.getIfPresent(fingerprint) != null) {
            return true;
        }
        CompletableFuture<Boolean> mine = new CompletableFuture<>();
        CompletableFuture<Boolean> running = inFlight.putIfAbsent(fingerprint, mine);
        if (running != null) {
            return running.join(); // the same password against the same hash: the same answer
        }
        try {
            if (matched.getIfPresent(fingerprint) != null) { // another caller finished between the two looks
                mine.complete(true);
                return true;
            }
            boolean ok = delegate.matches(rawPassword, encodedPassword);
            if (ok) {
                matched.put(fingerprint, Boolean.TRUE);
            }
            mine.complete(ok);
            return ok;
        } catch (RuntimeException | Error e) {
            mine.completeExceptionally(e);
            throw e;
        } finally {
            inFlight.remove(fingerprint, mine);
        }
    }

    @Override
    public boolean upgradeEncoding(String encodedPassword) {
        return delegate.upgradeEncoding(encodedPassword);
    }

    /** Number of remembered checks (approximate, for tests). */
    long size() {
        matched.cleanUp();
        return matched.estimatedSize();
    }

    private String fingerprint(CharSequence rawPassword, String encodedPassword) {
        try {
            Mac mac = Mac.getInstance(MAC);
            mac.init(key);
            mac.update(encodedPassword.getBytes(StandardCharsets.UTF_8));
            mac.update((byte) 0);
            mac.update(rawPassword.toString().getBytes(StandardCharsets.UTF_8));
            return HexFormat.of().formatHex(mac.doFinal());
        } catch (GeneralSecurityException e) {
            throw new IllegalStateException("HMAC-SHA256 is part of every JDK", e);
        }
    }
}
