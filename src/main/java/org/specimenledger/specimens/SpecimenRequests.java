package org.specimenledger.specimens;

import jakarta.validation.Valid;
import jakarta.validation.constraints.NotBlank;
import jakarta.validation.constraints.NotNull;
import jakarta.validation.constraints.Positive;
import jakarta.validation.constraints.PositiveOrZero;
import jakarta.validation.constraints.Size;
import java.math.BigDecimal;
import java.util.List;
import java.util.Map;
import java.util.UUID;

/**
 * Request bodies of the specimens feature. Lengths in mm, areas in mm². Problems are reported with RFC 6901
 * JSON Pointers into the body; array indices count from 0, so {@code /readings/d/1} is the second reading
 * of d, {@code /readings/d} the dimension as a whole and {@code /readings} the set of readings.
 */
public final class SpecimenRequests {

    private SpecimenRequests() {
    }

    /**
     * A specimen as registered or corrected.
     *
     * @param labIdentifier    the laboratory's own mark on the piece; unique in the laboratory, ignoring case
     * @param readings         dimension symbol → readings in mm: ROUND {@code d}; FLAT {@code a} (thickness) and
     *                         {@code b} (width); TUBE {@code a} (wall thickness) and {@code D} (outer diameter);
     *                         none for OTHER
     * @param s0Mm2            OTHER only: the cross-section determined otherwise, in mm²
     * @param s0Method         OTHER only: how {@code s0Mm2} was determined
     * @param leMm             extensometer gauge length Le
     * @param lcMm             parallel length Lc; at least L0
     * @param reason           why; required for a correction, optional on registration
     */
    public record SpecimenRequest(
            @NotBlank @Size(max = 100) String labIdentifier,
            @NotNull UUID heatId,
            @NotNull UUID orderId,
            @NotNull Orientation orientation,
            @Size(max = 500) String samplingPosition,
            @NotNull SpecimenShape shape,
            @Size(max = 10) Map<String, List<BigDecimal>> readings,
            BigDecimal s0Mm2,
            @Size(max = 500) String s0Method,
            @NotNull @Valid GaugeLengthRequest gaugeLength,
            @NotNull @Positive BigDecimal leMm,
            @NotNull @Positive BigDecimal lcMm,
            @Size(max = 2000) String reason) {
    }

    /**
     * How L0 is chosen: {@code PROPORTIONAL} with {@code k} 5.65 or 11.3 and {@code roundToFiveMm} (true when
     * absent), or {@code FIXED} with {@code l0Mm}.
     */
    public record GaugeLengthRequest(
            @NotNull GaugeLength.Basis basis,
            BigDecimal k,
            Boolean roundToFiveMm,
            BigDecimal l0Mm) {
    }

    /**
     * What was measured on the broken pieces.
     *
     * @param luMm               final gauge length Lu
     * @param readings           dimension symbol → readings at the fracture in mm: ROUND {@code du}; FLAT
     *                           {@code au}, {@code bu}; TUBE {@code au}, {@code Du}; none for OTHER
     * @param suMm2              OTHER only: the cross-section after fracture determined otherwise, mm²
     * @param suMethod           OTHER only: how {@code suMm2} was determined
     * @param fractureDistanceMm optional distance of the fracture from the nearest gauge mark
     * @param fractureZone       optional; derived from the distance when that is given (and must agree)
     * @param reason             why; required when measurements were already recorded
     */
    public record AfterFractureRequest(
            @NotNull @Positive BigDecimal luMm,
            @Size(max = 10) Map<String, List<BigDecimal>> readings,
            BigDecimal suMm2,
            @Size(max = 500) String suMethod,
            @PositiveOrZero BigDecimal fractureDistanceMm,
            FractureZone fractureZone,
            @Size(max = 2000) String reason) {
    }
}
