package org.specimenledger.web;

import java.io.IOException;
import java.net.CookieManager;
import java.net.CookiePolicy;
import java.net.HttpCookie;
import java.net.URI;
import java.net.URLEncoder;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Collectors;

/** A person's browser session over plain HTTP (cookies kept, redirects not followed), for page security tests. */
final class PageSession {

    private static final Pattern TOKEN = Pattern.compile("<meta name=\"csrf-token\" content=\"([^\"]+)\"");

    final CookieManager cookies = new CookieManager(null, CookiePolicy.ACCEPT_ALL);
    private final HttpClient http;
    private final int port;

    PageSession(int port) {
        this.port = port;
        this.http = HttpClient.newBuilder().cookieHandler(cookies).followRedirects(HttpClient.Redirect.NEVER).build();
    }

    /** Signs in through the form; returns the answer to the form post (a redirect on success). */
    HttpResponse<String> signIn(String username, String password) {
        String token = csrfToken("/sign-in");
        return postForm("/sign-in", Map.of("username", username, "password", password, "_csrf", token));
    }

    String csrfToken(String page) {
        Matcher m = TOKEN.matcher(get(page).body());
        if (!m.find()) {
            throw new IllegalStateException("no CSRF token on " + page);
        }
        return m.group(1);
    }

    String sessionId() {
        return cookies.getCookieStore().getCookies().stream().filter(c -> c.getName().equals("LEDGER_SESSION"))
                .map(HttpCookie::getValue).findFirst().orElse(null);
    }

    HttpResponse<String> get(String path) {
        return send(HttpRequest.newBuilder(uri(path)).GET().build());
    }

    HttpResponse<String> postForm(String path, Map<String, String> fields) {
        String body = fields.entrySet().stream()
                .map(e -> URLEncoder.encode(e.getKey(), StandardCharsets.UTF_8) + "="
                        + URLEncoder.encode(e.getValue(), StandardCharsets.UTF_8))
                .collect(Collectors.joining("&"));
        return send(HttpRequest.newBuilder(uri(path)).header("Content-Type", "application/x-www-form-urlencoded")
                .POST(HttpRequest.BodyPublishers.ofString(body)).build());
    }

    HttpResponse<String> put(String path, String body, String csrfToken) {
        HttpRequest.Builder b = HttpRequest.newBuilder(uri(path)).header("Content-Type", "text/csv")
                .PUT(HttpRequest.BodyPublishers.ofString(body));
        if (csrfToken != null) {
            b.header("X-CSRF-TOKEN", csrfToken);
        }
        return send(b.build());
    }

    private URI uri(String path) {
        return URI.create("http://localhost:" + port + path);
    }

    private HttpResponse<String> send(HttpRequest request) {
        try {
            return http.send(request, HttpResponse.BodyHandlers.ofString());
        } catch (IOException e) {
            throw new java.io.UncheckedIOException(e);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException(e);
        }
    }
}
