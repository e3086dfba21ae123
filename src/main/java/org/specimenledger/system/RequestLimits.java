package org.specimenledger.system;

import com.github.benmanes.caffeine.cache.Cache;
import com.github.benmanes.caffeine.cache.Caffeine;
import com.github.benmanes.caffeine.cache.Ticker;
import jakarta.servlet.FilterChain;
import jakarta.servlet.ReadListener;
import jakarta.servlet.ServletException;
import jakarta.servlet.ServletInputStream;
import jakarta.servlet.http.HttpServletRequest;
import jakarta.servlet.http.HttpServletRequestWrapper;
import jakarta.servlet.http.HttpServletResponse;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.Base64;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.atomic.AtomicLong;
import org.springframework.http.HttpHeaders;
import org.springframework.http.HttpStatus;
import org.springframework.http.MediaType;
import org.springframework.http.server.PathContainer;
import org.springframework.web.filter.OncePerRequestFilter;
import org.springframework.web.util.pattern.PathPattern;
import org.springframework.web.util.pattern.PathPatternParser;
import tools.jackson.databind.json.JsonMapper;

/**
 * Refuses, before any handler runs, a request body over {@code ledger.limits.max-body} (413) and a client
 * over one of the configured rate rules (429 with {@code Retry-After}). Both answers are problem responses.
 *
 * <p>The body limit covers everything except the raw curve upload (its own, larger limit is checked by the
 * curve intake) and multipart forms (the servlet container's multipart limits). A body without a length
 * is counted as it is read. Rate rules count in fixed windows per client; the counters live in a bounded
 * Caffeine cache, so a flood of distinct clients cannot grow the memory without limit.
 */
public final class RequestLimits extends OncePerRequestFilter {

    private static final PathPattern CURVE_UPLOAD = PathPatternParser.defaultInstance.parse("/api/v1/tests/*/curve");
    private static final String TYPE_PREFIX = ProblemResponses.TYPE_PREFIX;

    private final long maxBody;
    private final List<CompiledRule> rules = new ArrayList<>();
    private final JsonMapper json;
    private final Ticker ticker;

    private record CompiledRule(RequestLimitSettings.RateRule rule, PathPattern pattern,
            Cache<String, Window> windows) {
    }

    /** A fixed window: its start (ticker nanoseconds) and the requests counted in it. */
    private static final class Window {
        final long start;
        final AtomicLong count = new AtomicLong();

        Window(long start) {
            this.start = start;
        }
    }

    RequestLimits(RequestLimitSettings settings, JsonMapper json, Ticker ticker) {
        this.maxBody = settings.maxBody().toBytes();
        this.json = json;
        this.ticker = ticker;
        for (RequestLimitSettings.RateRule rule : settings.rate()) {
            rules.add(new CompiledRule(rule, PathPatternParser.defaultInstance.parse(rule.path()),
                    Caffeine.newBuilder().maximumSize(100_000).expireAfterWrite(rule.per()).ticker(ticker).build()));
        }
    }

    @Override
    protected void doFilterInternal(HttpServletRequest request, HttpServletResponse response, FilterChain chain)
            throws ServletException, IOException {
        PathContainer path;
        try {
            path = PathContainer.parsePath(request.getRequestURI().substring(request.getContextPath().length()));
        } catch (IllegalArgumentException e) {
            chain.doFilter(request, response); // a path this cannot read is refused further on, as a problem
            return;
        }
        for (CompiledRule rule : rules) {
            if (counts(rule, request, path)) {
                long retryAfter = overLimit(rule, request);
                if (retryAfter > 0) {
                    response.setHeader(HttpHeaders.RETRY_AFTER, Long.toString(retryAfter));
                    write(response, HttpStatus.TOO_MANY_REQUESTS, "rate-limited", "Too many requests",
                            "more than " + rule.rule().requests() + " requests in " + rule.rule().per()
                                    + " under the rule '" + rule.rule().name() + "'; try again in " + retryAfter + " s",
                            Map.of("rule", rule.rule().name(), "retryAfterSeconds", retryAfter));
                    return;
                }
            }
        }
        if (bodyLimited(request, path)) {
            long length = request.getContentLengthLong();
            if (length > maxBody) {
                response.setHeader(HttpHeaders.CONNECTION, "close");
                write(response, HttpStatus.CONTENT_TOO_LARGE, "body-too-large", "Request body too large",
                        "the request body has " + length + " bytes; at most " + maxBody + " are accepted",
                        Map.of("limitBytes", maxBody));
                return;
            }
            if (length < 0) {
                request = new CountedBody(request, maxBody);
            }
        }
        chain.doFilter(request, response);
    }

    private static boolean counts(CompiledRule rule, HttpServletRequest request, PathContainer path) {
        String method = rule.rule().method();
        return ("*".equals(method) || method.equalsIgnoreCase(request.getMethod())) && rule.pattern().matches(path);
    }

    /** Counts this request; returns 0 when it may pass, else the seconds until the client's window ends. */
    private long overLimit(CompiledRule rule, HttpServletRequest request) {
        String client = clientOf(rule.rule(), request);
        long now = ticker.read();
        long windowNanos = rule.rule().per().toNanos();
        Window w = rule.windows().asMap().compute(client, (k, old) ->
                old == null || now - old.start >= windowNanos ? new Window(now) : old);
        if (w.count.incrementAndGet() <= rule.rule().requests()) {
            return 0;
        }
        long leftNanos = windowNanos - (now - w.start);
        return Math.max(1, (leftNanos + 999_999_999L) / 1_000_000_000L);
    }

    private static String clientOf(RequestLimitSettings.RateRule rule, HttpServletRequest request) {
        if ("user".equals(rule.by())) {
            // the username is read before sign-in is checked, so anyone may send anyone's: counted together with
            // the address, so that a stranger elsewhere cannot use up a user's allowance
            String username = basicUsername(request.getHeader(HttpHeaders.AUTHORIZATION));
            if (username != null) {
                return "user:" + username + "@" + request.getRemoteAddr();
            }
        }
        return "address:" + request.getRemoteAddr();
    }

    /** The username of HTTP Basic credentials, or null; the password is never looked at here. */
    static String basicUsername(String authorization) {
        if (authorization == null || authorization.length() < 6
                || !authorization.regionMatches(true, 0, "Basic ", 0, 6)) {
            return null;
        }
        try {
            String decoded = new String(Base64.getDecoder().decode(authorization.substring(6).trim()),
                    StandardCharsets.UTF_8);
            int colon = decoded.indexOf(':');
            return colon < 0 ? null : decoded.substring(0, colon);
        } catch (IllegalArgumentException e) {
            return null;
        }
    }

    private static boolean bodyLimited(HttpServletRequest request, PathContainer path) {
        String type = request.getContentType();
        if (type != null && type.toLowerCase(java.util.Locale.ROOT).startsWith("multipart/")) {
            return false;
        }
        return !CURVE_UPLOAD.matches(path);
    }

    private void write(HttpServletResponse response, HttpStatus status, String slug, String title, String detail,
            Map<String, Object> extra) throws IOException {
        Map<String, Object> body = new LinkedHashMap<>();
        body.put("type", TYPE_PREFIX + slug);
        body.put("title", title);
        body.put("status", status.value());
        body.put("detail", detail);
        body.putAll(extra);
        byte[] bytes = json.writeValueAsBytes(body);
        response.setStatus(status.value());
        response.setContentType(MediaType.APPLICATION_PROBLEM_JSON_VALUE);
        response.setContentLength(bytes.length);
        response.getOutputStream().write(bytes);
        response.flushBuffer();
    }

    /** Thrown while reading a body without a length once it passes the limit; mapped to 413. */
    static final class BodyTooLarge extends IOException {
        final long limitBytes;

        BodyTooLarge(long limitBytes) {
            super("the request body is longer than " + limitBytes + " bytes");
            this.limitBytes = limitBytes;
        }
    }

    /** A request whose body stream fails with {@link BodyTooLarge} after {@code limit} bytes. */
    private static final class CountedBody extends HttpServletRequestWrapper {
        private final long limit;
        private ServletInputStream stream;

        CountedBody(HttpServletRequest request, long limit) {
            super(request);
            this.limit = limit;
        }

        @Override
        public ServletInputStream getInputStream() throws IOException {
            if (stream == null) {
                ServletInputStream in = super.getInputStream();
                stream = new ServletInputStream() {
                    private long read;

                    @Override
                    public int read() throws IOException {
                        int b = in.read();
                        if (b >= 0 && ++read > limit) {
                            throw new BodyTooLarge(limit);
                        }
                        return b;
                    }

                    @Override
                    public int read(byte[] buf, int off, int len) throws IOException {
                        int n = in.read(buf, off, len);
                        if (n > 0 && (read += n) > limit) {
                            throw new BodyTooLarge(limit);
                        }
                        return n;
                    }

                    @Override
                    public boolean isFinished() {
                        return in.isFinished();
                    }

                    @Override
                    public boolean isReady() {
                        return in.isReady();
                    }

                    @Override
                    public void setReadListener(ReadListener listener) {
                        in.setReadListener(listener);
                    }
                };
            }
            return stream;
        }
    }
}
