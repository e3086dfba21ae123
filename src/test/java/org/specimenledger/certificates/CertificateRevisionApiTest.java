package org.specimenledger.certificates;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.Map;
import org.junit.jupiter.api.Test;
import org.specimenledger.certificates.document.PdfReadBack;
import org.specimenledger.testsupport.Api;
import org.springframework.beans.factory.annotation.Autowired;
import tools.jackson.databind.JsonNode;

/**
 * Revision (ISO/IEC 17025:2017 7.8.8: a new document that names the one it replaces and why), withdrawal with a
 * reason, and anonymous verification from the code or the PDF file.
 */
class CertificateRevisionApiTest extends CertificateTesting {

    @Autowired
    VerificationRateLimit rateLimit;

    private JsonNode issuedCertificate() {
        CertificateBench.Order order = bench().order(customerId(), passingRequirements(), 1);
        return issued(draft(order, order.specimenIds(), null, false).get("id").asString());
    }

    @Test
    void revisionReferencesTheOldOneWhichStaysDownloadableAndSuperseded() {
        JsonNode first = issuedCertificate();
        String number = first.get("number").asString();
        byte[] firstPdf = manager().getBytes("/api/v1/certificates/" + number + "/pdf").body();

        assertThat(manager().post("/api/v1/certificates/" + number + "/revisions", Map.of()).status()).isEqualTo(422);
        Api.Response opened = manager().post("/api/v1/certificates/" + number + "/revisions",
                Map.of("reason", "customer's order reference was misspelt"));
        assertThat(opened.status()).as(opened.toString()).isEqualTo(201);
        assertThat(opened.json().get("revises").get("number").asString()).isEqualTo(number);
        JsonNode second = issued(opened.id());
        assertThat(second.get("number").asString()).isEqualTo(number);
        assertThat(second.get("revision").asInt()).isEqualTo(1);
        assertThat(second.get("replaces").get("id").asString()).isEqualTo(first.get("id").asString());
        assertThat(second.get("revisionReason").asString()).isEqualTo("customer's order reference was misspelt");

        JsonNode old = manager().get("/api/v1/certificates/" + number + "?revision=0").json();
        assertThat(old.get("status").asString()).isEqualTo("SUPERSEDED");
        assertThat(old.get("supersededBy").get("revision").asInt()).isEqualTo(1);
        Api.Download oldPdf = manager().getBytes("/api/v1/certificates/" + number + "/pdf?revision=0");
        assertThat(oldPdf.status()).isEqualTo(200);
        assertThat(oldPdf.body()).isEqualTo(firstPdf);
        assertThat(oldPdf.header("Certificate-Status")).isEqualTo("superseded");
        assertThat(manager().get("/api/v1/certificates/" + number).json().get("revision").asInt()).isEqualTo(1);
        assertThat(manager().get("/api/v1/certificates/" + number + "/revisions").json()).hasSize(2);

        String text = PdfReadBack.text(manager().getBytes("/api/v1/certificates/" + number + "/pdf").body());
        assertThat(text).contains("Replaces " + number + " rev 0 because customer's order reference was misspelt",
                "Certificate " + number + " · revision 1 · page 1 of");

        assertThat(anonymous().get("/verify/" + first.get("verificationCode").asString()).json().get("status")
                .asString()).isEqualTo("superseded");
        JsonNode events = manager().get("/api/v1/audit/events?entityType=certificate&entityId="
                + first.get("id").asString()).json().get("events");
        assertThat(events.get(events.size() - 1).get("action").asString()).isEqualTo("certificate.superseded");

        // withdrawal acts on the current revision (1); a withdrawn certificate cannot be revised
        assertThat(manager().post("/api/v1/certificates/" + number + "/withdraw", Map.of("reason", "r")).status())
                .isEqualTo(200);
        assertThat(manager().post("/api/v1/certificates/" + number + "/revisions", Map.of("reason", "again"))
                .status()).isEqualTo(409);
    }

    @Test
    void withdrawalNeedsAReasonIsFinalAndInTheLedger() {
        JsonNode c = issuedCertificate();
        String number = c.get("number").asString();
        assertThat(manager().post("/api/v1/certificates/" + number + "/withdraw", Map.of("reason", " ")).status())
                .isEqualTo(422);
        Api.Response withdrawn = manager().post("/api/v1/certificates/" + number + "/withdraw",
                Map.of("reason", "specimen identity mixed up at receipt"));
        assertThat(withdrawn.status()).as(withdrawn.toString()).isEqualTo(200);
        assertThat(withdrawn.json().get("status").asString()).isEqualTo("WITHDRAWN");
        assertThat(manager().post("/api/v1/certificates/" + number + "/withdraw", Map.of("reason", "twice"))
                .status()).isEqualTo(409);
        assertThat(manager().getBytes("/api/v1/certificates/" + number + "/pdf").header("Certificate-Status"))
                .isEqualTo("withdrawn");
        JsonNode verified = anonymous().get("/verify/" + c.get("verificationCode").asString()).json();
        assertThat(verified.get("status").asString()).isEqualTo("withdrawn");
        JsonNode events = manager().get("/api/v1/audit/events?entityType=certificate&entityId="
                + c.get("id").asString()).json().get("events");
        JsonNode last = events.get(events.size() - 1);
        assertThat(last.get("action").asString()).isEqualTo("certificate.withdrawn");
        assertThat(last.get("reason").asString()).isEqualTo("specimen identity mixed up at receipt");
    }

    @Test
    void verificationAnswersOnlyThePublicFacts() {
        JsonNode c = issuedCertificate();
        Api.Response r = anonymous().get("/verify/" + c.get("verificationCode").asString());
        assertThat(r.status()).as(r.toString()).isEqualTo(200);
        JsonNode v = r.json();
        assertThat(v.propertyNames()).containsExactlyInAnyOrder("number", "revision", "status", "issueDate",
                "laboratory", "pdfSha256");
        assertThat(v.get("number").asString()).isEqualTo(c.get("number").asString());
        assertThat(v.get("status").asString()).isEqualTo("valid");
        assertThat(v.get("pdfSha256").asString()).isEqualTo(c.get("pdfSha256").asString());
        Api.Response unknown = anonymous().get("/verify/0123456789abcdef0123456789abcdef");
        assertThat(unknown.status()).isEqualTo(404);
        assertThat(unknown.body()).doesNotContain("0123456789abcdef0123456789abcdef".substring(4) + "x");
        assertThat(anonymous().get("/verify/not-a-code").status()).isEqualTo(404);
    }

    @Test
    void uploadedPdfIsIdenticalOnlyWhenByteForByteTheSame() {
        JsonNode c = issuedCertificate();
        byte[] pdf = manager().getBytes("/api/v1/certificates/" + c.get("number").asString() + "/pdf").body();
        Api.Response same = anonymous().multipart("POST", "/verify", Api.Part.file("pdf", "c.pdf", pdf));
        assertThat(same.status()).as(same.toString()).isEqualTo(200);
        assertThat(same.json().get("identical").asBoolean()).isTrue();
        assertThat(same.json().get("certificate").get("number").asString()).isEqualTo(c.get("number").asString());
        byte[] changed = pdf.clone();
        changed[changed.length / 2] ^= 1;
        Api.Response other = anonymous().multipart("POST", "/verify", Api.Part.file("pdf", "c.pdf", changed));
        assertThat(other.json().get("identical").asBoolean()).isFalse();
        assertThat(other.json().get("certificate").isNull()).isTrue();
        assertThat(anonymous().multipart("POST", "/verify").status()).isEqualTo(400);
    }

    @Test
    void verificationIsRateLimitedPerClient() {
        rateLimit.reset();
        try {
            // a burst of 30 passes (the bucket refills 30 per minute meanwhile, so a few more may pass on a slow
            // machine); then the answer is a 429 problem
            int passed = 0;
            Api.Response refused = null;
            for (int i = 0; i < 200 && refused == null; i++) {
                Api.Response r = anonymous().get("/verify/0123456789abcdef0123456789abcdef");
                if (r.status() == 429) {
                    refused = r;
                } else {
                    assertThat(r.status()).isEqualTo(404);
                    passed++;
                }
            }
            assertThat(refused).as("a refusal after the burst").isNotNull();
            assertThat(passed).isGreaterThanOrEqualTo(30);
            assertThat(refused.contentType()).startsWith("application/problem+json");
            assertThat(refused.body()).contains("too many verification requests");
        } finally {
            rateLimit.reset();
        }
    }
}
