package org.specimenledger.testing;

import io.swagger.v3.oas.annotations.Operation;
import java.nio.charset.StandardCharsets;
import java.time.LocalDate;
import java.util.List;
import java.util.UUID;
import org.specimenledger.shared.Access;
import org.springframework.format.annotation.DateTimeFormat;
import org.springframework.http.ContentDisposition;
import org.springframework.http.HttpHeaders;
import org.springframework.http.MediaType;
import org.springframework.http.ResponseEntity;
import org.springframework.security.access.prepost.PreAuthorize;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.RequestMapping;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.bind.annotation.RestController;

/**
 * Results by specimen, heat, order and test date range (inclusive), as JSON or as CSV with units in the
 * header. By default only valid runs; {@code includeInvalid=true} lists invalidated ones too. A customer
 * sees only their own organisation's results.
 */
@RestController
@RequestMapping("/api/v1")
class ResultsController {

    static final MediaType CSV = new MediaType("text", "csv", StandardCharsets.UTF_8);

    private final ResultQueries queries;

    ResultsController(ResultQueries queries) {
        this.queries = queries;
    }

    @GetMapping("/results")
    @PreAuthorize(Access.ANY_SIGNED_IN)
    @Operation(summary = "Results (current analysis of each test run) by specimenId, heatId, orderId, from, to; "
            + "one page (page from 0, size 1–500, default 100) in test-date order, with the total")
    org.specimenledger.shared.Paged<ResultRow> results(@RequestParam(required = false) UUID specimenId,
            @RequestParam(required = false) UUID heatId, @RequestParam(required = false) UUID orderId,
            @RequestParam(required = false) @DateTimeFormat(iso = DateTimeFormat.ISO.DATE) LocalDate from,
            @RequestParam(required = false) @DateTimeFormat(iso = DateTimeFormat.ISO.DATE) LocalDate to,
            @RequestParam(defaultValue = "false") boolean includeInvalid,
            @RequestParam(defaultValue = "0") int page, @RequestParam(defaultValue = "100") int size) {
        return queries.find(new ResultQueries.Criteria(specimenId, heatId, orderId, from, to, includeInvalid), page,
                size);
    }

    @GetMapping("/results.csv")
    @PreAuthorize(Access.ANY_SIGNED_IN)
    @Operation(summary = "The same results as CSV, one row per test run, units in the header")
    ResponseEntity<String> csv(@RequestParam(required = false) UUID specimenId,
            @RequestParam(required = false) UUID heatId, @RequestParam(required = false) UUID orderId,
            @RequestParam(required = false) @DateTimeFormat(iso = DateTimeFormat.ISO.DATE) LocalDate from,
            @RequestParam(required = false) @DateTimeFormat(iso = DateTimeFormat.ISO.DATE) LocalDate to,
            @RequestParam(defaultValue = "false") boolean includeInvalid) {
        String body = ResultTable.csv(queries.find(
                new ResultQueries.Criteria(specimenId, heatId, orderId, from, to, includeInvalid)));
        HttpHeaders headers = new HttpHeaders();
        headers.setContentType(CSV);
        headers.setContentDisposition(ContentDisposition.attachment().filename("results.csv").build());
        return ResponseEntity.ok().headers(headers).body(body);
    }
}
