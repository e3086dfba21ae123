package org.specimenledger.audit;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.nio.charset.StandardCharsets;
import java.security.MessageDigest;
import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.HexFormat;
import java.util.List;
import java.util.Map;
import java.util.UUID;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.atomic.AtomicInteger;
import org.junit.jupiter.api.Test;
import org.specimenledger.testsupport.Api;
import org.specimenledger.testsupport.IntegrationTest;
import org.specimenledger.testsupport.TestAccounts;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.jdbc.core.JdbcTemplate;
import tools.jackson.databind.JsonNode;

class LedgerTest extends IntegrationTest {

    @Autowired
    JdbcTemplate jdbc;

    private Api manager() {
        return as(TestAccounts.MANAGER);
    }

    private JsonNode eventsFor(String type, String id) {
        Api.Response r = manager().get("/api/v1/audit/events?entityType=" + type + "&entityId=" + id);
        assertThat(r.status()).isEqualTo(200);
        return r.json().get("events");
    }

    @Test
    void eachWriteIsOneEventWithWhoWhatWhyAndBeforeAfter() {
        String name = "Ledgered Mill " + UUID.randomUUID();
        String id = manager().post("/api/v1/customers", Map.of("name", name, "address", "Old Road 1")).id();
        Api.Response changed = manager().put("/api/v1/customers/" + id,
                Map.of("name", name, "address", "New Road 2", "reason", "customer moved"));
        assertThat(changed.status()).isEqualTo(200);

        JsonNode events = eventsFor("customer", id);
        assertThat(events).hasSize(2);
        JsonNode created = events.get(0);
        assertThat(created.get("action").asString()).isEqualTo("customer.registered");
        assertThat(created.get("actor").asString()).isEqualTo(TestAccounts.MANAGER);
        assertThat(created.get("role").asString()).isEqualTo("LAB_MANAGER");
        assertThat(created.get("before").isNull()).isTrue();
        assertThat(created.get("after").get("address").asString()).isEqualTo("Old Road 1");

        JsonNode change = events.get(1);
        assertThat(change.get("action").asString()).isEqualTo("customer.changed");
        assertThat(change.get("reason").asString()).isEqualTo("customer moved");
        assertThat(change.get("before").get("address").asString()).isEqualTo("Old Road 1");
        assertThat(change.get("after").get("address").asString()).isEqualTo("New Road 2");
        assertThat(change.get("previousHash").asString()).hasSize(64);
        assertThat(Instant.parse(change.get("occurredAt").asString())).isBeforeOrEqualTo(Instant.now());
    }

    @Test
    void eventHashIsSha256OfItsCanonicalTextAndNamesThePreviousHash() throws Exception {
        String id = manager().post("/api/v1/customers", Map.of("name", "Hash Check " + UUID.randomUUID(),
                "address", "a")).id();
        JsonNode event = eventsFor("customer", id).get(0);
        String canonical = event.get("canonical").asString();
        // Oracle: the JDK's own SHA-256 over the stored text, as any outside tool would compute it.
        String expected = HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256")
                .digest(canonical.getBytes(StandardCharsets.UTF_8)));
        assertThat(event.get("hash").asString()).isEqualTo(expected);
        assertThat(canonical).contains("\"previousHash\":\"" + event.get("previousHash").asString() + "\"");
        JsonNode before = manager().get("/api/v1/audit/events?after=" + (event.get("seq").asLong() - 2)
                + "&limit=1").json().get("events").get(0);
        assertThat(before.get("hash").asString()).isEqualTo(event.get("previousHash").asString());
    }

    @Test
    void refusedRequestLeavesNoEventAndNoRow() {
        Long events = jdbc.queryForObject("SELECT count(*) FROM audit_event", Long.class);
        Long customers = jdbc.queryForObject("SELECT count(*) FROM customer", Long.class);
        String existing = manager().get("/api/v1/customers").json().get(0).get("name").asString();
        assertThat(manager().post("/api/v1/customers", Map.of("name", existing, "address", "x")).status())
                .isEqualTo(409);
        assertThat(manager().post("/api/v1/customers", Map.of("name", "", "address", "x")).status())
                .isEqualTo(422);
        assertThat(jdbc.queryForObject("SELECT count(*) FROM audit_event", Long.class)).isEqualTo(events);
        assertThat(jdbc.queryForObject("SELECT count(*) FROM customer", Long.class)).isEqualTo(customers);
    }

    @Test
    void eightConcurrentWritersLeaveOneGapFreeValidChain() throws Exception {
        long startSeq = jdbc.queryForObject("SELECT last_seq FROM audit_chain_head", Long.class);
        AtomicInteger written = new AtomicInteger();
        long until = System.nanoTime() + Duration.ofSeconds(4).toNanos();
        ExecutorService pool = Executors.newFixedThreadPool(8);
        List<Future<?>> futures = new ArrayList<>();
        for (int w = 0; w < 8; w++) {
            futures.add(pool.submit(() -> {
                Api api = manager();
                while (System.nanoTime() < until) {
                    Api.Response r = api.post("/api/v1/customers",
                            Map.of("name", "Concurrent " + UUID.randomUUID(), "address", "c"));
                    assertThat(r.status()).as(r.toString()).isEqualTo(201);
                    written.incrementAndGet();
                }
            }));
        }
        for (Future<?> f : futures) {
            f.get();
        }
        pool.shutdown();

        long endSeq = jdbc.queryForObject("SELECT last_seq FROM audit_chain_head", Long.class);
        assertThat(written.get()).isGreaterThan(8);
        assertThat(endSeq - startSeq).isEqualTo(written.get());
        List<Long> seqs = jdbc.queryForList("SELECT seq FROM audit_event WHERE seq > ? ORDER BY seq", Long.class,
                startSeq);
        for (int i = 0; i < seqs.size(); i++) {
            assertThat(seqs.get(i)).isEqualTo(startSeq + 1 + i);
        }
        JsonNode verification = manager().get("/api/v1/audit/verify").json();
        assertThat(verification.get("valid").asBoolean()).as(verification.toString()).isTrue();
        assertThat(verification.get("eventsChecked").asLong()).isEqualTo(endSeq);
    }

    @Test
    void databaseRefusesToChangeOrRemoveEvents() {
        manager().post("/api/v1/customers", Map.of("name", "Refusal " + UUID.randomUUID(), "address", "a"));
        assertThatThrownBy(() -> jdbc.update("UPDATE audit_event SET actor = 'mallory' WHERE seq = 1"))
                .rootCause().hasMessageContaining("append-only");
        assertThatThrownBy(() -> jdbc.update("DELETE FROM audit_event WHERE seq = 1"))
                .rootCause().hasMessageContaining("append-only");
        assertThatThrownBy(() -> jdbc.execute("TRUNCATE audit_event CASCADE"))
                .rootCause().hasMessageContaining("append-only");
    }

    @Test
    void verificationNamesTheFirstTamperedEvent() {
        String id = manager().post("/api/v1/customers", Map.of("name", "Tamper Target " + UUID.randomUUID(),
                "address", "a")).id();
        long seq = eventsFor("customer", id).get(0).get("seq").asLong();
        String original = jdbc.queryForObject("SELECT canonical FROM audit_event WHERE seq = ?", String.class, seq);
        // A superuser can switch the trigger off; the hash chain is what still gives the change away.
        jdbc.execute("ALTER TABLE audit_event DISABLE TRIGGER audit_event_no_update");
        try {
            jdbc.update("UPDATE audit_event SET canonical = replace(canonical, 'Tamper Target', 'Tampered') "
                    + "WHERE seq = ?", seq);
            JsonNode broken = manager().get("/api/v1/audit/verify").json();
            assertThat(broken.get("valid").asBoolean()).isFalse();
            assertThat(broken.get("firstBrokenSeq").asLong()).isEqualTo(seq);
            assertThat(broken.get("problem").asString()).isEqualTo("hash-mismatch");
        } finally {
            jdbc.update("UPDATE audit_event SET canonical = ? WHERE seq = ?", original, seq);
            jdbc.execute("ALTER TABLE audit_event ENABLE TRIGGER audit_event_no_update");
        }
        assertThat(manager().get("/api/v1/audit/verify").json().get("valid").asBoolean()).isTrue();
    }

    @Test
    void onlyAuditorAndManagerReadTheLedger() {
        assertThat(as(TestAccounts.AUDITOR).get("/api/v1/audit/events").status()).isEqualTo(200);
        assertThat(as(TestAccounts.MANAGER).get("/api/v1/audit/verify").status()).isEqualTo(200);
        assertThat(as(TestAccounts.TECHNICIAN).get("/api/v1/audit/events").status()).isEqualTo(403);
        assertThat(as(TestAccounts.CUSTOMER).get("/api/v1/audit/verify").status()).isEqualTo(403);
        Api.Response anonymous = anonymous().get("/api/v1/audit/events");
        assertThat(anonymous.status()).isEqualTo(401);
        assertThat(anonymous.contentType()).startsWith("application/problem+json");
    }
}
