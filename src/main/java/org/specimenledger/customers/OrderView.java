package org.specimenledger.customers;

import java.math.BigDecimal;
import java.time.Instant;
import java.time.LocalDate;
import java.util.List;
import java.util.UUID;

/** An order as the API returns it and as the ledger records it. */
public record OrderView(UUID id, UUID customerId, String purchaseOrder, String materialSpecification,
        LocalDate receivedOn, List<RequirementView> requirements, Instant createdAt) {

    /**
     * One requirement: property symbol (ISO 6892-1, e.g. {@code ReH}, {@code Rm}, {@code A}, {@code Z}),
     * limits in {@code unit}, and the nominal thickness range in mm it applies to (open when null).
     */
    public record RequirementView(String property, BigDecimal min, BigDecimal max, String unit,
            BigDecimal thicknessMinMm, BigDecimal thicknessMaxMm) {
    }

    static OrderView of(CustomerOrder o) {
        return new OrderView(o.id(), o.customerId(), o.purchaseOrder(), o.materialSpecification(), o.receivedOn(),
                o.requirements().stream().map(r -> new RequirementView(r.property(), r.min(), r.max(), r.unit(),
                        r.thicknessMinMm(), r.thicknessMaxMm())).toList(),
                o.createdAt());
    }
}
