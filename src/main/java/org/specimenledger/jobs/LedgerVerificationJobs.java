package org.specimenledger.jobs;

import io.swagger.v3.oas.annotations.Operation;
import java.net.URI;
import java.util.LinkedHashMap;
import java.util.Map;
import org.specimenledger.audit.ChainVerification;
import org.specimenledger.audit.ChainVerifier;
import org.specimenledger.shared.Access;
import org.springframework.http.ResponseEntity;
import org.springframework.security.access.prepost.PreAuthorize;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RestController;

/**
 * The ledger's chain verification as a job, for a ledger large enough that a user would rather not wait on
 * the request: the job's answer is exactly what {@code GET /api/v1/audit/verify} answers. It lives here,
 * not in {@code audit}, because the jobs feature already depends on the ledger.
 */
@RestController
public class LedgerVerificationJobs {

    static final String KIND = "ledger-verification";

    private final Jobs jobs;
    private final ChainVerifier verifier;

    LedgerVerificationJobs(Jobs jobs, ChainVerifier verifier) {
        this.jobs = jobs;
        this.verifier = verifier;
    }

    @PostMapping("/api/v1/audit/verification-jobs")
    @PreAuthorize(Access.AUDIT_READERS)
    @Operation(summary = "Verify the whole ledger chain as a job; 202 with the job, whose summary.verification is "
            + "the answer of GET /api/v1/audit/verify")
    ResponseEntity<JobView> submit() {
        JobView job = start();
        return ResponseEntity.accepted().location(URI.create("/api/v1/jobs/" + job.id())).body(job);
    }

    /** Submits the verification of the whole chain as a job (also started from the pages). */
    public JobView start() {
        return jobs.submit(KIND, "verification of the ledger chain", 1, null, progress -> {
            ChainVerification v = verifier.verify();
            Map<String, Object> item = new LinkedHashMap<>();
            item.put("eventsChecked", v.eventsChecked());
            item.put("valid", v.valid());
            if (v.valid()) {
                progress.succeeded(item);
            } else {
                item.put("firstBrokenSeq", v.firstBrokenSeq());
                item.put("problem", v.problem());
                progress.failed(item);
            }
            Map<String, Object> answer = new LinkedHashMap<>();
            answer.put("verification", v);
            return answer;
        });
    }
}
