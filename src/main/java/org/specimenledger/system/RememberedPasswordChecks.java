package org.specimenledger.system;

import com.github.benmanes.caffeine.cache.Cache;
import com.github.benmanes.caffeine.cache.Caffeine;
import java.nio.charset.StandardCharsets;
import java.security.GeneralSecurityException;
import java.security.SecureRandom;
import java.time.Duration;
import java.util.HexFormat;
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
 * costs a full bcrypt comparison, so guessing is not made cheaper. The cache is bounded ({@code maxEntries},
 * least recently used evicted) and entries expire {@code ttl} after they were written.
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
    private final SecretKeySpec key;
    private final boolean enabled;

    RememberedPasswordChecks(PasswordEncoder delegate, Duration ttl, long maxEntries) {
        this.delegate = delegate;
        this.enabled = !ttl.isZero() && !ttl.isNegative() && maxEntries > 0;
        this.matched = Caffeine.newBuilder().expireAfterWrite(enabled ? ttl : Duration.ofSeconds(1))
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
        boolean ok = delegate.matches(rawPassword, encodedPassword);
        if (ok) {
            matched.put(fingerprint, Boolean.TRUE);
        }
        return ok;
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
