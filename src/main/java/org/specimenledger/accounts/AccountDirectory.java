package org.specimenledger.accounts;

import java.util.Optional;
import org.springframework.security.crypto.password.PasswordEncoder;
import org.springframework.stereotype.Component;
import org.springframework.transaction.annotation.Transactional;

/** What other features may ask of accounts, by username: who a named operator is and whether they may work. */
@Component
public class AccountDirectory {

    private final AccountRepository accounts;
    private final PasswordEncoder passwords;

    AccountDirectory(AccountRepository accounts, PasswordEncoder passwords) {
        this.accounts = accounts;
        this.passwords = passwords;
    }

    /**
     * Whether {@code rawPassword} is the password of the enabled account {@code username}, checked with the
     * configured encoder: the certificates feature uses it for the signature at issue (the password re-entered).
     */
    @Transactional(readOnly = true)
    public boolean passwordMatches(String username, String rawPassword) {
        if (username == null || rawPassword == null) {
            return false;
        }
        return accounts.findByUsername(username).filter(Account::enabled)
                .map(a -> passwords.matches(rawPassword, a.passwordHash())).orElse(false);
    }

    @Transactional(readOnly = true)
    public Optional<AccountView> findByUsername(String username) {
        return username == null ? Optional.empty() : accounts.findByUsername(username).map(AccountView::of);
    }
}
