package org.specimenledger.analysis;

import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/** One tensile analysis in progress: finds the properties in dependency order, stores them in key order. */
final class TensileRun {
    private static final String MPA = "MPa";
    private static final String PCT = "%";
    private static final String J = "J";

    private final CurveArrays c;
    private final TensileSpecimen s;
    private final TensileParameters p;
    private final RoundingRule rule;
    private final List<AnalysisWarning> warnings = new ArrayList<>();

    private FracturePoint fracture;
    private int last;
    private UpperYieldPoint reh;
    private ElasticSlope elastic;
    private double mE;
    private double e0;
    private Yielding yielding;
    private YieldRange yieldRange;
    private int fmStart;
    private int fmIndex;
    private boolean fmPassed;
    private OffsetIntersection firstProof;
    private UnloadReloadLoop loop;
    /** Whether mE came from the reloading branch of a loop. */
    private boolean slopeFromLoop;
    /** Whether a slope mE is known (from the first loading or a loop). */
    private boolean slopeKnown;
    /** First point searched for offset intersections. */
    private int searchFrom;

    TensileRun(CurveArrays c, TensileSpecimen s, TensileParameters p) {
        this.c = c;
        this.s = s;
        this.p = p;
        this.rule = p.rounding();
    }

    TensileResult run() {
        warnings.addAll(c.source.notes());
        // A loop must rejoin its starting force, so it ends before the highest force of the record; both come
        // from one pass.
        UnloadReloadLoop.Scan scan = UnloadReloadLoop.scan(c, p);
        fracture = FracturePoint.locate(c.force, p, scan.maximumIndex());
        last = fracture != null ? fracture.index() : c.n - 1;
        loop = scan.loop();
        reh = UpperYieldPoint.find(c.force, c.strain, last, p, loop);
        int peak = reh != null ? reh.index() : c.argMaxForce(0, last);
        elastic = ElasticSlope.fit(c, peak, last, reh != null, p);
        mE = elastic.slope();
        e0 = elastic.found() ? elastic.strainOrigin() : 0;
        searchFrom = elastic.found() ? elastic.fit().firstIndex() : 0;
        if (loop != null) {
            useLoop();
        }
        slopeKnown = elastic.found() || slopeFromLoop;
        toeCheck();
        fmStart = reh != null ? reh.dropIndex() : 0;
        fmIndex = c.argMaxForce(fmStart, last);
        fmPassed = fracture != null || maximumPassed();
        yielding = classify();
        if (reh != null) {
            yieldRange = YieldRange.of(c, reh, fmIndex, p);
        }
        RecordQuality.check(c, reh, elastic, fmIndex, p, warnings);

        Map<String, PropertyResult> props = new LinkedHashMap<>();
        props.put("E", modulus());
        props.put("ReH", upperYield());
        props.put("ReL", lowerYield());
        for (double offset : p.proofOffsetsPercent()) {
            PropertyResult rp = proof(offset);
            props.put(rp.symbol(), rp);
        }
        for (double x : p.totalExtensionsPercent()) {
            PropertyResult rt = totalExtension(x);
            props.put(rt.symbol(), rt);
        }
        props.put("Fm", maximumForce());
        props.put("Rm", tensileStrength());
        props.put("Ae", yieldPointExtension());
        putUniformElongations(props);
        props.put("At", totalElongationAtFracture());
        props.put("A", elongationAfterFracture());
        props.put("Z", reductionOfArea());
        props.put("W", workToFracture());
        props.put("Welastic", elasticEnergy(props));
        List<StrainRateCheck> rates = strainRates();
        if (p.uncertainty().relativeS0Uncertainty(s.s0Mm2()) == 0) {
            warn("S0_UNCERTAINTY_NOT_GIVEN", "no uncertainty of S0 or its dimensions was given; the expanded"
                    + " uncertainties cover force (and extensometer for Rp) only");
        }
        return new TensileResult(TensileAnalysis.METHOD_VERSION, p, yielding, props, warnings, rates);
    }

    private boolean maximumPassed() {
        double threshold = c.force[fmIndex] * (1 - p.flatMaximumTolerancePercent() / 100);
        for (int j = fmIndex + 1; j < c.n; j++) {
            if (c.force[j] < threshold) {
                return true;
            }
        }
        return false;
    }

    private Yielding classify() {
        if (reh != null) {
            return Yielding.DISCONTINUOUS;
        }
        if (!slopeKnown) {
            warn("YIELDING_NOT_CLASSIFIED", "no elastic slope, so the 0.2 % plastic extension cannot be located;"
                    + " yielding reported as NONE");
            return Yielding.NONE;
        }
        OffsetIntersection at02 = OffsetIntersection.find(c.stress, c.strain, mE, e0,
                ElasticSlope.CLASSIFICATION_OFFSET, searchFrom, last);
        if (at02 != null) {
            return Yielding.CONTINUOUS;
        }
        if (fracture == null) {
            warn("RECORD_ENDS_BEFORE_YIELD", "the record ends before 0.2 % plastic extension without fracture;"
                    + " yielding reported as NONE");
        }
        return Yielding.NONE;
    }

    private PropertyResult modulus() {
        if (slopeFromLoop) {
            StraightLineFit fit = loop.reloading();
            Evidence e = loop.evidence().putAll(fit.evidence("slopeMPa", "interceptMPa").build())
                    .put("strainOriginPercent", 100 * e0).put("originShiftMm", e0 * s.leMm()).build();
            if (c.source.kind() == ExtensionSource.Kind.CROSSHEAD_ONLY && !p.modulusFromCrosshead()) {
                return crossheadModulus(e);
            }
            return PropertyResult.determined("E", mE, MPA, ReportedQuantity.MODULUS, rule,
                    "least-squares slope of the reloading branch of the unload–reload loop", e, null);
        }
        if (!elastic.found()) {
            return PropertyResult.notDeterminable("E", MPA, "no clear elastic part: " + elastic.windowPoints()
                    + " points between " + round1(elastic.lowerStress()) + " and " + round1(elastic.upperStress())
                    + " MPa before the first maximum (at least " + p.modulusMinimumPoints() + " needed)",
                    windowEvidence().build());
        }
        StraightLineFit fit = elastic.fit();
        if (fit.rSquared() < p.modulusMinimumRSquared()) {
            warn("ELASTIC_FIT_POOR", "R² of the elastic fit is " + fit.rSquared() + ", below "
                    + p.modulusMinimumRSquared() + "; the linear part may be unclear");
        }
        if (!elastic.converged()) {
            warn("MODULUS_NOT_CONVERGED", "the modulus fit window did not settle within "
                    + p.modulusMaxIterations() + " iterations");
        }
        Evidence e = windowEvidence().putAll(fit.evidence("slopeMPa", "interceptMPa").build())
                .put("strainOriginPercent", 100 * e0).put("originShiftMm", e0 * s.leMm()).build();
        if (c.source.kind() == ExtensionSource.Kind.CROSSHEAD_ONLY && !p.modulusFromCrosshead()) {
            return crossheadModulus(e);
        }
        return PropertyResult.determined("E", mE, MPA, ReportedQuantity.MODULUS, rule,
                "least-squares slope of stress on strain (extensometer)", e, null);
    }

    /** E from crosshead data measures machine and grips as well as the test piece [CP]. */
    private PropertyResult crossheadModulus(Evidence slope) {
        return PropertyResult.notDeterminable("E", MPA, "not determinable from crosshead data (the slope includes"
                + " the machine and grips); the apparent slope " + round1(mE) + " MPa is used only for the Rp"
                + " offset line; set modulusFromCrosshead to report it",
                Evidence.builder().putAll(slope).putAll(c.source.evidence(s.leMm())).build());
    }

    /**
     * The reloading branch sets mE; the origin stays on the first loading: the strain-axis intercept of a
     * line with the loop's slope through the upper half of the first elastic window (past any toe).
     */
    private void useLoop() {
        if (!p.slopeFromLoop()) {
            warn("UNLOAD_RELOAD_LOOP", "an unload–reload loop at points " + loop.unloadIndex() + "–"
                    + loop.rejoinIndex() + " was left out of ReH, Fm and Ag; slopeFromLoop is off, so mE is"
                    + " from the first loading");
            return;
        }
        if (!loop.sloped()) {
            warn("UNLOAD_RELOAD_LOOP", "an unload–reload loop at points " + loop.unloadIndex() + "–"
                    + loop.rejoinIndex() + " has too few reloading points for a slope; mE is from the first loading");
            return;
        }
        mE = loop.reloading().slope();
        slopeFromLoop = true;
        if (elastic.found() && p.originCorrection()) {
            int from = (elastic.fit().firstIndex() + elastic.fit().lastIndex() + 1) / 2;
            int to = elastic.fit().lastIndex();
            double sum = 0;
            for (int i = from; i <= to; i++) {
                sum += c.strain[i] - c.stress[i] / mE;
            }
            e0 = sum / (to - from + 1);
        } else {
            e0 = 0;
        }
        warn("UNLOAD_RELOAD_LOOP", "mE = " + round1(mE) + " MPa from the reloading branch of the unload–reload loop"
                + " at points " + loop.unloadIndex() + "–" + loop.rejoinIndex() + "; the loop is left out of ReH, Fm"
                + " and Ag");
    }

    /**
     * Toe compensation [S: ASTM E8/E8M toe region; ISO 6892-1 origin correction, M]: the origin moves to
     * where the elastic line meets zero force. A shift larger than the extensometer's bias limit
     * ({@code uncertainty.extensometerBiasLimitUm}, ISO 9513 [M]) is reported as a toe.
     */
    private void toeCheck() {
        double shiftMm = e0 * s.leMm();
        if (slopeKnown && p.originCorrection() && shiftMm * 1000 > p.uncertainty().extensometerBiasLimitUm()) {
            warn("TOE_COMPENSATED", "the elastic line meets zero force at " + round4(shiftMm) + " mm ("
                    + round4(100 * e0) + " % of Le); extensions are measured from there (seating or slack at the"
                    + " start of the test)");
        }
    }

    /** Adds where the extension of these points came from, when any came from the crosshead. */
    private Evidence.Builder sourced(Evidence.Builder b, int... indices) {
        for (int i : indices) {
            if (c.source.fromCrosshead(i)) {
                b.put("extensionSource", ExtensionSource.FROM_CROSSHEAD).put("switchIndex",
                        c.source.extensometerPoints() - 1);
                return b;
            }
        }
        return b;
    }

    private Evidence.Builder windowEvidence() {
        return Evidence.builder().put("reference", elastic.reference())
                .put("referenceStressMPa", elastic.referenceStress())
                .put("lowerStressMPa", elastic.lowerStress()).put("upperStressMPa", elastic.upperStress())
                .put("iterations", elastic.iterations()).put("converged", elastic.converged());
    }

    private PropertyResult upperYield() {
        if (reh == null) {
            return PropertyResult.notApplicable("ReH", MPA, notDiscontinuous());
        }
        double value = c.stress[reh.index()];
        Evidence e = Evidence.builder().put("index", reh.index()).put("strainPercent", 100 * (c.strain[reh.index()] - e0))
                .put("forceN", c.force[reh.index()]).put("dropIndex", reh.dropIndex()).put("holdIndex", reh.holdIndex())
                .put("dropPercent", p.yieldDropPercent()).put("holdStrainPercent", p.yieldHoldStrainPercent()).build();
        return PropertyResult.determined("ReH", value, MPA, ReportedQuantity.STRENGTH, rule,
                "maximum before the first force drop (digitised-data rule)", e,
                StrengthUncertainty.expanded(value, p, s));
    }

    private PropertyResult lowerYield() {
        if (reh == null) {
            return PropertyResult.notApplicable("ReL", MPA, notDiscontinuous());
        }
        int i = yieldRange.lowIndex();
        double value = c.stress[i];
        boolean only = yieldRange.minima() == 1;
        Evidence e = Evidence.builder().put("index", i).put("strainPercent", 100 * (c.strain[i] - e0))
                .put("forceN", c.force[i]).put("transientIndex", yieldRange.transientIndex())
                .put("localMinima", yieldRange.minima()).build();
        return PropertyResult.determined("ReL", value, MPA, ReportedQuantity.STRENGTH, rule,
                only ? "the only local minimum during yielding" : "lowest local minimum after the initial transient",
                e, StrengthUncertainty.expanded(value, p, s));
    }

    private String notDiscontinuous() {
        return yielding == Yielding.NONE ? "no yielding: " + noYieldingReason()
                : "continuous yielding: no force drop of " + p.yieldDropPercent() + " % followed by "
                        + p.yieldHoldStrainPercent() + " % strain below the maximum";
    }

    private String noYieldingReason() {
        return fracture != null ? "fracture before 0.2 % plastic extension" : "record ends before 0.2 % plastic extension";
    }

    private PropertyResult proof(double offsetPercent) {
        String symbol = "Rp" + plain(offsetPercent);
        if (!slopeKnown) {
            return PropertyResult.notDeterminable(symbol, MPA, "no elastic slope (E not determinable)", Evidence.EMPTY);
        }
        OffsetIntersection x = OffsetIntersection.find(c.stress, c.strain, mE, e0, offsetPercent / 100,
                searchFrom, last);
        if (x == null) {
            String why = (fracture != null ? "fracture before " : "record ends before ") + plain(offsetPercent)
                    + " % plastic extension";
            return PropertyResult.notDeterminable(symbol, MPA, why,
                    Evidence.builder().put("offsetPercent", offsetPercent).put("searchedToIndex", last).build());
        }
        if (firstProof == null && offsetPercent == p.proofOffsetsPercent().get(0)) {
            firstProof = x;
        }
        double corrected = x.strain() - e0;
        double k = StrengthUncertainty.localSlope(c.stress, c.strain, 0, last, x.strain());
        Evidence e = sourced(Evidence.builder().put("offsetPercent", offsetPercent).put("beforeIndex", x.before())
                .put("afterIndex", x.after()).put("interpolationFraction", x.fraction())
                .put("intersectionStrainPercent", 100 * corrected).put("intersectionStressMPa", x.stress())
                .put("lineSlopeMPa", mE).put("lineSlopeSource", slopeFromLoop ? "unload-reload loop" : "first loading")
                .put("strainOriginPercent", 100 * e0).put("localSlopeMPa", k), x.after()).build();
        return PropertyResult.determined(symbol, x.stress(), MPA, ReportedQuantity.STRENGTH, rule,
                "parallel-line intersection, interpolated between points " + x.before() + " and " + x.after(), e,
                StrengthUncertainty.expandedProof(x.stress(), corrected, k, p, s));
    }

    private PropertyResult totalExtension(double percent) {
        String symbol = "Rt" + plain(percent);
        double target = percent / 100 + e0;
        for (int i = 1; i <= last; i++) {
            if (c.strain[i] >= target && c.strain[i - 1] < target) {
                double t = (target - c.strain[i - 1]) / (c.strain[i] - c.strain[i - 1]);
                double value = c.stress[i - 1] + t * (c.stress[i] - c.stress[i - 1]);
                Evidence e = sourced(Evidence.builder().put("totalExtensionPercent", percent).put("beforeIndex", i - 1)
                        .put("afterIndex", i).put("interpolationFraction", t).put("strainOriginPercent", 100 * e0), i)
                        .build();
                return PropertyResult.determined(symbol, value, MPA, ReportedQuantity.STRENGTH, rule,
                        "stress at " + plain(percent) + " % total extension, interpolated", e,
                        null);
            }
        }
        return PropertyResult.notDeterminable(symbol, MPA, (fracture != null ? "fracture before " : "record ends before ")
                + plain(percent) + " % total extension", Evidence.EMPTY);
    }

    private PropertyResult maximumForce() {
        if (!fmPassed) {
            return PropertyResult.notDeterminable("Fm", "N", curveEndsBeforeFm(), Evidence.EMPTY);
        }
        Evidence e = Evidence.builder().put("index", fmIndex).put("strainPercent", 100 * (c.strain[fmIndex] - e0))
                .put("searchFromIndex", fmStart).put("searchToIndex", last).build();
        return PropertyResult.determined("Fm", c.force[fmIndex], "N", ReportedQuantity.FORCE, rule,
                reh != null ? "highest force after the yield drop" : "highest force before fracture", e, null);
    }

    private String curveEndsBeforeFm() {
        return "record ends before the maximum force: the force at the last point is within "
                + p.flatMaximumTolerancePercent() + " % of the highest force and no fracture was found";
    }

    private PropertyResult tensileStrength() {
        if (!fmPassed) {
            return PropertyResult.notDeterminable("Rm", MPA, curveEndsBeforeFm(), Evidence.EMPTY);
        }
        double rm = c.stress[fmIndex];
        return PropertyResult.determined("Rm", rm, MPA, ReportedQuantity.STRENGTH, rule, "Fm / S0",
                Evidence.builder().put("index", fmIndex).put("s0Mm2", s.s0Mm2()).build(),
                StrengthUncertainty.expanded(rm, p, s));
    }

    private PropertyResult yieldPointExtension() {
        if (reh == null) {
            return PropertyResult.notApplicable("Ae", PCT, notDiscontinuous());
        }
        Evidence.Builder e = Evidence.builder().put("startIndex", reh.index())
                .put("lastZeroSlopeIndex", yieldRange.lastValleyIndex())
                .put("horizontalStressMPa", c.stress[yieldRange.lastValleyIndex()]);
        if (yieldRange.tangent() != null) {
            e.put("tangent", yieldRange.tangent().evidence("slopeMPa", "interceptMPa").build());
        }
        if (!Double.isFinite(yieldRange.endStrain())) {
            return PropertyResult.notDeterminable("Ae", PCT,
                    "no work hardening after yielding to fit the tangent for the end of yielding", e.build());
        }
        double value = 100 * (yieldRange.endStrain() - c.strain[reh.index()]);
        e.put("endStrainPercent", 100 * (yieldRange.endStrain() - e0)).put("endIndex", yieldRange.endIndex());
        return PropertyResult.determined("Ae", value, PCT, ReportedQuantity.YIELD_POINT_EXTENSION, rule,
                "from ReH to the intersection of the horizontal through the last zero slope with the hardening tangent",
                e.build(), null);
    }

    private void putUniformElongations(Map<String, PropertyResult> props) {
        if (!fmPassed) {
            props.put("Agt", PropertyResult.notDeterminable("Agt", PCT, curveEndsBeforeFm(), Evidence.EMPTY));
            props.put("Ag", PropertyResult.notDeterminable("Ag", PCT, curveEndsBeforeFm(), Evidence.EMPTY));
            return;
        }
        double fm = c.force[fmIndex];
        double threshold = fm * (1 - p.flatMaximumTolerancePercent() / 100);
        int a = fmIndex;
        int plateauFrom = loop != null && loop.rejoinIndex() <= fmIndex ? Math.max(fmStart, loop.rejoinIndex()) : fmStart;
        for (int i = plateauFrom; i <= fmIndex; i++) {
            if (c.force[i] >= threshold) {
                a = i;
                break;
            }
        }
        int b = fmIndex;
        for (int i = last; i >= fmIndex; i--) {
            if (c.force[i] >= threshold) {
                b = i;
                break;
            }
        }
        double middle = (c.strain[a] + c.strain[b]) / 2 - e0;
        Evidence e = sourced(Evidence.builder().put("plateauFirstIndex", a).put("plateauLastIndex", b)
                .put("tolerancePercent", p.flatMaximumTolerancePercent()).put("strainAtFmPercent", 100 * middle)
                .put("strainOriginPercent", 100 * e0), a, b).build();
        props.put("Agt", PropertyResult.determined("Agt", 100 * middle, PCT, ReportedQuantity.ELONGATION, rule,
                "total extension at the middle of the maximum-force plateau", e, null));
        if (!slopeKnown) {
            props.put("Ag", PropertyResult.notDeterminable("Ag", PCT, "no elastic slope (E not determinable)", e));
            return;
        }
        double rm = c.stress[fmIndex];
        props.put("Ag", PropertyResult.determined("Ag", 100 * (middle - rm / mE), PCT, ReportedQuantity.ELONGATION,
                rule, "Agt minus the elastic part Rm/mE", e, null));
    }

    private PropertyResult totalElongationAtFracture() {
        if (fracture == null) {
            return PropertyResult.notDeterminable("At", PCT, noFracture(), Evidence.EMPTY);
        }
        int f = fracture.index();
        return PropertyResult.determined("At", 100 * (c.strain[f] - e0), PCT, ReportedQuantity.ELONGATION, rule,
                "total extension at fracture (" + fracture.rule() + ")", fractureEvidence().build(), null);
    }

    private Evidence.Builder fractureEvidence() {
        int f = fracture.index();
        return sourced(Evidence.builder().put("fractureIndex", f).put("fractureRule", fracture.rule())
                .put("forceN", c.force[f]).put("strainOriginPercent", 100 * e0), f);
    }

    private String noFracture() {
        return "no fracture in the record: no sudden force drop and the force never falls below "
                + p.fractureFallbackPercentOfFmax() + " % of Fmax";
    }

    private PropertyResult elongationAfterFracture() {
        if (s.luMm() != null) {
            double a = 100 * (s.luMm() - s.l0Mm()) / s.l0Mm();
            return PropertyResult.determined("A", a, PCT, ReportedQuantity.ELONGATION, rule, "from broken pieces",
                    Evidence.builder().put("luMm", s.luMm()).put("l0Mm", s.l0Mm()).build(), null);
        }
        if (fracture == null) {
            return PropertyResult.notDeterminable("A", PCT, "Lu not measured and " + noFracture(), Evidence.EMPTY);
        }
        if (!slopeKnown) {
            return PropertyResult.notDeterminable("A", PCT, "Lu not measured and no elastic slope to remove the elastic part",
                    fractureEvidence().build());
        }
        if (s.leMm() != s.l0Mm()) {
            warn("A_FROM_EXTENSOMETER_ON_LE", "A from the extensometer refers to Le = " + s.leMm()
                    + " mm, not to L0 = " + s.l0Mm() + " mm");
        }
        int f = fracture.index();
        double a = 100 * (c.strain[f] - e0 - c.stress[f] / mE);
        String how = c.source.fromCrosshead(f) ? "from the crosshead (compliance-corrected), elastic part removed"
                : "from extensometer, elastic part removed";
        return PropertyResult.determined("A", a, PCT, ReportedQuantity.ELONGATION, rule,
                how, fractureEvidence().put("leMm", s.leMm()).build(), null);
    }

    private PropertyResult reductionOfArea() {
        if (s.suMm2() == null) {
            return PropertyResult.notDeterminable("Z", PCT, "Su not measured", Evidence.EMPTY);
        }
        double z = 100 * (s.s0Mm2() - s.suMm2()) / s.s0Mm2();
        return PropertyResult.determined("Z", z, PCT, ReportedQuantity.REDUCTION_OF_AREA, rule, "(S0 − Su) / S0",
                Evidence.builder().put("s0Mm2", s.s0Mm2()).put("suMm2", s.suMm2()).build(), null);
    }

    private PropertyResult workToFracture() {
        if (fracture == null) {
            return PropertyResult.notDeterminable("W", J, noFracture(), Evidence.EMPTY);
        }
        int f = fracture.index();
        double sum = 0;
        for (int i = 1; i <= f; i++) {
            sum += 0.5 * (c.force[i] + c.force[i - 1]) * (c.extension[i] - c.extension[i - 1]);
        }
        return PropertyResult.determined("W", sum / 1000, J, ReportedQuantity.ENERGY, rule,
                "trapezoidal rule of force over extension from the first point to fracture",
                Evidence.builder().put("firstIndex", 0).put("lastIndex", f).build(), null);
    }

    private PropertyResult elasticEnergy(Map<String, PropertyResult> props) {
        String at = reh != null ? "ReH" : "Rp" + plain(p.proofOffsetsPercent().isEmpty() ? 0.2 : p.proofOffsetsPercent().get(0));
        PropertyResult point = props.get(at);
        if (point == null || !point.isDetermined()) {
            return PropertyResult.notDeterminable("Welastic", J, "no proof point: " + (point == null
                    ? "no proof offset requested" : at + " " + point.reason()), Evidence.EMPTY);
        }
        double stress = point.value();
        double force = stress * s.s0Mm2();
        double extension = stress / mE * s.leMm();
        double energy = 0.5 * force * extension / 1000;
        return PropertyResult.determined("Welastic", energy, J, ReportedQuantity.ENERGY, rule,
                "½·Fp·(Fp/(mE·S0))·Le at " + at,
                Evidence.builder().put("atProperty", at).put("stressMPa", stress).put("forceN", force)
                        .put("elasticExtensionMm", extension).build(), null);
    }

    private List<StrainRateCheck> strainRates() {
        double tol = p.strainRateTolerancePercent();
        int elasticFirst = elastic.found() ? elastic.fit().firstIndex() : 0;
        int elasticLast;
        int hardeningFirst;
        if (reh != null) {
            elasticLast = reh.index();
            hardeningFirst = yieldRange.endIndex() >= 0 ? yieldRange.endIndex() : reh.index();
        } else if (firstProof != null) {
            elasticLast = firstProof.before();
            hardeningFirst = firstProof.after();
        } else {
            elasticLast = last;
            hardeningFirst = -1;
        }
        List<StrainRateCheck> out = new ArrayList<>();
        out.add(StrainRates.measure(c, StrainRatePhase.ELASTIC, elasticFirst, elasticLast, p.elasticStrainRatesPerS(), tol));
        if (reh == null) {
            out.add(StrainRateCheck.notAvailable(StrainRatePhase.YIELD, PropertyStatus.NOT_APPLICABLE,
                    "no yield range: " + yielding.name().toLowerCase() + " yielding"));
        } else {
            out.add(StrainRates.measure(c, StrainRatePhase.YIELD, reh.index(), yieldRange.endIndex(),
                    p.yieldStrainRatesPerS(), tol));
        }
        if (hardeningFirst < 0) {
            out.add(StrainRateCheck.notAvailable(StrainRatePhase.HARDENING, PropertyStatus.NOT_APPLICABLE,
                    "no plastic range before fracture"));
        } else {
            out.add(StrainRates.measure(c, StrainRatePhase.HARDENING, hardeningFirst, fmIndex,
                    p.hardeningStrainRatesPerS(), tol));
        }
        for (StrainRateCheck r : out) {
            if (Boolean.FALSE.equals(r.withinRange())) {
                warn("STRAIN_RATE_OUTSIDE_RANGE", r.phase() + " strain rate " + r.measuredPerS() + " s⁻¹ is outside "
                        + r.lowerPerS() + "–" + r.upperPerS() + " s⁻¹");
            }
        }
        return out;
    }

    private void warn(String code, String message) {
        warnings.add(new AnalysisWarning(code, message));
    }

    static String plain(double percent) {
        return BigDecimal.valueOf(percent).stripTrailingZeros().toPlainString();
    }

    private static String round4(double v) {
        return plain(Math.round(v * 1e4) / 1e4);
    }

    private static String round1(double v) {
        return plain(Math.round(v * 10) / 10.0);
    }
}
