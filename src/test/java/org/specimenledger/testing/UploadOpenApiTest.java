package org.specimenledger.testing;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.specimenledger.testsupport.Api;
import tools.jackson.databind.JsonNode;

/** The OpenAPI document describes the raw upload bodies as binary with their media types and query parameters. */
class UploadOpenApiTest extends TestRunTesting {

    @Test
    void curveUploadZipAndImportSheetAreBinaryBodiesWithTheirMediaTypes() {
        Api.Response r = technician().get("/v3/api-docs");
        assertThat(r.status()).as(r.toString()).isEqualTo(200);
        JsonNode paths = r.json().get("paths");
        JsonNode put = paths.get("/api/v1/tests/{id}/curve").get("put");
        JsonNode content = put.get("requestBody").get("content");
        assertThat(content.propertyNames()).contains("text/csv", "text/tab-separated-values", "application/octet-stream");
        assertThat(content.get("text/csv").get("schema").get("format").asString()).isEqualTo("binary");
        assertThat(put.get("requestBody").get("required").asBoolean()).isTrue();
        List<String> names = new ArrayList<>();
        put.get("parameters").forEach(p -> names.add(p.get("name").asString()));
        assertThat(names).contains("id", "confirmDuplicate", "reason", "filename", "Content-Disposition");

        assertThat(paths.get("/api/v1/orders/{orderId}/curves").get("post").get("requestBody").get("content")
                .get("application/zip").get("schema").get("format").asString()).isEqualTo("binary");
        assertThat(paths.get("/api/v1/orders/{orderId}/specimens/import").get("post").get("requestBody")
                .get("content").get("text/csv").get("schema").get("format").asString()).isEqualTo("binary");
    }
}
