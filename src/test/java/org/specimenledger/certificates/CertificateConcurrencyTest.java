package org.specimenledger.certificates;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.UUID;
import java.util.concurrent.Callable;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import org.junit.jupiter.api.Test;
import org.specimenledger.testsupport.Api;
import org.specimenledger.testsupport.TestAccounts;

/**
 * Numbering under concurrency: parallel issues get distinct, consecutive numbers (the year's counter row is locked
 * by each issuing transaction), and two managers issuing one draft at once get exactly one certificate.
 */
class CertificateConcurrencyTest extends CertificateTesting {

    @Test
    void twentyParallelIssuesGetTwentyConsecutiveNumbers() throws Exception {
        CertificateBench.Order order = bench().order(customerId(), passingRequirements(), 20);
        List<String> drafts = new ArrayList<>();
        for (String specimen : order.specimenIds()) {
            drafts.add(draft(order, List.of(specimen), null, false).get("id").asString());
        }
        List<Api.Response> answers = all(drafts.stream().map(d -> (Callable<Api.Response>) () -> issue(manager(), d,
                null)).toList());
        List<Integer> serials = new ArrayList<>();
        for (Api.Response r : answers) {
            assertThat(r.status()).as(r.toString()).isEqualTo(201);
            String number = r.json().get("number").asString();
            serials.add(Integer.parseInt(number.substring(number.lastIndexOf('-') + 1)));
        }
        serials.sort(null);
        assertThat(serials).doesNotHaveDuplicates();
        assertThat(serials.get(19) - serials.get(0)).as("consecutive: %s", serials).isEqualTo(19);
        // and nothing else took a number in between: the stored serials of this year have no gap at all
        List<Integer> stored = jdbc.sql("SELECT number_serial FROM certificate WHERE revision = 0 AND number_year ="
                + " (SELECT max(number_year) FROM certificate) ORDER BY number_serial").query(Integer.class).list();
        for (int i = 0; i < stored.size(); i++) {
            assertThat(stored.get(i)).as("serial at %d of %s", i, stored).isEqualTo(i + 1);
        }
    }

    @Test
    void twoManagersIssuingOneDraftGetOneCertificate() throws Exception {
        String second = "t-manager-2-" + UUID.randomUUID().toString().substring(0, 8);
        Api.Response opened = manager().post("/api/v1/accounts", Map.of("username", second, "displayName",
                "Second Test Manager", "password", TestAccounts.PASSWORD, "role", "LAB_MANAGER"));
        assertThat(opened.status()).as(opened.toString()).isEqualTo(201);
        CertificateBench.Order order = bench().order(customerId(), passingRequirements(), 1);
        String draft = draft(order, order.specimenIds(), null, false).get("id").asString();
        long before = count("certificate");
        List<Api.Response> answers = all(List.of(() -> issue(manager(), draft, null),
                () -> issue(as(second), draft, null)));
        assertThat(answers.stream().map(Api.Response::status).sorted().toList()).as(answers.toString())
                .containsExactly(201, 409);
        assertThat(count("certificate")).isEqualTo(before + 1);
    }

    /** Runs the calls at once (released together) and returns their answers in order. */
    private static <T> List<T> all(List<Callable<T>> calls) throws Exception {
        ExecutorService pool = Executors.newFixedThreadPool(calls.size());
        try {
            CountDownLatch start = new CountDownLatch(1);
            List<Future<T>> futures = new ArrayList<>();
            for (Callable<T> call : calls) {
                futures.add(pool.submit(() -> {
                    start.await();
                    return call.call();
                }));
            }
            start.countDown();
            List<T> out = new ArrayList<>();
            for (Future<T> f : futures) {
                out.add(f.get());
            }
            return out;
        } finally {
            pool.shutdownNow();
        }
    }
}
