package org.specimenledger.web;

import jakarta.validation.ConstraintViolation;
import jakarta.validation.Validator;
import java.util.Comparator;
import java.util.List;
import org.specimenledger.shared.FieldIssue;
import org.springframework.stereotype.Component;

/**
 * The bean-validation constraints the API checks on its request bodies, applied to the requests the
 * pages build, so that a form meets exactly the checks an API call meets (the feature rules follow).
 */
@Component
class RequestChecks {

    private final Validator validator;

    RequestChecks(Validator validator) {
        this.validator = validator;
    }

    /** The constraint violations of a request, as problems at JSON Pointers. */
    List<FieldIssue> of(Object request) {
        return validator.validate(request).stream()
                .map(v -> new FieldIssue(pointer(v), v.getMessage()))
                .sorted(Comparator.comparing(FieldIssue::pointer))
                .toList();
    }

    private static String pointer(ConstraintViolation<?> v) {
        String path = v.getPropertyPath().toString().replaceAll("\\[(\\d*)]", "/$1").replace('.', '/');
        return "/" + path.replace("<map value>", "").replace("<list element>", "");
    }
}
