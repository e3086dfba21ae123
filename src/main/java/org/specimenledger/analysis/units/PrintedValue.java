package org.specimenledger.analysis.units;

/**
 * A value as printed: the rounded digits and the unit symbol, e.g. {@code 52.3 ksi}.
 *
 * @param digits the rounded value as a plain decimal string
 * @param unit the unit symbol
 * @param system the unit system it is printed in
 */
public record PrintedValue(String digits, String unit, UnitSystem system) {

    /** @return digits and unit separated by a space; a percentage is printed without the space */
    public String text() {
        return unit.equals("%") ? digits + " %" : digits + " " + unit;
    }
}
