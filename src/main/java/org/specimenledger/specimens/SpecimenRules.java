package org.specimenledger.specimens;

import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.specimenledger.shared.FieldIssue;
import org.specimenledger.shared.RuleViolation;

/**
 * Checks a specimen's geometry before it is stored and computes S0, L0 and Su with {@link CrossSection} and
 * {@link GaugeLength}. Every problem of the request is reported at once with a JSON Pointer into the body:
 * {@code /readings/d/1} for the second reading of d (indices from 0), {@code /readings/d} for the dimension,
 * {@code /gaugeLength/k}, {@code /lcMm} and so on. Geometry refused by the computation (a tube wall of half the
 * diameter, k = 5.65 below 15 mm) is reported after the request is otherwise well-formed.
 */
final class SpecimenRules {

    /** More readings than this of one dimension are a mistake of the client, not a measurement. */
    static final int MAX_READINGS = 50;
    private static final BigDecimal K_SHORT = new BigDecimal("5.65");
    private static final BigDecimal K_LONG = new BigDecimal("11.3");
    private static final Set<String> READING_SYMBOLS = Set.of("d", "a", "b", "D", "du", "au", "bu", "Du");

    private SpecimenRules() {
    }

    /**
     * The geometry to store, or a {@link RuleViolation} with every problem, including those already
     * {@code found} by the caller (unknown heat or order).
     */
    static Geometry checked(SpecimenRequests.SpecimenRequest r, List<FieldIssue> found) {
        List<FieldIssue> issues = new ArrayList<>(found);
        SpecimenShape shape = r.shape();
        List<Reading> readings = new ArrayList<>();
        Map<String, double[]> values = readings(shape, CrossSection.Stage.ORIGINAL, r.readings(), readings, issues);
        givenArea(shape, r.s0Mm2(), r.s0Method(), "/s0Mm2", "/s0Method", "S0", issues);
        SpecimenRequests.GaugeLengthRequest g = r.gaugeLength();
        if (g.basis() == GaugeLength.Basis.PROPORTIONAL) {
            if (g.k() == null) {
                issues.add(new FieldIssue("/gaugeLength/k", "a proportional gauge length needs k: 5.65 or 11.3"));
            } else if (g.k().compareTo(K_SHORT) != 0 && g.k().compareTo(K_LONG) != 0) {
                issues.add(new FieldIssue("/gaugeLength/k", "k must be 5.65 or 11.3 (ISO 6892-1 proportional test "
                        + "pieces), got " + g.k().toPlainString()));
            }
            if (g.l0Mm() != null) {
                issues.add(new FieldIssue("/gaugeLength/l0Mm", "l0Mm is for a FIXED gauge length; a proportional "
                        + "L0 is computed from k and S0"));
            }
        } else {
            finitePositive(g.l0Mm(), "/gaugeLength/l0Mm", "a fixed gauge length needs l0Mm", issues);
            if (g.k() != null || g.roundToFiveMm() != null) {
                issues.add(new FieldIssue(g.k() != null ? "/gaugeLength/k" : "/gaugeLength/roundToFiveMm",
                        "k and roundToFiveMm apply to a PROPORTIONAL gauge length only"));
            }
        }
        finitePositive(r.leMm(), "/leMm", "Le is required", issues);
        finitePositive(r.lcMm(), "/lcMm", "Lc is required", issues);
        throwIfAny(issues);

        CrossSection section;
        GaugeLength l0;
        try {
            section = shape.isMeasured() ? CrossSection.measured(shape, CrossSection.Stage.ORIGINAL, values)
                    : CrossSection.given(CrossSection.Stage.ORIGINAL, r.s0Mm2().doubleValue(), r.s0Method());
            l0 = g.basis() == GaugeLength.Basis.FIXED ? GaugeLength.fixed(g.l0Mm().doubleValue())
                    : GaugeLength.proportional(g.k().compareTo(K_SHORT) == 0 ? GaugeLength.K_SHORT : GaugeLength.K_LONG,
                            section.areaMm2(), g.roundToFiveMm() == null || g.roundToFiveMm());
        } catch (GeometryRefused e) {
            throw new RuleViolation(pointerOf(e, shape), e.getMessage());
        }
        BigDecimal usedL0 = BigDecimal.valueOf(l0.l0Mm());
        if (!ParallelLength.carriesGaugeLength(r.lcMm().doubleValue(), l0.l0Mm()) || r.lcMm().compareTo(usedL0) < 0) {
            throw new RuleViolation("/lcMm", "the parallel length Lc = " + r.lcMm().toPlainString()
                    + " mm is shorter than L0 = " + CrossSection.shown(l0.l0Mm()) + " mm: the gauge marks must lie "
                    + "on the parallel length (Lc ≥ L0)");
        }
        return new Geometry(shape, readings, section, shape.isMeasured() ? null : r.s0Method().trim(), l0, r.leMm(),
                r.lcMm());
    }

    /**
     * The after-fracture measurements to store for a piece of this shape, S0 and L0, or a
     * {@link RuleViolation} with every problem. Su above S0 is refused: a piece does not gain cross-section
     * by breaking, and Z = 100·(S0 − Su)/S0 would come out negative.
     */
    static FractureMeasurement afterFracture(SpecimenShape shape, BigDecimal s0Mm2, BigDecimal l0Mm,
            SpecimenRequests.AfterFractureRequest r) {
        List<FieldIssue> issues = new ArrayList<>();
        List<Reading> readings = new ArrayList<>();
        Map<String, double[]> values = readings(shape, CrossSection.Stage.AFTER_FRACTURE, r.readings(), readings,
                issues);
        givenArea(shape, r.suMm2(), r.suMethod(), "/suMm2", "/suMethod", "Su", issues);
        finitePositive(r.luMm(), "/luMm", "Lu is required", issues);
        FractureZone zone = r.fractureZone();
        BigDecimal distance = r.fractureDistanceMm();
        if (distance != null && Double.isFinite(distance.doubleValue()) && r.luMm() != null) {
            double x = distance.doubleValue();
            double halfLu = r.luMm().doubleValue() / 2.0;
            if (x > halfLu) {
                issues.add(new FieldIssue("/fractureDistanceMm", "the fracture cannot lie " + distance.toPlainString()
                        + " mm from the nearest gauge mark when Lu/2 is " + CrossSection.shown(halfLu) + " mm"));
            }
            // ISO 6892-1: at least L0/3 from the nearest gauge mark is inside the middle third
            FractureZone derived = x >= l0Mm.doubleValue() / 3.0 ? FractureZone.INSIDE_MIDDLE_THIRD
                    : FractureZone.OUTSIDE_MIDDLE_THIRD;
            if (zone != null && zone != derived) {
                issues.add(new FieldIssue("/fractureZone", "a fracture " + distance.toPlainString() + " mm from the "
                        + "nearest gauge mark is " + derived + " (L0/3 = " + CrossSection.shown(l0Mm.doubleValue() / 3.0)
                        + " mm), not " + zone));
            }
            zone = derived;
        } else if (distance != null && !Double.isFinite(distance.doubleValue())) {
            issues.add(new FieldIssue("/fractureDistanceMm", "must be a finite number of mm"));
        }
        throwIfAny(issues);

        CrossSection su;
        try {
            su = shape.isMeasured() ? CrossSection.measured(shape, CrossSection.Stage.AFTER_FRACTURE, values)
                    : CrossSection.given(CrossSection.Stage.AFTER_FRACTURE, r.suMm2().doubleValue(), r.suMethod());
        } catch (GeometryRefused e) {
            throw new RuleViolation(pointerOf(e, shape), e.getMessage());
        }
        if (BigDecimal.valueOf(su.areaMm2()).compareTo(s0Mm2) > 0) {
            throw new RuleViolation(shape.isMeasured() ? "/readings" : "/suMm2", "Su = "
                    + CrossSection.shown(su.areaMm2()) + " mm² is larger than S0 = "
                    + CrossSection.shown(s0Mm2.doubleValue()) + " mm²: a test piece does not gain cross-section by "
                    + "breaking (Su ≤ S0, else Z = 100·(S0 − Su)/S0 would be negative)");
        }
        return new FractureMeasurement(r.luMm(), readings, su, shape.isMeasured() ? null : r.suMethod().trim(),
                distance, zone);
    }

    /** Structural checks of the readings map; fills {@code out} in the shape's order and returns the doubles. */
    private static Map<String, double[]> readings(SpecimenShape shape, CrossSection.Stage stage,
            Map<String, List<BigDecimal>> given, List<Reading> out, List<FieldIssue> issues) {
        List<String> symbols = shape.dimensions(stage);
        Map<String, List<BigDecimal>> readings = given == null ? Map.of() : given;
        for (String symbol : readings.keySet()) {
            if (!symbols.contains(symbol)) {
                issues.add(new FieldIssue("/readings/" + escape(symbol), shape.isMeasured()
                        ? "a " + shape + " test piece has no dimension '" + symbol + "'; give "
                                + String.join(" and ", symbols)
                        : "an OTHER test piece has no readings; give " + stage.areaSymbol() + " directly with its "
                                + "method"));
            }
        }
        Map<String, double[]> values = new LinkedHashMap<>();
        for (String symbol : symbols) {
            List<BigDecimal> list = readings.get(symbol);
            String at = "/readings/" + symbol;
            if (list == null || list.isEmpty()) {
                issues.add(new FieldIssue(at, "at least one reading of " + symbol + " is required (mm)"));
                continue;
            }
            if (list.size() > MAX_READINGS) {
                issues.add(new FieldIssue(at, "at most " + MAX_READINGS + " readings of " + symbol + ", got "
                        + list.size()));
                continue;
            }
            double[] doubles = new double[list.size()];
            for (int i = 0; i < list.size(); i++) {
                BigDecimal v = list.get(i);
                if (v == null) {
                    issues.add(new FieldIssue(at + "/" + i, "a reading is required"));
                    continue;
                }
                doubles[i] = v.doubleValue();
                if (!Double.isFinite(doubles[i]) || doubles[i] <= 0) {
                    issues.add(new FieldIssue(at + "/" + i, "reading " + i + " of " + symbol + " must be a positive "
                            + "finite number of mm, got " + v.toPlainString()));
                }
                out.add(new Reading(symbol, v));
            }
            values.put(symbol, doubles);
        }
        return values;
    }

    private static void givenArea(SpecimenShape shape, BigDecimal area, String method, String areaPointer,
            String methodPointer, String symbol, List<FieldIssue> issues) {
        if (shape.isMeasured()) {
            if (area != null) {
                issues.add(new FieldIssue(areaPointer, symbol + " is computed from the readings of a " + shape
                        + " test piece; give it directly only for OTHER"));
            }
            if (method != null) {
                issues.add(new FieldIssue(methodPointer, "a method is given only with a directly given " + symbol));
            }
            return;
        }
        finitePositive(area, areaPointer, "an OTHER test piece needs " + symbol + " given directly in mm²", issues);
        if (method == null || method.isBlank()) {
            issues.add(new FieldIssue(methodPointer, "say how " + symbol + " was determined"));
        }
    }

    private static void finitePositive(BigDecimal value, String pointer, String missing, List<FieldIssue> issues) {
        if (value == null) {
            issues.add(new FieldIssue(pointer, missing));
        } else if (!Double.isFinite(value.doubleValue()) || value.doubleValue() <= 0) {
            issues.add(new FieldIssue(pointer, "must be a positive finite number, got " + value.toPlainString()));
        }
    }

    private static String pointerOf(GeometryRefused e, SpecimenShape shape) {
        String symbol = e.symbol();
        if (READING_SYMBOLS.contains(symbol)) {
            return "/readings/" + symbol + (e.index() == null ? "" : "/" + e.index());
        }
        return switch (symbol) {
            case "k" -> "/gaugeLength/k";
            case "L0" -> "/gaugeLength/l0Mm";
            // an unusable area from measured readings is the readings' fault
            case "Su" -> shape.isMeasured() ? "/readings" : "/suMm2";
            default -> shape.isMeasured() ? "/readings" : "/s0Mm2";
        };
    }

    private static void throwIfAny(List<FieldIssue> issues) {
        if (!issues.isEmpty()) {
            throw new RuleViolation(issues);
        }
    }

    /** JSON Pointer escaping of one reference token (RFC 6901 §3). */
    private static String escape(String token) {
        return String.valueOf(token).replace("~", "~0").replace("/", "~1");
    }
}
