package org.specimenledger.web;

import java.util.UUID;
import org.specimenledger.jobs.JobView;
import org.specimenledger.jobs.Jobs;
import org.specimenledger.shared.Access;
import org.springframework.security.access.prepost.PreAuthorize;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.RestController;

/**
 * The JSON a job page's script polls for its progress bar, on the page session (the API's {@code /api/v1/jobs}
 * is on the Basic chain). Failures are RFC 9457 problems like the other script endpoints.
 */
@RestController
class JobProgressFeed {

    private final Jobs jobs;

    JobProgressFeed(Jobs jobs) {
        this.jobs = jobs;
    }

    @GetMapping("/lab/jobs/{id}/progress")
    @PreAuthorize(Access.LAB_READERS)
    JobView progress(@PathVariable UUID id) {
        return jobs.get(id);
    }
}
