package org.specimenledger.benchmarks;

import java.util.List;
import java.util.Map;
import java.util.UUID;
import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.TearDown;
import org.specimenledger.SpecimenLedgerApplication;
import org.specimenledger.accounts.AccountService;
import org.specimenledger.certificates.CertificateBench;
import org.specimenledger.certificates.CertificateRequests;
import org.specimenledger.certificates.CertificateService;
import org.specimenledger.certificates.CertificateView;
import org.specimenledger.testsupport.Api;
import org.specimenledger.testsupport.TestAccounts;
import org.specimenledger.testsupport.TestDatabase;
import org.springframework.boot.builder.SpringApplicationBuilder;
import org.springframework.boot.web.server.context.WebServerApplicationContext;
import org.springframework.context.ConfigurableApplicationContext;
import org.springframework.security.authentication.UsernamePasswordAuthenticationToken;
import org.springframework.security.core.authority.SimpleGrantedAuthority;
import org.springframework.security.core.context.SecurityContextHolder;

/**
 * Issuing a 20-specimen certificate (two required properties each, 40 lines) with a curve appendix, through the
 * service: lines rebuilt from the stored analyses, number from the year's counter, issue event and signed
 * checkpoint, PDF/A-2b render of 2,000-point curves, PDF bytes and lines stored, second ledger event, commit. The
 * application runs in the benchmark's JVM against a fresh database on the PostgreSQL of {@code LEDGER_TEST_DB_URL}
 * (or an embedded one); the bench (20 specimens, runs and curves) is registered through its HTTP API once.
 *
 * <pre>
 * LEDGER_TEST_DB_URL="jdbc:postgresql://127.0.0.1:5432/postgres?user=postgres" \
 *   mvn -Pbench test-compile exec:exec -Dbench.args="CertificateIssueBenchmark -f 1 -wi 10 -i 100"
 * </pre>
 * Single-shot time, one issue per iteration: 10 warm-up issues, then 100 in a row (median and the first and last
 * ten from the per-iteration lines). Each iteration's draft is made in an untimed setup.
 */
@State(Scope.Benchmark)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
public class CertificateIssueBenchmark {

    private ConfigurableApplicationContext context;
    private CertificateService certificates;
    private Map<String, Object> draftBody;
    private UUID draft;

    @Setup(Level.Trial)
    public void start() {
        // Command-line arguments, not builder properties: those are defaults, which application.yml's
        // ${LEDGER_DB_URL:} would override, sending the benchmark to the embedded database under ./var.
        context = new SpringApplicationBuilder(SpecimenLedgerApplication.class).run(
                "--ledger.db.url=" + TestDatabase.url(), "--ledger.db.user=", "--ledger.db.password=",
                "--ledger.demo=off", "--ledger.password-hash-strength=4", "--server.port=0",
                "--ledger.signing.private-key-file=target/bench-keys/private.pem",
                "--ledger.signing.public-key-file=target/bench-keys/public.pem",
                "--logging.level.root=WARN");
        int port = ((WebServerApplicationContext) context).getWebServer().getPort();
        Map<String, String> organisations = TestAccounts.ensure(context.getBean(AccountService.class), port);
        Api manager = new Api.Signed(port, TestAccounts.MANAGER, TestAccounts.PASSWORD).api();
        Api technician = new Api.Signed(port, TestAccounts.TECHNICIAN, TestAccounts.PASSWORD).api();
        CertificateBench bench = new CertificateBench(technician, manager);
        CertificateBench.Order order = bench.order(organisations.get(TestAccounts.CUSTOMER), List.of(
                CertificateBench.requirement("Rp0.2", "280", null, "MPa"),
                CertificateBench.requirement("Rm", "380", "500", "MPa")), 20);
        draftBody = Map.of("orderId", order.orderId(), "specimenIds", order.specimenIds(),
                "productDescription", "Hot-rolled round bar, 20 mm", "includeCurves", true);
        certificates = context.getBean(CertificateService.class);
    }

    /** The ledger's actor is the signed-in manager (set on the thread that runs the benchmark). */
    @Setup(Level.Iteration)
    public void newDraft() {
        SecurityContextHolder.getContext().setAuthentication(UsernamePasswordAuthenticationToken.authenticated(
                TestAccounts.MANAGER, null, List.of(new SimpleGrantedAuthority("ROLE_LAB_MANAGER"))));
        draft = certificates.createDraft(new CertificateRequests.DraftRequest(
                UUID.fromString((String) draftBody.get("orderId")),
                ((List<?>) draftBody.get("specimenIds")).stream().map(id -> UUID.fromString((String) id)).toList(),
                null, "Hot-rolled round bar, 20 mm", null, null, true, null)).id();
    }

    @Benchmark
    @BenchmarkMode(Mode.SingleShotTime)
    public CertificateView issue() {
        return certificates.issue(draft, TestAccounts.MANAGER,
                new CertificateRequests.IssueRequest(TestAccounts.PASSWORD, null, null));
    }

    @TearDown(Level.Trial)
    public void stop() {
        SecurityContextHolder.clearContext();
        context.close();
    }
}
