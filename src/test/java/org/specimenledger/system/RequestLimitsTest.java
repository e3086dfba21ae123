package org.specimenledger.system;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import com.github.benmanes.caffeine.cache.Ticker;
import java.nio.charset.StandardCharsets;
import java.time.Duration;
import java.util.Base64;
import java.util.List;
import java.util.concurrent.atomic.AtomicLong;
import org.junit.jupiter.api.Test;
import org.springframework.mock.web.MockFilterChain;
import org.springframework.mock.web.MockHttpServletRequest;
import org.springframework.mock.web.MockHttpServletResponse;
import org.springframework.util.unit.DataSize;
import tools.jackson.databind.json.JsonMapper;

/**
 * The request limits at their edges: the body limit at exactly the limit and one byte over, the rate rule at
 * exactly its count and one over, the window's end, per-client counting. A new rule (sign-in, verification)
 * is tested by adding a case with its path here.
 */
class RequestLimitsTest {

    private final AtomicLong nanos = new AtomicLong(1_000_000_000L);
    private final Ticker ticker = nanos::get;

    private RequestLimits limits(long maxBody, RequestLimitSettings.RateRule... rules) {
        return new RequestLimits(new RequestLimitSettings(DataSize.ofBytes(maxBody), List.of(rules)),
                JsonMapper.builder().build(), ticker);
    }

    private static MockHttpServletRequest request(String method, String path, byte[] body, String user,
            String address) {
        MockHttpServletRequest r = new MockHttpServletRequest(method, path);
        r.setRemoteAddr(address);
        if (body != null) {
            r.setContent(body);
            r.setContentType("application/json");
        }
        if (user != null) {
            r.addHeader("Authorization", "Basic " + Base64.getEncoder()
                    .encodeToString((user + ":secret").getBytes(StandardCharsets.UTF_8)));
        }
        return r;
    }

    private static MockHttpServletResponse run(RequestLimits filter, MockHttpServletRequest request) throws Exception {
        MockHttpServletResponse response = new MockHttpServletResponse();
        filter.doFilter(request, response, new MockFilterChain());
        return response;
    }

    @Test
    void aBodyOfExactlyTheLimitPassesAndOneByteMoreIs413() throws Exception {
        RequestLimits filter = limits(100);
        assertThat(run(filter, request("POST", "/api/v1/heats", new byte[100], null, "10.0.0.1")).getStatus())
                .isEqualTo(200);
        MockHttpServletResponse over = run(filter, request("POST", "/api/v1/heats", new byte[101], null, "10.0.0.1"));
        assertThat(over.getStatus()).isEqualTo(413);
        assertThat(over.getContentType()).isEqualTo("application/problem+json");
        assertThat(over.getContentAsString()).contains("\"limitBytes\":100", "\"type\":\"urn:specimen-ledger:problem:body-too-large\"");
    }

    @Test
    void theCurveUploadAndMultipartFormsKeepTheirOwnLimits() throws Exception {
        RequestLimits filter = limits(10);
        assertThat(run(filter, request("PUT", "/api/v1/tests/0b7c/curve", new byte[1000], null, "10.0.0.1"))
                .getStatus()).isEqualTo(200);
        MockHttpServletRequest form = request("POST", "/api/v1/analysis/preview", new byte[1000], null, "10.0.0.1");
        form.setContentType("multipart/form-data; boundary=x");
        assertThat(run(filter, form).getStatus()).isEqualTo(200);
    }

    @Test
    void aRateRuleAllowsExactlyItsCountPerWindowAndTellsWhenToComeBack() throws Exception {
        RequestLimits filter = limits(1000, new RequestLimitSettings.RateRule("probe", "POST", "/api/v1/analysis/**",
                3, Duration.ofSeconds(60), "address"));
        for (int i = 0; i < 3; i++) {
            assertThat(run(filter, request("POST", "/api/v1/analysis/preview", null, null, "10.0.0.1")).getStatus())
                    .isEqualTo(200);
        }
        MockHttpServletResponse fourth = run(filter, request("POST", "/api/v1/analysis/preview", null, null, "10.0.0.1"));
        assertThat(fourth.getStatus()).isEqualTo(429);
        assertThat(fourth.getHeader("Retry-After")).isEqualTo("60");
        assertThat(fourth.getContentAsString()).contains("\"rule\":\"probe\"");
        // another client, another method, another path: not counted against the first
        assertThat(run(filter, request("POST", "/api/v1/analysis/preview", null, null, "10.0.0.2")).getStatus())
                .isEqualTo(200);
        assertThat(run(filter, request("GET", "/api/v1/analysis/preview", null, null, "10.0.0.1")).getStatus())
                .isEqualTo(200);
        assertThat(run(filter, request("POST", "/api/v1/heats", null, null, "10.0.0.1")).getStatus()).isEqualTo(200);
        nanos.addAndGet(Duration.ofSeconds(59).toNanos());
        MockHttpServletResponse stillOver = run(filter, request("POST", "/api/v1/analysis/preview", null, null, "10.0.0.1"));
        assertThat(stillOver.getStatus()).isEqualTo(429);
        assertThat(stillOver.getHeader("Retry-After")).isEqualTo("1");
        nanos.addAndGet(Duration.ofSeconds(1).toNanos());
        assertThat(run(filter, request("POST", "/api/v1/analysis/preview", null, null, "10.0.0.1")).getStatus())
                .isEqualTo(200);
    }

    @Test
    void aRuleByUserCountsEachUsernameAtItsAddressApart() throws Exception {
        RequestLimits filter = limits(1000, new RequestLimitSettings.RateRule("per-user", "*", "/api/v1/**", 1,
                Duration.ofMinutes(1), "user"));
        assertThat(run(filter, request("GET", "/api/v1/heats", null, "alice", "10.0.0.1")).getStatus()).isEqualTo(200);
        assertThat(run(filter, request("GET", "/api/v1/heats", null, "alice", "10.0.0.1")).getStatus()).isEqualTo(429);
        // another user behind the same address has an allowance of their own
        assertThat(run(filter, request("GET", "/api/v1/heats", null, "bob", "10.0.0.1")).getStatus()).isEqualTo(200);
        // someone elsewhere sending alice's name does not use up alice's allowance, nor alice theirs
        assertThat(run(filter, request("GET", "/api/v1/heats", null, "alice", "10.0.0.9")).getStatus()).isEqualTo(200);
    }

    @Test
    void aRuleThatCannotWorkStopsTheStart() {
        assertThatThrownBy(() -> new RequestLimitSettings.RateRule("zero", "*", "/x", 0, Duration.ofMinutes(1), "address"))
                .hasMessageContaining("requests must be at least 1");
        assertThatThrownBy(() -> new RequestLimitSettings.RateRule("none", "*", "/x", 1, Duration.ZERO, "address"))
                .hasMessageContaining("per must be a positive duration");
        assertThatThrownBy(() -> new RequestLimitSettings.RateRule("who", "*", "/x", 1, Duration.ofMinutes(1), "cookie"))
                .hasMessageContaining("by must be address or user");
    }
}
