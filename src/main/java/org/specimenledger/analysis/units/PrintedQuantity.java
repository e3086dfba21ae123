package org.specimenledger.analysis.units;

/**
 * What a printed value is, which fixes its SI unit, its US customary unit and how it is rounded. The
 * strength, modulus, force, elongation and energy kinds mirror the analysis results; the dimension kinds
 * are the specimen geometry printed beside them.
 */
public enum PrintedQuantity {
    /** ReH, ReL, Rp, Rt, Rm: MPa or ksi. */
    STRENGTH("MPa", "ksi"),
    /** E: MPa or ksi. */
    MODULUS("MPa", "ksi"),
    /** Fm: N or lbf. */
    FORCE("N", "lbf"),
    /** Ae: % in both systems. */
    YIELD_POINT_EXTENSION("%", "%"),
    /** Ag, Agt, A, At: % in both systems. */
    ELONGATION("%", "%"),
    /** Z: % in both systems. */
    REDUCTION_OF_AREA("%", "%"),
    /** W and cyclic energies: J or ft·lbf. */
    ENERGY("J", "ft·lbf"),
    /** Gauge length, thickness, width, diameter: mm or in. */
    LENGTH("mm", "in"),
    /** S0: mm² or in². */
    AREA("mm²", "in²");

    private final String siUnit;
    private final String customaryUnit;

    PrintedQuantity(String siUnit, String customaryUnit) {
        this.siUnit = siUnit;
        this.customaryUnit = customaryUnit;
    }

    /** @return the unit symbol printed in the given system */
    public String unit(UnitSystem system) {
        return system == UnitSystem.SI ? siUnit : customaryUnit;
    }

    /** @return true when the value has no unit to convert (a percentage) */
    public boolean dimensionless() {
        return siUnit.equals("%");
    }
}
