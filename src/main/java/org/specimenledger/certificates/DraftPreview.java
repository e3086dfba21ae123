package org.specimenledger.certificates;

import java.util.UUID;
import org.springframework.http.CacheControl;
import org.springframework.http.ContentDisposition;
import org.springframework.http.HttpHeaders;
import org.springframework.http.MediaType;
import org.springframework.http.ResponseEntity;

/**
 * The one way a draft preview leaves the service (API and lab page alike): inline, never cached, and marked in a
 * header as well as on its pages, so no client can file it as a certificate by mistake.
 */
public final class DraftPreview {

    /** Present, with value {@code true}, on every draft preview response. */
    public static final String HEADER = "Draft-Preview";

    private DraftPreview() {
    }

    /** The preview PDF of draft {@code id}: inline, {@code Cache-Control: no-store}, {@code Draft-Preview: true}. */
    public static ResponseEntity<byte[]> response(UUID id, byte[] pdf) {
        return ResponseEntity.ok().contentType(MediaType.APPLICATION_PDF)
                .cacheControl(CacheControl.noStore())
                .header(HEADER, "true")
                .header(HttpHeaders.CONTENT_DISPOSITION, ContentDisposition.inline()
                        .filename("draft-" + id + "-preview.pdf").build().toString())
                .body(pdf);
    }
}
