package org.specimenledger.certificates;

import com.github.benmanes.caffeine.cache.Cache;
import com.github.benmanes.caffeine.cache.Caffeine;
import java.time.Duration;
import java.util.function.LongSupplier;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.stereotype.Component;

/**
 * A token bucket per client address for the anonymous verification endpoints: {@code verifyCapacity} requests in a
 * burst, refilled at {@code verifyPerMinute}. Buckets live in a bounded Caffeine cache and expire when a client is
 * idle long enough to have refilled, so memory stays bounded whatever the number of addresses.
 */
@Component
class VerificationRateLimit {

    private static final int MAX_CLIENTS = 100_000;

    private final int capacity;
    private final double perNano;
    private final Cache<String, Bucket> buckets;
    private final LongSupplier nanos;

    @Autowired
    VerificationRateLimit(CertificateSettings settings) {
        // monotonic time: a wall-clock step must not refill or drain buckets
        this(settings, System::nanoTime);
    }

    /** With a time source of its own, so that tests can step time instead of waiting for it. */
    VerificationRateLimit(CertificateSettings settings, LongSupplier nanos) {
        this.nanos = nanos;
        this.capacity = settings.verifyCapacity();
        this.perNano = settings.verifyPerMinute() / 60e9;
        Duration refill = Duration.ofSeconds((long) Math.ceil(60.0 * capacity / settings.verifyPerMinute()) + 1);
        this.buckets = Caffeine.newBuilder().maximumSize(MAX_CLIENTS).expireAfterAccess(refill).build();
    }

    /** Takes one token for {@code client}; when none is left, the seconds until one will be. */
    long secondsToWait(String client) {
        long now = nanos.getAsLong();
        Bucket bucket = buckets.get(client, k -> new Bucket(capacity, now));
        synchronized (bucket) {
            bucket.tokens = Math.min(capacity, bucket.tokens + (now - bucket.at) * perNano);
            bucket.at = now;
            if (bucket.tokens >= 1) {
                bucket.tokens -= 1;
                return 0;
            }
            return Math.max(1, (long) Math.ceil((1 - bucket.tokens) / perNano / 1e9));
        }
    }

    /** Forgets every bucket (tests use it to leave no exhausted bucket behind). */
    void reset() {
        buckets.invalidateAll();
    }

    private static final class Bucket {
        double tokens;
        long at;

        Bucket(double tokens, long at) {
            this.tokens = tokens;
            this.at = at;
        }
    }
}
