package org.specimenledger.trace;

import io.swagger.v3.oas.annotations.Operation;
import io.swagger.v3.oas.annotations.tags.Tag;
import java.util.List;
import java.util.UUID;
import org.specimenledger.shared.Access;
import org.specimenledger.shared.RuleViolation;
import org.springframework.http.ContentDisposition;
import org.springframework.http.HttpHeaders;
import org.springframework.http.MediaType;
import org.springframework.http.ResponseEntity;
import org.springframework.security.access.prepost.PreAuthorize;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.RequestMapping;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.bind.annotation.RestController;
import org.springframework.web.servlet.mvc.method.annotation.StreamingResponseBody;

/**
 * Traces and audit bundles with the analysis run as the unit. Everyone who can sign in may read a trace; a
 * customer only of their own organisation's records (404 otherwise). The bundle holds raw curve files, which
 * customers do not download, so it is for the laboratory roles and the auditor.
 */
@RestController
@RequestMapping("/api/v1/trace")
@Tag(name = "trace")
class TraceController {

    static final int MAX_LINES = 100;
    static final MediaType ZIP = MediaType.parseMediaType("application/zip");

    private final TraceService traces;
    private final AuditBundleWriter writer;

    TraceController(TraceService traces, AuditBundleWriter writer) {
        this.traces = traces;
        this.writer = writer;
    }

    @GetMapping("/analyses/{id}")
    @PreAuthorize(Access.ANY_SIGNED_IN)
    @Operation(summary = "Trace one analysis run to its raw curve, test run, specimen, heat, instruments and "
            + "calibrations, with the ledger events of each and whether a replay reproduces it (records no event)")
    TraceView analysis(@PathVariable UUID id) {
        return traces.trace(List.of(new TraceLine("analysis " + id, id)), TraceRoot.NONE);
    }

    @GetMapping("/analyses")
    @PreAuthorize(Access.ANY_SIGNED_IN)
    @Operation(summary = "Trace several analysis runs at once (?id=…&id=…, 1 to " + MAX_LINES + "), one line each")
    TraceView analyses(@RequestParam(name = "id", required = false) List<UUID> ids) {
        if (ids == null || ids.isEmpty() || ids.size() > MAX_LINES) {
            throw new RuleViolation("id", "give between 1 and " + MAX_LINES + " analysis ids as ?id=…, was "
                    + (ids == null ? 0 : ids.size()));
        }
        if (ids.contains(null)) {
            // a blank ?id= converts to null: the caller's mistake, not a failure of ours
            throw new RuleViolation("id", "each ?id= must be an analysis id; position " + (ids.indexOf(null) + 1)
                    + " is blank");
        }
        return traces.trace(ids.stream().distinct().map(id -> new TraceLine("analysis " + id, id)).toList(),
                TraceRoot.NONE);
    }

    @GetMapping("/tests/{id}")
    @PreAuthorize(Access.ANY_SIGNED_IN)
    @Operation(summary = "Trace a test run's current analysis (409 before its curve is uploaded)")
    TraceView test(@PathVariable UUID id) {
        return traces.trace(traces.linesOfTestRun(id), TraceRoot.NONE);
    }

    @GetMapping("/tests/{id}/bundle")
    @PreAuthorize(Access.LAB_READERS)
    @Operation(summary = "Audit bundle (zip) of a test run's current analysis: raw curve, records, ledger events "
            + "with inclusion proofs, signed checkpoint, public key and VERIFY.txt (laboratory roles and auditor: "
            + "it holds raw data)")
    ResponseEntity<StreamingResponseBody> testBundle(@PathVariable UUID id) {
        AuditBundle bundle = traces.bundle(traces.linesOfTestRun(id), TraceRoot.NONE, "audit bundle of test run " + id);
        HttpHeaders headers = new HttpHeaders();
        headers.setContentType(ZIP);
        headers.setContentDisposition(ContentDisposition.attachment().filename("audit-bundle-test-" + id + ".zip")
                .build());
        return ResponseEntity.ok().headers(headers).body(out -> writer.write(bundle, out));
    }
}
