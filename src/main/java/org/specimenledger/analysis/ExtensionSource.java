package org.specimenledger.analysis;

import java.util.ArrayList;
import java.util.List;

/**
 * Where the extension of each point comes from, and the one extension array the analysis then uses.
 *
 * <p>Three cases:
 * <ul>
 *   <li><b>extensometer</b> for the whole record (the common case; the caller's array is used as is,
 *       nothing is allocated);</li>
 *   <li><b>switched to crosshead</b>: the extensometer stops (its values end, or it freezes: the same
 *       reading over at least {@code extensometerFreezePoints} points that still carry force above the
 *       fracture threshold [CP]) while a crosshead channel continues. Up to the last extensometer point k
 *       the extension is the extensometer's; after it, ΔL(i) = ΔL(k) + s·(u(i) − u(k)), where
 *       u = crosshead − C·F is the crosshead displacement with the machine compliance removed (a linear
 *       spring in series: crosshead = specimen extension + C·F [CP, textbook series-spring model]) and s
 *       scales the crosshead to the extensometer over the loading part both channels saw:
 *       s = (ΔL(k) − ΔL(w)) / (u(k) − u(w)), w the first point of the elastic fit window (past any
 *       seating slack). C comes from the equipment setting {@code machineComplianceMmPerN}, or from the
 *       elastic part of both channels: C = d(crosshead)/dF − d(extensometer)/dF, least squares over the
 *       same elastic window (this takes the crosshead's free length to be Le; any difference ends up in
 *       s);</li>
 *   <li><b>crosshead only</b> (no extensometer values): ΔL = u − u(0), with C from the setting or 0 with
 *       a warning.</li>
 * </ul>
 *
 * @param kind the case
 * @param extensometerPoints points taken from the extensometer (n, k + 1 after a switch-over, or 0)
 * @param complianceMmPerN C used, NaN when the crosshead is not used
 * @param complianceSource "equipment setting", "elastic part of both channels" or "not given (0 used)"
 * @param scale s, NaN unless switched
 * @param extension the effective extension in mm, one value per point
 * @param notes warnings to raise, in order
 */
record ExtensionSource(Kind kind, int extensometerPoints, double complianceMmPerN, String complianceSource,
        double scale, double[] extension, List<AnalysisWarning> notes) {

    /** The three cases. */
    enum Kind { EXTENSOMETER, SWITCHED_TO_CROSSHEAD, CROSSHEAD_ONLY }

    /** What a property's evidence says about points from the crosshead. */
    static final String FROM_CROSSHEAD = "crosshead, compliance-corrected";

    static ExtensionSource of(double[] force, double[] extension, double[] crosshead, TensileSpecimen s,
            TensileParameters p) {
        int n = force.length;
        List<AnalysisWarning> notes = new ArrayList<>();
        if (extension == null) {
            return crossheadOnly(force, crosshead, p, notes);
        }
        // Without a crosshead a NaN is refused later, by the finite check on every extension.
        int k = crosshead == null ? n : firstNaN(extension);
        if (k == n) {
            int frozen = frozenFrom(force, extension, p);
            if (frozen < 0) {
                return new ExtensionSource(Kind.EXTENSOMETER, n, Double.NaN, null, Double.NaN, extension, notes);
            }
            if (crosshead == null) {
                notes.add(new AnalysisWarning("EXTENSOMETER_FROZEN", "the extensometer reads " + extension[frozen]
                        + " mm unchanged from point " + frozen + " on while force continues and there is no crosshead"
                        + " channel; elongations after that point (Agt, Ag, At, A) are not reliable"));
                return new ExtensionSource(Kind.EXTENSOMETER, n, Double.NaN, null, Double.NaN, extension, notes);
            }
            notes.add(new AnalysisWarning("EXTENSOMETER_FROZEN", "the extensometer reads " + extension[frozen]
                    + " mm unchanged from point " + frozen + " on while force continues; taken as removed there"));
            k = frozen + 1;
        }
        if (k < p.minimumPoints()) {
            notes.add(new AnalysisWarning("EXTENSOMETER_TOO_SHORT", "only " + k + " extensometer points before it"
                    + " stops; the record is analysed from the crosshead alone"));
            return crossheadOnly(force, crosshead, p, notes);
        }
        return switched(force, extension, crosshead, k, s, p, notes);
    }

    private static ExtensionSource switched(double[] force, double[] extension, double[] crosshead, int k,
            TensileSpecimen s, TensileParameters p, List<AnalysisWarning> notes) {
        int n = force.length;
        int[] window = elasticWindow(force, extension, k, s, p);
        double c;
        String source;
        if (p.machineComplianceMmPerN() != null) {
            c = p.machineComplianceMmPerN();
            source = "equipment setting";
        } else if (window != null) {
            StraightLineFit head = StraightLineFit.of(force, crosshead, window[0], window[1]);
            StraightLineFit ext = StraightLineFit.of(force, extension, window[0], window[1]);
            c = head.slope() - ext.slope();
            source = "elastic part of both channels";
            if (!(c >= 0)) {
                notes.add(new AnalysisWarning("COMPLIANCE_NEGATIVE", "the crosshead is stiffer than the extensometer"
                        + " in the elastic part (C = " + c + " mm/N); C = 0 used"));
                c = 0;
            }
        } else {
            c = 0;
            source = "not given (0 used)";
            notes.add(new AnalysisWarning("COMPLIANCE_NOT_GIVEN", "no elastic part before the extensometer stops and"
                    + " no machine compliance setting; the crosshead is used without compliance correction"));
        }
        int last = k - 1;
        int w = window == null ? 0 : window[0];
        double uLast = crosshead[last] - c * force[last];
        double uW = crosshead[w] - c * force[w];
        double scale = (extension[last] - extension[w]) / (uLast - uW);
        if (!(scale > 0) || !Double.isFinite(scale)) {
            notes.add(new AnalysisWarning("CROSSHEAD_SCALE_UNDEFINED", "the crosshead did not move with the"
                    + " extensometer before the switch-over; scale 1 used"));
            scale = 1;
        }
        double[] out = new double[n];
        System.arraycopy(extension, 0, out, 0, k);
        for (int i = k; i < n; i++) {
            out[i] = extension[last] + scale * (crosshead[i] - c * force[i] - uLast);
        }
        notes.add(new AnalysisWarning("EXTENSOMETER_REMOVED", "the extensometer ends at point " + last
                + "; later extension from the crosshead with compliance " + c + " mm/N (" + source
                + ") scaled by " + scale + " to the extensometer"));
        return new ExtensionSource(Kind.SWITCHED_TO_CROSSHEAD, k, c, source, scale, out, notes);
    }

    private static ExtensionSource crossheadOnly(double[] force, double[] crosshead, TensileParameters p,
            List<AnalysisWarning> notes) {
        if (crosshead == null) {
            throw new AnalysisRejected("extensionMm or crossheadMm is required");
        }
        double c;
        String source;
        if (p.machineComplianceMmPerN() != null) {
            c = p.machineComplianceMmPerN();
            source = "equipment setting";
        } else {
            c = 0;
            source = "not given (0 used)";
            notes.add(new AnalysisWarning("COMPLIANCE_NOT_GIVEN", "crosshead-only record and no machine compliance"
                    + " setting; the strains include the deflection of the machine and grips"));
        }
        int n = force.length;
        double[] out = new double[n];
        double u0 = crosshead[0] - c * force[0];
        for (int i = 0; i < n; i++) {
            out[i] = crosshead[i] - c * force[i] - u0;
        }
        notes.add(new AnalysisWarning("CROSSHEAD_ONLY", "no extensometer: strains from the crosshead with compliance "
                + c + " mm/N (" + source + ") over Le"));
        return new ExtensionSource(Kind.CROSSHEAD_ONLY, 0, c, source, Double.NaN, out, notes);
    }

    /** The modulus window found on the extensometer part alone, or null. */
    private static int[] elasticWindow(double[] force, double[] extension, int k, TensileSpecimen s,
            TensileParameters p) {
        double[] f = java.util.Arrays.copyOf(force, k);
        double[] x = java.util.Arrays.copyOf(extension, k);
        CurveArrays prefix = CurveArrays.derived(f, x, null, s);
        UpperYieldPoint reh = UpperYieldPoint.find(f, prefix.strain, k - 1, p);
        int peak = reh != null ? reh.index() : prefix.argMaxForce(0, k - 1);
        ElasticSlope e = ElasticSlope.fit(prefix, peak, k - 1, reh != null, p);
        return e.found() ? new int[] {e.fit().firstIndex(), e.fit().lastIndex()} : null;
    }

    private static int firstNaN(double[] x) {
        for (int i = 0; i < x.length; i++) {
            if (Double.isNaN(x[i])) {
                for (int j = i + 1; j < x.length; j++) {
                    if (!Double.isNaN(x[j])) {
                        throw new AnalysisRejected("extensionMm[" + j + "] = " + x[j] + " follows the end of the"
                                + " extensometer at point " + i + "; a stopped extensometer may not resume");
                    }
                }
                return i;
            }
        }
        return x.length;
    }

    /**
     * First point of an unchanged tail of the extensometer that still carries force, or −1. Only the
     * tail is scanned, then its forces, so a moving extensometer costs a couple of reads.
     */
    private static int frozenFrom(double[] force, double[] x, TensileParameters p) {
        int n = x.length;
        int j = n - 1;
        while (j > 0 && x[j - 1] == x[n - 1]) {
            j--;
        }
        if (n - j < p.extensometerFreezePoints()) {
            return -1;
        }
        double fmax = 0;
        for (double f : force) {
            fmax = Math.max(fmax, f);
        }
        double floor = p.fractureFallbackPercentOfFmax() / 100 * fmax;
        int loaded = 0;
        for (int i = j + 1; i < n; i++) {
            if (force[i] >= floor) {
                loaded++;
            }
        }
        return loaded >= p.extensometerFreezePoints() ? j : -1;
    }

    /** Evidence of the switch-over or the crosshead use, empty for the extensometer case. */
    Evidence evidence(double leMm) {
        if (kind == Kind.EXTENSOMETER) {
            return Evidence.EMPTY;
        }
        return Evidence.builder().put("kind", kind.name()).put("extensometerPoints", extensometerPoints)
                .put("switchIndex", extensometerPoints - 1).put("complianceMmPerN", complianceMmPerN)
                .put("complianceSource", complianceSource).put("crossheadScale", scale).put("leMm", leMm).build();
    }

    /** Whether point i took its extension from the crosshead. */
    boolean fromCrosshead(int i) {
        return i >= extensometerPoints;
    }
}
