package org.specimenledger.testsupport;

import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.test.context.DynamicPropertyRegistry;
import org.springframework.test.context.DynamicPropertySource;

/**
 * Base of the full-stack tests: the whole service on a random port, real HTTP, a real PostgreSQL with
 * the real migrations applied and {@code ddl-auto=validate}. One application context (and database) is
 * shared by all subclasses, so tests make their own uniquely named records and never rely on others.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT,
        properties = {"ledger.demo=off", "ledger.password-hash-strength=4", "ledger.curves.warm-up=false", "logging.level.org.springframework.security=WARN"})
public abstract class IntegrationTest {

    @LocalServerPort
    protected int port;

    @DynamicPropertySource
    static void database(DynamicPropertyRegistry registry) {
        registry.add("ledger.db.url", TestDatabase::url);
        registry.add("ledger.db.user", () -> "");
        registry.add("ledger.db.password", () -> "");
    }

    @org.springframework.beans.factory.annotation.Autowired
    private org.specimenledger.accounts.AccountService accountService;

    /** {customer username → organisation id} of the two test organisations. */
    protected java.util.Map<String, String> organisations;

    @org.junit.jupiter.api.BeforeEach
    void ensureAccounts() {
        organisations = TestAccounts.ensure(accountService, port);
    }

    protected Api as(String username) {
        return new Api(port, username, TestAccounts.PASSWORD);
    }

    protected Api anonymous() {
        return new Api(port, null, null);
    }
}
