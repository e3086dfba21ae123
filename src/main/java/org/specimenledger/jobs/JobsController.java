package org.specimenledger.jobs;

import io.swagger.v3.oas.annotations.Operation;
import jakarta.validation.constraints.Max;
import jakarta.validation.constraints.Min;
import java.util.UUID;
import org.specimenledger.shared.Access;
import org.springframework.security.access.prepost.PreAuthorize;
import org.springframework.validation.annotation.Validated;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.RequestMapping;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.bind.annotation.RestController;

/** Background jobs: a technician sees their own, the lab manager and the auditor all. */
@RestController
@Validated
@RequestMapping("/api/v1/jobs")
class JobsController {

    private final Jobs jobs;

    JobsController(Jobs jobs) {
        this.jobs = jobs;
    }

    @GetMapping
    @PreAuthorize(Access.LAB_READERS)
    @Operation(summary = "Jobs, newest first (own jobs; the lab manager and the auditor see every job)")
    Jobs.JobPage list(@RequestParam(defaultValue = "0") @Min(0) int page,
            @RequestParam(defaultValue = "20") @Min(1) @Max(200) int size) {
        return jobs.list(page, size);
    }

    @GetMapping("/{id}")
    @PreAuthorize(Access.LAB_READERS)
    @Operation(summary = "One job: state, progress (done of total), each item's outcome and, at the end, the answer")
    JobView get(@PathVariable UUID id) {
        return jobs.get(id);
    }
}
