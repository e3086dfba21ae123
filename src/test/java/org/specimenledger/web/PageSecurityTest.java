package org.specimenledger.web;

import static org.assertj.core.api.Assertions.assertThat;

import java.net.http.HttpResponse;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.specimenledger.testsupport.IntegrationTest;
import org.specimenledger.testsupport.TestAccounts;

/**
 * The pages' security over real HTTP: CSRF tokens required on form posts and script calls, a new session
 * id at sign-in (session fixation), cookie flags, security headers on pages and API, the growing wait
 * after failed sign-ins, and sign-out ending the session.
 */
class PageSecurityTest extends IntegrationTest {

    @Test
    void formPostWithoutCsrfTokenIsRefused() {
        PageSession s = new PageSession(port);
        s.signIn(TestAccounts.TECHNICIAN, TestAccounts.PASSWORD);
        HttpResponse<String> r = s.postForm("/lab/specimens", Map.of("labIdentifier", "NO-TOKEN-1"));
        assertThat(r.statusCode()).isEqualTo(403);
        HttpResponse<String> upload = s.put("/lab/tests/00000000-0000-0000-0000-000000000000/curve", "x", null);
        assertThat(upload.statusCode()).isEqualTo(403);
    }

    @Test
    void signInWithoutCsrfTokenIsRefused() {
        PageSession s = new PageSession(port);
        s.get("/sign-in");
        HttpResponse<String> r = s.postForm("/sign-in",
                Map.of("username", TestAccounts.TECHNICIAN, "password", TestAccounts.PASSWORD));
        assertThat(r.statusCode()).isEqualTo(403);
    }

    @Test
    void signInIssuesNewSessionIdSoAPlantedOneIsUseless() {
        PageSession s = new PageSession(port);
        String token = s.csrfToken("/sign-in");
        String before = s.sessionId();
        assertThat(before).isNotNull();
        HttpResponse<String> r = s.postForm("/sign-in",
                Map.of("username", TestAccounts.MANAGER, "password", TestAccounts.PASSWORD, "_csrf", token));
        assertThat(r.statusCode()).isEqualTo(302);
        String after = s.sessionId();
        assertThat(after).isNotNull().isNotEqualTo(before);

        // the id known before sign-in opens nothing
        PageSession attacker = new PageSession(port);
        attacker.cookies.getCookieStore().add(java.net.URI.create("http://localhost:" + port),
                cookie("LEDGER_SESSION", before));
        assertThat(attacker.get("/lab").statusCode()).isEqualTo(302);
        assertThat(s.get("/lab").statusCode()).isEqualTo(200);
    }

    @Test
    void sessionCookieIsHttpOnlyAndSameSiteStrict() {
        PageSession s = new PageSession(port);
        HttpResponse<String> r = s.get("/sign-in");
        String setCookie = r.headers().allValues("Set-Cookie").stream().filter(c -> c.startsWith("LEDGER_SESSION="))
                .findFirst().orElseThrow();
        assertThat(setCookie).contains("HttpOnly").containsIgnoringCase("SameSite=Strict");
    }

    @Test
    void pagesAndApiCarrySecurityHeaders() {
        PageSession s = new PageSession(port);
        for (HttpResponse<String> r : java.util.List.of(s.get("/sign-in"), anonymousApi())) {
            assertThat(r.headers().firstValue("Content-Security-Policy")).get().asString()
                    .contains("default-src 'self'").contains("frame-ancestors 'none'");
            assertThat(r.headers().firstValue("X-Frame-Options")).hasValue("DENY");
            assertThat(r.headers().firstValue("X-Content-Type-Options")).hasValue("nosniff");
            assertThat(r.headers().firstValue("Referrer-Policy")).hasValue("same-origin");
        }
        assertThat(s.get("/sign-in").headers().firstValue("Content-Security-Policy").orElseThrow())
                .doesNotContain("unsafe-inline");
    }

    @Test
    void repeatedFailuresMakeTheNameWaitEvenWithTheRightPassword() {
        String name = "nobody-" + java.util.UUID.randomUUID();
        PageSession s = new PageSession(port);
        for (int i = 0; i < 6; i++) {
            HttpResponse<String> r = s.signIn(name, "wrong-password");
            assertThat(r.headers().firstValue("Location")).get().asString().contains("/sign-in?failed");
        }
        HttpResponse<String> waiting = s.signIn(name, "wrong-password");
        assertThat(waiting.headers().firstValue("Location")).get().asString().contains("/sign-in?wait=");
    }

    @Test
    void signOutEndsTheSession() {
        PageSession s = new PageSession(port);
        s.signIn(TestAccounts.AUDITOR, TestAccounts.PASSWORD);
        assertThat(s.get("/audit-desk").statusCode()).isEqualTo(200);
        String token = s.csrfToken("/audit-desk");
        HttpResponse<String> out = s.postForm("/sign-out", Map.of("_csrf", token));
        assertThat(out.headers().firstValue("Location")).get().asString().contains("/sign-in?signed-out");
        assertThat(s.get("/audit-desk").statusCode()).isEqualTo(302);
    }

    private HttpResponse<String> anonymousApi() {
        return new PageSession(port).get("/api/v1/heats");
    }

    private static java.net.HttpCookie cookie(String name, String value) {
        java.net.HttpCookie c = new java.net.HttpCookie(name, value);
        c.setPath("/");
        c.setVersion(0);
        return c;
    }
}
