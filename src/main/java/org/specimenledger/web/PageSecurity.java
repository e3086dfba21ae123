package org.specimenledger.web;

import jakarta.servlet.FilterChain;
import jakarta.servlet.ServletException;
import jakarta.servlet.http.HttpServletRequest;
import jakarta.servlet.http.HttpServletResponse;
import java.io.IOException;
import java.util.Optional;
import org.specimenledger.system.SecurityHeaders;
import org.springframework.beans.factory.annotation.Value;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;
import org.springframework.core.annotation.Order;
import org.springframework.security.config.annotation.web.builders.HttpSecurity;
import org.springframework.security.web.SecurityFilterChain;
import org.springframework.security.web.csrf.XorCsrfTokenRequestAttributeHandler;
import org.springframework.security.web.authentication.SavedRequestAwareAuthenticationSuccessHandler;
import org.springframework.security.web.authentication.UsernamePasswordAuthenticationFilter;
import org.springframework.web.filter.OncePerRequestFilter;

/**
 * Security of the pages, beside (and before) the API's stateless Basic chain: form sign-in with a
 * server session, CSRF tokens on every form and script call, a new session id at sign-in (session
 * fixation), a growing wait after repeated failures ({@link SignInThrottle}), sign-out that ends the
 * session and removes its cookie, and the strict content security policy. The cookie's flags
 * (HttpOnly, SameSite=Strict, Secure behind TLS) are set in {@code server.servlet.session.cookie}.
 * Which role may open which page is declared on each handler with {@code @PreAuthorize}, as on the API.
 */
@Configuration(proxyBeanMethods = false)
class PageSecurity {

    /** The paths the pages own; everything else belongs to the API chain. */
    static final String[] PAGE_PATHS = {"/", "/sign-in", "/sign-out", "/lab", "/lab/**", "/audit-desk", "/audit-desk/**",
        "/portal", "/portal/**",
        "/assets/**", "/favicon.ico"};

    @Bean
    @Order(1)
    SecurityFilterChain pageChain(HttpSecurity http, SignInThrottle throttle,
            @Value("${server.servlet.session.cookie.name:LEDGER_SESSION}") String cookieName) throws Exception {
        SavedRequestAwareAuthenticationSuccessHandler success = new SavedRequestAwareAuthenticationSuccessHandler();
        success.setDefaultTargetUrl("/");
        http.securityMatcher(PAGE_PATHS)
                .authorizeHttpRequests(auth -> auth
                        .requestMatchers("/sign-in", "/assets/**", "/favicon.ico").permitAll()
                        .anyRequest().authenticated())
                .formLogin(form -> form.loginPage("/sign-in").loginProcessingUrl("/sign-in")
                        .usernameParameter("username").passwordParameter("password")
                        .successHandler((request, response, authentication) -> {
                            throttle.succeeded(authentication.getName());
                            success.onAuthenticationSuccess(request, response, authentication);
                        })
                        .failureHandler((request, response, e) -> {
                            throttle.failed(request.getParameter("username"));
                            response.sendRedirect(request.getContextPath() + "/sign-in?failed");
                        }))
                .logout(out -> out.logoutUrl("/sign-out").logoutSuccessUrl("/sign-in?signed-out")
                        .invalidateHttpSession(true).deleteCookies(cookieName))
                .sessionManagement(s -> s.sessionFixation(f -> f.changeSessionId()))
                // the token is made before the page is written, not on first use, so a page that has started
                // to stream never needs to create a session afterwards
                .csrf(csrf -> csrf.csrfTokenRequestHandler(eagerTokens()))
                .addFilterBefore(new ThrottleFilter(throttle), UsernamePasswordAuthenticationFilter.class);
        SecurityHeaders.apply(http, SecurityHeaders.PAGE_POLICY);
        return http.build();
    }

    private static XorCsrfTokenRequestAttributeHandler eagerTokens() {
        XorCsrfTokenRequestAttributeHandler handler = new XorCsrfTokenRequestAttributeHandler();
        handler.setCsrfRequestAttributeName(null);
        return handler;
    }

    /** Refuses a sign-in attempt for a name that is still waiting, before the password is checked. */
    private static final class ThrottleFilter extends OncePerRequestFilter {
        private final SignInThrottle throttle;

        ThrottleFilter(SignInThrottle throttle) {
            this.throttle = throttle;
        }

        @Override
        protected void doFilterInternal(HttpServletRequest request, HttpServletResponse response, FilterChain chain)
                throws ServletException, IOException {
            if ("POST".equals(request.getMethod()) && "/sign-in".equals(request.getServletPath())) {
                Optional<java.time.Duration> wait = throttle.lockedFor(request.getParameter("username"));
                if (wait.isPresent()) {
                    long seconds = Math.max(1, (wait.get().toMillis() + 999) / 1000);
                    response.sendRedirect(request.getContextPath() + "/sign-in?wait=" + seconds);
                    return;
                }
            }
            chain.doFilter(request, response);
        }
    }
}
