package org.specimenledger.specimens;

import jakarta.persistence.Column;
import jakarta.persistence.Embeddable;
import java.math.BigDecimal;
import java.util.LinkedHashMap;
import java.util.Map;

/**
 * The mean of each dimension's readings, in mm, stored as the decimal of the double the computation used.
 * Only the dimensions of the shape are set: round d; flat a, b; tube a, D (after fracture du, au, bu, Du).
 */
@Embeddable
record MeanDimensions(
        @Column(name = "mean_d_mm") BigDecimal d,
        @Column(name = "mean_a_mm") BigDecimal a,
        @Column(name = "mean_b_mm") BigDecimal b,
        @Column(name = "mean_outer_d_mm") BigDecimal outerD) {

    static MeanDimensions of(CrossSection section) {
        CrossSection.Stage stage = section.stage();
        return new MeanDimensions(mean(section, stage.symbol("d")), mean(section, stage.symbol("a")),
                mean(section, stage.symbol("b")), mean(section, stage.symbol("D")));
    }

    /** By symbol of the given stage, in the shape's order; empty for a given (OTHER) cross-section. */
    Map<String, BigDecimal> bySymbol(SpecimenShape shape, CrossSection.Stage stage) {
        Map<String, BigDecimal> out = new LinkedHashMap<>();
        for (String symbol : shape.dimensions(stage)) {
            String base = symbol.substring(0, 1);
            out.put(symbol, switch (base) {
                case "d" -> d;
                case "a" -> a;
                case "b" -> b;
                case "D" -> outerD;
                default -> throw new IllegalStateException("unknown dimension " + symbol);
            });
        }
        return out;
    }

    private static BigDecimal mean(CrossSection section, String symbol) {
        Double value = section.meansMm().get(symbol);
        return value == null ? null : BigDecimal.valueOf(value);
    }
}
