package org.specimenledger.certificates.document;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.time.LocalDate;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import org.apache.pdfbox.pdmodel.font.PDFont;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.verapdf.pdfa.flavours.PDFAFlavour;

/**
 * Renders invented certificates and reads the PDF back with PDFBox (text, fonts) and veraPDF
 * (PDF/A-2b, ISO 19005-2), so what is checked is what a reader of the file gets.
 */
class CertificateRendererTest {

    private static CertificateRenderer renderer;
    private static CertificateDocument twenty;
    private static byte[] twentyPdf;

    @BeforeAll
    static void renderOnce() {
        renderer = new CertificateRenderer();
        twenty = CertificateFixtures.sample(20, true);
        twentyPdf = renderer.render(twenty);
    }

    @Test
    void printsEveryReportedValueWithItsRequirementAndVerdict() {
        String text = PdfReadBack.text(twentyPdf);
        for (CertificateDocument.ResultRow row : twenty.results()) {
            assertThat(text).contains(row.reportedValue());
            assertThat(text).contains(row.requirement());
            assertThat(text).contains(row.verdict());
        }
        assertThat(text).contains("elastic fit below 0.995");
        // 40-character identifiers are printed in full (PDFBox may break them across a line: spaces removed)
        String compact = text.replace(" ", "");
        for (int i = 1; i <= 20; i++) {
            assertThat(compact).contains(CertificateFixtures.specimenId(i));
        }
    }

    @Test
    void printsEveryRequiredContentItem() {
        String text = PdfReadBack.text(twentyPdf);
        assertThat(text).contains(
                "Inspection certificate 3.1 (EN 10204)",
                "Northgate Invented Materials Laboratory (fictitious)",
                "Unit 4, 12 Example Quay", "Harbourtown HT1 0ZZ", "Nowhere-land",
                "SL-2026-000417", "2026-03-09",
                "Fictional Fabrication Works Ltd", "88 Imaginary Road, Sampleton SA9 9XX", "PO-55-1029 / line 3",
                "Hot-rolled plate 20 mm, 2 plates", "Structural steel, invented specification IS-355 (demo)",
                "H-77120", "H-77121", "Imaginary Steelworks", "IS-355", "plate", "20 mm",
                "transverse", "round, machined", "78.24 mm²", "50.0 mm", "60.0 mm",
                "ISO 6892-1:2019", "Method B (stress-rate control)", "2026-03-02 to 2026-03-04", "23 °C ± 5 °C",
                "2026-02-27",
                "Simple acceptance: the reported (rounded) value is compared with the specification limit",
                "No deviations from the test method.",
                "TM-01", "testing machine 250 kN", "CAL-TM01-2025-11", "2025-11-03", "2026-11-03",
                "class 1 (ISO 7500-1)", "EX-07", "clip-on extensometer", "CAL-EX07-2026-01", "class 0.5 (ISO 9513)",
                "0.1.0", "495d1952c0ffee0000000000000000000000abcd", "tensile-1.3",
                "The results relate only to the items tested.",
                "Conformity statements follow the decision rule stated on this certificate.",
                "Local codes and the laboratory's accreditation scope govern",
                "Dr. Ada Invented", "Head of mechanical testing", "reviewed and approved for release",
                "7KQ2-M9XD-4TRB", "/verify/7KQ2-M9XD-4TRB", "sequence 10482",
                "9f2c1a7e5b3d4c6a8e0f1b2d3c4e5f60718293a4b5c6d7e8f90a1b2c3d4e5f6a",
                "Stress–strain curve, specimen", "End of certificate",
                // every table header in full
                "Nominal thickness", "Product form", "Orientation", "Dimensions", "Reported value", "Requirement",
                "Verdict", "Flags", "Calibration reference", "Calibrated on", "Due on");
        assertThat(text).doesNotContain("Replaces", "Status:");
    }

    @Test
    void everyPageCarriesNumberRevisionAndPageXOfY() {
        List<String> pages = PdfReadBack.pageTexts(twentyPdf);
        assertThat(pages).hasSizeGreaterThan(3);
        for (int p = 1; p <= pages.size(); p++) {
            assertThat(pages.get(p - 1))
                    .contains("Certificate SL-2026-000417 · revision 0 · page " + p + " of " + pages.size());
        }
        assertThat(pages.get(pages.size() - 1)).contains("End of certificate");
        for (int p = 0; p < pages.size() - 1; p++) {
            assertThat(pages.get(p)).doesNotContain("End of certificate");
        }
    }

    @Test
    void embedsEveryFont() {
        List<PDFont> fonts = PdfReadBack.fonts(twentyPdf);
        assertThat(fonts).isNotEmpty();
        assertThat(fonts).allSatisfy(font -> assertThat(font.isEmbedded()).as(font.getName()).isTrue());
        assertThat(fonts).allSatisfy(font -> assertThat(font.getName()).contains("DejaVuSans"));
    }

    @Test
    void isPdfA2bWithNoFailedRule() {
        assertThat(PdfReadBack.failedRules(twentyPdf, PDFAFlavour.PDFA_2_B)).isEmpty();
    }

    @Test
    void revisionNamesWhatItReplacesAndAWatermarkMarksAnInvalidDocument() {
        CertificateDocument base = CertificateFixtures.sample(2);
        CertificateDocument revised = new CertificateDocument(base.laboratory(),
                new CertificateDocument.Identification("SL-2026-000417", 1,
                        Optional.of(new CertificateDocument.Replacement("SL-2026-000417", 0,
                                "Rm of specimen 2 re-analysed after an extensometer slip was found")),
                        Optional.of("SUPERSEDED"), LocalDate.of(2026, 3, 20)),
                base.customer(), base.product(), base.heats(), base.specimens(), base.conditions(), base.results(),
                base.decisionRuleStatement(), base.deviationsStatement(), base.equipment(), base.software(),
                base.signatory().orElseThrow(), new CertificateDocument.Verification("7KQ2-M9XD-4TRC", 10544, "ab".repeat(32),
                        Optional.of("Checkpoint 212 signed 2026-03-20T06:00Z")), base.appendix());
        byte[] pdf = renderer.render(revised);
        String text = PdfReadBack.text(pdf);
        assertThat(text).contains("Replaces SL-2026-000417 rev 0 because Rm of specimen 2 re-analysed after an"
                .replace(" ", " "));
        assertThat(text.replace(" ", "")).contains("extensometerslipwasfound");
        assertThat(text).contains("Status: SUPERSEDED", "SUPERSEDED", "Checkpoint 212 signed 2026-03-20T06:00Z");
        assertThat(text).doesNotContain("Stress–strain curve, specimen");
        for (String page : PdfReadBack.pageTexts(pdf)) {
            assertThat(page).contains("revision 1");
        }
        assertThat(PdfReadBack.failedRules(pdf, PDFAFlavour.PDFA_2_B)).isEmpty();
    }

    @Test
    void longValuesAreNotClipped() {
        String longAddress = "Building 7, Gate C, " + "Long Industrial Estate Road ".repeat(8) + "END-OF-ADDRESS";
        CertificateDocument doc = CertificateFixtures.sample(3, false,
                s -> s.startsWith("88 Imaginary Road") ? longAddress : s);
        String text = PdfReadBack.text(renderer.render(doc));
        assertThat(text.replace(" ", "")).contains(longAddress.replace(" ", ""));
    }

    /** The same document as a draft preview: no number, issue date, signatory or verification (all absent). */
    static CertificateDocument preview(CertificateDocument d) {
        return new CertificateDocument(d.laboratory(), CertificateDocument.Identification.preview(0, Optional.empty()),
                d.customer(), d.product(), d.heats(), d.specimens(), d.conditions(), d.results(),
                d.decisionRuleStatement(), d.deviationsStatement(), d.equipment(), d.software(), Optional.empty(),
                Optional.empty(), d.appendix());
    }

    @Test
    void previewIsMarkedOnEveryPageAndPrintsNothingOfAnIssuedCertificatesIdentity() throws Exception {
        byte[] pdf = renderer.render(preview(twenty));
        java.nio.file.Files.createDirectories(java.nio.file.Path.of("target", "screenshots"));
        java.nio.file.Files.write(java.nio.file.Path.of("target", "screenshots", "draft-preview.pdf"), pdf);
        List<String> pages = PdfReadBack.pageTexts(pdf);
        assertThat(pages).hasSizeGreaterThan(3);
        for (int p = 1; p <= pages.size(); p++) {
            assertThat(pages.get(p - 1)).as("page %d", p).contains(CertificateDocument.PREVIEW_HEADER,
                    CertificateDocument.PREVIEW_FOOTER + " · page " + p + " of " + pages.size());
            // the watermark is set rotated: PDFBox reads its letters with spaces between some of them
            assertThat(pages.get(p - 1).replace(" ", "")).as("page %d", p)
                    .contains(CertificateDocument.PREVIEW_WATERMARK.replace(" ", ""));
        }
        String text = String.join(" ", pages);
        // the results are the same as the certificate's
        for (CertificateDocument.ResultRow row : twenty.results()) {
            assertThat(text).contains(row.reportedValue());
        }
        assertThat(text).contains("none until issued", "not issued",
                "None: a draft preview is not signed", "None: a draft preview has no verification code",
                "End of draft preview", "The results relate only to the items tested.");
        assertThat(text).doesNotContain("SL-2026-000417", "2026-03-09", "Dr. Ada Invented", "7KQ2-M9XD-4TRB",
                "/verify/", "sequence 10482", "Signature:", "Signed on", "End of certificate",
                "Certificate SL-");
        assertThat(PdfReadBack.failedRules(pdf, PDFAFlavour.PDFA_2_B)).as("veraPDF, PDF/A-2b").isEmpty();
    }

    @Test
    void aCertificateCarriesNoPreviewMarking() {
        String text = PdfReadBack.text(twentyPdf);
        assertThat(text).doesNotContain(CertificateDocument.PREVIEW_HEADER, CertificateDocument.PREVIEW_FOOTER);
        assertThat(text.replace(" ", "")).doesNotContain(CertificateDocument.PREVIEW_WATERMARK.replace(" ", ""));
    }

    @Test
    void aDocumentIsEitherACertificateOrAPreviewNeverAMix() {
        CertificateDocument d = CertificateFixtures.sample(1);
        assertThatThrownBy(() -> new CertificateDocument(d.laboratory(),
                CertificateDocument.Identification.preview(0, Optional.empty()), d.customer(), d.product(), d.heats(),
                d.specimens(), d.conditions(), d.results(), d.decisionRuleStatement(), d.deviationsStatement(),
                d.equipment(), d.software(), d.signatory(), d.verification(), d.appendix()))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("preview");
        assertThatThrownBy(() -> new CertificateDocument(d.laboratory(), d.identification(), d.customer(),
                d.product(), d.heats(), d.specimens(), d.conditions(), d.results(), d.decisionRuleStatement(),
                d.deviationsStatement(), d.equipment(), d.software(), Optional.empty(), Optional.empty(),
                d.appendix()))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("signatory");
        assertThatThrownBy(() -> new CertificateDocument.Identification(Optional.of("SL-1"), 0, Optional.empty(),
                Optional.empty(), Optional.empty())).isInstanceOf(IllegalArgumentException.class);
    }

    @Test
    void hostileTextComesOutLiterally() {
        String hostile = "<script>alert('x')</script> '; DROP TABLE certificates; -- $P{NUMBER} "
                + "Ø 12,5 mm — µm ≤ ≥ Ω bell\u0007 nul\u0000 esc\u001b end";
        CertificateDocument doc = CertificateFixtures.sample(2, false, s -> s + " " + hostile);
        byte[] pdf = renderer.render(doc);
        String text = PdfReadBack.text(pdf);
        assertThat(text).contains("<script>alert('x')</script>", "'; DROP TABLE certificates; --", "$P{NUMBER}",
                "Ø 12,5 mm — µm ≤ ≥ Ω", "bell[U+0007] nul[U+0000] esc[U+001B] end");
        assertThat(PdfReadBack.failedRules(pdf, PDFAFlavour.PDFA_2_B)).isEmpty();
    }

    /**
     * Every free text, with a markup-like text after it and a unique end mark, prints to its last word. The fill
     * breaks lines where AWT allows (before "(", after "<"...), the PDF library by default only at spaces and
     * hyphens; a narrow cell sized for the fill's line count lost its last line in the PDF (found by the reliability
     * suite with an equipment identifier, rerun here for every table cell and block of text).
     */
    @Test
    void aTextThatBreaksAtPunctuationKeepsItsLastLine() {
        String markupLike = "\"><img src=x onerror=alert(1)>";
        List<String> ends = new java.util.ArrayList<>();
        CertificateDocument d = CertificateFixtures.sample(3, false, s -> {
            String end = "~end" + ends.size();
            ends.add(end);
            return s + " " + markupLike + " " + end;
        });
        List<CertificateDocument.Equipment> equipment = new java.util.ArrayList<>();
        for (String field : List.of("identifier", "kind", "reference", "class")) {
            String v = "TM-ab12c " + markupLike + " ~" + field;
            ends.add("~" + field);
            equipment.add(new CertificateDocument.Equipment(field.equals("identifier") ? v : "TM-01",
                    field.equals("kind") ? v : "testing machine", field.equals("reference") ? v : "CAL-1",
                    LocalDate.of(2026, 1, 5), LocalDate.of(2027, 1, 5), field.equals("class") ? v : "class 1"));
        }
        CertificateDocument doc = new CertificateDocument(d.laboratory(), d.identification(), d.customer(),
                d.product(), d.heats(), d.specimens(), d.conditions(), d.results(), d.decisionRuleStatement(),
                d.deviationsStatement(), equipment, d.software(), d.signatory(), d.verification(), d.appendix());
        // PDFBox puts a space where a line was broken inside a word, so the comparison ignores white space
        String text = PdfReadBack.text(renderer.render(doc)).replaceAll("\\s+", "");
        String printed = markupLike.replace(" ", "");
        assertThat(ends).hasSizeGreaterThan(10);
        for (String end : ends) {
            assertThat(text).as("text ending in %s", end).contains(printed + end);
        }
    }

    @Test
    void rendersConcurrentlyWithOneRenderer() throws Exception {
        ExecutorService pool = Executors.newFixedThreadPool(4);
        try {
            List<Future<byte[]>> pdfs = pool.invokeAll(List.of(
                    () -> renderer.render(CertificateFixtures.sample(1)),
                    () -> renderer.render(CertificateFixtures.sample(2)),
                    () -> renderer.render(CertificateFixtures.sample(3)),
                    () -> renderer.render(CertificateFixtures.sample(4))));
            for (int i = 0; i < pdfs.size(); i++) {
                String text = PdfReadBack.text(pdfs.get(i).get()).replace(" ", "");
                assertThat(text).contains(CertificateFixtures.specimenId(i + 1));
                assertThat(text).doesNotContain(CertificateFixtures.specimenId(i + 2));
            }
        } finally {
            pool.shutdown();
        }
    }
}
