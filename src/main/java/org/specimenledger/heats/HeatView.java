package org.specimenledger.heats;

import java.math.BigDecimal;
import java.time.Instant;
import java.util.Map;
import java.util.UUID;

/**
 * A heat as the API returns it and as the ledger records it.
 *
 * @param composition element symbol → mass %, in order of atomic number (C, Si, P, S, Cr, Mn, ...)
 */
public record HeatView(UUID id, String heatNumber, String producer, String grade, ProductForm productForm,
        BigDecimal nominalThicknessMm, Map<String, BigDecimal> composition, Instant createdAt) {

    static HeatView of(Heat h) {
        return new HeatView(h.id(), h.heatNumber(), h.producer(), h.grade(), h.productForm(), h.nominalThicknessMm(),
                ChemicalElements.inAtomicOrder(h.composition()), h.createdAt());
    }
}
