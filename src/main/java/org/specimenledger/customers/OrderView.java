package org.specimenledger.customers;

import java.math.BigDecimal;
import java.time.Instant;
import java.time.LocalDate;
import java.util.List;
import java.util.UUID;
import org.specimenledger.analysis.units.ReportingUnits;

/** An order as the API returns it and as the ledger records it. */
public record OrderView(UUID id, UUID customerId, String purchaseOrder, String materialSpecification,
        LocalDate receivedOn, List<RequirementView> requirements, Instant createdAt, ReportingUnits reportingUnits) {

    /**
     * One requirement: property symbol (ISO 6892-1, e.g. {@code ReH}, {@code Rm}, {@code A}, {@code Z}),
     * limits in {@code unit}, and the nominal thickness range in mm it applies to (open when null).
     */
    public record RequirementView(String property, BigDecimal min, BigDecimal max, String unit,
            BigDecimal thicknessMinMm, BigDecimal thicknessMaxMm) {

        /** @return the lower limit in the unit results are stored in (MPa, N, %, J), or null */
        public BigDecimal minInStoredUnit() {
            return min == null ? null : RequirementUnit.toStored(min, unit);
        }

        /** @return the upper limit in the unit results are stored in (MPa, N, %, J), or null */
        public BigDecimal maxInStoredUnit() {
            return max == null ? null : RequirementUnit.toStored(max, unit);
        }

        /** @return a stored result (MPa, N, %, J) in this requirement's unit, for comparing with its limits */
        public BigDecimal inRequirementUnit(BigDecimal stored) {
            return RequirementUnit.fromStored(stored, unit);
        }
    }

    static OrderView of(CustomerOrder o) {
        return new OrderView(o.id(), o.customerId(), o.purchaseOrder(), o.materialSpecification(), o.receivedOn(),
                o.requirements().stream().map(r -> new RequirementView(r.property(), r.min(), r.max(), r.unit(),
                        r.thicknessMinMm(), r.thicknessMaxMm())).toList(),
                o.createdAt(), o.reportingUnits());
    }
}
