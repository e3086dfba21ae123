package org.specimenledger.specimens;

import io.swagger.v3.oas.annotations.Operation;
import jakarta.validation.Valid;
import java.util.List;
import java.util.UUID;
import org.specimenledger.shared.Access;
import org.springframework.http.HttpStatus;
import org.springframework.security.access.prepost.PreAuthorize;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.PutMapping;
import org.springframework.web.bind.annotation.RequestBody;
import org.springframework.web.bind.annotation.RequestMapping;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.bind.annotation.ResponseStatus;
import org.springframework.web.bind.annotation.RestController;

/**
 * Specimens. Technicians and the manager write; the laboratory and the auditor read all; a customer reads
 * only the specimens of their own organisation's orders.
 */
@RestController
@RequestMapping("/api/v1/specimens")
class SpecimenController {

    private final SpecimenService service;

    SpecimenController(SpecimenService service) {
        this.service = service;
    }

    @PostMapping
    @ResponseStatus(HttpStatus.CREATED)
    @PreAuthorize(Access.LAB_WORKERS)
    @Operation(summary = "Register a specimen with its measured geometry; S0 and L0 are computed")
    SpecimenView register(@Valid @RequestBody SpecimenRequests.SpecimenRequest request) {
        return service.register(request);
    }

    @GetMapping
    @PreAuthorize(Access.ANY_SIGNED_IN)
    @Operation(summary = "List specimens, optionally of one heat, one order or with one lab identifier")
    List<SpecimenView> list(@RequestParam(required = false) UUID heatId,
            @RequestParam(required = false) UUID orderId,
            @RequestParam(required = false) String labIdentifier) {
        return service.list(heatId, orderId, labIdentifier);
    }

    @GetMapping("/{id}")
    @PreAuthorize(Access.ANY_SIGNED_IN)
    @Operation(summary = "One specimen")
    SpecimenView get(@PathVariable UUID id) {
        return service.get(id);
    }

    @PutMapping("/{id}")
    @PreAuthorize(Access.LAB_WORKERS)
    @Operation(summary = "Correct a specimen's register data before testing (reason required)")
    SpecimenView correct(@PathVariable UUID id, @Valid @RequestBody SpecimenRequests.SpecimenRequest request) {
        return service.correct(id, request);
    }

    @PutMapping("/{id}/after-fracture")
    @PreAuthorize(Access.LAB_WORKERS)
    @Operation(summary = "Record Lu, the fracture dimensions (Su) and the fracture position; "
            + "a reason is required to replace recorded values")
    SpecimenView afterFracture(@PathVariable UUID id,
            @Valid @RequestBody SpecimenRequests.AfterFractureRequest request) {
        return service.recordAfterFracture(id, request);
    }
}
