package org.specimenledger.accounts;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.HashMap;
import java.util.Map;
import java.util.UUID;
import org.junit.jupiter.api.Test;
import org.specimenledger.testsupport.Api;
import org.specimenledger.testsupport.IntegrationTest;
import org.specimenledger.testsupport.TestAccounts;

class AccountsApiTest extends IntegrationTest {

    private Map<String, Object> account(String username, String role, String organisation) {
        Map<String, Object> body = new HashMap<>();
        body.put("username", username);
        body.put("displayName", "Someone");
        body.put("password", "a-long-enough-password");
        body.put("role", role);
        body.put("organisationId", organisation);
        return body;
    }

    private Api manager() {
        return as(TestAccounts.MANAGER);
    }

    @Test
    void managerOpensAnAccountThatCanSignIn() {
        String name = "tech-" + UUID.randomUUID().toString().substring(0, 8);
        Api.Response r = manager().post("/api/v1/accounts", account(name, "TECHNICIAN", null));
        assertThat(r.status()).as(r.toString()).isEqualTo(201);
        assertThat(r.body()).doesNotContain("password");
        Api.Response me = new Api.Signed(port, name, "a-long-enough-password").api().get("/api/v1/accounts/me");
        assertThat(me.status()).isEqualTo(200);
        assertThat(me.text("role")).isEqualTo("TECHNICIAN");
    }

    @Test
    void unknownRoleIsA400NamingTheFieldAndTheAllowedRoles() {
        Api.Response r = manager().post("/api/v1/accounts", account("x-" + UUID.randomUUID(), "OVERLORD", null));
        assertThat(r.status()).isEqualTo(400);
        assertThat(r.body()).contains("/role").contains("OVERLORD").contains("LAB_MANAGER");
    }

    @Test
    void ruleBreakingAccountsAreRefusedAndNothingIsStored() {
        String name = "c-" + UUID.randomUUID().toString().substring(0, 8);
        Api.Response noOrganisation = manager().post("/api/v1/accounts", account(name, "CUSTOMER", null));
        assertThat(noOrganisation.status()).isEqualTo(422);
        assertThat(noOrganisation.body()).contains("/organisationId");
        Api.Response unknownOrganisation = manager().post("/api/v1/accounts",
                account(name, "CUSTOMER", UUID.randomUUID().toString()));
        assertThat(unknownOrganisation.status()).isEqualTo(422);
        Map<String, Object> shortPassword = account(name, "AUDITOR", null);
        shortPassword.put("password", "short");
        Api.Response weak = manager().post("/api/v1/accounts", shortPassword);
        assertThat(weak.status()).isEqualTo(422);
        assertThat(weak.body()).contains("/password");
        assertThat(manager().post("/api/v1/accounts", account(TestAccounts.AUDITOR, "AUDITOR", null)).status())
                .isEqualTo(409);
        assertThat(manager().get("/api/v1/accounts").body()).doesNotContain(name);
    }

    @Test
    void disablingNeedsAReasonAndStopsSignIn() {
        String name = "gone-" + UUID.randomUUID().toString().substring(0, 8);
        String id = manager().post("/api/v1/accounts", account(name, "TECHNICIAN", null)).id();
        assertThat(manager().post("/api/v1/accounts/" + id + "/disable", Map.of()).status()).isEqualTo(422);
        assertThat(manager().post("/api/v1/accounts/" + id + "/disable", Map.of("reason", "left the laboratory"))
                .status()).isEqualTo(200);
        Api.Response signIn = new Api.Signed(port, name, "a-long-enough-password").api().get("/api/v1/accounts/me");
        assertThat(signIn.status()).isEqualTo(401);
    }
}
