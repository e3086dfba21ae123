package org.specimenledger.equipment;

import jakarta.persistence.Column;
import jakarta.persistence.Embeddable;
import java.math.BigDecimal;
import java.util.UUID;

/**
 * The ISO 7500-1 class one force range obtained in a calibration. {@code instrumentId} is kept beside
 * the range so that the database can refuse to remove a range a calibration refers to.
 */
@Embeddable
record RangeClass(
        @Column(name = "instrument_id", nullable = false) UUID instrumentId,
        @Column(name = "range_n", nullable = false) BigDecimal rangeN,
        @Column(name = "accuracy_class", nullable = false) String accuracyClass) {
}
