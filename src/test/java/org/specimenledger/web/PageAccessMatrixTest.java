package org.specimenledger.web;

import static org.assertj.core.api.Assertions.assertThat;

import java.net.http.HttpResponse;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.Map;
import java.util.Set;
import java.util.UUID;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import org.specimenledger.testsupport.IntegrationTest;
import org.specimenledger.testsupport.TestAccounts;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.beans.factory.annotation.Qualifier;
import org.springframework.core.MethodParameter;
import org.springframework.security.access.prepost.PreAuthorize;
import org.springframework.web.bind.annotation.RequestMethod;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.method.HandlerMethod;
import org.springframework.web.servlet.mvc.method.RequestMappingInfo;
import org.springframework.web.servlet.mvc.method.annotation.RequestMappingHandlerMapping;

/**
 * The pages' access matrix, generated from the live route table like the API's: every page handler ×
 * every role signed in through the form (and anonymous), with made-up ids and required query values,
 * and the CSRF token on writes. A role the handler does not name gets 403; a named role never gets
 * 401/403 or a 5xx; anonymous is sent to the sign-in page.
 */
class PageAccessMatrixTest extends IntegrationTest {

    private static final Map<String, String> USERS = Map.of("TECHNICIAN", TestAccounts.TECHNICIAN,
            "LAB_MANAGER", TestAccounts.MANAGER, "AUDITOR", TestAccounts.AUDITOR, "CUSTOMER", TestAccounts.CUSTOMER);
    private static final Pattern ROLE = Pattern.compile("'([A-Z_]+)'");

    @Autowired
    @Qualifier("requestMappingHandlerMapping")
    RequestMappingHandlerMapping mapping;

    @Test
    void everyPageAnswersEachRoleAsItsDeclarationSays() {
        Map<String, PageSession> sessions = new LinkedHashMap<>();
        USERS.forEach((role, user) -> {
            PageSession s = new PageSession(port);
            s.signIn(user, TestAccounts.PASSWORD);
            sessions.put(role, s);
        });
        Map<String, String> failures = new LinkedHashMap<>();
        int pages = 0;
        for (Map.Entry<RequestMappingInfo, HandlerMethod> e : mapping.getHandlerMethods().entrySet()) {
            HandlerMethod handler = e.getValue();
            if (!handler.getBeanType().getPackageName().equals("org.specimenledger.web")) {
                continue;
            }
            String expression = handler.getMethodAnnotation(PreAuthorize.class).value();
            if (expression.contains("permitAll")) {
                continue;
            }
            Set<String> roles = new LinkedHashSet<>();
            Matcher m = ROLE.matcher(expression);
            while (m.find()) {
                roles.add(m.group(1));
            }
            String query = requiredQuery(handler);
            for (String pattern : e.getKey().getPatternValues()) {
                String path = pattern.replaceAll("\\{[^}]+}", UUID.randomUUID().toString()) + query;
                for (RequestMethod method : e.getKey().getMethodsCondition().getMethods()) {
                    pages++;
                    for (Map.Entry<String, PageSession> user : sessions.entrySet()) {
                        int status = call(user.getValue(), method, path).statusCode();
                        boolean allowed = roles.contains(user.getKey());
                        String key = method + " " + pattern + " as " + user.getKey();
                        if (allowed && (status == 401 || status == 403 || status >= 500)) {
                            failures.put(key, "allowed, but answered " + status);
                        }
                        if (!allowed && status != 403) {
                            failures.put(key, "not allowed, but answered " + status);
                        }
                    }
                    HttpResponse<String> anonymous = call(new PageSession(port), method, path);
                    if (method == RequestMethod.GET && (anonymous.statusCode() != 302
                            || !anonymous.headers().firstValue("Location").orElse("").endsWith("/sign-in"))) {
                        failures.put(method + " " + pattern + " anonymously", "answered " + anonymous.statusCode());
                    }
                    if (anonymous.statusCode() >= 500) {
                        failures.put(method + " " + pattern + " anonymously", "answered " + anonymous.statusCode());
                    }
                }
            }
        }
        assertThat(pages).as("the route table lists the pages").isGreaterThan(8);
        assertThat(failures).as("pages answering against their declared roles").isEmpty();
    }

    private static String requiredQuery(HandlerMethod handler) {
        StringBuilder q = new StringBuilder();
        for (MethodParameter p : handler.getMethodParameters()) {
            RequestParam rp = p.getParameterAnnotation(RequestParam.class);
            if (rp != null && rp.required() && rp.defaultValue().equals(org.springframework.web.bind.annotation.ValueConstants.DEFAULT_NONE)
                    && p.getParameterType() == UUID.class) {
                String name = rp.value().isEmpty() ? rp.name() : rp.value();
                if (name.isEmpty()) {
                    p.initParameterNameDiscovery(new org.springframework.core.DefaultParameterNameDiscoverer());
                    name = p.getParameterName();
                }
                q.append(q.isEmpty() ? '?' : '&').append(name).append('=').append(UUID.randomUUID());
            }
        }
        return q.toString();
    }

    private static HttpResponse<String> call(PageSession s, RequestMethod method, String path) {
        return switch (method) {
            case GET -> s.get(path);
            case PUT -> s.put(path, "", token(s));
            default -> s.postForm(path, Map.of("_csrf", token(s)));
        };
    }

    private static String token(PageSession s) {
        try {
            return s.csrfToken("/sign-in");
        } catch (IllegalStateException e) {
            return "none";
        }
    }
}
