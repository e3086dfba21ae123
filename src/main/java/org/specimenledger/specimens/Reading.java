package org.specimenledger.specimens;

import jakarta.persistence.Column;
import jakarta.persistence.Embeddable;
import java.math.BigDecimal;

/** One reading of one dimension, in mm, with the digits as the technician gave them. */
@Embeddable
record Reading(
        @Column(name = "dimension", nullable = false) String dimension,
        @Column(name = "value_mm", nullable = false) BigDecimal valueMm) {
}
