package org.specimenledger.specimens;

import java.math.BigDecimal;
import java.util.List;

/** Checked after-fracture measurements, ready to store: Lu, the readings for Su, Su, and the fracture position. */
record FractureMeasurement(BigDecimal luMm, List<Reading> readings, CrossSection crossSection, String suMethod,
        BigDecimal fractureDistanceMm, FractureZone fractureZone) {
}
