package org.specimenledger.reliability;

import java.io.IOException;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpHeaders;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.time.Duration;
import java.util.Base64;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/** Raw HTTP for the reliability suite: any method, any bytes, any content type; the answer with its headers. */
final class Wire {

    static final JsonMapper JSON = JsonMapper.builder().build();
    // HTTP/1.1 as the service speaks it: the client's default would offer an h2c upgrade on every new connection
    private static final HttpClient HTTP = HttpClient.newBuilder().version(HttpClient.Version.HTTP_1_1)
            .connectTimeout(Duration.ofSeconds(10)).build();

    private final String base;
    private final String authorization;

    Wire(String base, String username, String password) {
        this.base = base;
        this.authorization = username == null ? null : "Basic " + Base64.getEncoder()
                .encodeToString((username + ":" + password).getBytes(StandardCharsets.UTF_8));
    }

    /** One answer: status, headers and the body as text. */
    record Answer(int status, HttpHeaders headers, String body) {

        String contentType() {
            return headers.firstValue("Content-Type").orElse("");
        }

        JsonNode json() {
            return body == null || body.isBlank() ? null : JSON.readTree(body);
        }

        @Override
        public String toString() {
            return status + " " + (body.length() > 400 ? body.substring(0, 400) + "…" : body);
        }
    }

    Answer send(String method, String pathAndQuery, String contentType, byte[] body, String... headers) {
        HttpRequest.Builder b = HttpRequest.newBuilder(URI.create(base + pathAndQuery)).timeout(Duration.ofSeconds(60));
        if (authorization != null) {
            b.header("Authorization", authorization);
        }
        if (contentType != null) {
            b.header("Content-Type", contentType);
        }
        for (int i = 0; i + 1 < headers.length; i += 2) {
            b.header(headers[i], headers[i + 1]);
        }
        b.method(method, body == null ? HttpRequest.BodyPublishers.noBody() : HttpRequest.BodyPublishers.ofByteArray(body));
        try {
            HttpResponse<String> r;
            try {
                r = HTTP.send(b.build(), HttpResponse.BodyHandlers.ofString(StandardCharsets.UTF_8));
            } catch (IOException e) {
                // The server closes a connection after refusing an oversized request line; a POST or PUT sent on that
                // pooled connection before the close was seen gets no bytes at all (the client retries only GETs by
                // itself). Such a request never reached the service, so sending it once more on a new connection is
                // the same request, not a second one.
                if (e.getMessage() == null || !e.getMessage().contains("received no bytes")) {
                    throw e;
                }
                r = HTTP.send(b.build(), HttpResponse.BodyHandlers.ofString(StandardCharsets.UTF_8));
            }
            return new Answer(r.statusCode(), r.headers(), r.body());
        } catch (IOException e) {
            throw new IllegalStateException(method + " " + pathAndQuery + " failed: " + e, e);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException(e);
        }
    }

    Answer json(String method, String pathAndQuery, String json) {
        return send(method, pathAndQuery, "application/json", json.getBytes(StandardCharsets.UTF_8));
    }

    Answer get(String pathAndQuery) {
        return send("GET", pathAndQuery, null, null);
    }

    /** The body of a GET as bytes (a PDF, say); {@code null} unless the status is 200. */
    byte[] bytes(String pathAndQuery) {
        HttpRequest.Builder b = HttpRequest.newBuilder(URI.create(base + pathAndQuery)).timeout(Duration.ofSeconds(60));
        if (authorization != null) {
            b.header("Authorization", authorization);
        }
        try {
            HttpResponse<byte[]> r = HTTP.send(b.GET().build(), HttpResponse.BodyHandlers.ofByteArray());
            return r.statusCode() == 200 ? r.body() : null;
        } catch (IOException e) {
            throw new IllegalStateException("GET " + pathAndQuery + " failed: " + e, e);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException(e);
        }
    }
}
