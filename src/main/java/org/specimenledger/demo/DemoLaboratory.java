package org.specimenledger.demo;

import java.util.List;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.specimenledger.accounts.AccountService;
import org.specimenledger.system.DatabaseMode;
import org.springframework.beans.factory.annotation.Value;
import org.springframework.boot.ApplicationArguments;
import org.springframework.boot.ApplicationRunner;
import org.springframework.security.authentication.UsernamePasswordAuthenticationToken;
import org.springframework.security.core.authority.SimpleGrantedAuthority;
import org.springframework.security.core.context.SecurityContextHolder;
import org.springframework.stereotype.Component;
import org.springframework.transaction.support.TransactionTemplate;

/**
 * Seeds the invented demo laboratory on the first start of the embedded mode (or when
 * {@code LEDGER_DEMO=on}), in one transaction through the ordinary services, so the ledger records
 * every seeded record like any other write, by the actor {@code demo-seed}. A register that already
 * has accounts is never touched.
 */
@Component
class DemoLaboratory implements ApplicationRunner {

    private static final Logger log = LoggerFactory.getLogger(DemoLaboratory.class);
    static final String ACTOR = "demo-seed";

    private final String mode;
    private final DatabaseMode databaseMode;
    private final AccountService accounts;
    private final DemoRecords records;
    private final TransactionTemplate transaction;

    DemoLaboratory(@Value("${ledger.demo:auto}") String mode, DatabaseMode databaseMode, AccountService accounts,
            DemoRecords records, TransactionTemplate transaction) {
        this.mode = mode;
        this.databaseMode = databaseMode;
        this.accounts = accounts;
        this.records = records;
        this.transaction = transaction;
    }

    boolean enabled() {
        return switch (mode.trim().toLowerCase()) {
            case "on", "true" -> true;
            case "off", "false" -> false;
            default -> databaseMode == DatabaseMode.EMBEDDED;
        };
    }

    @Override
    public void run(ApplicationArguments args) {
        if (!enabled() || accounts.anyAccount()) {
            return;
        }
        SecurityContextHolder.getContext().setAuthentication(UsernamePasswordAuthenticationToken.authenticated(
                ACTOR, null, List.of(new SimpleGrantedAuthority("ROLE_SYSTEM"))));
        try {
            transaction.executeWithoutResult(status -> records.seed());
            log.info("Seeded the demo laboratory; sign in as demo-technician, demo-manager, demo-auditor, "
                    + "demo-customer or demo-customer-2 with the password '{}'", DemoRecords.PASSWORD);
        } finally {
            SecurityContextHolder.clearContext();
        }
    }
}
