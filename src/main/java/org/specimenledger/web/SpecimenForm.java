package org.specimenledger.web;

import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.specimenledger.shared.FieldIssue;
import org.specimenledger.specimens.GaugeLength;
import org.specimenledger.specimens.Orientation;
import org.specimenledger.specimens.SpecimenRequests;
import org.specimenledger.specimens.SpecimenShape;

/**
 * The specimen form as typed: every field a string, so that a mistyped number comes back to the form
 * with its text and a message instead of failing the binding. {@link #toRequest(List)} turns it into
 * the feature's request, collecting every problem with the JSON Pointer the API would use.
 * Readings are typed as numbers separated by spaces (or semicolons).
 */
final class SpecimenForm {

    private String labIdentifier = "";
    private String heatId = "";
    private String orderId = "";
    private String orientation = "LONGITUDINAL";
    private String samplingPosition = "";
    private String shape = "ROUND";
    private String d = "";
    private String a = "";
    private String b = "";
    private String outerD = "";
    private String s0Mm2 = "";
    private String s0Method = "";
    private String basis = "PROPORTIONAL";
    private String k = "5.65";
    private boolean roundToFiveMm = true;
    private String l0Mm = "";
    private String leMm = "";
    private String lcMm = "";

    SpecimenRequests.SpecimenRequest toRequest(List<FieldIssue> problems) {
        SpecimenShape sh = FormValues.enumOf(SpecimenShape.class, shape, "/shape", problems);
        Map<String, List<BigDecimal>> readings = new LinkedHashMap<>();
        if (sh != null) {
            for (String symbol : sh.dimensions(org.specimenledger.specimens.CrossSection.Stage.ORIGINAL)) {
                readings.put(symbol, FormValues.numbers(textOf(symbol), "/readings/" + symbol, problems));
            }
        }
        GaugeLength.Basis gb = FormValues.enumOf(GaugeLength.Basis.class, basis, "/gaugeLength/basis", problems);
        SpecimenRequests.GaugeLengthRequest gauge = new SpecimenRequests.GaugeLengthRequest(gb,
                gb == GaugeLength.Basis.PROPORTIONAL ? FormValues.number(k, "/gaugeLength/k", problems) : null,
                gb == GaugeLength.Basis.PROPORTIONAL ? roundToFiveMm : null,
                gb == GaugeLength.Basis.FIXED ? FormValues.number(l0Mm, "/gaugeLength/l0Mm", problems) : null);
        return new SpecimenRequests.SpecimenRequest(FormValues.text(labIdentifier),
                FormValues.uuid(heatId, "/heatId", problems), FormValues.uuid(orderId, "/orderId", problems),
                FormValues.enumOf(Orientation.class, orientation, "/orientation", problems),
                FormValues.text(samplingPosition), sh, sh == SpecimenShape.OTHER ? Map.of() : readings,
                sh == SpecimenShape.OTHER ? FormValues.number(s0Mm2, "/s0Mm2", problems) : null,
                sh == SpecimenShape.OTHER ? FormValues.text(s0Method) : null, gauge,
                FormValues.number(leMm, "/leMm", problems), FormValues.number(lcMm, "/lcMm", problems), null);
    }

    private String textOf(String symbol) {
        return switch (symbol) {
            case "d" -> d;
            case "a" -> a;
            case "b" -> b;
            case "D" -> outerD;
            default -> "";
        };
    }

    /** The readings by symbol as numbers, for the live S0 and L0 preview; null where not numbers. */
    Map<String, double[]> readingsForPreview(SpecimenShape sh) {
        Map<String, double[]> out = new LinkedHashMap<>();
        for (String symbol : sh.dimensions(org.specimenledger.specimens.CrossSection.Stage.ORIGINAL)) {
            List<FieldIssue> ignored = new ArrayList<>();
            List<BigDecimal> values = FormValues.numbers(textOf(symbol), "", ignored);
            if (!ignored.isEmpty() || values == null || values.isEmpty()) {
                return null;
            }
            out.put(symbol, values.stream().mapToDouble(BigDecimal::doubleValue).toArray());
        }
        return out;
    }

    // bean accessors for form binding
    public String getLabIdentifier() { return labIdentifier; }
    public void setLabIdentifier(String v) { labIdentifier = v; }
    public String getHeatId() { return heatId; }
    public void setHeatId(String v) { heatId = v; }
    public String getOrderId() { return orderId; }
    public void setOrderId(String v) { orderId = v; }
    public String getOrientation() { return orientation; }
    public void setOrientation(String v) { orientation = v; }
    public String getSamplingPosition() { return samplingPosition; }
    public void setSamplingPosition(String v) { samplingPosition = v; }
    public String getShape() { return shape; }
    public void setShape(String v) { shape = v; }
    public String getD() { return d; }
    public void setD(String v) { d = v; }
    public String getA() { return a; }
    public void setA(String v) { a = v; }
    public String getB() { return b; }
    public void setB(String v) { b = v; }
    public String getOuterD() { return outerD; }
    public void setOuterD(String v) { outerD = v; }
    public String getS0Mm2() { return s0Mm2; }
    public void setS0Mm2(String v) { s0Mm2 = v; }
    public String getS0Method() { return s0Method; }
    public void setS0Method(String v) { s0Method = v; }
    public String getBasis() { return basis; }
    public void setBasis(String v) { basis = v; }
    public String getK() { return k; }
    public void setK(String v) { k = v; }
    public boolean isRoundToFiveMm() { return roundToFiveMm; }
    public void setRoundToFiveMm(boolean v) { roundToFiveMm = v; }
    public String getL0Mm() { return l0Mm; }
    public void setL0Mm(String v) { l0Mm = v; }
    public String getLeMm() { return leMm; }
    public void setLeMm(String v) { leMm = v; }
    public String getLcMm() { return lcMm; }
    public void setLcMm(String v) { lcMm = v; }
}
