package org.specimenledger.system;

import org.springframework.security.config.annotation.web.builders.HttpSecurity;
import org.springframework.security.web.header.writers.ReferrerPolicyHeaderWriter.ReferrerPolicy;

/**
 * The response headers every answer carries: no framing, no content sniffing, no referrer sent to other
 * sites, and a content security policy. The pages' policy allows only our own scripts and styles (no
 * inline code at all); the API's is the same except that inline styles are allowed, because the
 * interactive API description page draws with them. JSON answers are not affected either way.
 */
public final class SecurityHeaders {

    /** Pages: everything from this service only, no inline script or style, no plugins, no framing. */
    public static final String PAGE_POLICY = "default-src 'self'; script-src 'self'; style-src 'self'; "
            + "img-src 'self' data:; object-src 'none'; base-uri 'self'; form-action 'self'; frame-ancestors 'none'";

    static final String API_POLICY = "default-src 'self'; script-src 'self'; style-src 'self' 'unsafe-inline'; "
            + "img-src 'self' data:; object-src 'none'; base-uri 'self'; form-action 'self'; frame-ancestors 'none'";

    private SecurityHeaders() {
    }

    /** Applies the headers with the given content security policy. */
    public static void apply(HttpSecurity http, String contentSecurityPolicy) throws Exception {
        http.headers(h -> h
                .frameOptions(f -> f.deny())
                .contentTypeOptions(c -> { })
                .referrerPolicy(r -> r.policy(ReferrerPolicy.SAME_ORIGIN))
                .contentSecurityPolicy(c -> c.policyDirectives(contentSecurityPolicy)));
    }
}
