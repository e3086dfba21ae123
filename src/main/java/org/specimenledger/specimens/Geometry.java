package org.specimenledger.specimens;

import java.math.BigDecimal;
import java.util.List;

/**
 * A test piece's checked register geometry, ready to store: readings as given, the computed cross-section
 * and gauge length, Le and Lc.
 */
record Geometry(SpecimenShape shape, List<Reading> readings, CrossSection crossSection, String s0Method,
        GaugeLength gaugeLength, BigDecimal leMm, BigDecimal lcMm) {
}
