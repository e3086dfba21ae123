package org.specimenledger.specimens;

import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;

/**
 * The cross-sectional area of a test piece, before the test (S0) or after fracture (Su), computed from
 * the MEAN of several readings of each dimension (common practice [CP]; DOMAIN.md "Test pieces"), with
 * the ISO 6892-1 formulas: round π·d²/4, flat a·b, tube π·a·(D − a).
 *
 * <p>Arithmetic is IEEE 754 double. The readings carry at most about six significant digits (a
 * micrometer reads 0.001 mm on 10 mm) and a double carries 15 to 17, so rounding in the computation is
 * some ten orders of magnitude below the measurement's resolution; the analysis core works in doubles
 * too. Stored as {@code BigDecimal.valueOf(double)} — a decimal that converts back to exactly the same
 * double — the stored area loses nothing and a replay gets the identical input.
 *
 * @param areaMm2 the area in mm², finite and positive
 * @param meansMm the mean of each dimension's readings in mm, by symbol, in the shape's order (empty for a
 *                given area)
 * @param formula the formula used with its inputs, as text for the record and the certificate trace
 */
public record CrossSection(SpecimenShape shape, Stage stage, double areaMm2, Map<String, Double> meansMm,
        String formula) {

    /** Before the test (S0, dimensions d, a, b, D) or after fracture (Su, dimensions du, au, bu, Du). */
    public enum Stage {
        ORIGINAL("S0", ""),
        AFTER_FRACTURE("Su", "u");

        private final String areaSymbol;
        private final String suffix;

        Stage(String areaSymbol, String suffix) {
            this.areaSymbol = areaSymbol;
            this.suffix = suffix;
        }

        /** S0 or Su. */
        public String areaSymbol() {
            return areaSymbol;
        }

        /** The symbol of a dimension at this stage: d → du after fracture. */
        public String symbol(String dimension) {
            return dimension + suffix;
        }
    }

    private static final MathContext SHOWN = new MathContext(6, RoundingMode.HALF_EVEN);

    public CrossSection {
        Objects.requireNonNull(shape, "shape");
        Objects.requireNonNull(stage, "stage");
        meansMm = Map.copyOf(meansMm);
    }

    /**
     * The area computed from readings of each dimension the shape has.
     *
     * @param readingsMm symbol → readings in mm; exactly the shape's dimensions at this stage, each with at
     *                   least one reading, every reading finite and positive
     * @throws GeometryRefused naming the symbol (and reading) at fault: a missing or extra dimension, a
     *                         reading that is not a finite positive number, a tube wall a ≥ D/2
     */
    public static CrossSection measured(SpecimenShape shape, Stage stage, Map<String, double[]> readingsMm) {
        if (!shape.isMeasured()) {
            throw new GeometryRefused(stage.areaSymbol(), "an " + shape + " cross-section is given, not measured");
        }
        List<String> symbols = shape.dimensions(stage);
        for (String symbol : readingsMm.keySet()) {
            if (!symbols.contains(symbol)) {
                throw new GeometryRefused(symbol, "a " + shape + " test piece has no dimension " + symbol
                        + "; it has " + String.join(" and ", symbols));
            }
        }
        Map<String, Double> means = new LinkedHashMap<>();
        StringBuilder inputs = new StringBuilder();
        for (String symbol : symbols) {
            double[] readings = readingsMm.get(symbol);
            means.put(symbol, mean(symbol, readings));
            inputs.append(", ").append(symbol).append(" = mean of ").append(readings.length)
                    .append(readings.length == 1 ? " reading = " : " readings = ")
                    .append(shown(means.get(symbol))).append(" mm");
        }
        String area = stage.areaSymbol();
        double s;
        String formula;
        switch (shape) {
            case ROUND -> {
                double d = means.get(stage.symbol("d"));
                s = Math.PI * d * d / 4.0;
                formula = area + " = π·" + stage.symbol("d") + "²/4";
            }
            case FLAT -> {
                s = means.get(stage.symbol("a")) * means.get(stage.symbol("b"));
                formula = area + " = " + stage.symbol("a") + "·" + stage.symbol("b");
            }
            case TUBE -> {
                String aSymbol = stage.symbol("a");
                String outer = stage.symbol("D");
                double a = means.get(aSymbol);
                double outerD = means.get(outer);
                if (a >= outerD / 2.0) {
                    throw new GeometryRefused(aSymbol, "tube wall thickness " + aSymbol + " (" + shown(a)
                            + " mm) must be less than half the outer diameter " + outer + " (" + shown(outerD)
                            + " mm); a solid section is a ROUND test piece");
                }
                s = Math.PI * a * (outerD - a);
                formula = area + " = π·" + aSymbol + "·(" + outer + " − " + aSymbol + ")";
            }
            default -> throw new IllegalStateException("unhandled shape " + shape);
        }
        requireUsableArea(area, s);
        return new CrossSection(shape, stage, s, means, formula + " = " + shown(s) + " mm²" + inputs);
    }

    /**
     * An area determined otherwise (OTHER shape), e.g. from mass, length and density.
     *
     * @param method how it was determined; required, it goes into the record
     */
    public static CrossSection given(Stage stage, double areaMm2, String method) {
        requireUsableArea(stage.areaSymbol(), areaMm2);
        if (method == null || method.isBlank()) {
            throw new GeometryRefused(stage.areaSymbol(), "a directly given " + stage.areaSymbol()
                    + " needs the method it was determined by");
        }
        return new CrossSection(SpecimenShape.OTHER, stage, areaMm2, Map.of(),
                stage.areaSymbol() + " = " + shown(areaMm2) + " mm² as given, determined by: " + method.trim());
    }

    private static double mean(String symbol, double[] readings) {
        if (readings == null || readings.length == 0) {
            throw new GeometryRefused(symbol, "at least one reading of " + symbol + " is required");
        }
        double sum = 0;
        for (int i = 0; i < readings.length; i++) {
            if (!Double.isFinite(readings[i]) || readings[i] <= 0) {
                throw new GeometryRefused(symbol, i, "reading " + i + " of " + symbol + " must be a finite positive "
                        + "number of mm, got " + readings[i]);
            }
            sum += readings[i];
        }
        return sum / readings.length;
    }

    private static void requireUsableArea(String symbol, double area) {
        if (!Double.isFinite(area) || area <= 0) {
            throw new GeometryRefused(symbol, symbol + " must come out as a finite positive area in mm², got "
                    + area);
        }
    }

    /** Six significant digits for the formula text; the stored values keep full precision. */
    static String shown(double value) {
        return new BigDecimal(value).round(SHOWN).stripTrailingZeros().toPlainString();
    }
}
