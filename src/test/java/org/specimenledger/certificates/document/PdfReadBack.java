package org.specimenledger.certificates.document;

import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Collectors;
import org.apache.pdfbox.Loader;
import org.apache.pdfbox.cos.COSName;
import org.apache.pdfbox.pdmodel.PDDocument;
import org.apache.pdfbox.pdmodel.PDPage;
import org.apache.pdfbox.pdmodel.font.PDFont;
import org.apache.pdfbox.text.PDFTextStripper;
import org.verapdf.gf.foundry.VeraGreenfieldFoundryProvider;
import org.verapdf.pdfa.Foundries;
import org.verapdf.pdfa.PDFAParser;
import org.verapdf.pdfa.PDFAValidator;
import org.verapdf.pdfa.flavours.PDFAFlavour;
import org.verapdf.pdfa.results.TestAssertion;
import org.verapdf.pdfa.results.ValidationResult;

/** Reads a rendered PDF back with PDFBox, and validates it with veraPDF: the tests' independent eyes. */
public final class PdfReadBack {

    static {
        VeraGreenfieldFoundryProvider.initialise();
    }

    private PdfReadBack() {
    }

    /** The text of each page, in page order, with runs of white space collapsed to one space. */
    public static List<String> pageTexts(byte[] pdf) {
        try (PDDocument document = Loader.loadPDF(pdf)) {
            PDFTextStripper stripper = new PDFTextStripper();
            List<String> pages = new ArrayList<>();
            for (int p = 1; p <= document.getNumberOfPages(); p++) {
                stripper.setStartPage(p);
                stripper.setEndPage(p);
                pages.add(stripper.getText(document).replaceAll("\\s+", " "));
            }
            return pages;
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    public static String text(byte[] pdf) {
        return String.join(" ", pageTexts(pdf));
    }

    /** Every font used on any page, as "name embedded?" strings for readable failures. */
    static List<PDFont> fonts(byte[] pdf) {
        try (PDDocument document = Loader.loadPDF(pdf)) {
            List<PDFont> fonts = new ArrayList<>();
            for (PDPage page : document.getPages()) {
                for (COSName name : page.getResources().getFontNames()) {
                    fonts.add(page.getResources().getFont(name));
                }
            }
            return fonts;
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    /** The failed rules of a veraPDF validation against {@code flavour}, empty when compliant. */
    public static List<String> failedRules(byte[] pdf, PDFAFlavour flavour) {
        try (PDFAParser parser = Foundries.defaultInstance().createParser(new ByteArrayInputStream(pdf), flavour);
             PDFAValidator validator = Foundries.defaultInstance().createValidator(flavour, false)) {
            ValidationResult result = validator.validate(parser);
            List<String> failed = result.getTestAssertions().stream()
                    .filter(a -> a.getStatus() == TestAssertion.Status.FAILED)
                    .map(a -> a.getRuleId().getClause() + "-" + a.getRuleId().getTestNumber() + ": " + a.getMessage())
                    .distinct().collect(Collectors.toList());
            if (!result.isCompliant() && failed.isEmpty()) {
                failed.add("not compliant, no failed assertion listed");
            }
            return failed;
        } catch (Exception e) {
            throw new IllegalStateException("veraPDF could not validate: " + e.getMessage(), e);
        }
    }
}
