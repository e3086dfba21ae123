package org.specimenledger.curve;

import static org.assertj.core.api.Assertions.assertThat;

import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.statistics.Statistics;
import org.apache.commons.math3.util.Precision;
import org.specimenledger.curve.GeneratedCurve.GeneratedColumn;
import org.specimenledger.curve.GeneratedCurve.Layout;

/**
 * Property-based tests of the reader: generated well-formed files round-trip, and corrupted files are
 * either accepted or cleanly rejected.
 *
 * <p>Round-trip precision: values are written with {@link Double#toString(double)}, which the JDK
 * guarantees to read back as the same double. In canonical units (N, mm, s) the result must be that
 * exact double. After a unit conversion it must lie within 1 ulp of the exact decimal product of that
 * double and the defining factor, computed with BigDecimal and rounded once (JDK as the oracle; the
 * ulp count by Apache Commons Math {@link Precision#equals(double, double, int)}).
 */
class CurveReaderProperties {

    private static final CurveReader READER = new CurveReader(CurveReadingLimits.defaults().withMinPoints(1));

    @Property(tries = 200)
    void wellFormedFilesRoundTripToTheGeneratedValues(@ForAll("wellFormedCurves") GeneratedCurve generated) {
        RawCurve curve = READER.read(generated.bytes());

        assertThat(curve.size()).isEqualTo(generated.rows());
        for (int c = 0; c < generated.columns().size(); c++) {
            GeneratedColumn column = generated.columns().get(c);
            if (column.channel() == null) {
                continue;
            }
            double[] actual = valuesOf(curve, column.channel());
            for (int r = 0; r < generated.rows(); r++) {
                double written = generated.values()[c][r];
                if (column.exactFactor().equals("1")) {
                    assertThat(actual[r]).as("%s row %d", column.header(), r).isEqualTo(written);
                } else {
                    double exact = new BigDecimal(written).multiply(new BigDecimal(column.exactFactor())).doubleValue();
                    assertThat(Precision.equals(actual[r], exact, 1))
                            .as("%s row %d: %s read as %s, exact %s", column.header(), r, written, actual[r], exact)
                            .isTrue();
                }
            }
        }
        assertThat(curve.byteCount()).isEqualTo(generated.bytes().length);
    }

    @Property(tries = 200)
    void corruptedFilesAreAcceptedOrCleanlyRejected(@ForAll("wellFormedCurves") GeneratedCurve generated,
            @ForAll("corruptions") List<Corruption> corruptions) throws Exception {
        byte[] file = generated.bytes();
        for (Corruption corruption : corruptions) {
            file = corruption.applyTo(file);
        }
        int physicalLines = 1;
        for (byte b : file) {
            physicalLines += b == '\n' ? 1 : 0;
        }

        try {
            RawCurve curve = READER.read(file);
            Statistics.label("outcome").collect("accepted");
            assertThat(curve.sha256()).isEqualTo(CurveFingerprintTest.jdkSha256(file));
            assertThat(Arrays.stream(curve.forceN()).allMatch(Double::isFinite)).isTrue();
            // the extension channel: complete and finite; or, only beside a crosshead channel, missing
            // altogether or finite for its first extensometerPoints values and NaN after them
            double[] extension = curve.extensionMm();
            int k = curve.extensometerPoints();
            if (!curve.hasCrosshead()) {
                assertThat(extension).hasSize(curve.size());
                assertThat(k).isEqualTo(curve.size());
            }
            if (curve.hasExtensometer()) {
                assertThat(extension).hasSize(curve.size());
                assertThat(Arrays.stream(extension, 0, k).allMatch(Double::isFinite)).isTrue();
                assertThat(Arrays.stream(extension, k, extension.length).allMatch(Double::isNaN)).isTrue();
            } else {
                assertThat(extension).isEmpty();
                assertThat(k).isZero();
            }
        } catch (CurveRejected rejected) {
            Statistics.label("outcome").collect("rejected");
            assertThat(rejected.line()).isBetween(0, physicalLines);
            assertThat(rejected.column()).isNotNegative();
            assertThat(rejected.reason()).isNotBlank();
        }
        // Any other exception type escapes and fails the property.
    }

    @Property(tries = 200)
    void arbitraryBytesAreAcceptedOrCleanlyRejected(@ForAll("headerThenAnything") byte[] file) {
        try {
            READER.read(file);
        } catch (CurveRejected rejected) {
            assertThat(rejected.line()).isNotNegative();
            assertThat(rejected.reason()).isNotBlank();
        }
    }

    @Provide
    Arbitrary<byte[]> headerThenAnything() {
        // A valid header half of the time, so the random bytes also reach the data-row code.
        byte[] header = "force [N];extension [mm]\n".getBytes(java.nio.charset.StandardCharsets.UTF_8);
        Arbitrary<byte[]> noise = Arbitraries.bytes().array(byte[].class).ofMaxSize(300);
        return Combinators.combine(Arbitraries.of(true, false), noise).as((withHeader, rest) -> {
            if (!withHeader) {
                return rest;
            }
            byte[] file = Arrays.copyOf(header, header.length + rest.length);
            System.arraycopy(rest, 0, file, header.length, rest.length);
            return file;
        });
    }

    @Provide
    Arbitrary<GeneratedCurve> wellFormedCurves() {
        Arbitrary<Layout> layouts = Combinators.combine(
                Arbitraries.of(",", ";", "\t"),
                Arbitraries.of(true, false),
                Arbitraries.of(true, false),
                Arbitraries.of(true, false),
                Arbitraries.of(true, false),
                Arbitraries.integers().between(0, 3),
                Arbitraries.of("", " "),
                Arbitraries.integers().between(-1, 5))
                .as((delimiter, comma, bom, crlf, trailing, metadata, padding, blank) -> new Layout(delimiter,
                        comma && delimiter.equals(";"), bom, crlf, trailing, metadata, padding, blank));
        Arbitrary<List<GeneratedColumn>> columnSets = Combinators.combine(
                Arbitraries.oneOf(column(Channel.FORCE, "N", "1"), column(Channel.FORCE, "kN", "1000"),
                        column(Channel.FORCE, "lbf", "4.4482216152605"), column(Channel.FORCE, "kip", "4448.2216152605")),
                lengthColumn(Channel.EXTENSION),
                Arbitraries.oneOf(Arbitraries.<GeneratedColumn>just(null), column(Channel.TIME, "s", "1"),
                        column(Channel.TIME, "ms", "0.001"), column(Channel.TIME, "min", "60")),
                Arbitraries.oneOf(Arbitraries.<GeneratedColumn>just(null), lengthColumn(Channel.CROSSHEAD)),
                Arbitraries.of(true, false))
                .as((force, extension, time, crosshead, extra) -> {
                    List<GeneratedColumn> columns = new ArrayList<>(List.of(force, extension));
                    if (time != null) {
                        columns.add(time);
                    }
                    if (crosshead != null) {
                        columns.add(crosshead);
                    }
                    if (extra) {
                        columns.add(new GeneratedColumn(null, "temperature [°C]", null));
                    }
                    return columns;
                })
                .flatMap(Arbitraries::shuffle);
        return Combinators.combine(layouts, columnSets, Arbitraries.integers().between(1, 40))
                .flatAs((layout, columns, rows) -> valuesFor(columns, rows)
                        .map(values -> GeneratedCurve.write(layout, columns, values, rows)));
    }

    @Provide
    Arbitrary<List<Corruption>> corruptions() {
        Arbitrary<Corruption> one = Combinators.combine(
                Arbitraries.of(Corruption.Kind.values()),
                Arbitraries.integers().between(0, Integer.MAX_VALUE),
                Arbitraries.bytes().array(byte[].class).ofMinSize(1).ofMaxSize(6))
                .as(Corruption::new);
        return one.list().ofMinSize(1).ofMaxSize(4);
    }

    private static Arbitrary<double[][]> valuesFor(List<GeneratedColumn> columns, int rows) {
        List<Arbitrary<double[]>> perColumn = new ArrayList<>();
        for (GeneratedColumn column : columns) {
            if (column.channel() == null) {
                perColumn.add(Arbitraries.<double[]>just(null));
            } else if (column.channel() == Channel.TIME) {
                perColumn.add(timeStamps(rows));
            } else {
                perColumn.add(measuredValue().array(double[].class).ofSize(rows));
            }
        }
        return Combinators.combine(perColumn).as(list -> list.toArray(new double[0][]));
    }

    /** Decimal-looking values and arbitrary bit patterns of moderate magnitude, signs and zeros. */
    private static Arbitrary<Double> measuredValue() {
        Arbitrary<Double> decimals = Arbitraries.doubles().between(-1e6, 1e6).ofScale(6);
        Arbitrary<Double> anyBits = Arbitraries.longs().map(Double::longBitsToDouble)
                .filter(d -> Double.isFinite(d) && Math.abs(d) < 1e12 && (d == 0 || Math.abs(d) > 1e-200));
        return Arbitraries.frequencyOf(
                net.jqwik.api.Tuple.of(4, decimals), net.jqwik.api.Tuple.of(4, anyBits),
                net.jqwik.api.Tuple.of(1, Arbitraries.of(0.0, -0.0, 1e-9, 123456789.125)));
    }

    /** Non-decreasing time stamps, with repeats: cumulative sums of non-negative steps. */
    private static Arbitrary<double[]> timeStamps(int rows) {
        Arbitrary<Double> steps = Arbitraries.frequencyOf(
                net.jqwik.api.Tuple.of(1, Arbitraries.just(0.0)),
                net.jqwik.api.Tuple.of(6, Arbitraries.doubles().between(0, 10).ofScale(5)),
                net.jqwik.api.Tuple.of(2, Arbitraries.longs().map(Double::longBitsToDouble)
                        .filter(d -> Double.isFinite(d) && d >= 0 && d < 1e6)));
        return steps.array(double[].class).ofSize(rows).map(increments -> {
            double[] times = new double[rows];
            double t = 0;
            for (int i = 0; i < rows; i++) {
                t += increments[i];
                times[i] = t;
            }
            return times;
        });
    }

    private static Arbitrary<GeneratedColumn> column(Channel channel, String unit, String factor) {
        String[] spellings = {channel.label(), channel.label().toUpperCase(), capitalised(channel.label())};
        return Arbitraries.of(spellings).map(name -> new GeneratedColumn(channel, name + " [" + unit + "]", factor));
    }

    private static Arbitrary<GeneratedColumn> lengthColumn(Channel channel) {
        return Arbitraries.oneOf(column(channel, "mm", "1"), column(channel, "\u00B5m", "0.001"),
                column(channel, "\u03BCm", "0.001"), column(channel, "um", "0.001"), column(channel, "in", "25.4"));
    }

    private static String capitalised(String word) {
        return Character.toUpperCase(word.charAt(0)) + word.substring(1);
    }

    private static double[] valuesOf(RawCurve curve, Channel channel) {
        return switch (channel) {
            case FORCE -> curve.forceN();
            case EXTENSION -> curve.extensionMm();
            case TIME -> curve.timeS();
            case CROSSHEAD -> curve.crossheadMm();
        };
    }

    /**
     * One damage done to a valid file.
     *
     * @param kind what is done
     * @param where a position, taken modulo the file length
     * @param junk bytes written or inserted
     */
    record Corruption(Kind kind, int where, byte[] junk) {

        enum Kind { FLIP_BYTE, TRUNCATE, INSERT_JUNK, DELETE_DELIMITER }

        byte[] applyTo(byte[] file) {
            if (file.length == 0) {
                return kind == Kind.INSERT_JUNK ? junk.clone() : file;
            }
            int at = where % file.length;
            switch (kind) {
                case FLIP_BYTE -> {
                    byte[] flipped = file.clone();
                    flipped[at] = junk[0];
                    return flipped;
                }
                case TRUNCATE -> {
                    return Arrays.copyOf(file, at);
                }
                case INSERT_JUNK -> {
                    byte[] longer = new byte[file.length + junk.length];
                    System.arraycopy(file, 0, longer, 0, at);
                    System.arraycopy(junk, 0, longer, at, junk.length);
                    System.arraycopy(file, at, longer, at + junk.length, file.length - at);
                    return longer;
                }
                default -> {
                    for (int i = 0; i < file.length; i++) {
                        int j = (at + i) % file.length;
                        if (file[j] == ',' || file[j] == ';' || file[j] == '\t') {
                            byte[] shorter = new byte[file.length - 1];
                            System.arraycopy(file, 0, shorter, 0, j);
                            System.arraycopy(file, j + 1, shorter, j, file.length - j - 1);
                            return shorter;
                        }
                    }
                    return file;
                }
            }
        }
    }
}
