package org.specimenledger.system;

import jakarta.servlet.http.HttpServletResponse;
import java.io.IOException;
import java.net.URI;
import java.util.Map;
import org.springframework.beans.factory.annotation.Value;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;
import org.springframework.http.HttpStatus;
import org.springframework.http.MediaType;
import org.springframework.http.ProblemDetail;
import org.springframework.security.config.annotation.method.configuration.EnableMethodSecurity;
import org.springframework.security.config.annotation.web.builders.HttpSecurity;
import org.springframework.security.config.http.SessionCreationPolicy;
import org.springframework.security.config.observation.SecurityObservationSettings;
import org.springframework.security.crypto.factory.PasswordEncoderFactories;
import org.springframework.security.crypto.bcrypt.BCryptPasswordEncoder;
import org.springframework.security.crypto.password.DelegatingPasswordEncoder;
import org.springframework.security.crypto.password.PasswordEncoder;
import org.springframework.security.web.SecurityFilterChain;
import tools.jackson.databind.json.JsonMapper;

/**
 * The API is stateless HTTP Basic with CSRF off (no cookies, so nothing for CSRF to ride on); each
 * endpoint declares its roles with {@code @PreAuthorize}. Anonymous callers reach only health and the
 * ledger's public key and latest checkpoint, and certificate verification (rate-limited in its controller).
 * Authentication and authorisation failures are problem responses too.
 */
@Configuration(proxyBeanMethods = false)
@EnableMethodSecurity
class SecurityConfiguration {

    static final String REALM = "Specimen Ledger";

    /**
     * bcrypt, an adaptive hash, with the algorithm named in each stored hash ({@code {bcrypt}...}) so it can
     * be upgraded later. The work factor is a setting: tests lower it to stay fast.
     */
    @Bean
    PasswordEncoder passwordEncoder(@Value("${ledger.password-hash-strength:11}") int strength,
            @Value("${ledger.password-checks.remember-for:PT5M}") java.time.Duration rememberFor,
            @Value("${ledger.password-checks.remember-at-most:10000}") long rememberAtMost) {
        DelegatingPasswordEncoder encoder = new DelegatingPasswordEncoder("bcrypt",
                Map.of("bcrypt", new BCryptPasswordEncoder(strength)));
        encoder.setDefaultPasswordEncoderForMatches(PasswordEncoderFactories.createDelegatingPasswordEncoder());
        // HTTP Basic sends the password with every request; bcrypt on each would cap the API at a few dozen
        // requests per second per core. A matched check is remembered briefly (see RememberedPasswordChecks).
        return new RememberedPasswordChecks(encoder, rememberFor, rememberAtMost);
    }

    /**
     * No observation per security filter, authentication and authorisation: wrapping each of the chain's dozen
     * filters took about a tenth of a simple request's CPU samples in a profile under load. The request as a whole
     * is still observed ({@code http.server.requests}).
     */
    @Bean
    SecurityObservationSettings securityObservations() {
        return SecurityObservationSettings.noObservations();
    }

    @Bean
    SecurityFilterChain apiSecurity(HttpSecurity http, JsonMapper json) throws Exception {
        http.csrf(csrf -> csrf.disable())
                .sessionManagement(s -> s.sessionCreationPolicy(SessionCreationPolicy.STATELESS))
                .httpBasic(basic -> basic.realmName(REALM).authenticationEntryPoint((request, response, e) -> {
                    if (ProblemResponses.databaseUnreachable(e)) {
                        // the account could not be read: not a wrong password, so not a 401
                        response.setHeader("Retry-After", "5");
                        write(json, response, HttpStatus.SERVICE_UNAVAILABLE, "unavailable", "Temporarily unavailable",
                                "the database cannot be reached just now; try again in a few seconds", false);
                        return;
                    }
                    write(json, response, HttpStatus.UNAUTHORIZED, "unauthenticated", "Sign-in required",
                            "sign in with HTTP Basic credentials", true);
                }))
                .exceptionHandling(x -> x
                        .authenticationEntryPoint((request, response, e) ->
                                write(json, response, HttpStatus.UNAUTHORIZED, "unauthenticated", "Sign-in required",
                                        "sign in with HTTP Basic credentials", true))
                        .accessDeniedHandler((request, response, e) ->
                                write(json, response, HttpStatus.FORBIDDEN, "forbidden", "Not allowed for your role",
                                        "your role may not do this", false)))
                .authorizeHttpRequests(auth -> auth
                        .requestMatchers("/actuator/health", "/actuator/health/**", "/error").permitAll()
                        // the ledger's public key and latest signed checkpoint, for copies held outside the lab
                        .requestMatchers("/api/v1/ledger/key", "/api/v1/ledger/checkpoints/latest").permitAll()
                        // certificate verification from the printed code or a PDF file (rate-limited)
                        .requestMatchers("/verify", "/verify/*").permitAll()
                        .anyRequest().authenticated());
        SecurityHeaders.apply(http, SecurityHeaders.API_POLICY);
        return http.build();
    }

    private static void write(JsonMapper json, HttpServletResponse response, HttpStatus status, String slug,
            String title, String detail, boolean challenge) throws IOException {
        ProblemDetail problem = ProblemDetail.forStatusAndDetail(status, detail);
        problem.setType(URI.create(ProblemResponses.TYPE_PREFIX + slug));
        problem.setTitle(title);
        response.setStatus(status.value());
        if (challenge) {
            response.setHeader("WWW-Authenticate", "Basic realm=\"" + REALM + "\", charset=\"UTF-8\"");
        }
        response.setContentType(MediaType.APPLICATION_PROBLEM_JSON_VALUE);
        json.writeValue(response.getOutputStream(), problem);
    }
}
