package org.specimenledger.certificates.document;

import java.time.LocalDate;
import java.util.List;
import java.util.Objects;
import java.util.Optional;

/**
 * Everything printed on one inspection certificate 3.1 (EN 10204), as immutable values. The lead maps
 * stored data into this tree; the renderer prints it and nothing else, so what a PDF shows can be
 * reproduced from this record alone. Texts are printed literally (no markup); control characters are
 * shown as their code point by the renderer.
 *
 * <p>A document is either an issued certificate (number, issue date, signatory and verification all present) or a
 * draft preview (all four absent, {@link #isPreview()}): the preview prints {@link #PREVIEW_HEADER} and
 * {@link #PREVIEW_FOOTER} on every page and {@link #PREVIEW_WATERMARK} across it, and nothing that could pass for an
 * issued certificate's identity. No field of an issued certificate is ever filled with a stand-in value.
 *
 * <p>Content follows ISO/IEC 17025:2017 7.8.2.1 (title, laboratory, unique identification on every page,
 * customer, method, items, dates, results with units, the items-tested statement, deviations, who
 * authorised), 7.8.6 (decision rule) and 7.8.8 (a revision names the document it replaces and why).
 */
public record CertificateDocument(
        Laboratory laboratory,
        Identification identification,
        Customer customer,
        Product product,
        List<Heat> heats,
        List<Specimen> specimens,
        TestConditions conditions,
        List<ResultRow> results,
        String decisionRuleStatement,
        String deviationsStatement,
        List<Equipment> equipment,
        Software software,
        Optional<Signatory> signatory,
        Optional<Verification> verification,
        List<CurveAppendix> appendix) {

    /** The document type title printed at the top of every certificate. */
    public static final String DOCUMENT_TYPE = "Inspection certificate 3.1 (EN 10204)";

    /** The ISO/IEC 17025:2017 7.8.2.1 statement, printed on every certificate. */
    public static final String ITEMS_TESTED_STATEMENT = "The results relate only to the items tested.";

    /** The further cautions printed with the items-tested statement (mission rule 4). */
    public static final String CAUTIONS = "Conformity statements follow the decision rule stated on this certificate."
            + " Local codes and the laboratory's accreditation scope govern the use of these results.";

    /** What the authorised signature means, printed beside it. */
    public static final String SIGNATURE_MEANING = "reviewed and approved for release";

    /** The line printed at the top of every page of a draft preview. */
    public static final String PREVIEW_HEADER = "PREVIEW OF A DRAFT · NOT A CERTIFICATE · NOT VALID FOR ANY PURPOSE";

    /** The word printed large across every page of a draft preview. */
    public static final String PREVIEW_WATERMARK = "DRAFT PREVIEW";

    /** The footer of every page of a draft preview (the page count follows it). */
    public static final String PREVIEW_FOOTER = "Draft preview, not issued: no certificate number, no signature,"
            + " cannot be verified";

    /** An issued certificate's document: every part present. */
    public CertificateDocument(Laboratory laboratory, Identification identification, Customer customer,
            Product product, List<Heat> heats, List<Specimen> specimens, TestConditions conditions,
            List<ResultRow> results, String decisionRuleStatement, String deviationsStatement,
            List<Equipment> equipment, Software software, Signatory signatory, Verification verification,
            List<CurveAppendix> appendix) {
        this(laboratory, identification, customer, product, heats, specimens, conditions, results,
                decisionRuleStatement, deviationsStatement, equipment, software,
                Optional.of(Objects.requireNonNull(signatory, "signatory")),
                Optional.of(Objects.requireNonNull(verification, "verification")), appendix);
    }

    /**
     * Checks that no part is missing, that a certificate has its signatory and verification and a preview neither,
     * and copies the lists.
     */
    public CertificateDocument {
        Objects.requireNonNull(laboratory, "laboratory");
        Objects.requireNonNull(identification, "identification");
        Objects.requireNonNull(customer, "customer");
        Objects.requireNonNull(product, "product");
        heats = List.copyOf(heats);
        specimens = List.copyOf(specimens);
        Objects.requireNonNull(conditions, "conditions");
        results = List.copyOf(results);
        Objects.requireNonNull(decisionRuleStatement, "decisionRuleStatement");
        Objects.requireNonNull(deviationsStatement, "deviationsStatement");
        equipment = List.copyOf(equipment);
        Objects.requireNonNull(software, "software");
        Objects.requireNonNull(signatory, "signatory");
        Objects.requireNonNull(verification, "verification");
        appendix = List.copyOf(appendix);
        boolean preview = identification.number().isEmpty();
        if (preview && (signatory.isPresent() || verification.isPresent())) {
            throw new IllegalArgumentException("a draft preview has no signatory and no verification");
        }
        if (!preview && (signatory.isEmpty() || verification.isEmpty())) {
            throw new IllegalArgumentException("an issued certificate needs its signatory and verification");
        }
    }

    /** True for a draft preview: no number, issue date, signatory or verification. */
    public boolean isPreview() {
        return identification.number().isEmpty();
    }

    /** The issuing laboratory; the address may span several lines. */
    public record Laboratory(String name, String address) {
        public Laboratory {
            Objects.requireNonNull(name, "name");
            Objects.requireNonNull(address, "address");
        }
    }

    /**
     * Number, revision and status of this document.
     *
     * @param number           the certificate number; empty for a draft preview (a number is taken only at issue)
     * @param replaces         what this revision replaces, empty for revision 0
     * @param statusWatermark  printed across every page when this is not the current valid document,
     *                         e.g. "SUPERSEDED", "WITHDRAWN", {@link #PREVIEW_WATERMARK}; empty when valid
     * @param issueDate        empty exactly when the number is (a preview is not issued)
     */
    public record Identification(Optional<String> number, int revision, Optional<Replacement> replaces,
                                 Optional<String> statusWatermark, Optional<LocalDate> issueDate) {
        public Identification {
            Objects.requireNonNull(number, "number");
            if (revision < 0) {
                throw new IllegalArgumentException("revision must be 0 or more, was " + revision);
            }
            Objects.requireNonNull(replaces, "replaces");
            Objects.requireNonNull(statusWatermark, "statusWatermark");
            Objects.requireNonNull(issueDate, "issueDate");
            if (number.isPresent() != issueDate.isPresent()) {
                throw new IllegalArgumentException("a number and an issue date go together (both absent in a preview)");
            }
        }

        /** An issued certificate's identification. */
        public Identification(String number, int revision, Optional<Replacement> replaces,
                Optional<String> statusWatermark, LocalDate issueDate) {
            this(Optional.of(Objects.requireNonNull(number, "number")), revision, replaces, statusWatermark,
                    Optional.of(Objects.requireNonNull(issueDate, "issueDate")));
        }

        /** A draft preview's: the revision it would get and what it would replace; marked with the watermark. */
        public static Identification preview(int revision, Optional<Replacement> replaces) {
            return new Identification(Optional.empty(), revision, replaces, Optional.of(PREVIEW_WATERMARK),
                    Optional.empty());
        }
    }

    /** The document a revision replaces and why (ISO/IEC 17025:2017 7.8.8). */
    public record Replacement(String number, int revision, String reason) {
        public Replacement {
            Objects.requireNonNull(number, "number");
            Objects.requireNonNull(reason, "reason");
        }
    }

    /** The customer and the order the certificate answers. */
    public record Customer(String name, String address, String orderReference) {
        public Customer {
            Objects.requireNonNull(name, "name");
            Objects.requireNonNull(address, "address");
            Objects.requireNonNull(orderReference, "orderReference");
        }
    }

    /** The delivered product and the material specification its results are checked against. */
    public record Product(String description, String materialSpecification) {
        public Product {
            Objects.requireNonNull(description, "description");
            Objects.requireNonNull(materialSpecification, "materialSpecification");
        }
    }

    /** A heat (cast) the specimens were taken from; thickness as printed, with its unit. */
    public record Heat(String number, String producer, String grade, String productForm, String nominalThickness) {
        public Heat {
            Objects.requireNonNull(number, "number");
            Objects.requireNonNull(producer, "producer");
            Objects.requireNonNull(grade, "grade");
            Objects.requireNonNull(productForm, "productForm");
            Objects.requireNonNull(nominalThickness, "nominalThickness");
        }
    }

    /**
     * A tested specimen; dimensions and the S0, L0, Le values are printed as given (rounded text with
     * units), so the mapping decides the rounding.
     */
    public record Specimen(String identifier, String heatNumber, String orientation, String shape,
                           String dimensions, String s0, String l0, String le) {
        public Specimen {
            Objects.requireNonNull(identifier, "identifier");
            Objects.requireNonNull(heatNumber, "heatNumber");
            Objects.requireNonNull(orientation, "orientation");
            Objects.requireNonNull(shape, "shape");
            Objects.requireNonNull(dimensions, "dimensions");
            Objects.requireNonNull(s0, "s0");
            Objects.requireNonNull(l0, "l0");
            Objects.requireNonNull(le, "le");
        }
    }

    /** Test standard, method, dates and temperatures, each as printed. */
    public record TestConditions(String standard, String method, String testDates, String temperatures,
                                 String receiptDate) {
        public TestConditions {
            Objects.requireNonNull(standard, "standard");
            Objects.requireNonNull(method, "method");
            Objects.requireNonNull(testDates, "testDates");
            Objects.requireNonNull(temperatures, "temperatures");
            Objects.requireNonNull(receiptDate, "receiptDate");
        }
    }

    /** One line of the results table: a reported value against its requirement and the verdict. */
    public record ResultRow(String specimen, String property, String reportedValue, String unit,
                            String requirement, String verdict, String flags) {
        public ResultRow {
            Objects.requireNonNull(specimen, "specimen");
            Objects.requireNonNull(property, "property");
            Objects.requireNonNull(reportedValue, "reportedValue");
            Objects.requireNonNull(unit, "unit");
            Objects.requireNonNull(requirement, "requirement");
            Objects.requireNonNull(verdict, "verdict");
            Objects.requireNonNull(flags, "flags");
        }
    }

    /** An instrument used, with the calibration valid on the test dates. */
    public record Equipment(String identifier, String kind, String calibrationReference, LocalDate calibratedOn,
                            LocalDate dueOn, String accuracyClass) {
        public Equipment {
            Objects.requireNonNull(identifier, "identifier");
            Objects.requireNonNull(kind, "kind");
            Objects.requireNonNull(calibrationReference, "calibrationReference");
            Objects.requireNonNull(calibratedOn, "calibratedOn");
            Objects.requireNonNull(dueOn, "dueOn");
            Objects.requireNonNull(accuracyClass, "accuracyClass");
        }
    }

    /** The software that computed the results. */
    public record Software(String version, String sourceCommit, String analysisMethodVersion) {
        public Software {
            Objects.requireNonNull(version, "version");
            Objects.requireNonNull(sourceCommit, "sourceCommit");
            Objects.requireNonNull(analysisMethodVersion, "analysisMethodVersion");
        }
    }

    /** The authorised signatory; the meaning of the signature is {@link #SIGNATURE_MEANING}. */
    public record Signatory(String name, String function, LocalDate signedOn) {
        public Signatory {
            Objects.requireNonNull(name, "name");
            Objects.requireNonNull(function, "function");
            Objects.requireNonNull(signedOn, "signedOn");
        }
    }

    /**
     * How a reader checks the certificate: the code to enter at {@code /verify/{code}}, and the
     * audit-trail position (sequence and hash) at which it was issued, with an optional checkpoint text.
     */
    public record Verification(String code, long ledgerSequence, String ledgerHash, Optional<String> checkpoint) {
        public Verification {
            Objects.requireNonNull(code, "code");
            Objects.requireNonNull(ledgerHash, "ledgerHash");
            Objects.requireNonNull(checkpoint, "checkpoint");
        }

        /** The URL path that verifies this certificate. */
        public String verifyPath() {
            return "/verify/" + code;
        }
    }

    /** An appendix page for one specimen: its engineering stress–strain curve with the determined points. */
    public record CurveAppendix(String specimen, StressStrainCurve curve) {
        public CurveAppendix {
            Objects.requireNonNull(specimen, "specimen");
            Objects.requireNonNull(curve, "curve");
        }
    }
}
