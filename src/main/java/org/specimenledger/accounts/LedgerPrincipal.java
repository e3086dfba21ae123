package org.specimenledger.accounts;

import java.util.Collection;
import java.util.List;
import org.specimenledger.shared.SignedInUser;
import org.springframework.security.core.GrantedAuthority;
import org.springframework.security.core.authority.SimpleGrantedAuthority;
import org.springframework.security.core.userdetails.UserDetails;

/** The signed-in account as Spring Security holds it. */
final class LedgerPrincipal implements UserDetails, SignedInUser.Holder {

    private final SignedInUser user;
    private final String passwordHash;
    private final boolean enabled;

    LedgerPrincipal(Account account) {
        this.user = new SignedInUser(account.id(), account.username(), account.role(), account.organisationId());
        this.passwordHash = account.passwordHash();
        this.enabled = account.enabled();
    }

    @Override
    public SignedInUser signedInUser() {
        return user;
    }

    @Override
    public Collection<? extends GrantedAuthority> getAuthorities() {
        return List.of(new SimpleGrantedAuthority(user.role().authority()));
    }

    @Override
    public String getPassword() {
        return passwordHash;
    }

    @Override
    public String getUsername() {
        return user.username();
    }

    @Override
    public boolean isEnabled() {
        return enabled;
    }
}
