package org.specimenledger.analysis;

import java.util.ArrayList;
import java.util.List;

/**
 * Control rates per test phase.
 *
 * <p>ISO 6892-1 method A [M, DOMAIN.md] ({@link #measure}, run by the engine): the least-squares slope of
 * strain (ΔL/Le, extensometer) on time over the phase's points, compared with each allowed nominal rate ±
 * the tolerance; the nearest allowed rate is reported.
 *
 * <p>ISO 6892-1 method B and ASTM E8/E8M ({@link #isoMethodB}, {@link #astmE8}): over the same phases as the
 * method A checks found, the stress rate (slope of F/S0 on time) or the strain rate is compared with the
 * ranges of {@link #ISO_B_ELASTIC_LOW_MODULUS} and the constants beside it. The rules and their marks:
 * <ul>
 * <li>ISO 6892-1 method B, elastic range, stress rate: 2–20 MPa/s for E &lt; 150 GPa, 6–60 MPa/s for
 *     E ≥ 150 GPa [S: ISO 6892-1:2009 Table 3].
 * <li>ISO 6892-1 method B, plastic range for ReL: strain rate 0.00025–0.0025 s⁻¹ [M].
 * <li>ISO 6892-1 method B, for Rm (and Ag, A, Z): strain rate not above 0.008 s⁻¹ [M].
 * <li>ASTM E8/E8M, up to yield: rate of stressing 1.15–11.5 MPa/s (10 000–100 000 psi/min) [M], or rate of
 *     straining 0.015 ± 0.006 min⁻¹ (0.00015–0.00035 s⁻¹) [M]; either control satisfies the standard.
 * <li>ASTM E8/E8M, after yield for the tensile strength: strain rate 0.05–0.5 min⁻¹ (0.000833–0.00833 s⁻¹)
 *     [M].
 * </ul>
 * Pure and deterministic: the same arrays give the same checks.
 */
public final class StrainRates {

    /** ISO 6892-1 method B, elastic range, E below 150 GPa [S: ISO 6892-1:2009 Table 3]. */
    public static final ControlRateRule ISO_B_ELASTIC_LOW_MODULUS = new ControlRateRule(
            "ISO 6892-1 method B, elastic range (E < 150 GPa)", StrainRatePhase.ELASTIC,
            ControlRateRule.Quantity.STRESS_RATE, 2, 20, "ISO 6892-1:2009 Table 3 [S]");
    /** ISO 6892-1 method B, elastic range, E at or above 150 GPa [S: ISO 6892-1:2009 Table 3]. */
    public static final ControlRateRule ISO_B_ELASTIC_HIGH_MODULUS = new ControlRateRule(
            "ISO 6892-1 method B, elastic range (E ≥ 150 GPa)", StrainRatePhase.ELASTIC,
            ControlRateRule.Quantity.STRESS_RATE, 6, 60, "ISO 6892-1:2009 Table 3 [S]");
    /** ISO 6892-1 method B, yield range for ReL [M]. */
    public static final ControlRateRule ISO_B_YIELD = new ControlRateRule("ISO 6892-1 method B, plastic range (ReL)",
            StrainRatePhase.YIELD, ControlRateRule.Quantity.STRAIN_RATE, 0.00025, 0.0025, "ISO 6892-1 method B [M]");
    /** ISO 6892-1 method B, from yield to Fm [M]. */
    public static final ControlRateRule ISO_B_HARDENING = new ControlRateRule("ISO 6892-1 method B, for Rm",
            StrainRatePhase.HARDENING, ControlRateRule.Quantity.STRAIN_RATE, 0, 0.008, "ISO 6892-1 method B [M]");
    /** ASTM E8/E8M, rate of stressing up to yield [M]. */
    public static final ControlRateRule ASTM_YIELD_STRESSING = new ControlRateRule(
            "ASTM E8/E8M, up to yield (rate of stressing)", StrainRatePhase.ELASTIC,
            ControlRateRule.Quantity.STRESS_RATE, 1.15, 11.5, "ASTM E8/E8M yield determination [M]");
    /** ASTM E8/E8M, rate of straining up to yield, 0.015 ± 0.006 min⁻¹ [M]. */
    public static final ControlRateRule ASTM_YIELD_STRAINING = new ControlRateRule(
            "ASTM E8/E8M, up to yield (rate of straining)", StrainRatePhase.ELASTIC,
            ControlRateRule.Quantity.STRAIN_RATE, 0.009 / 60, 0.021 / 60, "ASTM E8/E8M yield determination [M]");
    /** ASTM E8/E8M, after yield for the tensile strength, 0.05–0.5 min⁻¹ [M]. */
    public static final ControlRateRule ASTM_TENSILE_STRENGTH = new ControlRateRule(
            "ASTM E8/E8M, tensile strength", StrainRatePhase.HARDENING, ControlRateRule.Quantity.STRAIN_RATE,
            0.05 / 60, 0.5 / 60, "ASTM E8/E8M tensile strength determination [M]");

    /** Below this modulus the lower ISO 6892-1 method B elastic stress-rate range applies, MPa [S: Table 3]. */
    public static final double ISO_B_MODULUS_LIMIT_MPA = 150_000;

    private StrainRates() {
    }

    /**
     * The ISO 6892-1 method B checks of a record, over the phases the engine's method A checks found.
     *
     * @param timeS time in s (null: every check NOT_DETERMINABLE)
     * @param forceN force in N
     * @param s0Mm2 original cross-section S0 in mm², &gt; 0
     * @param modulusMPa E in MPa, or NaN when not determined (the elastic check is then NOT_DETERMINABLE)
     * @param elasticFit first and last index of the modulus fit window (the linear elastic part, where the
     *     stress rate is measured), or null to use the whole elastic phase up to ReH or Rp
     * @param phases the engine's strain-rate checks, one per {@link StrainRatePhase} (their indices and
     *     measured strain rates are used)
     * @return elastic, yield and hardening checks in that order
     */
    public static List<ControlRateCheck> isoMethodB(double[] timeS, double[] forceN, double s0Mm2, double modulusMPa,
            int[] elasticFit, List<StrainRateCheck> phases) {
        return isoMethodB(timeS, forceN, s0Mm2, modulusMPa, elasticFit, phases, ControlRateRules.defaults());
    }

    /** As {@link #isoMethodB(double[], double[], double, double, int[], List)} against the given rules. */
    public static List<ControlRateCheck> isoMethodB(double[] timeS, double[] forceN, double s0Mm2, double modulusMPa,
            int[] elasticFit, List<StrainRateCheck> phases, ControlRateRules rules) {
        List<ControlRateCheck> out = new ArrayList<>();
        StrainRateCheck elastic = phase(phases, StrainRatePhase.ELASTIC);
        if (!Double.isFinite(modulusMPa)) {
            out.add(new ControlRateCheck(rules.isoBElasticHighModulus(), PropertyStatus.NOT_DETERMINABLE, Double.NaN, null,
                    elastic.firstIndex(), elastic.lastIndex(),
                    "E was not determined, and the method B elastic range depends on it"));
        } else {
            out.add(stress(modulusMPa < ISO_B_MODULUS_LIMIT_MPA ? rules.isoBElasticLowModulus()
                            : rules.isoBElasticHighModulus(),
                    timeS, forceN, s0Mm2, elastic, elasticFit));
        }
        out.add(strain(rules.isoBYield(), phase(phases, StrainRatePhase.YIELD)));
        out.add(strain(rules.isoBHardening(), phase(phases, StrainRatePhase.HARDENING)));
        return List.copyOf(out);
    }

    /**
     * The ASTM E8/E8M checks of a record: rate of stressing and rate of straining up to yield (either one in
     * range satisfies the standard), and the strain rate for the tensile strength.
     *
     * @see #isoMethodB for the parameters
     */
    public static List<ControlRateCheck> astmE8(double[] timeS, double[] forceN, double s0Mm2, int[] elasticFit,
            List<StrainRateCheck> phases) {
        return astmE8(timeS, forceN, s0Mm2, elasticFit, phases, ControlRateRules.defaults());
    }

    /** As {@link #astmE8(double[], double[], double, int[], List)} against the given rules. */
    public static List<ControlRateCheck> astmE8(double[] timeS, double[] forceN, double s0Mm2, int[] elasticFit,
            List<StrainRateCheck> phases, ControlRateRules rules) {
        StrainRateCheck elastic = phase(phases, StrainRatePhase.ELASTIC);
        return List.of(stress(rules.astmYieldStressing(), timeS, forceN, s0Mm2, elastic, elasticFit),
                strain(rules.astmYieldStraining(), elastic),
                strain(rules.astmTensileStrength(), phase(phases, StrainRatePhase.HARDENING)));
    }

    private static StrainRateCheck phase(List<StrainRateCheck> phases, StrainRatePhase phase) {
        for (StrainRateCheck c : phases) {
            if (c.phase() == phase) {
                return c;
            }
        }
        return StrainRateCheck.notAvailable(phase, PropertyStatus.NOT_DETERMINABLE, "phase not checked");
    }

    /** A strain-rate rule over a phase whose strain rate the method A check already measured. */
    private static ControlRateCheck strain(ControlRateRule rule, StrainRateCheck phase) {
        if (phase.status() != PropertyStatus.DETERMINED) {
            return new ControlRateCheck(rule, phase.status(), Double.NaN, null, phase.firstIndex(), phase.lastIndex(),
                    phase.reason());
        }
        double rate = phase.measuredPerS();
        return new ControlRateCheck(rule, PropertyStatus.DETERMINED, rate, rate >= rule.lower() && rate <= rule.upper(),
                phase.firstIndex(), phase.lastIndex(), null);
    }

    /**
     * A stress-rate rule: least-squares slope of F/S0 on time over the linear elastic part (the modulus fit
     * window) when given, else over the phase's points. Measured up to Rp on a continuously yielding curve the
     * slope would mix in the bend of the curve, which the controlled rate of stressing does not include.
     */
    private static ControlRateCheck stress(ControlRateRule rule, double[] time, double[] force, double s0,
            StrainRateCheck phase, int[] window) {
        if (phase.status() != PropertyStatus.DETERMINED || time == null) {
            return new ControlRateCheck(rule, phase.status() == PropertyStatus.DETERMINED
                    ? PropertyStatus.NOT_DETERMINABLE : phase.status(), Double.NaN, null, phase.firstIndex(),
                    phase.lastIndex(), time == null ? "no time channel in the record" : phase.reason());
        }
        int first = phase.firstIndex();
        int last = phase.lastIndex();
        if (window != null && window.length == 2 && window[0] >= 0 && window[1] - window[0] >= 2
                && window[1] < time.length) {
            first = window[0];
            last = window[1];
        }
        if (!(time[last] > time[first])) {
            return new ControlRateCheck(rule, PropertyStatus.NOT_DETERMINABLE, Double.NaN, null, first, last,
                    "time does not advance over the elastic part");
        }
        double rate = slope(time, force, first, last) / s0;
        return new ControlRateCheck(rule, PropertyStatus.DETERMINED, rate, rate >= rule.lower() && rate <= rule.upper(),
                first, last, null);
    }

    /** Least-squares slope of y on x over [first, last], centred for accuracy (two passes). */
    static double slope(double[] x, double[] y, int first, int last) {
        int n = last - first + 1;
        double mx = 0;
        double my = 0;
        for (int i = first; i <= last; i++) {
            mx += x[i];
            my += y[i];
        }
        mx /= n;
        my /= n;
        double sxy = 0;
        double sxx = 0;
        for (int i = first; i <= last; i++) {
            double dx = x[i] - mx;
            sxy += dx * (y[i] - my);
            sxx += dx * dx;
        }
        return sxy / sxx;
    }

    static StrainRateCheck measure(CurveArrays c, StrainRatePhase phase, int first, int last, List<Double> allowed,
            double tolerancePercent) {
        if (c.time == null) {
            return StrainRateCheck.notAvailable(phase, PropertyStatus.NOT_DETERMINABLE, "no time channel in the record");
        }
        if (first < 0 || last - first + 1 < 3) {
            return StrainRateCheck.notAvailable(phase, PropertyStatus.NOT_DETERMINABLE,
                    "fewer than 3 points in the " + phase.name().toLowerCase() + " phase");
        }
        if (!(c.time[last] > c.time[first])) {
            return StrainRateCheck.notAvailable(phase, PropertyStatus.NOT_DETERMINABLE,
                    "time does not advance over the " + phase.name().toLowerCase() + " phase");
        }
        double rate = StraightLineFit.of(c.time, c.strain, first, last).slope();
        double tol = tolerancePercent / 100;
        double nominal = allowed.get(0);
        if (rate > 0) {
            for (double r : allowed) {
                if (Math.abs(Math.log(rate / r)) < Math.abs(Math.log(rate / nominal))) {
                    nominal = r;
                }
            }
        }
        double lower = nominal * (1 - tol);
        double upper = nominal * (1 + tol);
        boolean within = rate >= lower && rate <= upper;
        return new StrainRateCheck(phase, PropertyStatus.DETERMINED, rate, nominal, lower, upper, within, first, last,
                null);
    }
}
