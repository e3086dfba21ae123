package org.specimenledger.testing;

import jakarta.servlet.http.HttpServletRequest;
import jakarta.servlet.http.HttpServletResponse;
import java.io.IOException;
import java.net.URI;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.specimenledger.shared.FieldIssue;
import org.springframework.core.Ordered;
import org.springframework.core.annotation.Order;
import org.springframework.http.HttpHeaders;
import org.springframework.http.HttpStatus;
import org.springframework.http.MediaType;
import org.springframework.http.ProblemDetail;
import org.springframework.web.bind.annotation.ExceptionHandler;
import org.springframework.web.bind.annotation.RestControllerAdvice;

/**
 * The problem responses particular to test runs, with the structured detail a client needs to act: the
 * instruments the calibration gate refused, the size limit, the other run holding the same bytes. Every
 * other failure is mapped by the service-wide handler.
 */
@RestControllerAdvice(basePackageClasses = TestingProblems.class)
@Order(Ordered.HIGHEST_PRECEDENCE)
class TestingProblems {

    private static final String TYPE_PREFIX = "urn:specimen-ledger:problem:";

    @ExceptionHandler(CalibrationNotValid.class)
    ProblemDetail calibrationNotValid(CalibrationNotValid e) {
        ProblemDetail p = problem(HttpStatus.UNPROCESSABLE_CONTENT, "calibration-not-valid",
                "Calibration does not allow this test", e.getMessage());
        p.setProperty("errors", e.findings().stream().map(f -> new FieldIssue(f.pointer(), f.line())).toList());
        p.setProperty("instruments", e.findings().stream().map(TestingProblems::instrument).toList());
        p.setProperty("override", "a lab manager may accept the run with a written calibrationOverrideReason; "
                + "the acceptance is recorded and flags every result of the run");
        return p;
    }

    /**
     * Written and flushed at once, with the connection to be closed: the client is still sending a body
     * nobody will read, and the answer must reach it before the server stops listening to the rest.
     */
    @ExceptionHandler(CurveTooLarge.class)
    void tooLarge(CurveTooLarge e, HttpServletRequest request, HttpServletResponse response) throws IOException {
        Map<String, Object> body = new LinkedHashMap<>();
        body.put("type", TYPE_PREFIX + "curve-too-large");
        body.put("title", "Curve file too large");
        body.put("status", HttpStatus.CONTENT_TOO_LARGE.value());
        body.put("detail", e.getMessage());
        body.put("instance", request.getRequestURI());
        body.put("limitBytes", e.limitBytes());
        byte[] bytes = StoredJson.MAPPER.writeValueAsBytes(body);
        response.setStatus(HttpStatus.CONTENT_TOO_LARGE.value());
        response.setHeader(HttpHeaders.CONNECTION, "close");
        response.setContentType(MediaType.APPLICATION_PROBLEM_JSON_VALUE);
        response.setContentLength(bytes.length);
        response.getOutputStream().write(bytes);
        response.flushBuffer();
    }

    @ExceptionHandler(DuplicateCurve.class)
    ProblemDetail duplicateCurve(DuplicateCurve e) {
        ProblemDetail p = problem(HttpStatus.CONFLICT, "duplicate-curve", "Same bytes as another test run",
                e.getMessage());
        p.setProperty("otherTestRunId", e.otherTestRunId());
        p.setProperty("sha256", e.sha256());
        p.setProperty("errors", List.of(new FieldIssue(e.pointer(), e.getMessage())));
        return p;
    }

    private static Map<String, Object> instrument(CalibrationGate.Finding f) {
        CalibrationUsed c = f.calibration();
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("pointer", f.pointer());
        m.put("role", f.role().name());
        m.put("equipmentId", c.equipmentId());
        m.put("assetId", c.assetId());
        Map<String, Object> last = null;
        if (c.calibrationId() != null) {
            last = new LinkedHashMap<>();
            last.put("id", c.calibrationId());
            last.put("certificateReference", c.certificateReference());
            last.put("calibratedOn", c.calibratedOn());
            last.put("dueOn", c.dueOn());
            last.put("accuracyClass", c.accuracyClass());
        }
        m.put("lastCalibration", last);
        m.put("reason", f.reason());
        return m;
    }

    private static ProblemDetail problem(HttpStatus status, String slug, String title, String detail) {
        ProblemDetail p = ProblemDetail.forStatusAndDetail(status, detail);
        p.setType(URI.create(TYPE_PREFIX + slug));
        p.setTitle(title);
        return p;
    }
}
