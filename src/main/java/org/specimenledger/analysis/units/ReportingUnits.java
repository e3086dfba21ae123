package org.specimenledger.analysis.units;

import java.util.List;

/** Which unit systems a report prints, as chosen on the customer order. Stored values are always SI. */
public enum ReportingUnits {
    /** MPa, N, mm, mm², J. */
    SI(List.of(UnitSystem.SI)),
    /** ksi, lbf, in, in², ft·lbf (ASTM practice) instead of SI. */
    US_CUSTOMARY(List.of(UnitSystem.US_CUSTOMARY)),
    /** SI first, US customary beside it. */
    SI_AND_US_CUSTOMARY(List.of(UnitSystem.SI, UnitSystem.US_CUSTOMARY));

    private final List<UnitSystem> printed;

    ReportingUnits(List<UnitSystem> printed) {
        this.printed = printed;
    }

    /** @return the unit systems printed, in order (the first is the primary column) */
    public List<UnitSystem> printed() {
        return printed;
    }
}
