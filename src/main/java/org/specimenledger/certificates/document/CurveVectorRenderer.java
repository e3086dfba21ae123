package org.specimenledger.certificates.document;

import java.awt.Graphics2D;
import java.awt.geom.Rectangle2D;
import net.sf.jasperreports.engine.JasperReportsContext;
import net.sf.jasperreports.renderers.AbstractRenderToImageAwareRenderer;
import net.sf.jasperreports.renderers.Graphics2DRenderable;

/**
 * Draws a stress–strain chart straight into the report's graphics: the PDF exporter then writes it as
 * vector paths instead of a raster image.
 */
final class CurveVectorRenderer extends AbstractRenderToImageAwareRenderer implements Graphics2DRenderable {

    private static final long serialVersionUID = 1L;

    private final transient StressStrainCurve curve;

    CurveVectorRenderer(StressStrainCurve curve) {
        this.curve = curve;
    }

    @Override
    public void render(JasperReportsContext context, Graphics2D graphics, Rectangle2D area) {
        CurveChart.chart(curve, 1.0).draw(graphics, area);
    }
}
