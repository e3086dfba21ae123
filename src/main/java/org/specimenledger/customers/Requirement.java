package org.specimenledger.customers;

import jakarta.persistence.Column;
import jakarta.persistence.Embeddable;
import java.math.BigDecimal;

/**
 * What the material specification demands of one property, optionally only for products whose
 * nominal thickness lies in [thicknessMinMm, thicknessMaxMm].
 */
@Embeddable
record Requirement(
        @Column(name = "property", nullable = false) String property,
        @Column(name = "min_value") BigDecimal min,
        @Column(name = "max_value") BigDecimal max,
        @Column(name = "unit", nullable = false) String unit,
        @Column(name = "thickness_min_mm") BigDecimal thicknessMinMm,
        @Column(name = "thickness_max_mm") BigDecimal thicknessMaxMm) {
}
