package org.specimenledger.audit;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.Instant;
import java.util.Map;
import java.util.UUID;
import org.junit.jupiter.api.Test;
import org.specimenledger.testsupport.Api;
import org.specimenledger.testsupport.IntegrationTest;
import org.specimenledger.testsupport.TestAccounts;
import tools.jackson.databind.JsonNode;

/** {@code GET /api/v1/audit/events} searched by record, actor, action and time, paged. */
class LedgerSearchApiTest extends IntegrationTest {

    private Api manager() {
        return as(TestAccounts.MANAGER);
    }

    private JsonNode events(String query) {
        Api.Response r = as(TestAccounts.AUDITOR).get("/api/v1/audit/events?" + query);
        assertThat(r.status()).as(r.toString()).isEqualTo(200);
        return r.json();
    }

    @Test
    void searchesByActorActionAndTimeRange() {
        Instant before = Instant.now().minusMillis(1);
        String id = manager().post("/api/v1/customers", Map.of("name", "Search Foundry " + UUID.randomUUID(),
                "address", "Old Lane 1")).id();
        manager().put("/api/v1/customers/" + id, Map.of("name", "Search Foundry " + id, "address", "New Lane 2",
                "reason", "moved"));
        Instant after = Instant.now().plusMillis(1);

        JsonNode changes = events("action=customer.changed&actor=" + TestAccounts.MANAGER + "&from=" + before
                + "&to=" + after).get("events");
        assertThat(changes).hasSize(1);
        assertThat(changes.get(0).get("entityId").asString()).isEqualTo(id);
        assertThat(changes.get(0).get("reason").asString()).isEqualTo("moved");

        JsonNode window = events("entityType=customer&entityId=" + id + "&from=" + before + "&to=" + after)
                .get("events");
        assertThat(window).hasSize(2);
        assertThat(events("entityId=" + id + "&to=" + before).get("events")).isEmpty();
        assertThat(events("entityId=" + id + "&from=" + after).get("events")).isEmpty();
        assertThat(events("entityId=" + id + "&actor=" + TestAccounts.AUDITOR).get("events")).isEmpty();
        // offsets other than Z name the same instant
        assertThat(events("entityId=" + id + "&from=" + before.atOffset(java.time.ZoneOffset.ofHours(2))
                .toString().replace("+", "%2B")).get("events")).hasSize(2);
    }

    @Test
    void pagesThroughSearchResultsInChainOrder() {
        String actor = TestAccounts.MANAGER;
        for (int i = 0; i < 3; i++) {
            manager().post("/api/v1/customers", Map.of("name", "Paged Mill " + UUID.randomUUID(), "address", "p"));
        }
        JsonNode first = events("action=customer.registered&actor=" + actor + "&limit=2");
        assertThat(first.get("events")).hasSize(2);
        long next = first.get("nextAfter").asLong();
        assertThat(next).isEqualTo(first.get("events").get(1).get("seq").asLong());
        JsonNode second = events("action=customer.registered&actor=" + actor + "&limit=2&after=" + next);
        assertThat(second.get("events").get(0).get("seq").asLong()).isGreaterThan(next);
        second.get("events").forEach(e -> assertThat(e.get("action").asString()).isEqualTo("customer.registered"));
    }

    @Test
    void badInstantIs400NamingTheParameter() {
        Api.Response r = as(TestAccounts.AUDITOR).get("/api/v1/audit/events?from=yesterday");
        assertThat(r.status()).isEqualTo(400);
        assertThat(r.contentType()).startsWith("application/problem+json");
        assertThat(r.json().get("errors").get(0).get("pointer").asString()).isEqualTo("from");
        assertThat(r.json().get("detail").asString()).contains("'from'").contains("yesterday");

        Api.Response to = as(TestAccounts.AUDITOR).get("/api/v1/audit/events?to=2031-13-01T00:00:00Z");
        assertThat(to.status()).isEqualTo(400);
        assertThat(to.json().get("errors").get(0).get("pointer").asString()).isEqualTo("to");
    }

    @Test
    void emptyTimeRangeIs422NamingTo() {
        Api.Response r = as(TestAccounts.AUDITOR).get(
                "/api/v1/audit/events?from=2031-03-03T10:00:00Z&to=2031-03-03T09:00:00Z");
        assertThat(r.status()).isEqualTo(422);
        assertThat(r.json().get("errors").get(0).get("pointer").asString()).isEqualTo("to");
        assertThat(r.json().get("errors").get(0).get("detail").asString()).contains("must be after from");
    }

    @Test
    void onlyAuditorAndManagerSearch() {
        String q = "/api/v1/audit/events?actor=" + TestAccounts.MANAGER;
        assertThat(as(TestAccounts.AUDITOR).get(q).status()).isEqualTo(200);
        assertThat(as(TestAccounts.MANAGER).get(q).status()).isEqualTo(200);
        assertThat(as(TestAccounts.TECHNICIAN).get(q).status()).isEqualTo(403);
        assertThat(as(TestAccounts.CUSTOMER).get(q).status()).isEqualTo(403);
        assertThat(anonymous().get(q).status()).isEqualTo(401);
    }
}
