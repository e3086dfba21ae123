package org.specimenledger.certificates;

import java.math.BigDecimal;
import java.math.RoundingMode;
import java.util.Optional;
import java.util.regex.Pattern;
import org.specimenledger.analysis.RoundingRule;
import org.specimenledger.analysis.units.PrintedQuantity;
import org.specimenledger.analysis.units.ReportingUnits;
import org.specimenledger.analysis.units.UnitPrinter;
import org.specimenledger.analysis.units.UnitSystem;
import org.specimenledger.customers.RequirementUnit;

/**
 * A certificate line's value in the units the order asks for, and in a requirement's own unit for its
 * verdict. Lines keep the SI value, its rounded SI text and the rounding rule as the analysis stored them;
 * everything here is derived from those three, so the stored record never changes with the printed units.
 */
final class LineUnits {

    private static final Pattern STRENGTH = Pattern.compile("ReH|ReL|Rm|Rp\\d+(\\.\\d+)?|Rt\\d+(\\.\\d+)?");

    private LineUnits() {
    }

    /** The printed value and unit of a determined line, e.g. ("356 (51.7)", "MPa (ksi)") for both systems. */
    record Printed(String value, String unit) {
    }

    static Printed printed(CertificateLine l, ReportingUnits units) {
        Optional<PrintedQuantity> q = quantity(l.property(), l.unit());
        if (units == ReportingUnits.SI || q.isEmpty() || q.get().dimensionless() || l.value() == null) {
            return new Printed(l.reported(), l.unit());
        }
        String customary = UnitPrinter.print(l.value(), q.get(), UnitSystem.US_CUSTOMARY, rule(l.rounding())).digits();
        String customaryUnit = q.get().unit(UnitSystem.US_CUSTOMARY);
        if (units == ReportingUnits.US_CUSTOMARY) {
            return new Printed(customary, customaryUnit);
        }
        return new Printed(l.reported() + " (" + customary + ")", l.unit() + " (" + customaryUnit + ")");
    }

    /**
     * A determined result in a requirement's unit, for comparing with limits written in that unit: the value at
     * full precision and the reported (rounded) text as it would be printed in that unit.
     *
     * @return empty when the units cannot be converted into each other
     */
    static Optional<InUnit> inRequirementUnit(String property, double value, String reported, Double expanded,
            String storedUnit, String requirementUnit, String rounding) {
        Optional<PrintedQuantity> q = quantity(property, storedUnit);
        if (q.isEmpty() || !RequirementUnit.known(requirementUnit) || q.get().dimensionless()
                || !fits(q.get(), requirementUnit)) {
            return Optional.empty();
        }
        BigDecimal converted = RequirementUnit.fromStored(BigDecimal.valueOf(value), requirementUnit);
        BigDecimal u = expanded == null ? null : RequirementUnit.fromStored(BigDecimal.valueOf(expanded), requirementUnit);
        String shown = switch (requirementUnit) {
            // printed as the order's customary column prints them
            case "ksi", "lbf" -> UnitPrinter.print(value, q.get(), UnitSystem.US_CUSTOMARY, rule(rounding)).digits();
            // whole-lbf print over 1000, so a kip limit meets the same rounding as an lbf one
            case "kip" -> new BigDecimal(UnitPrinter.print(value, q.get(), UnitSystem.US_CUSTOMARY, rule(rounding))
                    .digits()).movePointLeft(3).toPlainString();
            // SI prefixes: the reported SI digits scaled exactly
            default -> RequirementUnit.fromStored(new BigDecimal(reported), requirementUnit).stripTrailingZeros()
                    .toPlainString();
        };
        return Optional.of(new InUnit(converted.doubleValue(), new BigDecimal(shown), u));
    }

    record InUnit(double value, BigDecimal reported, BigDecimal expandedUncertainty) {
    }

    private static boolean fits(PrintedQuantity q, String unit) {
        return switch (q) {
            case STRENGTH -> unit.equals("MPa") || unit.equals("ksi");
            case MODULUS -> unit.equals("MPa") || unit.equals("GPa") || unit.equals("ksi");
            case FORCE -> unit.equals("N") || unit.equals("kN") || unit.equals("lbf") || unit.equals("kip");
            default -> false;
        };
    }

    private static Optional<PrintedQuantity> quantity(String property, String storedUnit) {
        if (STRENGTH.matcher(property).matches() && "MPa".equals(storedUnit)) {
            return Optional.of(PrintedQuantity.STRENGTH);
        }
        if (property.equals("E") && "MPa".equals(storedUnit)) {
            return Optional.of(PrintedQuantity.MODULUS);
        }
        if (property.equals("Fm") && "N".equals(storedUnit)) {
            return Optional.of(PrintedQuantity.FORCE);
        }
        if ("%".equals(storedUnit)) {
            return Optional.of(PrintedQuantity.ELONGATION);
        }
        if ("J".equals(storedUnit)) {
            return Optional.of(PrintedQuantity.ENERGY);
        }
        return Optional.empty();
    }

    private static RoundingRule rule(String rounding) {
        return "ASTM_PRACTICE".equals(rounding) ? RoundingRule.ASTM_PRACTICE : RoundingRule.ISO_6892_1;
    }

    /** Specimen geometry in the order's units: S0 and L0 as "78.54 mm²" or "0.1217 in²", or both. */
    static String length(BigDecimal mm, int siScale, ReportingUnits units) {
        return dimension(mm, siScale, PrintedQuantity.LENGTH, units);
    }

    static String area(BigDecimal mm2, int siScale, ReportingUnits units) {
        return dimension(mm2, siScale, PrintedQuantity.AREA, units);
    }

    private static String dimension(BigDecimal si, int siScale, PrintedQuantity q, ReportingUnits units) {
        if (si == null) {
            return "–";
        }
        String siText = si.setScale(siScale, RoundingMode.HALF_EVEN).toPlainString() + " " + q.unit(UnitSystem.SI);
        if (units == ReportingUnits.SI) {
            return siText;
        }
        String us = UnitPrinter.print(si.doubleValue(), q, UnitSystem.US_CUSTOMARY, RoundingRule.ISO_6892_1).text();
        return units == ReportingUnits.US_CUSTOMARY ? us : siText + " (" + us + ")";
    }
}
