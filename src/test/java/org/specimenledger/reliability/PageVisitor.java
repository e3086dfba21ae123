package org.specimenledger.reliability;

import java.io.IOException;
import java.net.CookieManager;
import java.net.CookiePolicy;
import java.net.URI;
import java.net.URLEncoder;
import java.net.http.HttpClient;
import java.net.http.HttpHeaders;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.time.Duration;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * A person signed in to the pages through the sign-in form (session cookie kept, redirects not followed), for
 * reading pages the way a browser receives them: status, headers and the HTML as sent.
 */
final class PageVisitor {

    private static final Pattern TOKEN = Pattern.compile("<meta name=\"csrf-token\" content=\"([^\"]+)\"");

    /** One page as received. */
    record Page(String path, int status, HttpHeaders headers, String html) {

        String header(String name) {
            return headers.firstValue(name).orElse(null);
        }

        @Override
        public String toString() {
            return path + " (" + status + ")";
        }
    }

    private final String base;
    private final HttpClient http;
    private final java.util.concurrent.atomic.AtomicInteger reads = new java.util.concurrent.atomic.AtomicInteger();

    private PageVisitor(String base) {
        this.base = base;
        this.http = HttpClient.newBuilder().cookieHandler(new CookieManager(null, CookiePolicy.ACCEPT_ALL))
                .followRedirects(HttpClient.Redirect.NEVER).connectTimeout(Duration.ofSeconds(10)).build();
    }

    /** Signs in through the form as {@code username}; fails unless the service redirects away from the form. */
    static PageVisitor signedIn(String base, String username, String password) {
        PageVisitor v = new PageVisitor(base);
        Matcher m = TOKEN.matcher(v.get("/sign-in").html());
        if (!m.find()) {
            throw new IllegalStateException("no CSRF token on the sign-in page");
        }
        String form = "username=" + enc(username) + "&password=" + enc(password) + "&_csrf=" + enc(m.group(1));
        HttpResponse<String> r = v.send(HttpRequest.newBuilder(URI.create(base + "/sign-in"))
                .header("Content-Type", "application/x-www-form-urlencoded")
                .POST(HttpRequest.BodyPublishers.ofString(form)).build());
        String location = r.headers().firstValue("Location").orElse("");
        if (r.statusCode() != 302 || location.contains("failed")) {
            throw new IllegalStateException("sign-in of " + username + " failed: " + r.statusCode() + " " + location);
        }
        return v;
    }

    /** How many pages this visitor has read (the sign-in form included). */
    int reads() {
        return reads.get();
    }

    Page get(String pathAndQuery) {
        reads.incrementAndGet();
        HttpResponse<String> r = send(HttpRequest.newBuilder(URI.create(base + pathAndQuery))
                .timeout(Duration.ofSeconds(60)).GET().build());
        return new Page(pathAndQuery, r.statusCode(), r.headers(), r.body());
    }

    static String enc(String s) {
        return URLEncoder.encode(s, StandardCharsets.UTF_8);
    }

    private HttpResponse<String> send(HttpRequest request) {
        try {
            return http.send(request, HttpResponse.BodyHandlers.ofString(StandardCharsets.UTF_8));
        } catch (IOException e) {
            throw new IllegalStateException(request.method() + " " + request.uri() + " failed: " + e, e);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException(e);
        }
    }
}
