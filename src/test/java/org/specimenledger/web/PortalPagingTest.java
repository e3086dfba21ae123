package org.specimenledger.web;

import static org.assertj.core.api.Assertions.assertThat;

import java.net.http.HttpResponse;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.UUID;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.specimenledger.certificates.CertificateBench;
import org.specimenledger.testsupport.Api;
import org.specimenledger.testsupport.IntegrationTest;
import org.specimenledger.testsupport.TestAccounts;
import tools.jackson.databind.JsonNode;

/**
 * The portal's paging over plain HTTP against a real PostgreSQL: 120 certificates of one invented organisation (70
 * on one purchase order, 50 on another) are pages of 50, 50 and 20 with no certificate twice, the filters stay in
 * the previous and next links, another organisation's certificates are never counted, and bad paging values are
 * the page's 400, not a 500.
 */
class PortalPagingTest extends IntegrationTest {

    private static final Pattern ROW = Pattern.compile("<tr id=\"(certificate-[^\"]+)\"[^>]*data-number=\"([^\"]+)\"");
    private static final Pattern ID = Pattern.compile("\\sid=\"([^\"]+)\"");
    private static final Pattern RANGE = Pattern.compile("id=\"result-range\"[^>]*>([^<]+)<");
    private static final Pattern NEXT = Pattern.compile("id=\"next-page\" rel=\"next\" href=\"([^\"]+)\"");
    private static final Pattern PREVIOUS = Pattern.compile("id=\"previous-page\" rel=\"prev\" href=\"([^\"]+)\"");

    private static String username;
    private static String firstOrder;
    private static String secondOrder;
    private static List<String> firstOrderNumbers;
    private static CertificateBench bench;
    private static final List<Map<String, Object>> REQUIREMENTS =
            List.of(CertificateBench.requirement("Rm", "380", "500", "MPa"));

    @BeforeEach
    void issueOnce() {
        synchronized (PortalPagingTest.class) {
            if (username != null) {
                return;
            }
            Api manager = as(TestAccounts.MANAGER);
            String organisation = manager.post("/api/v1/customers", Map.of("name", "Paging Works (invented) "
                    + UUID.randomUUID(), "address", "3 Page Row, Sampleton")).id();
            String name = "t-paging-" + UUID.randomUUID().toString().substring(0, 8);
            Map<String, Object> account = new HashMap<>();
            account.put("username", name);
            account.put("displayName", "Paging customer");
            account.put("password", TestAccounts.PASSWORD);
            account.put("role", "CUSTOMER");
            account.put("organisationId", organisation);
            assertThat(manager.post("/api/v1/accounts", account).status()).isEqualTo(201);

            bench = new CertificateBench(as(TestAccounts.TECHNICIAN), manager);
            List<Map<String, Object>> requirements = REQUIREMENTS;
            CertificateBench.Order a = bench.order(organisation, requirements, 1);
            CertificateBench.Order b = bench.order(organisation, requirements, 1);
            firstOrderNumbers = issue(manager, a, 70);
            issue(manager, b, 50);
            // two of another organisation, on an order of the same requirements: never counted above
            issue(manager, bench.order(organisations.get(TestAccounts.CUSTOMER), requirements, 1), 2);
            firstOrder = purchaseOrder(manager, a.orderId());
            secondOrder = purchaseOrder(manager, b.orderId());
            username = name;
        }
    }

    private static List<String> issue(Api manager, CertificateBench.Order order, int count) {
        List<String> numbers = new ArrayList<>();
        for (int i = 0; i < count; i++) {
            Map<String, Object> draft = new HashMap<>();
            draft.put("orderId", order.orderId());
            draft.put("specimenIds", order.specimenIds());
            draft.put("productDescription", "Cold-drawn bar, lot " + i);
            Api.Response d = manager.post("/api/v1/certificates/drafts", draft);
            assertThat(d.status()).as(d.toString()).isEqualTo(201);
            Api.Response issued = manager.post("/api/v1/certificates/drafts/" + d.id() + "/issue",
                    Map.of("password", TestAccounts.PASSWORD));
            assertThat(issued.status()).as(issued.toString()).isEqualTo(201);
            numbers.add(issued.json().get("number").asString());
        }
        return numbers;
    }

    private static String purchaseOrder(Api manager, String orderId) {
        return manager.get("/api/v1/orders/" + orderId).json().get("purchaseOrder").asString();
    }

    private PageSession customer() {
        PageSession session = new PageSession(port);
        assertThat(session.signIn(username, TestAccounts.PASSWORD).statusCode()).isEqualTo(302);
        return session;
    }

    private static List<String> numbers(String html) {
        List<String> out = new ArrayList<>();
        Matcher m = ROW.matcher(html);
        while (m.find()) {
            out.add(m.group(2));
        }
        return out;
    }

    private static String first(Pattern p, String html) {
        Matcher m = p.matcher(html);
        return m.find() ? m.group(1).replace("&amp;", "&") : null;
    }

    @Test
    void hundredTwentyCertificatesArePagesOfFiftyFiftyAndTwentyWithNoneTwice() {
        PageSession session = customer();
        Set<String> seen = new LinkedHashSet<>();
        String path = "/portal";
        List<Integer> sizes = new ArrayList<>();
        List<String> ranges = new ArrayList<>();
        while (path != null) {
            HttpResponse<String> page = session.get(path);
            assertThat(page.statusCode()).as(path).isEqualTo(200);
            List<String> rows = numbers(page.body());
            sizes.add(rows.size());
            for (String n : rows) {
                assertThat(seen.add(n)).as("%s listed twice (at %s)", n, path).isTrue();
            }
            ranges.add(first(RANGE, page.body()));
            String next = first(NEXT, page.body());
            if (next != null) {
                assertThat(next).isEqualTo("/portal?page=" + (sizes.size() + 1));
            }
            path = next;
        }
        assertThat(sizes).containsExactly(50, 50, 20);
        assertThat(ranges).containsExactly("1–50 of 120 (page 1 of 3)", "51–100 of 120 (page 2 of 3)",
                "101–120 of 120 (page 3 of 3)");
        assertThat(seen).hasSize(120);

        // the last page links back, and only back
        HttpResponse<String> last = session.get("/portal?page=3");
        assertThat(first(PREVIOUS, last.body())).isEqualTo("/portal?page=2");
        assertThat(first(NEXT, last.body())).isNull();
        assertThat(first(PREVIOUS, session.get("/portal").body())).isNull();

        // the API list is the same query: the same count and the same slice
        JsonNode api = as(username).get("/api/v1/certificates?page=2&size=50").json();
        assertThat(api.get("total").asLong()).isEqualTo(120);
        List<String> apiNumbers = new ArrayList<>();
        api.get("certificates").forEach(c -> apiNumbers.add(c.get("number").asString()));
        assertThat(apiNumbers).containsExactlyElementsOf(numbers(last.body()));
    }

    @Test
    void filtersAndSizeStayInTheLinksAcrossPages() {
        PageSession session = customer();
        String path = "/portal?order=" + firstOrder + "&size=30";
        Set<String> seen = new LinkedHashSet<>();
        List<Integer> sizes = new ArrayList<>();
        while (path != null) {
            HttpResponse<String> page = session.get(path);
            assertThat(page.statusCode()).as(path).isEqualTo(200);
            assertThat(page.body()).contains("value=\"" + firstOrder + "\"", "value=\"30\"");
            List<String> rows = numbers(page.body());
            sizes.add(rows.size());
            seen.addAll(rows);
            path = first(NEXT, page.body());
            if (path != null) {
                assertThat(path).isEqualTo("/portal?order=" + firstOrder + "&size=30&page=" + (sizes.size() + 1));
            }
        }
        assertThat(sizes).containsExactly(30, 30, 10);
        assertThat(seen).containsExactlyInAnyOrderElementsOf(firstOrderNumbers);
        HttpResponse<String> second = session.get("/portal?order=" + secondOrder + "&size=500");
        assertThat(numbers(second.body())).hasSize(50).doesNotContainAnyElementsOf(firstOrderNumbers);
        assertThat(first(RANGE, second.body())).isEqualTo("1–50 of 50 (page 1 of 1)");
        assertThat(first(NEXT, second.body())).isNull();
    }

    @Test
    void badPagingValuesAreThePagesProblemNeverA500() {
        PageSession session = customer();
        for (String query : List.of("page=0", "page=-1", "page=x", "page=99999999999", "size=0", "size=501",
                "size=abc", "size=2.5", "from=not-a-date", "to=2026-13-40")) {
            HttpResponse<String> r = session.get("/portal?" + query);
            assertThat(r.statusCode()).as(query).isEqualTo(400);
            String pointer = "/" + query.substring(0, query.indexOf('='));
            assertThat(r.body()).as(query).contains("class=\"problems\"", "<code>" + pointer + "</code>")
                    .doesNotContain("id=\"certificates\"");
        }
        HttpResponse<String> past = session.get("/portal?page=9");
        assertThat(past.statusCode()).isEqualTo(200);
        assertThat(past.body()).contains("There is no page <span>9</span>; the last is page <span>3</span>");
        assertThat(first(PREVIOUS, past.body())).isEqualTo("/portal?page=3");
    }

    /** On the test customer's organisation (not the paging one, whose count of 120 the other tests rely on). */
    @Test
    void bothRevisionsOfANumberAreRowsWithTheirOwnIds() {
        Api manager = as(TestAccounts.MANAGER);
        String number = issue(manager, bench.order(organisations.get(TestAccounts.CUSTOMER), REQUIREMENTS, 1), 1)
                .get(0);
        Api.Response revision = manager.post("/api/v1/certificates/" + number + "/revisions",
                Map.of("reason", "lot number corrected"));
        assertThat(revision.status()).as(revision.toString()).isEqualTo(201);
        assertThat(manager.post("/api/v1/certificates/drafts/" + revision.id() + "/issue",
                Map.of("password", TestAccounts.PASSWORD)).status()).isEqualTo(201);

        PageSession session = new PageSession(port);
        assertThat(session.signIn(TestAccounts.CUSTOMER, TestAccounts.PASSWORD).statusCode()).isEqualTo(302);
        String html = session.get("/portal?number=" + number).body();
        assertThat(numbers(html)).containsExactly(number, number);
        assertThat(html).contains("id=\"certificate-" + number + "-rev1\"", "id=\"certificate-" + number + "-rev0\"");
        List<String> ids = new ArrayList<>();
        Matcher m = ID.matcher(html);
        while (m.find()) {
            ids.add(m.group(1));
        }
        assertThat(ids).as("element ids on the page").doesNotHaveDuplicates();
    }
}
