package org.specimenledger.certificates.document;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.FontFormatException;
import java.awt.geom.Ellipse2D;
import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.annotations.XYPointerAnnotation;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.jfree.chart.ui.TextAnchor;
import org.jfree.data.xy.XYSeries;
import org.jfree.data.xy.XYSeriesCollection;

/**
 * Builds the JFreeChart chart of a {@link StressStrainCurve}: the measured curve, the elastic and
 * offset lines dashed, and the determined points marked and labelled. Labels use the DejaVu Sans file
 * shipped with the report fonts, so the picture does not depend on the fonts installed on the host.
 * Thread-safe: each call builds its own chart.
 */
final class CurveChart {

    private static final String FONT_FILE = "net/sf/jasperreports/fonts/dejavu/DejaVuSans.ttf";
    private static final Font BASE_FONT = loadFont();

    private CurveChart() {
    }

    /** The chart for {@code curve} with fonts and strokes sized for {@code scale} device units per point. */
    static JFreeChart chart(StressStrainCurve curve, double scale) {
        XYSeriesCollection data = new XYSeriesCollection();
        XYSeries measured = new XYSeries("measured", false, true);
        double[] strain = curve.strainPercent();
        double[] stress = curve.stressMpa();
        for (int i = 0; i < strain.length; i++) {
            measured.add(strain[i], stress[i]);
        }
        data.addSeries(measured);
        for (StressStrainCurve.Line line : curve.lines()) {
            XYSeries s = new XYSeries(line.label(), false, true);
            s.add(line.strainPercent1(), line.stressMpa1());
            s.add(line.strainPercent2(), line.stressMpa2());
            data.addSeries(s);
        }
        XYSeries marks = new XYSeries("determined points", false, true);
        curve.points().forEach(p -> marks.add(p.strainPercent(), p.stressMpa()));
        data.addSeries(marks);

        Font label = BASE_FONT.deriveFont((float) (8 * scale));
        NumberAxis x = new NumberAxis("Engineering strain [%]");
        NumberAxis y = new NumberAxis("Engineering stress [MPa]");
        for (NumberAxis axis : new NumberAxis[] {x, y}) {
            axis.setLabelFont(label);
            axis.setTickLabelFont(label);
            axis.setAutoRangeIncludesZero(true);
        }
        // room for the point labels above the highest point and left of the elastic line
        y.setUpperMargin(0.15);
        x.setLowerMargin(0.04);
        XYLineAndShapeRenderer renderer = new XYLineAndShapeRenderer(true, false);
        int marksIndex = data.getSeriesCount() - 1;
        renderer.setSeriesPaint(0, new Color(0x1f, 0x3a, 0x5f));
        renderer.setSeriesStroke(0, new BasicStroke((float) (1.2 * scale)));
        for (int i = 1; i < marksIndex; i++) {
            renderer.setSeriesPaint(i, new Color(0x80, 0x80, 0x80));
            renderer.setSeriesStroke(i, new BasicStroke((float) (0.8 * scale), BasicStroke.CAP_BUTT,
                    BasicStroke.JOIN_MITER, 10f, new float[] {(float) (4 * scale), (float) (3 * scale)}, 0f));
        }
        renderer.setSeriesLinesVisible(marksIndex, false);
        renderer.setSeriesShapesVisible(marksIndex, true);
        double r = 3 * scale;
        renderer.setSeriesShape(marksIndex, new Ellipse2D.Double(-r, -r, 2 * r, 2 * r));
        renderer.setSeriesPaint(marksIndex, new Color(0xb0, 0x30, 0x20));

        XYPlot plot = new XYPlot(data, x, y, renderer);
        plot.setBackgroundPaint(Color.WHITE);
        plot.setDomainGridlinePaint(new Color(0xdd, 0xdd, 0xdd));
        plot.setRangeGridlinePaint(new Color(0xdd, 0xdd, 0xdd));
        for (StressStrainCurve.MarkedPoint p : curve.points()) {
            XYPointerAnnotation note = new XYPointerAnnotation(p.label(), p.strainPercent(), p.stressMpa(),
                    -Math.PI / 2);
            note.setFont(label);
            note.setTextAnchor(TextAnchor.BOTTOM_CENTER);
            note.setArrowLength(14 * scale);
            note.setArrowWidth(2 * scale);
            note.setBaseRadius(18 * scale);
            note.setTipRadius(4 * scale);
            plot.addAnnotation(note);
        }
        JFreeChart chart = new JFreeChart(null, label, plot, true);
        chart.getLegend().setItemFont(label);
        chart.setBackgroundPaint(Color.WHITE);
        chart.setAntiAlias(true);
        return chart;
    }

    private static Font loadFont() {
        try (InputStream in = CurveChart.class.getClassLoader().getResourceAsStream(FONT_FILE)) {
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
