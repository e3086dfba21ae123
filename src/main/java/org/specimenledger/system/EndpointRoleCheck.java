package org.specimenledger.system;

import jakarta.servlet.http.HttpServletRequest;
import jakarta.servlet.http.HttpServletResponse;
import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;
import org.springframework.context.annotation.Configuration;
import org.springframework.security.access.AccessDeniedException;
import org.springframework.security.access.prepost.PreAuthorize;
import org.springframework.security.authorization.AuthorizationResult;
import org.springframework.security.core.context.SecurityContextHolder;
import org.springframework.security.web.access.expression.WebExpressionAuthorizationManager;
import org.springframework.security.web.access.intercept.RequestAuthorizationContext;
import org.springframework.web.method.HandlerMethod;
import org.springframework.web.servlet.HandlerInterceptor;
import org.springframework.web.servlet.config.annotation.InterceptorRegistry;
import org.springframework.web.servlet.config.annotation.WebMvcConfigurer;

/**
 * Checks an endpoint's declared roles before its arguments are read. Method security alone would
 * first bind and validate the request body, so a role that may not call the endpoint at all would be
 * told about field errors (422) instead of being refused (403). Method security stays on as a second
 * line behind this check.
 */
@Configuration(proxyBeanMethods = false)
class EndpointRoleCheck implements WebMvcConfigurer, HandlerInterceptor {

    private final Map<HandlerMethodKey, WebExpressionAuthorizationManager> managers = new ConcurrentHashMap<>();

    @Override
    public void addInterceptors(InterceptorRegistry registry) {
        registry.addInterceptor(this);
    }

    @Override
    public boolean preHandle(HttpServletRequest request, HttpServletResponse response, Object handler) {
        if (!(handler instanceof HandlerMethod method)) {
            return true;
        }
        PreAuthorize declared = method.getMethodAnnotation(PreAuthorize.class);
        if (declared == null) {
            return true; // the architecture test makes every handler declare one
        }
        WebExpressionAuthorizationManager manager = managers.computeIfAbsent(
                new HandlerMethodKey(method.getBeanType(), method.getMethod().toGenericString()),
                k -> new WebExpressionAuthorizationManager(declared.value()));
        AuthorizationResult result = manager.authorize(
                () -> SecurityContextHolder.getContext().getAuthentication(), new RequestAuthorizationContext(request));
        if (result != null && !result.isGranted()) {
            throw new AccessDeniedException("role not allowed for " + request.getMethod() + " " + request.getRequestURI());
        }
        return true;
    }

    private record HandlerMethodKey(Class<?> type, String signature) {
    }
}
