package org.specimenledger.certificates;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;
import java.util.Map;
import java.util.UUID;
import org.junit.jupiter.api.Test;
import org.specimenledger.certificates.document.CertificateDocument;
import org.specimenledger.certificates.document.PdfReadBack;
import org.specimenledger.testsupport.Api;
import org.specimenledger.testsupport.TestAccounts;
import org.verapdf.pdfa.flavours.PDFAFlavour;
import tools.jackson.databind.JsonNode;

/**
 * The draft preview through real HTTP against a real PostgreSQL: the PDF read back with PDFBox shows the draft's
 * lines and the preview marking and nothing of an issued certificate's identity, veraPDF finds it PDF/A-2b as the
 * issued ones are, and a preview leaves every certificate and ledger table as it was.
 */
class DraftPreviewApiTest extends CertificateTesting {

    private static String previewPath(String draftId) {
        return "/api/v1/certificates/drafts/" + draftId + "/preview";
    }

    @Test
    void previewPrintsTheDraftsLinesMarkedOnEveryPageWithNoNumberSignatureOrVerification() {
        CertificateBench.Order order = bench().order(customerId(), passingRequirements(), 2);
        JsonNode draft = draft(order, order.specimenIds(), null, true);
        String draftId = draft.get("id").asString();
        long serialsBefore = jdbc.sql("SELECT coalesce(sum(last_serial), 0) FROM certificate_counter")
                .query(Long.class).single();

        Api.Download preview = manager().getBytes(previewPath(draftId));
        assertThat(preview.status()).as(new String(preview.body())).isEqualTo(200);
        assertThat(preview.header("Content-Type")).isEqualTo("application/pdf");
        assertThat(preview.header("Draft-Preview")).isEqualTo("true");
        assertThat(preview.header("Cache-Control")).contains("no-store");
        assertThat(preview.header("Content-Disposition")).startsWith("inline");
        assertThat(preview.header("Certificate-SHA256")).isNull();

        List<String> pages = PdfReadBack.pageTexts(preview.body());
        assertThat(pages).hasSizeGreaterThanOrEqualTo(3); // results + one curve page per specimen, as issued
        for (int p = 0; p < pages.size(); p++) {
            assertThat(pages.get(p)).as("page %d", p + 1).contains(CertificateDocument.PREVIEW_HEADER,
                    CertificateDocument.PREVIEW_FOOTER + " · page " + (p + 1) + " of " + pages.size());
            // the watermark is set rotated: PDFBox reads its letters with spaces between some of them
            assertThat(pages.get(p).replace(" ", "")).as("page %d", p + 1)
                    .contains(CertificateDocument.PREVIEW_WATERMARK.replace(" ", ""));
        }
        String text = String.join(" ", pages);
        assertEveryLinePrinted(text, draft.get("lines"));
        assertThat(text).contains("Inspection certificate 3.1 (EN 10204)", "EN 10025-2 S355J2+N",
                "Hot-rolled round bar, 20 mm", "Simple acceptance (ILAC-G8:09/2019", "ISO 6892-1:2019",
                "Stress–strain curve, specimen " + order.marks().get(0), "The results relate only to the items tested.",
                "none until issued", "not issued", "End of draft preview");
        // no number (the year's pattern of the issued ones), no signatory, no verification, no audit-trail position
        assertThat(text).doesNotContainPattern("IC-\\d{4}-\\d{5}");
        assertThat(text).doesNotContain("Test Manager", "Laboratory manager", "Signature:", "/verify/",
                "Audit trail position", "sequence ", "Checkpoint", "End of certificate");
        assertThat(PdfReadBack.failedRules(preview.body(), PDFAFlavour.PDFA_2_B)).as("veraPDF, PDF/A-2b").isEmpty();

        // the draft issues afterwards as usual, and takes the next number: the preview took none
        JsonNode issued = issued(draftId);
        assertThat(jdbc.sql("SELECT coalesce(sum(last_serial), 0) FROM certificate_counter").query(Long.class)
                .single()).isEqualTo(serialsBefore + 1);
        String issuedText = PdfReadBack.text(manager().getBytes("/api/v1/certificates/"
                + issued.get("number").asString() + "/pdf").body());
        assertThat(issuedText).doesNotContain(CertificateDocument.PREVIEW_HEADER, CertificateDocument.PREVIEW_FOOTER);
    }

    @Test
    void previewStoresNothingAndWritesNoLedgerEvent() {
        CertificateBench.Order order = bench().order(customerId(), passingRequirements(), 1);
        String draftId = draft(order, order.specimenIds(), null, false).get("id").asString();
        Map<String, Long> before = footprint();
        long draftVersion = jdbc.sql("SELECT version FROM certificate_draft WHERE id = ?::uuid").param(draftId)
                .query(Long.class).single();
        for (Api who : List.of(manager(), technician(), as(TestAccounts.AUDITOR))) {
            assertThat(who.getBytes(previewPath(draftId)).status()).isEqualTo(200);
        }
        assertThat(footprint()).isEqualTo(before);
        assertThat(jdbc.sql("SELECT version FROM certificate_draft WHERE id = ?::uuid").param(draftId)
                .query(Long.class).single()).isEqualTo(draftVersion);
        assertThat(manager().get("/api/v1/certificates/drafts/" + draftId).json().get("state").asString())
                .isEqualTo("OPEN");
    }

    @Test
    void customersAndAnonymousGetNoPreview() {
        CertificateBench.Order order = bench().order(customerId(), passingRequirements(), 1);
        String draftId = draft(order, order.specimenIds(), null, false).get("id").asString();
        assertThat(as(TestAccounts.CUSTOMER).getBytes(previewPath(draftId)).status()).isEqualTo(403);
        assertThat(anonymous().getBytes(previewPath(draftId)).status()).isEqualTo(401);
    }

    @Test
    void issuedAndDiscardedDraftsAreAConflictAndAnUnknownOneIsNotFound() {
        CertificateBench.Order order = bench().order(customerId(), passingRequirements(), 1);
        String issuedDraft = draft(order, order.specimenIds(), null, false).get("id").asString();
        String number = issued(issuedDraft).get("number").asString();
        String discarded = draft(order, order.specimenIds(), null, false).get("id").asString();
        assertThat(manager().post("/api/v1/certificates/drafts/" + discarded + "/discard",
                Map.of("reason", "drafted twice")).status()).isEqualTo(200);
        Map<String, Long> before = footprint();

        Api.Response afterIssue = manager().get(previewPath(issuedDraft));
        assertThat(afterIssue.status()).as(afterIssue.toString()).isEqualTo(409);
        assertThat(afterIssue.contentType()).startsWith("application/problem+json");
        assertThat(afterIssue.body()).contains("is issued as " + number);
        Api.Response afterDiscard = manager().get(previewPath(discarded));
        assertThat(afterDiscard.status()).as(afterDiscard.toString()).isEqualTo(409);
        assertThat(afterDiscard.body()).contains("is discarded");
        Api.Response unknown = manager().get(previewPath(UUID.randomUUID().toString()));
        assertThat(unknown.status()).as(unknown.toString()).isEqualTo(404);
        assertThat(unknown.contentType()).startsWith("application/problem+json");
        Api.Response notAnId = manager().get(previewPath("not-a-draft"));
        assertThat(notAnId.status()).as(notAnId.toString()).isEqualTo(400);
        assertThat(footprint()).isEqualTo(before);
    }

    @Test
    void aDraftWhoseLinesCanNoLongerBeBuiltIsAConflictNamingWhy() {
        CertificateBench.Order order = bench().order(customerId(), passingRequirements(), 1);
        JsonNode draft = draft(order, order.specimenIds(), null, false);
        String run = draft.get("lines").get(0).get("testRunId").asString();
        Api.Response invalidated = technician().post("/api/v1/tests/" + run + "/invalidate",
                Map.of("reason", "grip slipped; the run is not valid"));
        assertThat(invalidated.status()).as(invalidated.toString()).isEqualTo(200);
        Map<String, Long> before = footprint();

        Api.Response r = manager().get(previewPath(draft.get("id").asString()));
        assertThat(r.status()).as(r.toString()).isEqualTo(409);
        assertThat(r.contentType()).startsWith("application/problem+json");
        assertThat(r.body()).contains("can no longer be built", order.marks().get(0), "no valid test run");
        assertThat(footprint()).isEqualTo(before);
    }

    @Test
    void aRevisionDraftPreviewsAsTheNextRevisionNamingWhatItReplaces() {
        CertificateBench.Order order = bench().order(customerId(), passingRequirements(), 1);
        String number = issued(draft(order, order.specimenIds(), null, false).get("id").asString()).get("number")
                .asString();
        Api.Response opened = manager().post("/api/v1/certificates/" + number + "/revisions",
                Map.of("reason", "order reference corrected"));
        assertThat(opened.status()).as(opened.toString()).isEqualTo(201);
        Api.Download preview = manager().getBytes(previewPath(opened.id()));
        assertThat(preview.status()).isEqualTo(200);
        String text = PdfReadBack.text(preview.body());
        assertThat(text).contains("Replaces " + number + " rev 0 because order reference corrected",
                CertificateDocument.PREVIEW_HEADER, CertificateDocument.PREVIEW_FOOTER);
        // the number appears only as what the revision replaces, never as this document's own
        assertThat(text).doesNotContain("Certificate " + number + " · revision");
        assertThat(manager().get("/api/v1/certificates/" + number).json().get("revision").asInt()).isZero();
    }
}
