package org.specimenledger.accounts;

import io.swagger.v3.oas.annotations.Operation;
import jakarta.validation.Valid;
import jakarta.validation.constraints.Size;
import java.util.List;
import java.util.UUID;
import org.specimenledger.shared.Access;
import org.springframework.http.HttpStatus;
import org.springframework.security.access.prepost.PreAuthorize;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestBody;
import org.springframework.web.bind.annotation.RequestMapping;
import org.springframework.web.bind.annotation.ResponseStatus;
import org.springframework.web.bind.annotation.RestController;

/** Accounts: the manager opens and disables them; everyone can see their own. */
@RestController
@RequestMapping("/api/v1/accounts")
class AccountController {

    private final AccountService service;

    AccountController(AccountService service) {
        this.service = service;
    }

    @PostMapping
    @ResponseStatus(HttpStatus.CREATED)
    @PreAuthorize(Access.MANAGER)
    @Operation(summary = "Open an account with one role")
    AccountView open(@Valid @RequestBody AccountService.NewAccount request) {
        return service.open(request);
    }

    @GetMapping
    @PreAuthorize(Access.MANAGER)
    List<AccountView> list() {
        return service.list();
    }

    @GetMapping("/me")
    @PreAuthorize(Access.ANY_SIGNED_IN)
    @Operation(summary = "The signed-in account")
    AccountView me() {
        return service.me();
    }

    record Disabling(@Size(max = 2000) String reason) {
    }

    @PostMapping("/{id}/disable")
    @PreAuthorize(Access.MANAGER)
    @Operation(summary = "Disable an account (reason required); accounts are never deleted")
    AccountView disable(@PathVariable UUID id, @Valid @RequestBody Disabling request) {
        return service.disable(id, request.reason());
    }
}
