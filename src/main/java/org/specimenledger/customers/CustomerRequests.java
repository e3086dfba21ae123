package org.specimenledger.customers;

import jakarta.validation.Valid;
import jakarta.validation.constraints.NotBlank;
import jakarta.validation.constraints.NotNull;
import jakarta.validation.constraints.PositiveOrZero;
import jakarta.validation.constraints.Size;
import java.math.BigDecimal;
import java.time.LocalDate;
import java.util.List;
import org.specimenledger.analysis.units.ReportingUnits;

/** Request bodies of the customers feature. A {@code reason} is required when changing a record. */
public final class CustomerRequests {

    private CustomerRequests() {
    }

    public record CustomerRequest(
            @NotBlank @Size(max = 200) String name,
            @NotBlank @Size(max = 1000) String address,
            @Size(max = 2000) String reason) {
    }

    public record RequirementRequest(
            @NotBlank @Size(max = 20) String property,
            BigDecimal min,
            BigDecimal max,
            @NotBlank @Size(max = 10) String unit,
            @PositiveOrZero BigDecimal thicknessMinMm,
            @PositiveOrZero BigDecimal thicknessMaxMm) {
    }

    /**
     * An order. {@code reportingUnits} chooses the unit systems its certificates print (SI when absent);
     * requirement limits may be given in ksi, lbf or kip too, and are compared in SI.
     */
    public record OrderRequest(
            @NotBlank @Size(max = 100) String purchaseOrder,
            @NotBlank @Size(max = 300) String materialSpecification,
            LocalDate receivedOn,
            @NotNull @Size(max = 100) List<@NotNull @Valid RequirementRequest> requirements,
            @Size(max = 2000) String reason,
            ReportingUnits reportingUnits) {

        /** An order printed in SI. */
        public OrderRequest(String purchaseOrder, String materialSpecification, LocalDate receivedOn,
                List<RequirementRequest> requirements, String reason) {
            this(purchaseOrder, materialSpecification, receivedOn, requirements, reason, null);
        }

        /** @return the chosen unit systems, SI when none was given */
        public ReportingUnits reportingUnitsOrDefault() {
            return reportingUnits == null ? ReportingUnits.SI : reportingUnits;
        }
    }
}
