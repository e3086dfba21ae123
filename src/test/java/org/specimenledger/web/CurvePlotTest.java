package org.specimenledger.web;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.charset.StandardCharsets;
import java.time.Instant;
import java.util.List;
import java.util.Map;
import java.util.UUID;
import org.junit.jupiter.api.Test;
import org.specimenledger.testing.AnalysisRunView;
import org.specimenledger.testing.TestMode;

/**
 * The diagram's drawing instructions from a stored analysis: points and constructions are placed where
 * the analysis's evidence says, thinning keeps the highest stress, and cyclic loops become closed shapes.
 * Plain JUnit; the analysis maps are written by hand, so only the drawing is under test.
 */
class CurvePlotTest {

    /** A straight elastic part to 0.1 % then a plateau-free rise; force in kN, extension in mm, Le 50 mm. */
    private static byte[] curve(int points) {
        StringBuilder csv = new StringBuilder("force [kN],extension [mm]\n");
        for (int i = 0; i < points; i++) {
            double e = 0.05 * i / (points - 1); // strain as a fraction, to 5 %
            double stress = e <= 0.001 ? 200_000 * e : 200 + 2000 * (e - 0.001);
            csv.append(stress * 100 / 1000).append(',').append(e * 50).append('\n');
        }
        return csv.toString().getBytes(StandardCharsets.UTF_8);
    }

    private static AnalysisRunView analysis(Map<String, Object> results) {
        return new AnalysisRunView(UUID.randomUUID(), UUID.randomUUID(), 1, UUID.randomUUID(), "0".repeat(64),
                TestMode.TENSILE, "test", "test", "tensile/test", Map.of(), Map.of(), results, List.of(),
                Map.of("s0Mm2", 100, "leMm", 50), List.of(), null, null, Instant.EPOCH, "t");
    }

    @Test
    void marksTheProofPointWhereTheEvidenceSaysAndDrawsBothLines() {
        Map<String, Object> results = Map.of("properties", Map.of(
                "E", Map.of("value", 200_000.0, "evidence", Map.of("firstIndex", 1, "lastIndex", 15,
                        "strainOriginPercent", 0.0)),
                "Rp0.2", Map.of("value", 202.0, "evidence", Map.of("offsetPercent", 0.2, "lineSlopeMPa", 200_000.0,
                        "strainOriginPercent", 0.0, "intersectionStrainPercent", 0.301,
                        "intersectionStressMPa", 202.0)),
                "Fm", Map.of("value", 29_800.0, "evidence", Map.of("index", 999))));
        CurvePlot plot = CurvePlot.of(analysis(results), curve(1000));

        assertThat(plot.lines()).extracting(CurvePlot.Line::kind).containsExactlyInAnyOrder("elastic", "offset");
        CurvePlot.Line offset = plot.lines().stream().filter(l -> l.kind().equals("offset")).findFirst().orElseThrow();
        CurvePlot.Marker rp = plot.markers().stream().filter(m -> m.label().equals("Rp0.2")).findFirst().orElseThrow();
        // the offset line starts at 0.2 % strain on the zero-stress axis and passes through the marked point
        double slope = (offset.y2() - offset.y1()) / (offset.x2() - offset.x1());
        assertThat(offset.y1() + slope * (rp.x() - offset.x1())).isCloseTo(rp.y(), org.assertj.core.data.Offset.offset(0.01));
        assertThat(plot.fitPath()).startsWith("M");
        assertThat(plot.markers()).extracting(CurvePlot.Marker::label).contains("Fm");
    }

    @Test
    void thinningKeepsTheHighestStressOfALongCurve() {
        CurvePlot plot = CurvePlot.of(analysis(Map.of("properties", Map.of())), curve(100_000));
        String[] points = plot.curvePath().split(" ");
        assertThat(points.length).isLessThanOrEqualTo(CurvePlot.BUCKETS * 3 + 1);
        double topY = Double.MAX_VALUE;
        for (String p : points) {
            topY = Math.min(topY, Double.parseDouble(p.substring(1).split(",")[1]));
        }
        // the last point (5 %, 200 + 2000 × 0.049 = 298 MPa) is the highest; the axis covers 1.05 × 298 = 312.9 MPa
        // in five or fewer steps of 1, 2, 2.5, 5 or 10 × 10^n: 100 MPa steps (50 would need seven), so up to 400 MPa
        double expected = CurvePlot.HEIGHT - CurvePlot.BOTTOM
                - (CurvePlot.HEIGHT - CurvePlot.BOTTOM - CurvePlot.TOP) * (298.0 / 400.0);
        assertThat(topY).isCloseTo(expected, org.assertj.core.data.Offset.offset(0.1));
    }

    @Test
    void cyclicLoopsBecomeClosedShapes() {
        Map<String, Object> results = Map.of("cycles", List.of(
                Map.of("number", 1, "startIndex", 0, "peakIndex", 100, "endIndex", 200),
                Map.of("number", 2, "startIndex", 200, "peakIndex", 300, "endIndex", 400)));
        CurvePlot plot = CurvePlot.of(analysis(results), curve(500));
        assertThat(plot.loops()).hasSize(2).allSatisfy(p -> assertThat(p).startsWith("M").endsWith("Z"));
    }
}
