package org.specimenledger.testsupport;

import java.io.IOException;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.time.Duration;
import java.util.Base64;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/** A small real-HTTP client for tests: JSON in, status and JSON out, signed in as one user (or nobody). */
public final class Api {

    private static final HttpClient HTTP = HttpClient.newBuilder().connectTimeout(Duration.ofSeconds(10)).build();
    public static final JsonMapper JSON = JsonMapper.builder().build();

    private final int port;
    private final String authorization;

    Api(int port, String username, String password) {
        this.port = port;
        this.authorization = username == null ? null : "Basic " + Base64.getEncoder()
                .encodeToString((username + ":" + password).getBytes(StandardCharsets.UTF_8));
    }

    /** Credentials of an account made in a test, for signing in as it. */
    public record Signed(int port, String username, String password) {
        public Api api() {
            return new Api(port, username, password);
        }
    }

    public Response get(String path) {
        return send(request(path).GET());
    }

    public Response post(String path, Object body) {
        return send(request(path).header("Content-Type", "application/json")
                .POST(HttpRequest.BodyPublishers.ofString(text(body))));
    }

    public Response put(String path, Object body) {
        return send(request(path).header("Content-Type", "application/json")
                .PUT(HttpRequest.BodyPublishers.ofString(text(body))));
    }

    public Response delete(String path) {
        return send(request(path).DELETE());
    }

    /** Sends raw text as the JSON body, for malformed-input tests. */
    public Response postRaw(String path, String body) {
        return send(request(path).header("Content-Type", "application/json")
                .POST(HttpRequest.BodyPublishers.ofString(body)));
    }

    /** One part of a multipart/form-data body: name, optional file name, content type, bytes. */
    public record Part(String name, String filename, String contentType, byte[] bytes) {

        public static Part file(String name, String filename, byte[] bytes) {
            return new Part(name, filename, "text/csv", bytes);
        }

        public static Part json(String name, String json) {
            return new Part(name, null, "application/json", json.getBytes(StandardCharsets.UTF_8));
        }
    }

    public Response multipart(String method, String path, Part... parts) {
        String boundary = "----ledger-test-" + System.nanoTime();
        var out = new java.io.ByteArrayOutputStream();
        for (Part part : parts) {
            StringBuilder head = new StringBuilder("--").append(boundary).append("\r\n")
                    .append("Content-Disposition: form-data; name=\"").append(part.name()).append('"');
            if (part.filename() != null) {
                head.append("; filename=\"").append(part.filename()).append('"');
            }
            head.append("\r\nContent-Type: ").append(part.contentType()).append("\r\n\r\n");
            out.writeBytes(head.toString().getBytes(StandardCharsets.UTF_8));
            out.writeBytes(part.bytes());
            out.writeBytes("\r\n".getBytes(StandardCharsets.UTF_8));
        }
        out.writeBytes(("--" + boundary + "--\r\n").getBytes(StandardCharsets.UTF_8));
        return send(request(path).header("Content-Type", "multipart/form-data; boundary=" + boundary)
                .method(method, HttpRequest.BodyPublishers.ofByteArray(out.toByteArray())));
    }

    /** POSTs raw bytes with a content type, e.g. an import sheet or a zip of curve files. */
    public Response postBytes(String path, String contentType, byte[] bytes) {
        return send(request(path).header("Content-Type", contentType)
                .POST(HttpRequest.BodyPublishers.ofByteArray(bytes)));
    }

    /** Sends raw bytes with a content type, e.g. a curve file uploaded as the whole body. */
    public Response putBytes(String path, String contentType, byte[] bytes, String... headers) {
        HttpRequest.Builder b = request(path).header("Content-Type", contentType)
                .PUT(HttpRequest.BodyPublishers.ofByteArray(bytes));
        for (int i = 0; i + 1 < headers.length; i += 2) {
            b.header(headers[i], headers[i + 1]);
        }
        return send(b);
    }

    /** A response read as bytes, with its headers: for downloads that must come back byte for byte. */
    public record Download(int status, byte[] body, java.net.http.HttpHeaders headers) {

        public String header(String name) {
            return headers.firstValue(name).orElse(null);
        }
    }

    public Download getBytes(String path) {
        try {
            HttpResponse<byte[]> r = HTTP.send(request(path).GET().build(), HttpResponse.BodyHandlers.ofByteArray());
            return new Download(r.statusCode(), r.body(), r.headers());
        } catch (IOException e) {
            throw new IllegalStateException(e);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException(e);
        }
    }

    private HttpRequest.Builder request(String path) {
        HttpRequest.Builder b = HttpRequest.newBuilder(URI.create("http://127.0.0.1:" + port + path))
                .timeout(Duration.ofSeconds(60));
        if (authorization != null) {
            b.header("Authorization", authorization);
        }
        return b;
    }

    private static String text(Object body) {
        return body instanceof String s ? s : JSON.writeValueAsString(body);
    }

    private static Response send(HttpRequest.Builder builder) {
        try {
            HttpResponse<String> r = HTTP.send(builder.build(), HttpResponse.BodyHandlers.ofString());
            return new Response(r.statusCode(), r.body(), r.headers().firstValue("Content-Type").orElse(""));
        } catch (IOException e) {
            throw new IllegalStateException(e);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException(e);
        }
    }

    /** A response: status, raw body and the body as JSON (null when empty or not JSON). */
    public record Response(int status, String body, String contentType) {

        public JsonNode json() {
            if (body == null || body.isBlank()) {
                return null;
            }
            return JSON.readTree(body);
        }

        public String text(String field) {
            JsonNode n = json().get(field);
            return n == null || n.isNull() ? null : n.asString();
        }

        public String id() {
            return text("id");
        }

        @Override
        public String toString() {
            return status + " " + body;
        }
    }
}
