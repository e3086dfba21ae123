package org.specimenledger.testing;

import io.swagger.v3.oas.annotations.Operation;
import jakarta.servlet.http.Part;
import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.util.LinkedHashMap;
import java.util.Map;
import org.specimenledger.analysis.TensileSpecimen;
import org.specimenledger.curve.CurveReader;
import org.specimenledger.curve.RawCurve;
import org.specimenledger.shared.Access;
import org.springframework.http.MediaType;
import org.springframework.security.access.prepost.PreAuthorize;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestMapping;
import org.springframework.web.bind.annotation.RequestPart;
import org.springframework.web.bind.annotation.RestController;

/**
 * Analyses an uploaded curve without storing anything: for trying parameters, and for checking a file
 * before a test is registered. Stored analyses belong to test runs.
 */
@RestController
@RequestMapping("/api/v1/analysis")
class AnalysisPreviewController {

    private final CurveReader reader;

    AnalysisPreviewController(CurveSettings settings) {
        this.reader = new CurveReader(settings.limits());
    }

    @PostMapping(path = "/preview", consumes = MediaType.MULTIPART_FORM_DATA_VALUE)
    @PreAuthorize(Access.LAB_READERS)
    @Operation(summary = "Analyse a raw curve (parts: curve, specimen, optional parameters); nothing is stored")
    Map<String, Object> preview(@RequestPart("curve") Part curve, @RequestPart("specimen") Part specimen,
            @RequestPart(name = "parameters", required = false) Part parameters) throws IOException {
        TensileSpecimen geometry = AnalysisRequestParts.specimen(text(specimen));
        AnalysisRequestParts.Settings settings = AnalysisRequestParts.settings(parameters == null ? null : text(parameters));
        RawCurve raw;
        try (InputStream in = curve.getInputStream()) {
            raw = reader.read(in);
        }
        Map<String, Object> body = new LinkedHashMap<>(settings.isCyclic()
                ? AnalysisReports.cyclic(AnalysisComputation.cyclic(raw, settings.cyclic()))
                : AnalysisReports.tensile(AnalysisComputation.tensile(raw, geometry, settings.tensile())));
        body.put("input", AnalysisReports.input(raw));
        return body;
    }

    private static String text(Part part) throws IOException {
        try (InputStream in = part.getInputStream()) {
            // JSON parts are small; anything over 64 KiB is not a specimen description
            byte[] bytes = in.readNBytes(64 * 1024);
            return new String(bytes, StandardCharsets.UTF_8);
        }
    }
}
