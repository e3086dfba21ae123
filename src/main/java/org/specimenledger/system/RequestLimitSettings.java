package org.specimenledger.system;

import java.time.Duration;
import java.util.List;
import org.springframework.boot.context.properties.ConfigurationProperties;
import org.springframework.boot.context.properties.bind.DefaultValue;
import org.springframework.util.unit.DataSize;

/**
 * Limits every request meets before a handler sees it ({@code ledger.limits}).
 *
 * @param maxBody largest request body other than a raw curve upload or a multipart form (those have
 *     {@code ledger.curves.max-size} and the multipart limits); default 1MB, far above any JSON record
 * @param rate    request rate rules; each caps how many requests one client may make to the matching
 *     paths per window. Other branches add theirs (sign-in, certificate verification) to this list.
 */
@ConfigurationProperties("ledger.limits")
public record RequestLimitSettings(@DefaultValue("1MB") DataSize maxBody, List<RateRule> rate) {

    public RequestLimitSettings {
        rate = rate == null ? List.of() : List.copyOf(rate);
    }

    /**
     * One rate rule.
     *
     * @param name     names the rule in the problem response and the configuration
     * @param method   HTTP method the rule counts, or {@code *} for all
     * @param path     path pattern (Spring {@code PathPattern} syntax, e.g. {@code /api/v1/analysis/**})
     * @param requests requests allowed per window and client, at least 1
     * @param per      length of the window
     * @param by       what a client is: {@code address} (remote address) or {@code user} (the Basic username
     *     at its address, so several users behind one address count apart; the address alone when there is none)
     */
    public record RateRule(String name, @DefaultValue("*") String method, String path, int requests,
            @DefaultValue("PT1M") Duration per, @DefaultValue("address") String by) {

        public RateRule {
            if (name == null || name.isBlank() || path == null || path.isBlank()) {
                throw new IllegalArgumentException("a rate rule needs a name and a path");
            }
            if (requests < 1) {
                throw new IllegalArgumentException("rate rule '" + name + "': requests must be at least 1");
            }
            if (per == null || per.isZero() || per.isNegative()) {
                throw new IllegalArgumentException("rate rule '" + name + "': per must be a positive duration");
            }
            if (!by.equals("address") && !by.equals("user")) {
                throw new IllegalArgumentException("rate rule '" + name + "': by must be address or user");
            }
        }
    }
}
