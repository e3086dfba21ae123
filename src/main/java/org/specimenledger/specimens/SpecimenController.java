package org.specimenledger.specimens;

import io.swagger.v3.oas.annotations.Operation;
import jakarta.validation.Valid;
import java.util.List;
import java.util.UUID;
import org.specimenledger.shared.Access;
import org.springframework.http.HttpStatus;
import org.springframework.http.MediaType;
import org.springframework.web.HttpMediaTypeNotSupportedException;
import org.springframework.security.access.prepost.PreAuthorize;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.PutMapping;
import org.springframework.web.bind.annotation.RequestBody;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.bind.annotation.ResponseStatus;
import org.springframework.web.bind.annotation.RestController;

/**
 * Specimens. Technicians and the manager write; the laboratory and the auditor read all; a customer reads
 * only the specimens of their own organisation's orders.
 */
@RestController
class SpecimenController {

    private final SpecimenService service;
    private final SpecimenImport sheets;

    SpecimenController(SpecimenService service, SpecimenImport sheets) {
        this.service = service;
        this.sheets = sheets;
    }

    /** Import files larger than this are refused before they are read: 2,000 rows fit in far less. */
    static final long MAX_SHEET_BYTES = 4L * 1024 * 1024;

    // any Content-Type reaches the handler, so that a role without access gets its 403 before the media type is
    // looked at; the handler then refuses anything but CSV with 415
    @PostMapping(path = "/api/v1/orders/{orderId}/specimens/import", consumes = MediaType.ALL_VALUE)
    @ResponseStatus(HttpStatus.CREATED)
    @PreAuthorize(Access.LAB_WORKERS)
    @Operation(summary = "Register all specimens of an order from one CSV file (columns: mark, heat, orientation, "
            + "shape, position, diameter, thickness, width, outer_diameter, area, area_method, k, l0, round_l0, "
            + "le, lc, note); every row is checked first, all problems are reported at once with /rows/{row}/{column} "
            + "and nothing is stored unless every row is valid; one ledger event per specimen")
    @io.swagger.v3.oas.annotations.parameters.RequestBody(required = true, description = "The import sheet: UTF-8 "
            + "CSV, header first; layout in the README (\"Specimen import sheet\")", content =
            @io.swagger.v3.oas.annotations.media.Content(mediaType = "text/csv",
                    schema = @io.swagger.v3.oas.annotations.media.Schema(type = "string", format = "binary")))
    SpecimenImport.Imported importSheet(@PathVariable UUID orderId, jakarta.servlet.http.HttpServletRequest request)
            throws java.io.IOException, HttpMediaTypeNotSupportedException {
        List<MediaType> csv = List.of(MediaType.parseMediaType("text/csv"), MediaType.parseMediaType("application/csv"));
        MediaType given;
        try {
            given = request.getContentType() == null ? null : MediaType.parseMediaType(request.getContentType());
        } catch (org.springframework.http.InvalidMediaTypeException e) {
            given = null; // a malformed Content-Type is no CSV either
        }
        MediaType type = given;
        if (type == null || csv.stream().noneMatch(m -> m.includes(type))) {
            throw new HttpMediaTypeNotSupportedException(type, csv);
        }
        long announced = request.getContentLengthLong();
        if (announced > MAX_SHEET_BYTES) {
            throw new org.specimenledger.shared.RuleViolation("/", "an import file may have at most " + MAX_SHEET_BYTES
                    + " bytes, this one announces " + announced);
        }
        byte[] bytes = request.getInputStream().readNBytes((int) MAX_SHEET_BYTES + 1);
        if (bytes.length > MAX_SHEET_BYTES) {
            throw new org.specimenledger.shared.RuleViolation("/", "an import file may have at most " + MAX_SHEET_BYTES
                    + " bytes");
        }
        return sheets.importSheet(orderId, bytes);
    }

    @PostMapping("/api/v1/specimens")
    @ResponseStatus(HttpStatus.CREATED)
    @PreAuthorize(Access.LAB_WORKERS)
    @Operation(summary = "Register a specimen with its measured geometry; S0 and L0 are computed")
    SpecimenView register(@Valid @RequestBody SpecimenRequests.SpecimenRequest request) {
        return service.register(request);
    }

    @GetMapping("/api/v1/specimens")
    @PreAuthorize(Access.ANY_SIGNED_IN)
    @Operation(summary = "List specimens, optionally of one heat, one order or with one lab identifier")
    List<SpecimenView> list(@RequestParam(required = false) UUID heatId,
            @RequestParam(required = false) UUID orderId,
            @RequestParam(required = false) String labIdentifier) {
        return service.list(heatId, orderId, labIdentifier);
    }

    @GetMapping("/api/v1/specimens/{id}")
    @PreAuthorize(Access.ANY_SIGNED_IN)
    @Operation(summary = "One specimen")
    SpecimenView get(@PathVariable UUID id) {
        return service.get(id);
    }

    @PutMapping("/api/v1/specimens/{id}")
    @PreAuthorize(Access.LAB_WORKERS)
    @Operation(summary = "Correct a specimen's register data before testing (reason required)")
    SpecimenView correct(@PathVariable UUID id, @Valid @RequestBody SpecimenRequests.SpecimenRequest request) {
        return service.correct(id, request);
    }

    @PutMapping("/api/v1/specimens/{id}/after-fracture")
    @PreAuthorize(Access.LAB_WORKERS)
    @Operation(summary = "Record Lu, the fracture dimensions (Su) and the fracture position; "
            + "a reason is required to replace recorded values")
    SpecimenView afterFracture(@PathVariable UUID id,
            @Valid @RequestBody SpecimenRequests.AfterFractureRequest request) {
        return service.recordAfterFracture(id, request);
    }
}
