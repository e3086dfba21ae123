package org.specimenledger.web;

import org.specimenledger.shared.Access;
import org.specimenledger.shared.CurrentUser;
import org.specimenledger.shared.SignedInUser;
import org.springframework.security.access.prepost.PreAuthorize;
import org.springframework.stereotype.Controller;
import org.springframework.web.bind.annotation.GetMapping;

/** Sign-in, and the start page of each role. */
@Controller
class StartPages {

    @GetMapping("/sign-in")
    @PreAuthorize("permitAll()")
    String signIn() {
        return "sign-in";
    }

    /** Sends each person to their role's start page. */
    @GetMapping("/")
    @PreAuthorize(Access.ANY_SIGNED_IN)
    String start() {
        SignedInUser me = CurrentUser.get().orElseThrow();
        return "redirect:" + Navigation.startOf(me.role());
    }

    @GetMapping("/audit-desk")
    @PreAuthorize("hasRole('AUDITOR')")
    String auditDesk() {
        return "audit-desk";
    }
}
