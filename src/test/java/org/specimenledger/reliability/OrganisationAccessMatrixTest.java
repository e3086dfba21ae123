package org.specimenledger.reliability;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.specimenledger.certificates.CertificateBench;
import org.specimenledger.testing.ReliabilityBench;
import org.specimenledger.testsupport.Api;
import org.specimenledger.testsupport.IntegrationTest;
import org.specimenledger.testsupport.TestAccounts;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.beans.factory.annotation.Qualifier;
import org.springframework.security.access.prepost.PreAuthorize;
import org.springframework.web.servlet.mvc.method.annotation.RequestMappingHandlerMapping;

/**
 * The own/other organisation half of the access matrix (the role half is {@code RouteAccessMatrixTest}),
 * generated from the route table: every endpoint a customer may call that names a record in its path is
 * called with one organisation's real records, as that organisation's customer (answered) and as another
 * organisation's customer (always 404, never 403, so existence is not revealed). Lists and searches called
 * by the other customer must not contain the first organisation's records. An endpoint whose record kind is
 * not known here fails the test until it is added to {@link #recordFor}.
 */
class OrganisationAccessMatrixTest extends IntegrationTest {

    @Autowired
    @Qualifier("requestMappingHandlerMapping")
    RequestMappingHandlerMapping mapping;

    /** Endpoints a customer reaches but that answer 403 even for the customer's own records (raw data). */
    private static final List<String> OWN_BUT_NOT_FOR_CUSTOMERS = List.of("GET /api/v1/tests/{id}/curve");

    private Map<String, String> own;

    private void ownRecords() {
        if (own != null) {
            return;
        }
        Api t = as(TestAccounts.TECHNICIAN);
        String organisation = organisations.get(TestAccounts.CUSTOMER);
        ReliabilityBench bench = ReliabilityBench.make(t, as(TestAccounts.MANAGER), organisation);
        Api.Response run = t.post("/api/v1/tests", bench.registration());
        Api.Response upload = t.putBytes("/api/v1/tests/" + run.id() + "/curve", "text/csv", bench.curve());
        assertThat(upload.status()).as(upload.toString()).isEqualTo(201);
        own = new LinkedHashMap<>();
        own.put("customers", organisation);
        own.put("orders", bench.orderId());
        own.put("heats", bench.heatId());
        own.put("specimens", bench.specimenId());
        own.put("tests", run.id());
        own.put("analyses", upload.json().get("analysis").get("id").asString());
        own.put("certificates", issueCertificate(organisation));
    }

    /** An issued certificate of the own organisation, for the certificate and certificate-trace routes. */
    private String issueCertificate(String organisation) {
        Api manager = as(TestAccounts.MANAGER);
        // an order with a requirement, so that the certificate has lines to trace
        CertificateBench.Order order = new CertificateBench(as(TestAccounts.TECHNICIAN), manager).order(organisation,
                List.of(CertificateBench.requirement("Rm", "380", null, "MPa")), 1);
        Api.Response draft = manager.post("/api/v1/certificates/drafts", Map.of("orderId", order.orderId(),
                "specimenIds", order.specimenIds(), "productDescription", "Hot-rolled round bar"));
        assertThat(draft.status()).as(draft.toString()).isEqualTo(201);
        Map<String, Object> issue = new LinkedHashMap<>();
        issue.put("password", TestAccounts.PASSWORD);
        if (!draft.json().get("allLinesPass").asBoolean()) {
            issue.put("nonConformityStatement", "a line does not pass; issued for the access matrix");
        }
        Api.Response issued = manager.post("/api/v1/certificates/drafts/" + draft.id() + "/issue", issue);
        assertThat(issued.status()).as(issued.toString()).isEqualTo(201);
        return issued.json().get("number").asString();
    }

    private String recordFor(String pattern) {
        String[] segments = pattern.split("/");
        StringBuilder out = new StringBuilder();
        String previous = "";
        for (String segment : segments) {
            if (segment.isEmpty()) {
                continue;
            }
            out.append('/');
            if (segment.equals("{position}")) {
                out.append('1'); // the first printed line of a certificate
            } else if (segment.startsWith("{")) {
                String id = own.get(previous);
                if (id == null) {
                    return null;
                }
                out.append(id);
            } else {
                out.append(segment);
                previous = segment;
            }
        }
        return out.toString();
    }

    @Test
    void aCustomerReachesOwnRecordsAndGets404ForEveryOtherOrganisations() {
        ownRecords();
        Map<String, String> failures = new LinkedHashMap<>();
        int checked = 0;
        for (RouteTable.Route route : RouteTable.of(mapping).api()) {
            PreAuthorize declared = route.handler().getMethodAnnotation(PreAuthorize.class);
            // the pages have their own matrix (web.PageAccessMatrixTest) and browser tests of the portal's scope
            if (declared == null || !route.pattern().startsWith("/api/") || !route.pattern().contains("{") || !route.method().equals("GET")
                    || !(declared.value().contains("'CUSTOMER'") || declared.value().contains("permitAll"))) {
                continue;
            }
            if (declared.value().contains("permitAll")) {
                continue; // public facts (ledger key, checkpoints) belong to no organisation
            }
            String key = route.method() + " " + route.pattern();
            String path = recordFor(route.pattern());
            if (path == null) {
                failures.put(key, "names a record kind this matrix does not know yet; add it to recordFor");
                continue;
            }
            checked++;
            Api.Response answer = as(TestAccounts.CUSTOMER).get(path);
            int mine = answer.status();
            int expectedMine = OWN_BUT_NOT_FOR_CUSTOMERS.contains(key) ? 403 : 200;
            if (mine != expectedMine) {
                failures.put(key + " as the owner", "answered " + mine + ", expected " + expectedMine
                        + ": " + answer.body().substring(0, Math.min(300, answer.body().length())));
            }
            int other = as(TestAccounts.OTHER_CUSTOMER).get(path).status();
            if (other != 404) {
                failures.put(key + " as another organisation", "answered " + other + ", expected 404");
            }
        }
        assertThat(failures).as("own/other organisation matrix").isEmpty();
        assertThat(checked).as("customer endpoints with a record in the path").isGreaterThanOrEqualTo(5);
    }

    @Test
    void listsAndSearchesShowAnotherOrganisationNothingOfTheFirst() {
        ownRecords();
        Api other = as(TestAccounts.OTHER_CUSTOMER);
        for (String list : List.of("/api/v1/customers", "/api/v1/orders", "/api/v1/heats", "/api/v1/specimens",
                "/api/v1/tests", "/api/v1/results", "/api/v1/results.csv",
                "/api/v1/tests?specimenId=" + own.get("specimens"),
                "/api/v1/results?specimenId=" + own.get("specimens"),
                "/api/v1/results?orderId=" + own.get("orders"), "/api/v1/certificates",
                "/api/v1/certificates?number=" + own.get("certificates"))) {
            Api.Response r = other.get(list);
            assertThat(r.status()).as(list + " " + r).isIn(200, 404, 422);
            for (String id : own.values()) {
                assertThat(r.body()).as(list + " must not show " + id).doesNotContain(id);
            }
        }
    }
}
