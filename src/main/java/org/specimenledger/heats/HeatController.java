package org.specimenledger.heats;

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
 * Heats. Technicians and the manager write; the laboratory and the auditor read all; a customer reads
 * only the heats of their own organisation's specimens.
 */
@RestController
@RequestMapping("/api/v1/heats")
class HeatController {

    private final HeatService service;

    HeatController(HeatService service) {
        this.service = service;
    }

    @PostMapping
    @ResponseStatus(HttpStatus.CREATED)
    @PreAuthorize(Access.LAB_WORKERS)
    @Operation(summary = "Register a heat (cast) with its grade, product form, size and composition")
    HeatView register(@Valid @RequestBody HeatRequests.HeatRequest request) {
        return service.register(request);
    }

    @GetMapping
    @PreAuthorize(Access.ANY_SIGNED_IN)
    @Operation(summary = "List heats, optionally of one producer or with one heat number (whole value, any case)")
    List<HeatView> list(@RequestParam(required = false) String producer,
            @RequestParam(required = false) String heatNumber) {
        return service.list(producer, heatNumber);
    }

    @GetMapping("/{id}")
    @PreAuthorize(Access.ANY_SIGNED_IN)
    @Operation(summary = "One heat")
    HeatView get(@PathVariable UUID id) {
        return service.get(id);
    }

    @PutMapping("/{id}")
    @PreAuthorize(Access.LAB_WORKERS)
    @Operation(summary = "Correct a heat (reason required)")
    HeatView change(@PathVariable UUID id, @Valid @RequestBody HeatRequests.HeatRequest request) {
        return service.change(id, request);
    }
}
