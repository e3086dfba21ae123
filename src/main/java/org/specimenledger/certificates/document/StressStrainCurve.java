package org.specimenledger.certificates.document;

import java.util.List;
import java.util.Objects;

/**
 * A curve to draw in the appendix: engineering strain in % and stress in MPa, the determined points
 * to mark (Rp0.2, ReH, ReL, Fm, fracture…) and straight lines such as the elastic line and the
 * offset line.
 */
public record StressStrainCurve(double[] strainPercent, double[] stressMpa, List<MarkedPoint> points,
                                List<Line> lines) {

    /** Checks lengths and copies the arrays, so the record stays immutable. */
    public StressStrainCurve {
        if (strainPercent.length != stressMpa.length) {
            throw new IllegalArgumentException("strain and stress differ in length: " + strainPercent.length
                    + " and " + stressMpa.length);
        }
        strainPercent = strainPercent.clone();
        stressMpa = stressMpa.clone();
        points = List.copyOf(points);
        lines = List.copyOf(lines);
    }

    @Override
    public double[] strainPercent() {
        return strainPercent.clone();
    }

    @Override
    public double[] stressMpa() {
        return stressMpa.clone();
    }

    /** A determined point, labelled with its symbol, e.g. "Rp0.2". */
    public record MarkedPoint(String label, double strainPercent, double stressMpa) {
        public MarkedPoint {
            Objects.requireNonNull(label, "label");
        }
    }

    /** A straight segment from (strain1, stress1) to (strain2, stress2), labelled e.g. "offset 0.2 %". */
    public record Line(String label, double strainPercent1, double stressMpa1, double strainPercent2,
                       double stressMpa2) {
        public Line {
            Objects.requireNonNull(label, "label");
        }
    }
}
