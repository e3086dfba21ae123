package org.specimenledger.accounts;

import java.util.Optional;
import org.springframework.stereotype.Component;
import org.springframework.transaction.annotation.Transactional;

/** What other features may ask of accounts, by username: who a named operator is and whether they may work. */
@Component
public class AccountDirectory {

    private final AccountRepository accounts;

    AccountDirectory(AccountRepository accounts) {
        this.accounts = accounts;
    }

    @Transactional(readOnly = true)
    public Optional<AccountView> findByUsername(String username) {
        return username == null ? Optional.empty() : accounts.findByUsername(username).map(AccountView::of);
    }
}
