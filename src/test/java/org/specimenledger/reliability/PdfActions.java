package org.specimenledger.reliability;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import org.apache.pdfbox.Loader;
import org.apache.pdfbox.cos.COSBase;
import org.apache.pdfbox.cos.COSDictionary;
import org.apache.pdfbox.cos.COSDocument;
import org.apache.pdfbox.cos.COSName;
import org.apache.pdfbox.cos.COSObject;
import org.apache.pdfbox.cos.COSObjectKey;
import org.apache.pdfbox.pdmodel.PDDocument;
import org.apache.pdfbox.pdmodel.PDDocumentCatalog;
import org.apache.pdfbox.pdmodel.PDPage;
import org.apache.pdfbox.pdmodel.interactive.annotation.PDAnnotation;

/**
 * What in a PDF could act when it is opened or clicked, read with PDFBox: the catalogue's open action and
 * additional actions, the JavaScript name tree, an interactive form, each page's annotations and additional
 * actions, and, in every object of the file, an action dictionary of a kind that runs script, opens a file or a
 * URL, or submits data [S: ISO 32000-1:2008 12.6.4, action types]. A certificate has none of them.
 */
final class PdfActions {

    private static final Set<String> ACTIVE = Set.of("JavaScript", "Launch", "URI", "SubmitForm", "ImportData",
            "GoToR", "GoToE", "ResetForm", "Rendition", "Movie", "Sound");

    private PdfActions() {
    }

    /** Everything active found, empty for an inert document. */
    static List<String> of(byte[] pdf) {
        List<String> out = new ArrayList<>();
        try (PDDocument document = Loader.loadPDF(pdf)) {
            PDDocumentCatalog catalog = document.getDocumentCatalog();
            COSDictionary root = catalog.getCOSObject();
            if (root.getDictionaryObject(COSName.OPEN_ACTION) != null) {
                out.add("PDF: the catalogue has an OpenAction");
            }
            if (root.getDictionaryObject(COSName.AA) != null) {
                out.add("PDF: the catalogue has additional actions");
            }
            if (catalog.getNames() != null && catalog.getNames().getJavaScript() != null) {
                out.add("PDF: the names tree has JavaScript");
            }
            if (catalog.getAcroForm() != null) {
                out.add("PDF: the document has an interactive form");
            }
            int number = 0;
            for (PDPage page : document.getPages()) {
                number++;
                for (PDAnnotation a : page.getAnnotations()) {
                    out.add("PDF: page " + number + " has a " + a.getSubtype() + " annotation");
                }
                if (page.getCOSObject().getDictionaryObject(COSName.AA) != null) {
                    out.add("PDF: page " + number + " has additional actions");
                }
            }
            COSDocument cos = document.getDocument();
            for (COSObjectKey key : cos.getXrefTable().keySet()) {
                COSObject object = cos.getObjectFromPool(key);
                COSBase value = object.getObject();
                if (value instanceof COSDictionary d) {
                    if (d.containsKey(COSName.JS) || d.containsKey(COSName.JAVA_SCRIPT)) {
                        out.add("PDF: object " + key + " holds script");
                    }
                    String kind = d.getNameAsString(COSName.S);
                    if (kind != null && ACTIVE.contains(kind)) {
                        out.add("PDF: object " + key + " is a " + kind + " action");
                    }
                }
            }
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return out;
    }
}
