package org.specimenledger.web;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.specimenledger.curve.CurveReader;
import org.specimenledger.curve.RawCurve;
import org.specimenledger.testing.AnalysisRunView;

/**
 * The stress–strain diagram of one analysis as plain drawing instructions for an SVG template: the curve
 * (at most about {@value #BUCKETS}×3 points: first, lowest and highest stress of each bucket, so peaks
 * and drops survive thinning), the elastic fit window and line, each proof-strength offset line with
 * its intersection, ReH/ReL, Fm and the fracture point, and for a cyclic run the loops shaded. Stress
 * R = F/S0 in MPa and strain e = ΔL/Le in % (ISO 6892-1 symbols), computed from the stored raw curve
 * and the geometry the analysis used; the marked points are the analysis's own evidence (point indices
 * and intersection values), never recomputed here.
 */
record CurvePlot(String curvePath, String fitPath, List<Line> lines, List<Marker> markers, List<String> loops,
        List<Tick> xTicks, List<Tick> yTicks) {

    static final int WIDTH = 760;
    static final int HEIGHT = 440;
    static final int LEFT = 64;
    static final int RIGHT = 16;
    static final int TOP = 16;
    static final int BOTTOM = 48;
    static final int BUCKETS = 600;

    record Line(String kind, String label, double x1, double y1, double x2, double y2) {
    }

    record Marker(String kind, String label, double x, double y, double labelX, double labelY) {
    }

    record Tick(String label, double at) {
    }

    static CurvePlot of(AnalysisRunView analysis, byte[] bytes) {
        RawCurve curve = new CurveReader().read(bytes);
        double s0 = number(analysis.geometry().get("s0Mm2"));
        double le = number(analysis.geometry().get("leMm"));
        double[] f = curve.forceN();
        double[] x = curve.extensionMm();
        int n = f.length;
        double[] stress = new double[n];
        double[] strain = new double[n];
        double maxStress = 1;
        double maxStrain = 0.01;
        for (int i = 0; i < n; i++) {
            stress[i] = f[i] / s0;
            strain[i] = x[i] / le * 100;
            maxStress = Math.max(maxStress, stress[i]);
            maxStrain = Math.max(maxStrain, strain[i]);
        }
        Scale sx = Scale.nice(maxStrain, LEFT, WIDTH - RIGHT);
        Scale sy = Scale.nice(maxStress * 1.05, HEIGHT - BOTTOM, TOP);
        String curvePath = path(thinned(stress, 0, n - 1), strain, stress, sx, sy);

        Map<String, Map<String, Object>> props = analysis.properties();
        String fitPath = null;
        List<Line> lines = new ArrayList<>();
        List<Marker> markers = new ArrayList<>();
        Map<String, Object> e = evidence(props, "E");
        if (e != null && e.get("firstIndex") != null && e.get("lastIndex") != null) {
            int a = (int) number(e.get("firstIndex"));
            int b = (int) number(e.get("lastIndex"));
            if (a >= 0 && b < n && a < b) {
                fitPath = path(thinned(stress, a, b), strain, stress, sx, sy);
            }
        }
        Double modulus = value(props, "E");
        double origin = e == null || e.get("strainOriginPercent") == null ? 0 : number(e.get("strainOriginPercent"));
        if (modulus != null && modulus > 0) {
            double top = Math.min(maxStress * 1.02, sy.max);
            double end = origin + top / modulus * 100;
            lines.add(new Line("elastic", "elastic fit, E", sx.at(origin), sy.at(0), sx.at(end), sy.at(top)));
        }
        for (Map.Entry<String, Map<String, Object>> p : props.entrySet()) {
            String symbol = p.getKey();
            Map<String, Object> ev = evidence(props, symbol);
            if (ev == null) {
                continue;
            }
            if (symbol.startsWith("Rp") && ev.get("intersectionStressMPa") != null) {
                double slope = ev.get("lineSlopeMPa") == null ? (modulus == null ? 0 : modulus)
                        : number(ev.get("lineSlopeMPa"));
                double o = (ev.get("strainOriginPercent") == null ? origin : number(ev.get("strainOriginPercent")))
                        + number(ev.get("offsetPercent"));
                double r = number(ev.get("intersectionStressMPa"));
                double ex = number(ev.get("intersectionStrainPercent"));
                if (slope > 0) {
                    double top = Math.min(r * 1.15, sy.max);
                    lines.add(new Line("offset", symbol + " offset line", sx.at(o), sy.at(0),
                            sx.at(o + top / slope * 100), sy.at(top)));
                }
                markers.add(marker("proof", symbol, sx.at(ex), sy.at(r)));
            } else if (symbol.equals("ReH") || symbol.equals("ReL") || symbol.equals("Fm")) {
                Object index = ev.get("index");
                if (index != null && (int) number(index) < n) {
                    int i = (int) number(index);
                    markers.add(marker(symbol.equals("Fm") ? "maximum" : "yield", symbol.equals("Fm") ? "Fm" : symbol,
                            sx.at(strain[i]), sy.at(stress[i])));
                }
            } else if (ev.get("fractureIndex") != null && markers.stream().noneMatch(m -> m.kind().equals("fracture"))) {
                int i = (int) number(ev.get("fractureIndex"));
                if (i >= 0 && i < n) {
                    markers.add(marker("fracture", "fracture", sx.at(strain[i]), sy.at(stress[i])));
                }
            }
        }
        List<String> loops = new ArrayList<>();
        Object cycles = analysis.results().get("cycles");
        if (cycles instanceof List<?> list) {
            for (Object c : list) {
                if (c instanceof Map<?, ?> m && m.get("startIndex") != null && m.get("endIndex") != null) {
                    int a = (int) number(m.get("startIndex"));
                    int b = (int) number(m.get("endIndex"));
                    if (a >= 0 && b < n && a < b) {
                        loops.add(path(thinned(stress, a, b), strain, stress, sx, sy) + " Z");
                    }
                }
            }
        }
        return new CurvePlot(curvePath, fitPath, lines, markers, loops, sx.ticks(), sy.ticks());
    }

    private static Marker marker(String kind, String label, double x, double y) {
        // the fracture label goes below its point: a curve that ends at its maximum puts it beside Fm
        double labelY = kind.equals("fracture") ? Math.min(HEIGHT - BOTTOM - 4, y + 18) : Math.max(TOP + 10, y - 8);
        return new Marker(kind, label, x, y, x + 6, labelY);
    }

    @SuppressWarnings("unchecked")
    private static Map<String, Object> evidence(Map<String, Map<String, Object>> props, String symbol) {
        Map<String, Object> p = props.get(symbol);
        return p != null && p.get("evidence") instanceof Map<?, ?> m ? (Map<String, Object>) m : null;
    }

    private static Double value(Map<String, Map<String, Object>> props, String symbol) {
        Map<String, Object> p = props.get(symbol);
        return p == null || p.get("value") == null ? null : number(p.get("value"));
    }

    private static double number(Object o) {
        if (o instanceof Number num) {
            return num.doubleValue();
        }
        return o == null ? Double.NaN : Double.parseDouble(o.toString());
    }

    /** Indices to draw between a and b: per bucket the first, lowest and highest stress, in index order. */
    private static int[] thinned(double[] stress, int a, int b) {
        int count = b - a + 1;
        if (count <= BUCKETS * 3) {
            int[] all = new int[count];
            for (int i = 0; i < count; i++) {
                all[i] = a + i;
            }
            return all;
        }
        int[] out = new int[BUCKETS * 3 + 1];
        int k = 0;
        double size = (double) count / BUCKETS;
        for (int bucket = 0; bucket < BUCKETS; bucket++) {
            int from = a + (int) (bucket * size);
            int to = Math.min(b, a + (int) ((bucket + 1) * size) - 1);
            int lo = from;
            int hi = from;
            for (int i = from; i <= to; i++) {
                if (stress[i] < stress[lo]) {
                    lo = i;
                }
                if (stress[i] > stress[hi]) {
                    hi = i;
                }
            }
            out[k++] = from;
            out[k++] = Math.min(lo, hi);
            out[k++] = Math.max(lo, hi);
        }
        out[k++] = b;
        return java.util.Arrays.copyOf(out, k);
    }

    private static String path(int[] indices, double[] strain, double[] stress, Scale sx, Scale sy) {
        StringBuilder sb = new StringBuilder(indices.length * 14);
        for (int j = 0; j < indices.length; j++) {
            int i = indices[j];
            sb.append(j == 0 ? 'M' : 'L').append(fmt(sx.at(strain[i]))).append(',').append(fmt(sy.at(stress[i])))
                    .append(' ');
        }
        return sb.toString().trim();
    }

    static String fmt(double v) {
        return String.format(Locale.ROOT, "%.1f", v);
    }

    /** A linear axis from 0 to a round maximum, mapped to pixels between {@code from} and {@code to}. */
    private record Scale(double max, double step, double from, double to) {

        static Scale nice(double dataMax, double from, double to) {
            double raw = dataMax / 5;
            double magnitude = Math.pow(10, Math.floor(Math.log10(raw)));
            double step = magnitude;
            for (double m : new double[] {1, 2, 2.5, 5, 10}) {
                if (m * magnitude >= raw) {
                    step = m * magnitude;
                    break;
                }
            }
            return new Scale(Math.ceil(dataMax / step) * step, step, from, to);
        }

        double at(double v) {
            return from + (to - from) * (v / max);
        }

        List<Tick> ticks() {
            List<Tick> out = new ArrayList<>();
            for (int i = 0; i * step <= max + step / 1000; i++) {
                double v = i * step;
                out.add(new Tick(java.math.BigDecimal.valueOf(v).round(new java.math.MathContext(6))
                        .stripTrailingZeros().toPlainString(), at(v)));
            }
            return out;
        }
    }
}
