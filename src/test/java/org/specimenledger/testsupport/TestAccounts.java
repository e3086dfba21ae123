package org.specimenledger.testsupport;

import java.util.Map;
import java.util.UUID;
import org.specimenledger.accounts.AccountService;
import org.specimenledger.shared.Role;
import org.springframework.security.authentication.UsernamePasswordAuthenticationToken;
import org.springframework.security.core.authority.SimpleGrantedAuthority;
import org.springframework.security.core.context.SecurityContextHolder;

/**
 * One account per role, and two customer organisations with one customer account each, made once per
 * test run through the real services (not the demo data). The first manager is opened directly, as an
 * operator would on a new installation; everything else goes through the HTTP API.
 */
public final class TestAccounts {

    public static final String PASSWORD = "test-password-long-enough";
    public static final String TECHNICIAN = "t-technician";
    public static final String MANAGER = "t-manager";
    public static final String AUDITOR = "t-auditor";
    public static final String CUSTOMER = "t-customer";
    public static final String OTHER_CUSTOMER = "t-customer-other";

    private static volatile Map<String, String> organisations;

    private TestAccounts() {
    }

    /** Ensures the accounts exist; returns {customer username → organisation id}. */
    public static synchronized Map<String, String> ensure(AccountService accounts, int port) {
        if (organisations != null) {
            return organisations;
        }
        SecurityContextHolder.getContext().setAuthentication(UsernamePasswordAuthenticationToken.authenticated(
                "test-setup", null, java.util.List.of(new SimpleGrantedAuthority("ROLE_SYSTEM"))));
        try {
            accounts.open(new AccountService.NewAccount(MANAGER, "Test Manager", PASSWORD, Role.LAB_MANAGER, null));
        } finally {
            SecurityContextHolder.clearContext();
        }
        Api manager = new Api(port, MANAGER, PASSWORD);
        open(manager, TECHNICIAN, Role.TECHNICIAN, null);
        open(manager, AUDITOR, Role.AUDITOR, null);
        String orgA = manager.post("/api/v1/customers", Map.of("name", "Test Organisation A " + UUID.randomUUID(),
                "address", "1 Test Street")).id();
        String orgB = manager.post("/api/v1/customers", Map.of("name", "Test Organisation B " + UUID.randomUUID(),
                "address", "2 Test Street")).id();
        open(manager, CUSTOMER, Role.CUSTOMER, orgA);
        open(manager, OTHER_CUSTOMER, Role.CUSTOMER, orgB);
        organisations = Map.of(CUSTOMER, orgA, OTHER_CUSTOMER, orgB);
        return organisations;
    }

    private static void open(Api manager, String username, Role role, String organisation) {
        var body = new java.util.HashMap<String, Object>();
        body.put("username", username);
        body.put("displayName", username);
        body.put("password", PASSWORD);
        body.put("role", role.name());
        body.put("organisationId", organisation);
        Api.Response r = manager.post("/api/v1/accounts", body);
        if (r.status() != 201) {
            throw new IllegalStateException("could not open test account " + username + ": " + r);
        }
    }
}
