package org.specimenledger.testing;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.specimenledger.specimens.SpecimenFixtures;
import org.specimenledger.testsupport.Api;
import tools.jackson.databind.JsonNode;

/** Test-run and result lists come in pages of a stable order with the total. */
class PagingApiTest extends TestRunTesting {

    private static List<String> ids(JsonNode page, String field) {
        List<String> out = new ArrayList<>();
        page.get("items").forEach(n -> out.add(n.get(field).asString()));
        return out;
    }

    @Test
    void resultsOfAnOrderComeInPagesThatTogetherHoldEachResultOnce() {
        TestRunFixtures.Bench b = bench();
        List<String> runs = new ArrayList<>();
        runs.add(register(b));
        uploaded(runs.get(0), TestRunFixtures.curve(b));
        for (int i = 0; i < 2; i++) {
            String mark = SpecimenFixtures.mark();
            Api.Response s = technician().post("/api/v1/specimens",
                    SpecimenFixtures.roundBar(mark, b.heatId(), b.orderId()));
            String run = register(TestRunFixtures.with(TestRunFixtures.registration(b), "specimenId", s.id()));
            uploaded(run, SyntheticCurves.labelled("specimen: " + mark, SyntheticCurves.rambergOsgood(200_000, 300, 10,
                    s.json().get("s0Mm2").asDouble(), 50, 0.05, 2000)));
            runs.add(run);
        }
        JsonNode first = technician().get("/api/v1/results?orderId=" + b.orderId() + "&size=2").json();
        JsonNode second = technician().get("/api/v1/results?orderId=" + b.orderId() + "&size=2&page=1").json();
        JsonNode beyond = technician().get("/api/v1/results?orderId=" + b.orderId() + "&size=2&page=7").json();
        assertThat(first.get("total").asLong()).isEqualTo(3);
        assertThat(first.get("page").asInt()).isZero();
        assertThat(first.get("size").asInt()).isEqualTo(2);
        assertThat(ids(first, "testRunId")).hasSize(2);
        assertThat(ids(second, "testRunId")).hasSize(1);
        List<String> all = new ArrayList<>(ids(first, "testRunId"));
        all.addAll(ids(second, "testRunId"));
        assertThat(all).containsExactlyInAnyOrderElementsOf(runs);
        assertThat(beyond.get("items")).isEmpty();
        assertThat(beyond.get("total").asLong()).isEqualTo(3);
    }

    @Test
    void testRunPagesFollowTheRegistrationOrderAndRefuseBadSizes() {
        TestRunFixtures.Bench b = bench();
        register(b);
        JsonNode a = manager().get("/api/v1/tests?size=3").json();
        JsonNode next = manager().get("/api/v1/tests?size=3&page=1").json();
        assertThat(a.get("total").asLong()).isEqualTo(count("test_run"));
        assertThat(ids(a, "id")).doesNotContainAnyElementsOf(ids(next, "id"));
        assertThat(manager().get("/api/v1/tests?size=3").json()).as("the same page again").isEqualTo(a);
        assertProblem(manager().get("/api/v1/tests?size=0"), 422, "size", "1–500");
        assertProblem(manager().get("/api/v1/results?page=-1"), 422, "page", "from 0");
    }
}
