package org.specimenledger;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.UUID;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import org.specimenledger.testsupport.Api;
import org.specimenledger.testsupport.IntegrationTest;
import org.specimenledger.testsupport.TestAccounts;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.beans.factory.annotation.Qualifier;
import org.springframework.security.access.prepost.PreAuthorize;
import org.springframework.web.bind.annotation.RequestMethod;
import org.springframework.web.method.HandlerMethod;
import org.springframework.web.servlet.mvc.method.RequestMappingInfo;
import org.springframework.web.servlet.mvc.method.annotation.RequestMappingHandlerMapping;

/**
 * The access matrix, generated from the live route table so that a new endpoint cannot be missed:
 * every API endpoint × every role (and anonymous), each answered as the endpoint's declared roles say.
 * A role that may not call an endpoint gets 403 before anything of the request is read; a role that
 * may gets no 401/403, and a request with made-up ids and an empty body never gets a 5xx.
 */
class RouteAccessMatrixTest extends IntegrationTest {

    private static final Map<String, String> USERS = Map.of(
            "TECHNICIAN", TestAccounts.TECHNICIAN,
            "LAB_MANAGER", TestAccounts.MANAGER,
            "AUDITOR", TestAccounts.AUDITOR,
            "CUSTOMER", TestAccounts.CUSTOMER);
    private static final Pattern ROLE = Pattern.compile("'([A-Z_]+)'");

    @Autowired
    @Qualifier("requestMappingHandlerMapping")
    RequestMappingHandlerMapping mapping;

    record Endpoint(String method, String pattern, Set<String> roles, boolean anonymous, boolean multipart) {
    }

    private List<Endpoint> endpoints() {
        List<Endpoint> out = new ArrayList<>();
        for (Map.Entry<RequestMappingInfo, HandlerMethod> e : mapping.getHandlerMethods().entrySet()) {
            HandlerMethod handler = e.getValue();
            if (!handler.getBeanType().getPackageName().startsWith("org.specimenledger")) {
                continue;
            }
            PreAuthorize declared = handler.getMethodAnnotation(PreAuthorize.class);
            String expression = declared == null ? "" : declared.value();
            Set<String> roles = new LinkedHashSet<>();
            Matcher m = ROLE.matcher(expression);
            while (m.find()) {
                roles.add(m.group(1));
            }
            boolean anonymous = expression.contains("permitAll");
            if (anonymous) {
                roles.addAll(USERS.keySet());
            }
            boolean multipart = e.getKey().getConsumesCondition().getConsumableMediaTypes().stream()
                    .anyMatch(t -> t.getSubtype().equals("form-data"));
            Set<RequestMethod> methods = e.getKey().getMethodsCondition().getMethods();
            for (String pattern : e.getKey().getPatternValues()) {
                if (!pattern.startsWith("/api/")) {
                    continue; // pages have their own session-based matrix (web.PageAccessMatrixTest)
                }
                for (RequestMethod method : methods.isEmpty() ? Set.of(RequestMethod.GET) : methods) {
                    out.add(new Endpoint(method.name(), pattern, roles, anonymous, multipart));
                }
            }
        }
        return out;
    }

    @Test
    void everyEndpointAnswersEachRoleAsItsDeclarationSays() {
        List<Endpoint> endpoints = endpoints();
        assertThat(endpoints).as("the route table lists the API").hasSizeGreaterThan(10);
        Map<String, String> failures = new LinkedHashMap<>();
        for (Endpoint endpoint : endpoints) {
            String path = endpoint.pattern().replaceAll("\\{[^}]+}", UUID.randomUUID().toString());
            for (Map.Entry<String, String> user : USERS.entrySet()) {
                int status = call(as(user.getValue()), endpoint, path).status();
                boolean allowed = endpoint.roles().contains(user.getKey());
                if (allowed && (status == 401 || status == 403 || status >= 500)) {
                    failures.put(endpoint.method() + " " + endpoint.pattern() + " as " + user.getKey(),
                            "allowed, but answered " + status);
                }
                if (!allowed && status != 403) {
                    failures.put(endpoint.method() + " " + endpoint.pattern() + " as " + user.getKey(),
                            "not allowed, but answered " + status);
                }
            }
            int anonymous = call(anonymous(), endpoint, path).status();
            if (!endpoint.anonymous() && anonymous != 401) {
                failures.put(endpoint.method() + " " + endpoint.pattern() + " anonymously", "answered " + anonymous);
            }
            if (anonymous >= 500) {
                failures.put(endpoint.method() + " " + endpoint.pattern() + " anonymously", "answered " + anonymous);
            }
        }
        assertThat(failures).as("endpoints answering against their declared roles").isEmpty();
    }

    private static Api.Response call(Api api, Endpoint endpoint, String path) {
        return switch (endpoint.method()) {
            case "GET" -> api.get(path);
            case "DELETE" -> api.delete(path);
            case "POST" -> endpoint.multipart() ? api.multipart("POST", path) : api.post(path, "{}");
            case "PUT" -> endpoint.multipart() ? api.multipart("PUT", path) : api.put(path, "{}");
            default -> api.multipart(endpoint.method(), path);
        };
    }
}
