package org.specimenledger.equipment;

import io.swagger.v3.oas.annotations.Operation;
import jakarta.validation.Valid;
import java.time.LocalDate;
import java.util.List;
import java.util.UUID;
import org.specimenledger.shared.Access;
import org.springframework.format.annotation.DateTimeFormat;
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
 * Instruments and their calibration records. The lab manager writes; the laboratory's people and the
 * auditor read; customers have no access (equipment is laboratory-internal).
 */
@RestController
@RequestMapping("/api/v1/equipment")
class EquipmentController {

    private final EquipmentService service;

    EquipmentController(EquipmentService service) {
        this.service = service;
    }

    @PostMapping
    @ResponseStatus(HttpStatus.CREATED)
    @PreAuthorize(Access.MANAGER)
    @Operation(summary = "Register an instrument")
    EquipmentView register(@Valid @RequestBody EquipmentRequests.InstrumentRequest request) {
        return service.register(request);
    }

    @GetMapping
    @PreAuthorize(Access.LAB_READERS)
    @Operation(summary = "List instruments with their calibration status today, optionally of one kind")
    List<EquipmentView> list(@RequestParam(required = false) InstrumentKind kind) {
        return service.list(kind);
    }

    @GetMapping("/{id}")
    @PreAuthorize(Access.LAB_READERS)
    EquipmentView get(@PathVariable UUID id) {
        return service.get(id);
    }

    @PutMapping("/{id}")
    @PreAuthorize(Access.MANAGER)
    @Operation(summary = "Change an instrument (reason required); referenced force ranges stay")
    EquipmentView change(@PathVariable UUID id, @Valid @RequestBody EquipmentRequests.InstrumentRequest request) {
        return service.change(id, request);
    }

    @PostMapping("/{id}/retire")
    @PreAuthorize(Access.MANAGER)
    @Operation(summary = "Retire an instrument from a date on (reason required); it is never deleted")
    EquipmentView retire(@PathVariable UUID id, @Valid @RequestBody EquipmentRequests.RetirementRequest request) {
        return service.retire(id, request);
    }

    @PostMapping("/{id}/calibrations")
    @ResponseStatus(HttpStatus.CREATED)
    @PreAuthorize(Access.MANAGER)
    @Operation(summary = "Record a calibration of an instrument")
    CalibrationView recordCalibration(@PathVariable UUID id,
            @Valid @RequestBody EquipmentRequests.CalibrationRequest request) {
        return service.recordCalibration(id, request);
    }

    @GetMapping("/{id}/calibrations")
    @PreAuthorize(Access.LAB_READERS)
    @Operation(summary = "List an instrument's calibration records, withdrawn ones included")
    List<CalibrationView> calibrations(@PathVariable UUID id) {
        return service.calibrations(id);
    }

    @PostMapping("/{id}/calibrations/{calibrationId}/withdraw")
    @PreAuthorize(Access.MANAGER)
    @Operation(summary = "Withdraw a wrong calibration record (reason required); it stays in the history")
    CalibrationView withdraw(@PathVariable UUID id, @PathVariable UUID calibrationId,
            @Valid @RequestBody EquipmentRequests.WithdrawalRequest request) {
        return service.withdrawCalibration(id, calibrationId, request);
    }

    @GetMapping("/{id}/calibration-on")
    @PreAuthorize(Access.LAB_READERS)
    @Operation(summary = "Which calibration governed the instrument on a date, and whether it was valid")
    CalibrationOnDate calibrationOn(@PathVariable UUID id, @RequestParam @DateTimeFormat(iso = DateTimeFormat.ISO.DATE) LocalDate date) {
        return service.calibrationOn(id, date);
    }
}
