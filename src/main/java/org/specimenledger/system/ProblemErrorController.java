package org.specimenledger.system;

import jakarta.servlet.RequestDispatcher;
import jakarta.servlet.http.HttpServletRequest;
import org.springframework.boot.webmvc.error.ErrorController;
import org.springframework.http.HttpStatus;
import org.springframework.http.MediaType;
import org.springframework.http.ProblemDetail;
import org.springframework.http.ResponseEntity;
import org.springframework.security.access.prepost.PreAuthorize;
import org.springframework.web.bind.annotation.RequestMapping;
import org.springframework.web.bind.annotation.RestController;

/**
 * The servlet container's error path ({@code /error}) as a problem response, for the refusals that happen
 * outside the controllers (the security firewall refusing a path with {@code ;} or {@code //}, a
 * {@code sendError} from a filter). Says the status and nothing else: never the exception, never a trace.
 */
@RestController
@io.swagger.v3.oas.annotations.Hidden
class ProblemErrorController implements ErrorController {

    @RequestMapping("/error")
    @PreAuthorize("permitAll()")
    ResponseEntity<ProblemDetail> error(HttpServletRequest request) {
        Object code = request.getAttribute(RequestDispatcher.ERROR_STATUS_CODE);
        HttpStatus status = code instanceof Integer i && HttpStatus.resolve(i) != null ? HttpStatus.valueOf(i)
                : HttpStatus.NOT_FOUND;
        String detail = switch (status) {
            case BAD_REQUEST -> "the request could not be read (for example a path with characters it may not hold)";
            case NOT_FOUND -> "no such path";
            case METHOD_NOT_ALLOWED -> "this path does not take that method";
            default -> status.is5xxServerError() ? "the service failed; the failure is logged" : status.getReasonPhrase();
        };
        ProblemDetail problem = ProblemResponses.problem(status, "http-" + status.value(), status.getReasonPhrase(),
                detail);
        return ResponseEntity.status(status).contentType(MediaType.APPLICATION_PROBLEM_JSON).body(problem);
    }
}
