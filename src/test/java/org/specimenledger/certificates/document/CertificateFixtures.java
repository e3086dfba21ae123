package org.specimenledger.certificates.document;

import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.function.UnaryOperator;

/**
 * Sample certificates for tests and benchmarks. EVERYTHING HERE IS INVENTED: the laboratory, the
 * customer, the producer, the people, the numbers, codes and hashes describe no real organisation,
 * product or test.
 */
public final class CertificateFixtures {

    private CertificateFixtures() {
    }

    /** A valid revision-0 certificate with {@code specimens} specimens, six results each, and no appendix. */
    public static CertificateDocument sample(int specimens) {
        return sample(specimens, false, UnaryOperator.identity());
    }

    /** As {@link #sample(int)}, with one curve appendix per specimen when {@code withCurves}. */
    public static CertificateDocument sample(int specimens, boolean withCurves) {
        return sample(specimens, withCurves, UnaryOperator.identity());
    }

    /** The sample with every free text passed through {@code text} (to inject hostile text). */
    public static CertificateDocument sample(int specimens, boolean withCurves, UnaryOperator<String> text) {
        List<CertificateDocument.Specimen> pieces = new ArrayList<>();
        List<CertificateDocument.ResultRow> rows = new ArrayList<>();
        List<CertificateDocument.CurveAppendix> curves = new ArrayList<>();
        for (int i = 1; i <= specimens; i++) {
            String id = specimenId(i);
            String heat = i % 2 == 0 ? "H-77120" : "H-77121";
            pieces.add(new CertificateDocument.Specimen(id, heat, "transverse", "round, machined",
                    text.apply("Ø " + String.format("%.2f", 9.98 + i * 0.001) + " mm"),
                    String.format("%.2f mm²", 78.23 + i * 0.01), "50.0 mm", "60.0 mm"));
            rows.add(row(id, "ReH", reh(i), "MPa", "≥ 355", "PASS", ""));
            rows.add(row(id, "ReL", Integer.toString(350 + i * 2), "MPa", "—", "not assessed", ""));
            rows.add(row(id, "Rm", Integer.toString(512 + i), "MPa", "470 … 630", "PASS", ""));
            rows.add(row(id, "A", String.format("%.1f", 24.0 + i * 0.1), "%", "≥ 20", "PASS", ""));
            rows.add(row(id, "Z", String.format("%.0f", 60.0 + i), "%", "—", "not assessed", ""));
            rows.add(row(id, "E", "207.1", "GPa", "—", "not assessed", i == 3 ? "elastic fit below 0.995" : ""));
            if (withCurves) {
                curves.add(new CertificateDocument.CurveAppendix(id, curve(355 + i)));
            }
        }
        return new CertificateDocument(
                new CertificateDocument.Laboratory(text.apply("Northgate Invented Materials Laboratory (fictitious)"),
                        text.apply("Unit 4, 12 Example Quay\nHarbourtown HT1 0ZZ\nNowhere-land")),
                new CertificateDocument.Identification("SL-2026-000417", 0, Optional.empty(), Optional.empty(),
                        LocalDate.of(2026, 3, 9)),
                new CertificateDocument.Customer(text.apply("Fictional Fabrication Works Ltd"),
                        text.apply("88 Imaginary Road, Sampleton SA9 9XX"), text.apply("PO-55-1029 / line 3")),
                new CertificateDocument.Product(text.apply("Hot-rolled plate 20 mm, 2 plates"),
                        text.apply("Structural steel, invented specification IS-355 (demo)")),
                List.of(new CertificateDocument.Heat("H-77120", text.apply("Imaginary Steelworks"), "IS-355",
                                "plate", "20 mm"),
                        new CertificateDocument.Heat("H-77121", text.apply("Imaginary Steelworks"), "IS-355",
                                "plate", "20 mm")),
                pieces,
                new CertificateDocument.TestConditions("ISO 6892-1:2019", "Method B (stress-rate control)",
                        "2026-03-02 to 2026-03-04", "23 °C ± 5 °C", "2026-02-27"),
                rows,
                text.apply("Simple acceptance: the reported (rounded) value is compared with the specification limit;"
                        + " no guard band."),
                text.apply("No deviations from the test method. Flags are listed beside the affected results."),
                List.of(new CertificateDocument.Equipment("TM-01", "testing machine 250 kN", "CAL-TM01-2025-11",
                                LocalDate.of(2025, 11, 3), LocalDate.of(2026, 11, 3), "class 1 (ISO 7500-1)"),
                        new CertificateDocument.Equipment("EX-07", "clip-on extensometer", "CAL-EX07-2026-01",
                                LocalDate.of(2026, 1, 15), LocalDate.of(2027, 1, 15), "class 0.5 (ISO 9513)")),
                new CertificateDocument.Software("0.1.0", "495d1952c0ffee0000000000000000000000abcd", "tensile-1.3"),
                new CertificateDocument.Signatory(text.apply("Dr. Ada Invented"), text.apply("Head of mechanical testing"),
                        LocalDate.of(2026, 3, 9)),
                new CertificateDocument.Verification("7KQ2-M9XD-4TRB", 10482,
                        "9f2c1a7e5b3d4c6a8e0f1b2d3c4e5f60718293a4b5c6d7e8f90a1b2c3d4e5f6a", Optional.empty()),
                curves);
    }

    /** A 40-character specimen identifier, unique per index. */
    public static String specimenId(int i) {
        return String.format("IS355-PLATE-2026-0417-TRANSVERSE-SPEC-%03d", i);
    }

    static String reh(int i) {
        return Integer.toString(360 + i * 3);
    }

    private static CertificateDocument.ResultRow row(String specimen, String symbol, String value, String unit,
                                                     String requirement, String verdict, String flags) {
        return new CertificateDocument.ResultRow(specimen, symbol, value, unit, requirement, verdict, flags);
    }

    /** A smooth invented curve: linear to {@code yield}, then hardening to a maximum and a drop to fracture. */
    static StressStrainCurve curve(double yield) {
        int n = 400;
        double[] strain = new double[n];
        double[] stress = new double[n];
        double e = 2070.0; // MPa per % strain
        for (int i = 0; i < n; i++) {
            double x = 25.0 * i / (n - 1);
            strain[i] = x;
            double elastic = e * x;
            double plastic = yield + 160 * (1 - Math.exp(-x / 6.0)) - (x > 20 ? 12 * (x - 20) : 0);
            stress[i] = Math.min(elastic, plastic);
        }
        double yieldStrain = yield / e;
        return new StressStrainCurve(strain, stress,
                List.of(new StressStrainCurve.MarkedPoint("Rp0.2", yieldStrain + 0.2, yield + 5),
                        new StressStrainCurve.MarkedPoint("Fm", 20.0, yield + 160 * (1 - Math.exp(-20 / 6.0))),
                        new StressStrainCurve.MarkedPoint("fracture", 25.0, stress[n - 1])),
                List.of(new StressStrainCurve.Line("elastic line", 0, 0, yieldStrain * 1.2, yield * 1.2),
                        new StressStrainCurve.Line("offset 0.2 %", 0.2, 0, 0.2 + yieldStrain * 1.2, yield * 1.2)));
    }
}
