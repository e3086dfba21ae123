package org.specimenledger.accounts;

import jakarta.validation.constraints.NotBlank;
import jakarta.validation.constraints.NotNull;
import jakarta.validation.constraints.Pattern;
import jakarta.validation.constraints.Size;
import java.time.Clock;
import java.util.List;
import java.util.UUID;
import org.specimenledger.audit.Ledger;
import org.specimenledger.customers.CustomerDirectory;
import org.specimenledger.shared.ChangeReason;
import org.specimenledger.shared.CurrentUser;
import org.specimenledger.shared.DuplicateRecord;
import org.specimenledger.shared.RecordNotFound;
import org.specimenledger.shared.Role;
import org.specimenledger.shared.RuleViolation;
import org.specimenledger.shared.SignedInUser;
import org.springframework.security.crypto.password.PasswordEncoder;
import org.springframework.stereotype.Service;
import org.springframework.transaction.annotation.Transactional;

/** Opens and closes accounts; the lab manager does this, and each change is in the ledger. */
@Service
public class AccountService {

    private final AccountRepository accounts;
    private final CustomerDirectory customers;
    private final PasswordEncoder passwords;
    private final Ledger ledger;
    private final Clock clock;

    AccountService(AccountRepository accounts, CustomerDirectory customers, PasswordEncoder passwords, Ledger ledger,
            Clock clock) {
        this.accounts = accounts;
        this.customers = customers;
        this.passwords = passwords;
        this.ledger = ledger;
        this.clock = clock;
    }

    /**
     * A new account. A customer account must name an existing organisation; laboratory accounts must not.
     *
     * @param password at least 12 characters (NIST SP 800-63B asks for at least 8; we ask more)
     */
    public record NewAccount(
            @NotBlank @Size(max = 64) @Pattern(regexp = "[A-Za-z0-9._@-]+",
                    message = "may contain only letters, digits and . _ @ -") String username,
            @NotBlank @Size(max = 200) String displayName,
            @NotNull @Size(min = 12, max = 200) String password,
            @NotNull Role role,
            UUID organisationId) {
    }

    @Transactional
    public AccountView open(NewAccount request) {
        if (request.role() == Role.CUSTOMER && request.organisationId() == null) {
            throw new RuleViolation("/organisationId", "a customer account needs the organisation it belongs to");
        }
        if (request.role() != Role.CUSTOMER && request.organisationId() != null) {
            throw new RuleViolation("/organisationId", "only customer accounts belong to an organisation");
        }
        if (request.organisationId() != null && !customers.customerExists(request.organisationId())) {
            throw new RuleViolation("/organisationId", "no customer with id " + request.organisationId());
        }
        if (accounts.existsByUsername(request.username())) {
            throw new DuplicateRecord("/username", "username '" + request.username() + "' is taken");
        }
        Account account = accounts.saveAndFlush(new Account(request.username(), request.displayName().trim(),
                passwords.encode(request.password()), request.role(), request.organisationId(), clock.instant()));
        AccountView view = AccountView.of(account);
        ledger.record("account.opened", "account", account.id(), null, null, view);
        return view;
    }

    @Transactional
    AccountView disable(UUID id, String reason) {
        String why = ChangeReason.required(reason);
        Account account = accounts.findById(id).orElseThrow(() -> new RecordNotFound("account", id));
        AccountView before = AccountView.of(account);
        account.disable();
        accounts.saveAndFlush(account);
        AccountView after = AccountView.of(account);
        ledger.record("account.disabled", "account", id, why, before, after);
        return after;
    }

    @Transactional(readOnly = true)
    List<AccountView> list() {
        return accounts.findAllByOrderByUsernameAsc().stream().map(AccountView::of).toList();
    }

    @Transactional(readOnly = true)
    AccountView me() {
        SignedInUser user = CurrentUser.get().orElseThrow(() -> new RecordNotFound("account", "current"));
        return accounts.findById(user.accountId()).map(AccountView::of)
                .orElseThrow(() -> new RecordNotFound("account", user.accountId()));
    }

    /** Whether any account exists yet (the demo seeding runs only on an empty register). */
    @Transactional(readOnly = true)
    public boolean anyAccount() {
        return accounts.count() > 0;
    }
}
