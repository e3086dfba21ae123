package org.specimenledger.shared;

import java.util.Optional;
import java.util.UUID;
import org.springframework.security.core.Authentication;
import org.springframework.security.core.context.SecurityContextHolder;

/** The signed-in user of the current request, if any. */
public final class CurrentUser {

    private CurrentUser() {
    }

    public static Optional<SignedInUser> get() {
        Authentication auth = SecurityContextHolder.getContext().getAuthentication();
        if (auth != null && auth.getPrincipal() instanceof SignedInUser.Holder holder) {
            return Optional.of(holder.signedInUser());
        }
        return Optional.empty();
    }

    /**
     * The organisation a customer is confined to; empty for laboratory roles (and for system work),
     * which see all organisations.
     */
    public static Optional<UUID> customerOrganisation() {
        return get().filter(SignedInUser::isCustomer).map(SignedInUser::organisationId);
    }
}
