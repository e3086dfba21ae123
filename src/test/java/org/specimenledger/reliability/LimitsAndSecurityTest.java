package org.specimenledger.reliability;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.ByteArrayInputStream;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Base64;
import java.util.Map;
import java.util.UUID;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import javax.sql.DataSource;
import org.junit.jupiter.api.Test;
import org.specimenledger.testsupport.IntegrationTest;
import org.specimenledger.testsupport.TestAccounts;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.jdbc.core.JdbcTemplate;

/**
 * Limits over real HTTP at their edges, and the security basics: how passwords are kept, what a failed
 * sign-in says, the headers on every answer, a disabled account refused at once even though its password
 * check is remembered, and no secret written into the configuration.
 */
class LimitsAndSecurityTest extends IntegrationTest {

    private static final int ONE_MB = 1024 * 1024;

    @Autowired
    DataSource dataSource;

    private Wire manager() {
        return new Wire("http://127.0.0.1:" + port, TestAccounts.MANAGER, TestAccounts.PASSWORD);
    }

    /** A JSON body of exactly n bytes: a customer whose address is padded with spaces. */
    private static byte[] bodyOf(int n) {
        String head = "{\"name\":\"Limit Customer " + UUID.randomUUID() + "\",\"address\":\"";
        String tail = "\"}";
        return (head + " ".repeat(n - head.length() - tail.length()) + tail).getBytes(StandardCharsets.UTF_8);
    }

    @Test
    void aJsonBodyOfExactlyOneMegabyteIsReadAndOneByteMoreIs413() {
        Wire.Answer atLimit = manager().send("POST", "/api/v1/customers", "application/json", bodyOf(ONE_MB));
        // read and judged by the rules (the address is too long), not refused for its size
        assertThat(atLimit.status()).as(atLimit.toString()).isEqualTo(422);
        Wire.Answer over = manager().send("POST", "/api/v1/customers", "application/json", bodyOf(ONE_MB + 1));
        assertThat(over.status()).isEqualTo(413);
        assertThat(over.contentType()).startsWith("application/problem+json");
        assertThat(over.json().get("limitBytes").asLong()).isEqualTo(ONE_MB);
    }

    @Test
    void aChunkedBodyWithoutLengthIsCutAtTheLimit() throws Exception {
        byte[] body = bodyOf(ONE_MB + 10);
        HttpRequest request = HttpRequest.newBuilder(URI.create("http://127.0.0.1:" + port + "/api/v1/customers"))
                .header("Authorization", basic(TestAccounts.MANAGER, TestAccounts.PASSWORD))
                .header("Content-Type", "application/json")
                .POST(HttpRequest.BodyPublishers.ofInputStream(() -> new ByteArrayInputStream(body))).build();
        HttpResponse<String> r = HttpClient.newHttpClient().send(request, HttpResponse.BodyHandlers.ofString());
        assertThat(r.statusCode()).isEqualTo(413);
        assertThat(r.headers().firstValue("Content-Type").orElse("")).startsWith("application/problem+json");
    }

    @Test
    void passwordsAreKeptAsBcryptHashesOnly() {
        JdbcTemplate jdbc = new JdbcTemplate(dataSource);
        for (Map<String, Object> row : jdbc.queryForList("select username, password_hash from account")) {
            String hash = (String) row.get("password_hash");
            assertThat(hash).as("hash of " + row.get("username")).startsWith("{bcrypt}$2");
            assertThat(hash).doesNotContain(TestAccounts.PASSWORD);
        }
    }

    @Test
    void aFailedSignInSaysTheSameForAnUnknownUserAndAWrongPassword() {
        Wire unknown = new Wire("http://127.0.0.1:" + port, "nobody-" + UUID.randomUUID(), "whatever-password");
        Wire wrong = new Wire("http://127.0.0.1:" + port, TestAccounts.MANAGER, "not-the-password");
        Wire.Answer a = unknown.get("/api/v1/customers");
        Wire.Answer b = wrong.get("/api/v1/customers");
        assertThat(a.status()).isEqualTo(401);
        assertThat(b.status()).isEqualTo(401);
        assertThat(a.body()).isEqualTo(b.body());
        assertThat(a.headers().firstValue("WWW-Authenticate")).contains(b.headers().firstValue("WWW-Authenticate").get());
    }

    @Test
    void everyAnswerCarriesTheSecurityHeaders() {
        for (Wire.Answer a : new Wire.Answer[] {manager().get("/api/v1/customers"), manager().get("/api/v1/no-such"),
                new Wire("http://127.0.0.1:" + port, null, null).get("/api/v1/customers")}) {
            assertThat(a.headers().firstValue("X-Content-Type-Options")).as(a.toString()).contains("nosniff");
            assertThat(a.headers().firstValue("X-Frame-Options")).as(a.toString()).contains("DENY");
            assertThat(a.headers().firstValue("Cache-Control").orElse("")).as(a.toString()).contains("no-store");
            assertThat(a.headers().firstValue("Set-Cookie")).as("the API keeps no session").isEmpty();
        }
    }

    @Test
    void aDisabledAccountIsRefusedAtOnceThoughItsPasswordCheckIsRemembered() {
        String username = "limits-" + UUID.randomUUID().toString().substring(0, 8);
        var opened = as(TestAccounts.MANAGER).post("/api/v1/accounts", Map.of("username", username,
                "displayName", "Short-lived Technician", "password", TestAccounts.PASSWORD, "role", "TECHNICIAN"));
        assertThat(opened.status()).isEqualTo(201);
        Wire user = new Wire("http://127.0.0.1:" + port, username, TestAccounts.PASSWORD);
        assertThat(user.get("/api/v1/accounts/me").status()).isEqualTo(200);
        assertThat(user.get("/api/v1/accounts/me").status()).isEqualTo(200);
        var disabled = as(TestAccounts.MANAGER).post("/api/v1/accounts/" + opened.id() + "/disable",
                Map.of("reason", "left the laboratory"));
        assertThat(disabled.status()).isEqualTo(200);
        assertThat(user.get("/api/v1/accounts/me").status()).isEqualTo(401);
    }

    @Test
    void secretsComeOnlyFromTheEnvironment() throws Exception {
        String config = Files.readString(Path.of("src/main/resources/application.yml"));
        Matcher m = Pattern.compile("(?im)^[ \\t]*([a-z-]*(password|secret|private-key|token)[a-z-]*):[ \\t]*(\\S.*)$")
                .matcher(config);
        int seen = 0;
        while (m.find()) {
            seen++;
            assertThat(m.group(3).trim()).as(m.group(1) + " must be an environment placeholder").startsWith("${");
        }
        assertThat(seen).isGreaterThan(0);
    }

    private static String basic(String user, String password) {
        return "Basic " + Base64.getEncoder().encodeToString((user + ":" + password).getBytes(StandardCharsets.UTF_8));
    }
}
