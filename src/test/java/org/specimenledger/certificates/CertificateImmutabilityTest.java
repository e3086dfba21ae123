package org.specimenledger.certificates;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.List;
import java.util.Map;
import java.util.UUID;
import org.junit.jupiter.api.Test;
import org.springframework.dao.DataAccessException;
import tools.jackson.databind.JsonNode;

/**
 * Nothing issued changes: direct SQL UPDATE, DELETE and TRUNCATE on the certificate, its lines, its PDF and its
 * status rows are refused by triggers, and so is any change to an issued draft. The PDF still hashes to the SHA-256
 * recorded at issue afterwards.
 */
class CertificateImmutabilityTest extends CertificateTesting {

    @Test
    void directSqlCannotChangeAnIssuedCertificate() {
        CertificateBench.Order order = bench().order(customerId(), passingRequirements(), 1);
        String draftId = draft(order, order.specimenIds(), null, false).get("id").asString();
        JsonNode c = issued(draftId);
        String number = c.get("number").asString();
        assertThat(manager().post("/api/v1/certificates/" + number + "/withdraw", Map.of("reason", "test")).status())
                .isEqualTo(200);
        UUID id = UUID.fromString(c.get("id").asString());

        for (String sql : List.of(
                "UPDATE certificate SET signatory_name = 'someone else' WHERE id = ?",
                "UPDATE certificate SET pdf_sha256 = repeat('0', 64) WHERE id = ?",
                "DELETE FROM certificate WHERE id = ?",
                "UPDATE certificate_line SET reported = '999' WHERE certificate_id = ?",
                "DELETE FROM certificate_line WHERE certificate_id = ?",
                "UPDATE certificate_pdf SET content = 'x'::bytea WHERE certificate_id = ?",
                "DELETE FROM certificate_pdf WHERE certificate_id = ?",
                "UPDATE certificate_status_change SET reason = 'other' WHERE certificate_id = ?",
                "DELETE FROM certificate_status_change WHERE certificate_id = ?")) {
            assertThatThrownBy(() -> jdbc.sql(sql).param(id).update()).as(sql).isInstanceOf(DataAccessException.class)
                    .rootCause().hasMessageContaining("is not allowed: recorded history is append-only");
        }
        for (String table : List.of("certificate", "certificate_line", "certificate_pdf", "certificate_status_change",
                "certificate_draft")) {
            assertThatThrownBy(() -> jdbc.sql("TRUNCATE " + table + " CASCADE").update()).as(table)
                    .isInstanceOf(DataAccessException.class);
        }
        assertThatThrownBy(() -> jdbc.sql("UPDATE certificate_draft SET product_description = 'x' WHERE id = ?")
                .param(UUID.fromString(draftId)).update()).rootCause().hasMessageContaining("can no longer change");
        assertThatThrownBy(() -> jdbc.sql("DELETE FROM certificate_draft WHERE id = ?")
                .param(UUID.fromString(draftId)).update()).rootCause().hasMessageContaining("never removed");

        String stored = jdbc.sql("SELECT encode(sha256(content), 'hex') FROM certificate_pdf WHERE certificate_id = ?")
                .param(id).query(String.class).single();
        assertThat(stored).isEqualTo(c.get("pdfSha256").asString());
        assertThat(jdbc.sql("SELECT signatory_name FROM certificate WHERE id = ?").param(id).query(String.class)
                .single()).isEqualTo("Test Manager");
    }

    @Test
    void noApiCallChangesAnIssuedCertificate() {
        CertificateBench.Order order = bench().order(customerId(), passingRequirements(), 1);
        String draftId = draft(order, order.specimenIds(), null, false).get("id").asString();
        JsonNode c = issued(draftId);
        String number = c.get("number").asString();
        byte[] before = manager().getBytes("/api/v1/certificates/" + number + "/pdf").body();
        Map<String, Object> body = CertificateBench.draft(order, order.specimenIds(), "GUARD_BANDED", false);
        body.put("reason", "try to change after issue");
        assertThat(manager().put("/api/v1/certificates/drafts/" + draftId, body).status()).isEqualTo(409);
        assertThat(manager().post("/api/v1/certificates/drafts/" + draftId + "/discard", Map.of("reason", "x"))
                .status()).isEqualTo(409);
        assertThat(manager().put("/api/v1/certificates/" + number, body).status()).isIn(404, 405);
        assertThat(manager().delete("/api/v1/certificates/" + number).status()).isIn(404, 405);
        assertThat(manager().getBytes("/api/v1/certificates/" + number + "/pdf").body()).isEqualTo(before);
        assertThat(manager().get("/api/v1/certificates/" + number).json().get("lines").toString())
                .isEqualTo(c.get("lines").toString());
    }
}
