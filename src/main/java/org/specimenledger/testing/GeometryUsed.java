package org.specimenledger.testing;

import java.math.BigDecimal;
import java.util.UUID;
import org.specimenledger.analysis.TensileSpecimen;
import org.specimenledger.specimens.SpecimenView;

/**
 * The specimen geometry an analysis used, as the specimen register gave it at that moment (lengths in mm,
 * areas in mm²; Lu, Su and the fracture position null until measured on the broken pieces).
 */
public record GeometryUsed(UUID specimenId, String labIdentifier, String shape, BigDecimal s0Mm2, BigDecimal leMm,
        BigDecimal l0Mm, BigDecimal luMm, BigDecimal suMm2, BigDecimal fractureDistanceMm, String fractureZone) {

    static GeometryUsed of(SpecimenView s) {
        SpecimenView.AfterFractureView after = s.afterFracture();
        return new GeometryUsed(s.id(), s.labIdentifier(), s.shape().name(), s.s0Mm2(), s.leMm(), s.l0Mm(),
                s.luMm(), s.suMm2(), after == null ? null : after.fractureDistanceMm(),
                after == null || after.fractureZone() == null ? null : after.fractureZone().name());
    }

    /** The engine's input: the doubles nearest to the stored decimals. */
    TensileSpecimen tensileSpecimen() {
        return new TensileSpecimen(s0Mm2.doubleValue(), leMm.doubleValue(), l0Mm.doubleValue(),
                luMm == null ? null : luMm.doubleValue(), suMm2 == null ? null : suMm2.doubleValue());
    }
}
