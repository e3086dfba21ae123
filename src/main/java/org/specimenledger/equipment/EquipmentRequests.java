package org.specimenledger.equipment;

import jakarta.validation.Valid;
import jakarta.validation.constraints.NotBlank;
import jakarta.validation.constraints.NotNull;
import jakarta.validation.constraints.Pattern;
import jakarta.validation.constraints.Positive;
import jakarta.validation.constraints.Size;
import java.math.BigDecimal;
import java.time.LocalDate;
import java.util.List;
import java.util.UUID;

/**
 * Request bodies of the equipment feature. Public so that the demo laboratory can be seeded through
 * the same checks as the API. A {@code reason} is required when changing or retiring a record.
 */
public final class EquipmentRequests {

    private EquipmentRequests() {
    }

    /**
     * An instrument. Kind-specific data: {@code forceRanges} for a force transducer (at least one),
     * {@code gaugeLengthMm} (and optionally {@code travelMm}) for an extensometer,
     * {@code builtInTransducerIds} (optional) for a testing machine; the others must be left out.
     */
    public record InstrumentRequest(
            @NotBlank @Size(max = 40) @Pattern(regexp = "\\s*[A-Za-z0-9][A-Za-z0-9._/-]*\\s*",
                    message = "use letters, digits and . _ / - only, such as TM-01") String assetId,
            @NotNull InstrumentKind kind,
            @NotBlank @Size(max = 500) String description,
            @Size(max = 200) String maker,
            @Size(max = 200) String model,
            @Size(max = 100) String serialNumber,
            @Size(max = 200) String location,
            @Size(max = 20) List<@NotNull @Valid ForceRangeRequest> forceRanges,
            @Positive BigDecimal gaugeLengthMm,
            @Positive BigDecimal travelMm,
            @Size(max = 20) List<@NotNull UUID> builtInTransducerIds,
            @Size(max = 2000) String reason) {
    }

    /**
     * One force range: its upper limit in N and, optionally, the lower limit of its verified part in N
     * (20 % of the range when left out, ISO 7500-1 [from memory]).
     */
    public record ForceRangeRequest(
            @NotNull @Positive BigDecimal upperLimitN,
            @Positive BigDecimal lowerLimitN) {
    }

    /** Retires an instrument: it is no longer usable from {@code retiredOn} on. */
    public record RetirementRequest(
            @NotNull LocalDate retiredOn,
            @Size(max = 2000) String reason) {
    }

    /**
     * A calibration as its certificate states it. A force transducer is classed per range in
     * {@code classes} (every range of the instrument, ISO 7500-1 classes 0.5, 1, 2, 3); an extensometer
     * takes its ISO 9513 class in {@code accuracyClass} (0.5, 1, 2); a testing machine may take an
     * ISO 7500-1 class there.
     */
    public record CalibrationRequest(
            @NotNull LocalDate calibratedOn,
            @NotNull LocalDate dueOn,
            @NotBlank @Size(max = 300) String calibratingBody,
            @NotBlank @Size(max = 100) String certificateReference,
            @Size(max = 10) String accuracyClass,
            @Size(max = 20) List<@NotNull @Valid RangeClassRequest> classes,
            @Size(max = 2000) String reason) {
    }

    /** The class one force range obtained; the range is named by its upper limit in N. */
    public record RangeClassRequest(
            @NotNull @Positive BigDecimal rangeN,
            @NotBlank @Size(max = 10) String accuracyClass) {
    }

    /** Takes a wrong calibration record out of force. */
    public record WithdrawalRequest(@Size(max = 2000) String reason) {
    }
}
