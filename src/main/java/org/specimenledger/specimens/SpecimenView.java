package org.specimenledger.specimens;

import com.fasterxml.jackson.annotation.JsonIgnore;
import java.math.BigDecimal;
import java.time.Instant;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.UUID;

/**
 * A specimen as the API returns it, as the ledger records it and as other features read it. Lengths in mm,
 * areas in mm²; computed values (means, S0, L0, Su) are the decimals of the doubles the computation used.
 *
 * @param customerId  the customer organisation of the order
 * @param readings    the original readings as given, by dimension symbol
 * @param meansMm     the mean of each dimension, by symbol
 * @param s0Formula   the formula with its inputs, e.g. {@code S0 = π·d²/4 = 78.5922 mm², d = mean of 3 readings = 10.0033 mm}
 * @param s0Method    OTHER shapes: how S0 was determined
 * @param l0Mm        the original gauge length used (see {@code gaugeLength} for how it was chosen)
 * @param leMm        extensometer gauge length Le
 * @param lcMm        parallel length Lc
 * @param afterFracture null until measured after fracture
 * @param warnings    advice on allowed but not recommended geometry (nothing refused is stored)
 */
public record SpecimenView(UUID id, String labIdentifier, UUID heatId, UUID orderId, UUID customerId,
        Orientation orientation, String samplingPosition, SpecimenShape shape,
        Map<String, List<BigDecimal>> readings, Map<String, BigDecimal> meansMm,
        BigDecimal s0Mm2, String s0Formula, String s0Method,
        GaugeLengthView gaugeLength, BigDecimal l0Mm, BigDecimal leMm, BigDecimal lcMm,
        AfterFractureView afterFracture, List<String> warnings, Instant createdAt) {

    /**
     * How L0 was chosen.
     *
     * @param k             5.65 or 11.3 for a proportional piece, null for a fixed one
     * @param calculatedMm  k·√S0 (for a fixed piece, the given L0)
     * @param rule          the rule applied, as text
     */
    public record GaugeLengthView(GaugeLength.Basis basis, BigDecimal k, Boolean roundToFiveMm,
            BigDecimal calculatedMm, String rule) {
    }

    /**
     * Measurements on the broken pieces.
     *
     * @param luMm   final gauge length Lu
     * @param suMm2  cross-section after fracture Su, computed from the means like S0 (or given, OTHER)
     */
    public record AfterFractureView(BigDecimal luMm, Map<String, List<BigDecimal>> readings,
            Map<String, BigDecimal> meansMm, BigDecimal suMm2, String suFormula, String suMethod,
            BigDecimal fractureDistanceMm, FractureZone fractureZone, Instant recordedAt) {
    }

    /** Lu, or null before after-fracture measurements are recorded. */
    @JsonIgnore
    public BigDecimal luMm() {
        return afterFracture == null ? null : afterFracture.luMm();
    }

    /** Su, or null before after-fracture measurements are recorded. */
    @JsonIgnore
    public BigDecimal suMm2() {
        return afterFracture == null ? null : afterFracture.suMm2();
    }

    static SpecimenView of(Specimen s) {
        Map<String, BigDecimal> means = s.means() == null ? Map.of()
                : s.means().bySymbol(s.shape(), CrossSection.Stage.ORIGINAL);
        AfterFractureView after = null;
        if (s.isBroken()) {
            after = new AfterFractureView(s.luMm(), grouped(s.fractureReadings()),
                    s.fractureMeans() == null ? Map.of()
                            : s.fractureMeans().bySymbol(s.shape(), CrossSection.Stage.AFTER_FRACTURE),
                    s.suMm2(), s.suFormula(), s.suMethod(), s.fractureDistanceMm(), s.fractureZone(),
                    s.fractureRecordedAt());
        }
        BigDecimal meanD = means.get("d");
        List<String> warnings = ParallelLength.warnings(s.shape(), s.lcMm().doubleValue(), s.l0Mm().doubleValue(),
                meanD == null ? null : meanD.doubleValue(), s.leMm().doubleValue());
        return new SpecimenView(s.id(), s.labIdentifier(), s.heatId(), s.orderId(), s.customerId(), s.orientation(),
                s.samplingPosition(), s.shape(), grouped(s.readings()), means, s.s0Mm2(), s.s0Formula(),
                s.s0Method(),
                new GaugeLengthView(s.l0Basis(), s.l0K(), s.l0RoundToFiveMm(), s.l0CalculatedMm(), s.l0Rule()),
                s.l0Mm(), s.leMm(), s.lcMm(), after, warnings, s.createdAt());
    }

    private static Map<String, List<BigDecimal>> grouped(List<Reading> readings) {
        Map<String, List<BigDecimal>> out = new LinkedHashMap<>();
        for (Reading r : readings) {
            out.computeIfAbsent(r.dimension(), k -> new java.util.ArrayList<>()).add(r.valueMm());
        }
        out.replaceAll((k, v) -> List.copyOf(v));
        return out;
    }
}
