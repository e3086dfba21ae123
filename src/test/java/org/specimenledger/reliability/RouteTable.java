package org.specimenledger.reliability;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.springframework.web.bind.annotation.RequestMethod;
import org.springframework.web.method.HandlerMethod;
import org.springframework.web.servlet.mvc.method.RequestMappingInfo;
import org.springframework.web.servlet.mvc.method.annotation.RequestMappingHandlerMapping;

/** The service's own HTTP endpoints as the running application maps them, in a stable order. */
final class RouteTable {

    /** One method on one path pattern, with the handler that answers it. */
    record Route(String method, String pattern, HandlerMethod handler, boolean multipart) {
    }

    private final List<Route> routes;

    private RouteTable(List<Route> routes) {
        this.routes = routes;
    }

    static RouteTable of(RequestMappingHandlerMapping mapping) {
        List<Route> out = new ArrayList<>();
        for (Map.Entry<RequestMappingInfo, HandlerMethod> e : mapping.getHandlerMethods().entrySet()) {
            HandlerMethod handler = e.getValue();
            if (!handler.getBeanType().getPackageName().startsWith("org.specimenledger")) {
                continue;
            }
            boolean multipart = e.getKey().getConsumesCondition().getConsumableMediaTypes().stream()
                    .anyMatch(t -> t.getSubtype().equals("form-data"));
            Set<RequestMethod> methods = e.getKey().getMethodsCondition().getMethods();
            for (String pattern : e.getKey().getPatternValues()) {
                for (RequestMethod method : methods.isEmpty() ? Set.of(RequestMethod.GET) : methods) {
                    out.add(new Route(method.name(), pattern, handler, multipart));
                }
            }
        }
        out.sort(Comparator.comparing(Route::pattern).thenComparing(Route::method));
        return new RouteTable(List.copyOf(out));
    }

    /** Every route of the service. */
    List<Route> api() {
        return routes;
    }
}
