package org.specimenledger.certificates.document;

import java.awt.Font;
import java.awt.FontFormatException;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.time.format.DateTimeFormatter;
import java.util.ArrayList;
import java.util.Collection;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import net.sf.jasperreports.engine.JREmptyDataSource;
import net.sf.jasperreports.engine.JRException;
import net.sf.jasperreports.engine.JasperCompileManager;
import net.sf.jasperreports.engine.JasperFillManager;
import net.sf.jasperreports.engine.JasperPrint;
import net.sf.jasperreports.engine.JasperReport;
import net.sf.jasperreports.engine.SimpleJasperReportsContext;
import net.sf.jasperreports.export.SimpleExporterInput;
import net.sf.jasperreports.export.SimpleOutputStreamExporterOutput;
import net.sf.jasperreports.pdf.JRPdfExporter;
import net.sf.jasperreports.pdf.SimplePdfExporterConfiguration;
import net.sf.jasperreports.pdf.SimplePdfReportConfiguration;
import net.sf.jasperreports.pdf.type.PdfaConformanceEnum;
import org.apache.pdfbox.Loader;
import org.apache.pdfbox.cos.COSName;
import org.apache.pdfbox.pdmodel.PDDocument;
import org.apache.pdfbox.pdmodel.PDPage;
import org.apache.pdfbox.pdmodel.PDResources;
import org.apache.pdfbox.pdmodel.font.PDFont;
import org.apache.pdfbox.pdmodel.font.PDFontDescriptor;
import org.apache.pdfbox.pdmodel.font.PDType0Font;

/**
 * Renders a {@link CertificateDocument} to a PDF/A-2b file with every font embedded (DejaVu Sans from
 * the JasperReports font extension), an sRGB output intent and a tagged structure.
 *
 * <p>The JRXML templates under {@code report-templates/} on the classpath are compiled once, in the
 * constructor (about two seconds); the compiled reports are immutable and shared, so one renderer
 * serves concurrent {@link #render} calls. A missing font is an error, not a silent substitution.
 *
 * <p>PDF/A-2b needs one repair after export: the exporter writes a CIDSet for subset fonts that does
 * not list every glyph used, which PDF/A-2 (ISO 19005-2 6.2.11.4.2) forbids; the CIDSet is optional in
 * PDF/A-2, so it is removed from each Type 0 font's descriptor with PDFBox.
 */
public final class CertificateRenderer {

    /** The conformance level the output is validated against in the tests. */
    public static final String CONFORMANCE = "PDF/A-2b";

    static final String TEMPLATE_FOLDER = "report-templates/";
    static final String ICC_PROFILE = "certificates/sRGB.icc";
    private static final String FONT_FILE = "net/sf/jasperreports/fonts/dejavu/DejaVuSans.ttf";
    private static final DateTimeFormatter DATE = DateTimeFormatter.ISO_LOCAL_DATE;
    private static final String[] SUBREPORTS = {"HEATS", "SPECIMENS", "RESULTS", "EQUIPMENT", "APPENDIX"};

    private final SimpleJasperReportsContext context;
    private final JasperReport main;
    private final Map<String, JasperReport> subreports;
    private final PrintableText printable;

    /** Compiles the templates; fails with {@link IllegalStateException} when one is missing or invalid. */
    public CertificateRenderer() {
        context = new SimpleJasperReportsContext();
        context.setProperty("net.sf.jasperreports.awt.ignore.missing.font", "false");
        context.setProperty("net.sf.jasperreports.default.font.name", "DejaVu Sans");
        context.setProperty("net.sf.jasperreports.default.pdf.embedded", "true");
        // The compiler writes each template's expression class to a file named after a hash of the template, in
        // java.io.tmpdir by default: two processes compiling the same templates at once (two instances on one
        // host, parallel builds) then overwrite and delete each other's files. A private folder per renderer avoids it.
        context.setProperty("net.sf.jasperreports.compiler.temp.dir", privateCompileFolder());
        // the Eclipse compiler reads classes through the class loader, so the templates also compile inside the
        // packaged jar (java -jar), whose nested jars the default javax.tools compiler cannot see
        context.setProperty("net.sf.jasperreports.compiler.java", "net.sf.jasperreports.jdt.JRJdtCompiler");
        main = compile("certificate");
        Map<String, JasperReport> subs = new HashMap<>();
        for (String name : SUBREPORTS) {
            subs.put(name, compile("certificate-" + name.toLowerCase()));
        }
        subreports = Map.copyOf(subs);
        printable = new PrintableText(loadFont());
    }

    /**
     * The certificate as PDF/A-2b bytes.
     *
     * @throws CertificateRenderingFailed when filling or exporting fails
     */
    public byte[] render(CertificateDocument document) {
        try {
            JasperPrint print = JasperFillManager.getInstance(context)
                    .fill(main, parameters(document), new JREmptyDataSource(1));
            ByteArrayOutputStream pdf = new ByteArrayOutputStream(64 * 1024);
            JRPdfExporter exporter = new JRPdfExporter(context);
            exporter.setExporterInput(new SimpleExporterInput(print));
            exporter.setExporterOutput(new SimpleOutputStreamExporterOutput(pdf));
            SimplePdfExporterConfiguration configuration = new SimplePdfExporterConfiguration();
            configuration.setPdfaConformance(PdfaConformanceEnum.PDFA_2B);
            configuration.setIccProfilePath(ICC_PROFILE);
            configuration.setTagged(true);
            configuration.setTagLanguage("en");
            configuration.setMetadataTitle(printable.of(document.identification().number()
                    .map(n -> CertificateDocument.DOCUMENT_TYPE + " " + n + " revision "
                            + document.identification().revision())
                    .orElse("Draft preview, not a certificate: " + document.customer().orderReference())));
            configuration.setMetadataAuthor(printable.of(document.laboratory().name()));
            configuration.setMetadataCreator("Specimen Ledger " + printable.of(document.software().version()));
            configuration.setDisplayMetadataTitle(true);
            exporter.setConfiguration(configuration);
            exporter.setConfiguration(sameLineBreaksAsTheFill());
            exporter.exportReport();
            return withoutCidSets(pdf.toByteArray());
        } catch (JRException e) {
            throw new CertificateRenderingFailed(document.identification().number().orElse("(draft preview)"), e);
        }
    }

    /**
     * The fill measures each text field with AWT's line breaking and sizes the cell to that many lines; the PDF
     * library then breaks the text again by its own rules, which split at fewer places (text such as
     * {@code "><img src=x} has break points AWT takes and the PDF library does not). The PDF needed one line more than
     * the cell had, and the cell's last line was cut off. Forcing the fill's break policy on the export keeps every
     * line the fill counted.
     */
    private static SimplePdfReportConfiguration sameLineBreaksAsTheFill() {
        SimplePdfReportConfiguration report = new SimplePdfReportConfiguration();
        report.setForceLineBreakPolicy(true);
        return report;
    }

    private Map<String, Object> parameters(CertificateDocument d) {
        Map<String, Object> p = new HashMap<>();
        CertificateDocument.Identification id = d.identification();
        text(p, "LAB_NAME", d.laboratory().name());
        text(p, "LAB_ADDRESS", d.laboratory().address());
        text(p, "DOCUMENT_TYPE", CertificateDocument.DOCUMENT_TYPE);
        boolean preview = d.isPreview();
        p.put("PREVIEW", preview);
        text(p, "PREVIEW_HEADER", preview ? CertificateDocument.PREVIEW_HEADER : null);
        text(p, "PREVIEW_FOOTER", preview ? CertificateDocument.PREVIEW_FOOTER : null);
        // a preview prints what is absent as absent: no number, no date, nothing that reads like one
        text(p, "NUMBER", id.number().orElse("none until issued"));
        text(p, "REVISION", Integer.toString(id.revision()));
        text(p, "REPLACES", id.replaces().map(r -> "Replaces " + r.number() + " rev " + r.revision()
                + " because " + r.reason()).orElse(null));
        text(p, "WATERMARK", id.statusWatermark().orElse(null));
        text(p, "ISSUE_DATE", id.issueDate().map(DATE::format).orElse("not issued"));
        text(p, "CUSTOMER_NAME", d.customer().name());
        text(p, "CUSTOMER_ADDRESS", d.customer().address());
        text(p, "ORDER_REFERENCE", d.customer().orderReference());
        text(p, "PRODUCT", d.product().description());
        text(p, "MATERIAL_SPECIFICATION", d.product().materialSpecification());
        text(p, "TEST_STANDARD", d.conditions().standard());
        text(p, "TEST_METHOD", d.conditions().method());
        text(p, "TEST_DATES", d.conditions().testDates());
        text(p, "TEST_TEMPERATURES", d.conditions().temperatures());
        text(p, "RECEIPT_DATE", d.conditions().receiptDate());
        text(p, "DECISION_RULE", d.decisionRuleStatement());
        text(p, "DEVIATIONS", d.deviationsStatement());
        text(p, "SOFTWARE_VERSION", d.software().version());
        text(p, "SOURCE_COMMIT", d.software().sourceCommit());
        text(p, "METHOD_VERSION", d.software().analysisMethodVersion());
        text(p, "ITEMS_TESTED", CertificateDocument.ITEMS_TESTED_STATEMENT);
        text(p, "CAUTIONS", CertificateDocument.CAUTIONS);
        text(p, "SIGNATORY_NAME", d.signatory().map(CertificateDocument.Signatory::name).orElse(null));
        text(p, "SIGNATORY_FUNCTION", d.signatory().map(CertificateDocument.Signatory::function).orElse(null));
        text(p, "SIGNED_ON", d.signatory().map(s -> DATE.format(s.signedOn())).orElse(null));
        text(p, "SIGNATURE_MEANING", CertificateDocument.SIGNATURE_MEANING);
        text(p, "VERIFICATION_CODE", d.verification().map(CertificateDocument.Verification::code).orElse(null));
        text(p, "VERIFY_PATH", d.verification().map(CertificateDocument.Verification::verifyPath).orElse(null));
        text(p, "LEDGER_POSITION", d.verification().map(v -> "sequence " + v.ledgerSequence() + ", hash "
                + v.ledgerHash()).orElse(null));
        text(p, "CHECKPOINT", d.verification().flatMap(CertificateDocument.Verification::checkpoint).orElse(null));

        p.put("HEATS", rows(d.heats(), h -> new Object[] {"number", h.number(), "producer", h.producer(),
                "grade", h.grade(), "productForm", h.productForm(), "nominalThickness", h.nominalThickness()}));
        p.put("SPECIMENS", rows(d.specimens(), s -> new Object[] {"identifier", s.identifier(),
                "heatNumber", s.heatNumber(), "orientation", s.orientation(), "shape", s.shape(),
                "dimensions", s.dimensions(), "s0", s.s0(), "l0", s.l0(), "le", s.le()}));
        p.put("RESULTS", rows(d.results(), r -> new Object[] {"specimen", r.specimen(), "property", r.property(),
                "reportedValue", r.reportedValue(), "unit", r.unit(), "requirement", r.requirement(),
                "verdict", r.verdict(), "flags", r.flags()}));
        p.put("EQUIPMENT", rows(d.equipment(), e -> new Object[] {"identifier", e.identifier(), "kind", e.kind(),
                "calibrationReference", e.calibrationReference(), "calibratedOn", DATE.format(e.calibratedOn()),
                "dueOn", DATE.format(e.dueOn()), "accuracyClass", e.accuracyClass()}));
        p.put("APPENDIX", rows(d.appendix(), a -> new Object[] {"specimen", a.specimen(),
                "chart", new CurveVectorRenderer(a.curve())}));
        for (String name : SUBREPORTS) {
            p.put(name + "_REPORT", subreports.get(name));
        }
        return p;
    }

    private void text(Map<String, Object> parameters, String name, String value) {
        parameters.put(name, printable.of(value));
    }

    private <T> Collection<Map<String, ?>> rows(List<T> items, java.util.function.Function<T, Object[]> columns) {
        List<Map<String, ?>> rows = new ArrayList<>(items.size());
        for (T item : items) {
            Object[] pairs = columns.apply(item);
            Map<String, Object> row = new LinkedHashMap<>();
            for (int i = 0; i < pairs.length; i += 2) {
                Object value = pairs[i + 1];
                row.put((String) pairs[i], value instanceof String s ? printable.of(s) : value );
            }
            rows.add(row);
        }
        return rows;
    }

    /** Removes /CIDSet from every Type 0 font's descriptor (see the class comment). */
    static byte[] withoutCidSets(byte[] pdf) {
        try (PDDocument document = Loader.loadPDF(pdf)) {
            for (PDPage page : document.getPages()) {
                PDResources resources = page.getResources();
                if (resources == null) {
                    continue;
                }
                for (COSName name : resources.getFontNames()) {
                    PDFont font = resources.getFont(name);
                    if (font instanceof PDType0Font type0) {
                        PDFontDescriptor descriptor = type0.getDescendantFont().getFontDescriptor();
                        if (descriptor != null) {
                            descriptor.getCOSObject().removeItem(COSName.CID_SET);
                        }
                    }
                }
            }
            ByteArrayOutputStream out = new ByteArrayOutputStream(pdf.length);
            document.save(out);
            return out.toByteArray();
        } catch (IOException e) {
            throw new UncheckedIOException("cannot post-process the exported PDF", e);
        }
    }

    private JasperReport compile(String name) {
        String path = TEMPLATE_FOLDER + name + ".jrxml";
        try (InputStream in = CertificateRenderer.class.getClassLoader().getResourceAsStream(path)) {
            if (in == null) {
                throw new IllegalStateException("template not on the classpath: " + path);
            }
            return JasperCompileManager.getInstance(context).compile(in);
        } catch (IOException e) {
            throw new UncheckedIOException("cannot read " + path, e);
        } catch (JRException e) {
            throw new IllegalStateException("template does not compile: " + path + ": " + e.getMessage(), e);
        }
    }

    private static String privateCompileFolder() {
        try {
            java.nio.file.Path folder = java.nio.file.Files.createTempDirectory("certificate-templates-");
            folder.toFile().deleteOnExit();
            return folder.toString();
        } catch (IOException e) {
            throw new UncheckedIOException("cannot make a folder to compile the certificate templates in", e);
        }
    }

    private static Font loadFont() {
        try (InputStream in = CertificateRenderer.class.getClassLoader().getResourceAsStream(FONT_FILE)) {
            if (in == null) {
                throw new IllegalStateException("font not on the classpath: " + FONT_FILE);
            }
            return Font.createFont(Font.TRUETYPE_FONT, in);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        } catch (FontFormatException e) {
            throw new IllegalStateException("cannot read " + FONT_FILE, e);
        }
    }

}
