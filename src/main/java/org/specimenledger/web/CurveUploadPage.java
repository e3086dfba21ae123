package org.specimenledger.web;

import jakarta.servlet.http.HttpServletRequest;
import java.io.IOException;
import java.io.InputStream;
import java.util.Map;
import java.util.UUID;
import org.specimenledger.shared.Access;
import org.specimenledger.testing.CurveIntake;
import org.springframework.beans.factory.annotation.Value;
import org.springframework.http.MediaType;
import org.springframework.security.access.prepost.PreAuthorize;
import org.springframework.util.unit.DataSize;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.PutMapping;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.bind.annotation.RestController;

/**
 * The workbench's curve upload: the page's script sends the chosen file as the request body (so the
 * browser can report upload progress) with the session's CSRF token in a header, and gets back where
 * the result is. The same intake as {@code PUT /api/v1/tests/{id}/curve}: a refused file is the same
 * RFC 9457 problem, which the page shows.
 */
@RestController
class CurveUploadPage {

    private final CurveIntake intake;
    private final long limit;

    CurveUploadPage(CurveIntake intake, @Value("${ledger.curves.max-size}") DataSize limit) {
        this.intake = intake;
        this.limit = limit.toBytes();
    }

    @PutMapping(path = "/lab/tests/{id}/curve", consumes = MediaType.ALL_VALUE)
    @PreAuthorize(Access.LAB_WORKERS)
    Map<String, Object> upload(@PathVariable UUID id, @RequestParam(required = false) String filename,
            HttpServletRequest request) throws IOException {
        byte[] bytes;
        try (InputStream in = request.getInputStream()) {
            // one byte beyond the limit is read so that an oversized body without a length is still refused
            bytes = in.readNBytes((int) Math.min(Integer.MAX_VALUE - 8, limit + 1));
        }
        CurveIntake.Received received = intake.receive(id, bytes,
                request.getContentType() == null ? "text/csv" : request.getContentType(), filename);
        return Map.of("analysisId", received.analysis().id(), "result", "/lab/tests/" + id);
    }
}
