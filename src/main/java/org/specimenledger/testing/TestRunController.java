package org.specimenledger.testing;

import io.swagger.v3.oas.annotations.Operation;
import jakarta.servlet.http.HttpServletRequest;
import jakarta.validation.Valid;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.util.Base64;
import java.util.HexFormat;
import java.util.List;
import java.util.UUID;
import org.specimenledger.shared.Access;
import org.springframework.http.ContentDisposition;
import org.springframework.http.HttpHeaders;
import org.springframework.http.HttpStatus;
import org.springframework.http.InvalidMediaTypeException;
import org.springframework.http.MediaType;
import org.springframework.http.ResponseEntity;
import org.springframework.security.access.prepost.PreAuthorize;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.PutMapping;
import org.springframework.web.bind.annotation.RequestBody;
import org.springframework.web.bind.annotation.RequestHeader;
import org.springframework.web.bind.annotation.RequestMapping;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.bind.annotation.ResponseStatus;
import org.springframework.web.bind.annotation.RestController;

/**
 * Test runs, their raw curves and their analyses. Laboratory workers register, upload and re-analyse;
 * laboratory roles and the auditor read and download raw data; a customer reads their own organisation's
 * runs and results (any other is 404) but not raw data.
 */
@RestController
@RequestMapping("/api/v1")
class TestRunController {

    /** Our own header with the raw curve's SHA-256 in hex, beside the standard {@code Repr-Digest} (RFC 9530). */
    static final String SHA256_HEADER = "Curve-SHA256";

    private final TestRunService runs;
    private final CurveIntake intake;
    private final AnalysisService analyses;
    private final AnalysisReplay replay;
    private final CurveBatch batches;
    private final ReanalysisJobs reanalyses;

    TestRunController(TestRunService runs, CurveIntake intake, AnalysisService analyses, AnalysisReplay replay,
            CurveBatch batches, ReanalysisJobs reanalyses) {
        this.reanalyses = reanalyses;
        this.runs = runs;
        this.intake = intake;
        this.analyses = analyses;
        this.replay = replay;
        this.batches = batches;
    }

    // any Content-Type reaches the handler (a role without access gets its 403 first); anything but a zip is 415
    @PostMapping(path = "/orders/{orderId}/curves", consumes = MediaType.ALL_VALUE)
    @PreAuthorize(Access.LAB_WORKERS)
    @Operation(summary = "Upload many curve files of an order as one zip; each entry named <specimen mark>.<ext> "
            + "goes to that specimen's valid test run exactly as a single upload would. Answers at once with the "
            + "job (202, Location of the job); entries that fail are reported one by one in the job's summary")
    @io.swagger.v3.oas.annotations.parameters.RequestBody(required = true, description = "A zip of curve files, "
            + "each named <specimen mark>.<extension> (folders allowed, ignored for matching)", content =
            @io.swagger.v3.oas.annotations.media.Content(mediaType = "application/zip",
                    schema = @io.swagger.v3.oas.annotations.media.Schema(type = "string", format = "binary")))
    ResponseEntity<org.specimenledger.jobs.JobView> uploadBatch(@PathVariable UUID orderId,
            HttpServletRequest request) throws IOException, org.springframework.web.HttpMediaTypeNotSupportedException {
        List<MediaType> zip = List.of(MediaType.parseMediaType("application/zip"),
                MediaType.parseMediaType("application/x-zip-compressed"));
        MediaType given = request.getContentType() == null ? null : mediaType(request.getContentType());
        if (given == null || zip.stream().noneMatch(m -> m.includes(given))) {
            throw new org.springframework.web.HttpMediaTypeNotSupportedException(given, zip);
        }
        org.specimenledger.jobs.JobView job = batches.receive(orderId, request.getInputStream(),
                request.getContentLengthLong());
        return ResponseEntity.accepted().location(java.net.URI.create("/api/v1/jobs/" + job.id())).body(job);
    }

    @PostMapping("/tests")
    @ResponseStatus(HttpStatus.CREATED)
    @PreAuthorize(Access.LAB_WORKERS)
    @Operation(summary = "Register a test run; its instruments must pass the calibration gate (a lab manager may "
            + "accept a refused run with calibrationOverrideReason)")
    TestRunView register(@Valid @RequestBody TestRunRequests.TestRunRequest request) {
        return runs.register(request);
    }

    @GetMapping("/tests")
    @PreAuthorize(Access.ANY_SIGNED_IN)
    @Operation(summary = "List test runs, optionally of one specimen, oldest first; one page (page from 0, size "
            + "1–500, default 100) with the total (a customer sees only their own organisation's)")
    org.specimenledger.shared.Paged<TestRunView> list(@RequestParam(required = false) UUID specimenId,
            @RequestParam(defaultValue = "0") int page, @RequestParam(defaultValue = "100") int size) {
        return runs.list(specimenId, page, size);
    }

    @GetMapping("/tests/{id}")
    @PreAuthorize(Access.ANY_SIGNED_IN)
    TestRunView get(@PathVariable UUID id) {
        return runs.get(id);
    }

    @PostMapping("/tests/{id}/invalidate")
    @PreAuthorize(Access.LAB_WORKERS)
    @Operation(summary = "Invalidate a test run (reason required); its curve and analyses stay")
    TestRunView invalidate(@PathVariable UUID id, @Valid @RequestBody TestRunRequests.ReasonRequest request) {
        return runs.invalidate(id, request.reason());
    }

    @PostMapping("/tests/{id}/reinstate")
    @PreAuthorize(Access.LAB_WORKERS)
    @Operation(summary = "Make an invalidated run the valid one again (reason required)")
    TestRunView reinstate(@PathVariable UUID id, @Valid @RequestBody TestRunRequests.ReasonRequest request) {
        return runs.reinstate(id, request.reason());
    }

    @PutMapping(path = "/tests/{id}/curve", consumes = MediaType.ALL_VALUE)
    @ResponseStatus(HttpStatus.CREATED)
    @PreAuthorize(Access.LAB_WORKERS)
    @Operation(summary = "Upload the raw curve file as the request body, byte for byte (once per run); the "
            + "first analysis is made at once. Same bytes as another run: 409 unless confirmDuplicate=true "
            + "with a reason")
    @io.swagger.v3.oas.annotations.parameters.RequestBody(required = true, description = "The curve file exactly as "
            + "the testing machine wrote it (UTF-8 text: optional # lines, a header row naming each channel with its "
            + "unit in brackets, then data rows), sent as the whole body, not as a form. Stored byte for byte; "
            + "at most ledger.curves.max-size (a larger Content-Length is refused with 413 before reading)",
            content = {
                @io.swagger.v3.oas.annotations.media.Content(mediaType = "text/csv",
                        schema = @io.swagger.v3.oas.annotations.media.Schema(type = "string", format = "binary")),
                @io.swagger.v3.oas.annotations.media.Content(mediaType = "text/tab-separated-values",
                        schema = @io.swagger.v3.oas.annotations.media.Schema(type = "string", format = "binary")),
                @io.swagger.v3.oas.annotations.media.Content(mediaType = "text/plain",
                        schema = @io.swagger.v3.oas.annotations.media.Schema(type = "string", format = "binary")),
                @io.swagger.v3.oas.annotations.media.Content(mediaType = "application/octet-stream",
                        schema = @io.swagger.v3.oas.annotations.media.Schema(type = "string", format = "binary"))})
    CurveIntake.Received upload(@PathVariable UUID id, HttpServletRequest request,
            @io.swagger.v3.oas.annotations.Parameter(description = "true to store bytes identical to another run's "
                    + "curve (then reason is required)") @RequestParam(defaultValue = "false") boolean confirmDuplicate,
            @io.swagger.v3.oas.annotations.Parameter(description = "why identical bytes are stored (with "
                    + "confirmDuplicate=true); the ledger event's reason") @RequestParam(required = false) String reason,
            @io.swagger.v3.oas.annotations.Parameter(description = "the file's original name, when no "
                    + "Content-Disposition header gives it") @RequestParam(required = false) String filename,
            @io.swagger.v3.oas.annotations.Parameter(description = "e.g. attachment; filename=\"run-0412.csv\"")
            @RequestHeader(name = HttpHeaders.CONTENT_DISPOSITION, required = false) String disposition)
            throws IOException {
        String name = filename;
        if (name == null && disposition != null) {
            try {
                name = ContentDisposition.parse(disposition).getFilename();
            } catch (IllegalArgumentException e) {
                name = null; // a malformed header names no file; the bytes are what matters
            }
        }
        return intake.receive(id, new CurveIntake.Upload(request.getInputStream(), request.getContentLengthLong(),
                request.getContentType(), name, confirmDuplicate, reason));
    }

    @GetMapping("/tests/{id}/curve")
    @PreAuthorize(Access.ANY_SIGNED_IN)
    @Operation(summary = "Download the raw curve exactly as uploaded, with its SHA-256 in the Repr-Digest and "
            + SHA256_HEADER + " headers (laboratory roles and auditor)")
    ResponseEntity<byte[]> download(@PathVariable UUID id) {
        CurveIntake.Download d = intake.download(id);
        byte[] sha = HexFormat.of().parseHex(d.curve().sha256());
        HttpHeaders headers = new HttpHeaders();
        headers.setContentType(mediaType(d.curve().mediaType()));
        headers.setContentLength(d.bytes().length);
        headers.setContentDisposition(ContentDisposition.attachment()
                .filename(d.curve().originalName() == null ? "curve-" + id + ".csv" : d.curve().originalName(),
                        StandardCharsets.UTF_8)
                .build());
        headers.set("Repr-Digest", "sha-256=:" + Base64.getEncoder().encodeToString(sha) + ":");
        headers.set(SHA256_HEADER, d.curve().sha256());
        headers.setETag("\"" + d.curve().sha256() + "\"");
        return new ResponseEntity<>(d.bytes(), headers, HttpStatus.OK);
    }

    @GetMapping("/tests/{id}/analyses")
    @PreAuthorize(Access.ANY_SIGNED_IN)
    @Operation(summary = "All analyses of a test run, oldest first")
    List<AnalysisRunView> analysesOf(@PathVariable UUID id) {
        return analyses.ofTestRun(id);
    }

    @PostMapping("/tests/{id}/analyses")
    @ResponseStatus(HttpStatus.CREATED)
    @PreAuthorize(Access.LAB_WORKERS)
    @Operation(summary = "Analyse the stored curve again with other parameters (reason required); the new "
            + "analysis becomes current, the previous one stays")
    AnalysisRunView reanalyse(@PathVariable UUID id, @Valid @RequestBody TestRunRequests.AnalysisRequest request) {
        return analyses.reanalyse(id, request);
    }

    @PutMapping("/tests/{id}/current-analysis")
    @PreAuthorize(Access.LAB_WORKERS)
    @Operation(summary = "Make an earlier analysis of the run its current one again (reason required)")
    AnalysisRunView pointCurrent(@PathVariable UUID id,
            @Valid @RequestBody TestRunRequests.CurrentAnalysisRequest request) {
        return analyses.pointCurrent(id, request);
    }

    @PostMapping("/analyses/reanalysis-jobs")
    @PreAuthorize(Access.LAB_WORKERS)
    @Operation(summary = "Re-analyse every test run matching a filter as one job (reason required): each run gets a "
            + "new analysis that becomes current, nothing is overwritten; 202 with the job")
    ResponseEntity<org.specimenledger.jobs.JobView> reanalyseMany(
            @Valid @RequestBody ReanalysisJobs.ReanalysisRequest request) {
        org.specimenledger.jobs.JobView job = reanalyses.submit(request);
        return ResponseEntity.accepted().location(java.net.URI.create("/api/v1/jobs/" + job.id())).body(job);
    }

    @GetMapping("/analyses/{id}")
    @PreAuthorize(Access.ANY_SIGNED_IN)
    AnalysisRunView analysis(@PathVariable UUID id) {
        return analyses.get(id);
    }

    @PostMapping("/analyses/{id}/replay")
    @PreAuthorize(Access.LAB_READERS)
    @Operation(summary = "Recompute a stored analysis from the stored bytes and parameters with the running "
            + "software and say whether every value is bit-identical; recorded in the ledger")
    ReplayView replay(@PathVariable UUID id) {
        return replay.replay(id);
    }

    private static MediaType mediaType(String stored) {
        try {
            return MediaType.parseMediaType(stored);
        } catch (InvalidMediaTypeException e) {
            return MediaType.APPLICATION_OCTET_STREAM;
        }
    }
}
