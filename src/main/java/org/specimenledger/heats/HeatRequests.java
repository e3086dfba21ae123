package org.specimenledger.heats;

import jakarta.validation.constraints.NotBlank;
import jakarta.validation.constraints.NotNull;
import jakarta.validation.constraints.Positive;
import jakarta.validation.constraints.Size;
import java.math.BigDecimal;
import java.util.Map;

/** Request bodies of the heats feature. A {@code reason} is required when changing a heat. */
public final class HeatRequests {

    private HeatRequests() {
    }

    /**
     * A heat as registered or corrected.
     *
     * @param heatNumber         the producer's heat (cast) number; unique per producer, ignoring case
     * @param grade              the steel or alloy designation as ordered, free text (e.g. {@code S355J2+N})
     * @param nominalThicknessMm nominal thickness, or diameter for round products, in mm; positive
     * @param composition        optional element symbol → mass % (each in [0, 100], sum at most 100)
     * @param reason             why; required for a change, optional on registration
     */
    public record HeatRequest(
            @NotBlank @Size(max = 50) String heatNumber,
            @NotBlank @Size(max = 200) String producer,
            @NotBlank @Size(max = 100) String grade,
            @NotNull ProductForm productForm,
            @NotNull @Positive BigDecimal nominalThicknessMm,
            @Size(max = 118) Map<String, BigDecimal> composition,
            @Size(max = 2000) String reason) {
    }
}
