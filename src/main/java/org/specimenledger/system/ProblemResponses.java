package org.specimenledger.system;

import jakarta.validation.ConstraintViolationException;
import java.net.URI;
import java.util.ArrayList;
import java.util.List;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.specimenledger.analysis.AnalysisRejected;
import org.specimenledger.curve.CurveRejected;
import org.specimenledger.shared.DuplicateRecord;
import org.specimenledger.shared.FieldIssue;
import org.specimenledger.shared.RecordNotFound;
import org.specimenledger.shared.RuleViolation;
import org.specimenledger.shared.StateConflict;
import org.springframework.dao.DataIntegrityViolationException;
import org.springframework.http.HttpHeaders;
import org.springframework.http.HttpStatus;
import org.springframework.http.HttpStatusCode;
import org.springframework.http.ProblemDetail;
import org.springframework.http.ResponseEntity;
import org.springframework.http.converter.HttpMessageNotReadableException;
import org.springframework.security.access.AccessDeniedException;
import org.springframework.web.bind.MethodArgumentNotValidException;
import org.springframework.web.bind.annotation.ExceptionHandler;
import org.springframework.web.bind.annotation.RestControllerAdvice;
import org.springframework.web.context.request.WebRequest;
import org.springframework.web.method.annotation.HandlerMethodValidationException;
import org.springframework.web.method.annotation.MethodArgumentTypeMismatchException;
import org.springframework.web.multipart.MultipartException;
import org.springframework.web.servlet.mvc.method.annotation.ResponseEntityExceptionHandler;
import tools.jackson.core.JacksonException;
import tools.jackson.databind.exc.InvalidFormatException;
import tools.jackson.databind.exc.UnrecognizedPropertyException;

/**
 * Maps every failure to an RFC 9457 problem response once, here. Client mistakes are 4xx and name the
 * field (as a JSON Pointer into the body) or the rule; only a fault of our own is a 500, and its body
 * says nothing of the internals.
 */
@RestControllerAdvice
class ProblemResponses extends ResponseEntityExceptionHandler {

    private static final Logger log = LoggerFactory.getLogger(ProblemResponses.class);
    static final String TYPE_PREFIX = "urn:specimen-ledger:problem:";

    static ProblemDetail problem(HttpStatus status, String slug, String title, String detail) {
        ProblemDetail problem = ProblemDetail.forStatusAndDetail(status, detail);
        problem.setType(URI.create(TYPE_PREFIX + slug));
        problem.setTitle(title);
        return problem;
    }

    static ProblemDetail withIssues(ProblemDetail problem, List<FieldIssue> issues) {
        problem.setProperty("errors", issues);
        return problem;
    }

    @ExceptionHandler(RecordNotFound.class)
    ProblemDetail notFound(RecordNotFound e) {
        return problem(HttpStatus.NOT_FOUND, "not-found", "Record not found", e.getMessage());
    }

    @ExceptionHandler(DuplicateRecord.class)
    ProblemDetail duplicate(DuplicateRecord e) {
        return withIssues(problem(HttpStatus.CONFLICT, "duplicate", "Record already exists", e.getMessage()),
                List.of(new FieldIssue(e.pointer(), e.getMessage())));
    }

    @ExceptionHandler(StateConflict.class)
    ProblemDetail stateConflict(StateConflict e) {
        return problem(HttpStatus.CONFLICT, "state-conflict", "Not allowed in the current state", e.getMessage());
    }

    @ExceptionHandler(RuleViolation.class)
    ProblemDetail ruleViolation(RuleViolation e) {
        return withIssues(problem(HttpStatus.UNPROCESSABLE_CONTENT, "rule-violated", "Request breaks a rule",
                e.getMessage()), e.issues());
    }

    /** A raw curve file the reader refused: the problem names the line and column in the file. */
    @ExceptionHandler(CurveRejected.class)
    ProblemDetail curveRejected(CurveRejected e) {
        ProblemDetail problem = problem(HttpStatus.UNPROCESSABLE_CONTENT, "curve-rejected", "Curve file refused",
                e.getMessage());
        problem.setProperty("line", e.line());
        problem.setProperty("column", e.column());
        problem.setProperty("reason", e.reason());
        return withIssues(problem, List.of(new FieldIssue("curve", e.getMessage())));
    }

    /** Arrays or geometry the analysis cannot work with (too few points, NaN...). */
    @ExceptionHandler(AnalysisRejected.class)
    ProblemDetail analysisRejected(AnalysisRejected e) {
        return problem(HttpStatus.UNPROCESSABLE_CONTENT, "analysis-rejected", "Curve cannot be analysed",
                e.getMessage());
    }

    @ExceptionHandler(ConstraintViolationException.class)
    ProblemDetail constraintViolation(ConstraintViolationException e) {
        List<FieldIssue> issues = e.getConstraintViolations().stream()
                .map(v -> new FieldIssue(pointerOf(v.getPropertyPath().toString()), v.getMessage()))
                .toList();
        return withIssues(problem(HttpStatus.UNPROCESSABLE_CONTENT, "validation", "Invalid request",
                issues.isEmpty() ? "invalid request" : issues.get(0).pointer() + " " + issues.get(0).detail()), issues);
    }

    @ExceptionHandler(MethodArgumentTypeMismatchException.class)
    ProblemDetail typeMismatch(MethodArgumentTypeMismatchException e) {
        String detail = "parameter '" + e.getName() + "' has an invalid value '" + e.getValue() + "'";
        return withIssues(problem(HttpStatus.BAD_REQUEST, "malformed", "Malformed request", detail),
                List.of(new FieldIssue(e.getName(), detail)));
    }

    /** A multipart body that cannot be parsed (broken boundary, a control character in a part header). */
    @ExceptionHandler(MultipartException.class)
    ProblemDetail malformedMultipart(MultipartException e) {
        log.info("Malformed multipart request: {}", e.getMessage());
        return problem(HttpStatus.BAD_REQUEST, "malformed", "Malformed request",
                "the multipart body could not be read; check the boundary and each part's headers and file name");
    }

    @ExceptionHandler(AccessDeniedException.class)
    ProblemDetail accessDenied(AccessDeniedException e) {
        return problem(HttpStatus.FORBIDDEN, "forbidden", "Not allowed for your role",
                "your role may not do this");
    }

    /** A constraint the service did not check first (a race between two requests): still the client's 409. */
    @ExceptionHandler(DataIntegrityViolationException.class)
    ProblemDetail integrity(DataIntegrityViolationException e) {
        log.info("Database constraint refused a write: {}", e.getMostSpecificCause().getMessage());
        return problem(HttpStatus.CONFLICT, "conflict", "Conflicts with stored data",
                "the request conflicts with a record stored at the same time; reload and try again");
    }

    @ExceptionHandler(Exception.class)
    ResponseEntity<ProblemDetail> unexpected(Exception e) {
        if (databaseUnreachable(e)) {
            // not our bug and not the client's: the database is restarting or the network to it is down.
            // Nothing was stored (the transaction did not commit); the client may safely send it again.
            log.warn("Database unreachable: {}", e.getMessage());
            return ResponseEntity.status(HttpStatus.SERVICE_UNAVAILABLE).header(HttpHeaders.RETRY_AFTER, "5")
                    .body(problem(HttpStatus.SERVICE_UNAVAILABLE, "unavailable", "Temporarily unavailable",
                            "the database cannot be reached just now; nothing was stored; try again in a few seconds"));
        }
        log.error("Unexpected failure", e);
        return ResponseEntity.status(HttpStatus.INTERNAL_SERVER_ERROR).body(problem(HttpStatus.INTERNAL_SERVER_ERROR,
                "internal", "Internal error", "the service failed; the failure is logged"));
    }

    /**
     * A lost or refused database connection: Spring's resource-failure exceptions, JDBC's connection
     * exception types, the pool's "Connection is closed", or anywhere in the cause chain a SQL state of class
     * 08 (connection exception) or 57P (operator intervention: the server is shutting down or restarting).
     */
    static boolean databaseUnreachable(Throwable e) {
        for (Throwable t = e; t != null; t = t.getCause()) {
            if (t instanceof org.springframework.dao.DataAccessResourceFailureException
                    || t instanceof org.springframework.transaction.CannotCreateTransactionException
                    || t instanceof java.net.ConnectException) {
                return true;
            }
            if (t instanceof java.sql.SQLTransientConnectionException
                    || t instanceof java.sql.SQLNonTransientConnectionException
                    || t instanceof java.sql.SQLRecoverableException) {
                return true;
            }
            if (t instanceof java.sql.SQLException sql && sql.getSQLState() != null
                    && (sql.getSQLState().startsWith("08") || sql.getSQLState().startsWith("57P"))) {
                return true;
            }
            // the pool's answer for a connection the server dropped mid-transaction (rolling back on it fails)
            if (t instanceof java.sql.SQLException sql && "Connection is closed".equals(sql.getMessage())) {
                return true;
            }
            if (t.getCause() == t) {
                break;
            }
        }
        return false;
    }


    @Override
    protected ResponseEntity<Object> handleMethodArgumentNotValid(MethodArgumentNotValidException ex,
            HttpHeaders headers, HttpStatusCode status, WebRequest request) {
        List<FieldIssue> issues = new ArrayList<>();
        ex.getBindingResult().getFieldErrors().forEach(f ->
                issues.add(new FieldIssue(pointerOf(f.getField()), f.getDefaultMessage())));
        ex.getBindingResult().getGlobalErrors().forEach(g ->
                issues.add(new FieldIssue("", g.getDefaultMessage())));
        String detail = issues.isEmpty() ? "invalid request"
                : issues.get(0).pointer() + ": " + issues.get(0).detail()
                        + (issues.size() > 1 ? " (and " + (issues.size() - 1) + " more)" : "");
        ProblemDetail body = withIssues(problem(HttpStatus.UNPROCESSABLE_CONTENT, "validation",
                "Invalid request", detail), issues);
        return ResponseEntity.status(HttpStatus.UNPROCESSABLE_CONTENT).headers(headers).body(body);
    }

    @Override
    protected ResponseEntity<Object> handleHandlerMethodValidationException(HandlerMethodValidationException ex,
            HttpHeaders headers, HttpStatusCode status, WebRequest request) {
        List<FieldIssue> issues = new ArrayList<>();
        ex.getParameterValidationResults().forEach(r -> r.getResolvableErrors().forEach(err ->
                issues.add(new FieldIssue(r.getMethodParameter().getParameterName(), err.getDefaultMessage()))));
        String detail = issues.isEmpty() ? "invalid request" : issues.get(0).pointer() + ": " + issues.get(0).detail();
        return ResponseEntity.status(HttpStatus.UNPROCESSABLE_CONTENT).headers(headers)
                .body(withIssues(problem(HttpStatus.UNPROCESSABLE_CONTENT, "validation", "Invalid request", detail), issues));
    }

    @Override
    protected ResponseEntity<Object> handleHttpMessageNotReadable(HttpMessageNotReadableException ex,
            HttpHeaders headers, HttpStatusCode status, WebRequest request) {
        for (Throwable t = ex; t != null; t = t.getCause()) {
            if (t instanceof RequestLimits.BodyTooLarge tooLarge) {
                ProblemDetail body = problem(HttpStatus.CONTENT_TOO_LARGE, "body-too-large", "Request body too large",
                        tooLarge.getMessage());
                body.setProperty("limitBytes", tooLarge.limitBytes);
                return ResponseEntity.status(HttpStatus.CONTENT_TOO_LARGE).headers(headers).body(body);
            }
        }
        String pointer = "";
        String detail = "the request body is not valid JSON";
        Throwable cause = ex.getCause();
        if (cause instanceof JacksonException je) {
            pointer = pointerOf(je.getPath());
            if (cause instanceof UnrecognizedPropertyException) {
                detail = "unknown field '" + lastName(je) + "'";
            } else if (cause instanceof InvalidFormatException ife) {
                detail = "value '" + ife.getValue() + "' is not valid for " + (pointer.isEmpty() ? "the body" : pointer)
                        + enumHint(ife.getTargetType());
            } else if (!je.getPath().isEmpty()) {
                detail = "wrong type or shape at " + pointer;
            } else if (cause instanceof tools.jackson.databind.exc.MismatchedInputException) {
                // the message would name our Java types; say what the client can act on instead
                detail = "the body must be a JSON object with the documented fields";
            } else {
                detail = "malformed JSON: " + shorten(je.getOriginalMessage());
            }
        } else if (ex.getMessage() != null && ex.getMessage().startsWith("Required request body is missing")) {
            detail = "the request needs a JSON body";
        }
        ProblemDetail body = withIssues(problem(HttpStatus.BAD_REQUEST, "malformed", "Malformed request", detail),
                List.of(new FieldIssue(pointer, detail)));
        return ResponseEntity.status(HttpStatus.BAD_REQUEST).headers(headers).body(body);
    }

    @Override
    protected ResponseEntity<Object> createResponseEntity(Object body, HttpHeaders headers,
            HttpStatusCode statusCode, WebRequest request) {
        if (body instanceof ProblemDetail problem && (problem.getType() == null
                || "about:blank".equals(problem.getType().toString()))) {
            problem.setType(URI.create(TYPE_PREFIX + "http-" + statusCode.value()));
        }
        return super.createResponseEntity(body, headers, statusCode, request);
    }

    private static String enumHint(Class<?> type) {
        if (type != null && type.isEnum()) {
            List<String> names = new ArrayList<>();
            for (Object constant : type.getEnumConstants()) {
                names.add(constant.toString());
            }
            return "; allowed: " + String.join(", ", names);
        }
        return type == null ? "" : " (expected " + type.getSimpleName() + ")";
    }

    private static String lastName(JacksonException e) {
        List<JacksonException.Reference> path = e.getPath();
        return path.isEmpty() ? "?" : path.get(path.size() - 1).getPropertyName();
    }

    private static String pointerOf(List<JacksonException.Reference> path) {
        StringBuilder sb = new StringBuilder();
        for (JacksonException.Reference ref : path) {
            sb.append('/');
            sb.append(ref.getPropertyName() != null ? ref.getPropertyName() : Integer.toString(ref.getIndex()));
        }
        return sb.toString();
    }

    /** Turns a bean property path such as {@code readings[0].valueMm} into {@code /readings/0/valueMm}. */
    static String pointerOf(String propertyPath) {
        if (propertyPath == null || propertyPath.isEmpty()) {
            return "";
        }
        String p = propertyPath.replace("[", ".").replace("]", "");
        // method validation paths start with the method and parameter name: keep the parameter's fields
        return "/" + p.replace('.', '/');
    }

    private static String shorten(String message) {
        if (message == null) {
            return "unreadable";
        }
        return message.length() > 200 ? message.substring(0, 200) + "…" : message;
    }
}
