package org.specimenledger.curve;

import static org.assertj.core.api.Assertions.assertThat;
import static org.specimenledger.curve.CurveFixtures.read;

import java.math.BigDecimal;
import org.apache.commons.math3.util.Precision;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * Unit conversion against the exact factors, with BigDecimal (JDK) as the exact oracle and Apache
 * Commons Math {@link Precision#equals(double, double, int)} counting ulps.
 *
 * <p>Sources of the factors, all exact by definition: 1 lb = 0.45359237 kg (international yard and
 * pound agreement, 1959); standard gravity g_n = 9.80665 m/s² (3rd CGPM, 1901); hence
 * 1 lbf = 4.4482216152605 N; 1 kip = 1000 lbf; 1 in = 25.4 mm (1959 agreement); all as listed in
 * NIST SP 811 (2008), appendix B. The SI prefixes k, m and µ are exact powers of ten (SI Brochure).
 */
class UnitConversionTest {

    @Test
    void poundForceFactorFollowsFromThePoundAndStandardGravity() {
        BigDecimal pound = new BigDecimal("0.45359237");
        BigDecimal standardGravity = new BigDecimal("9.80665");

        assertThat(pound.multiply(standardGravity)).isEqualByComparingTo("4.4482216152605");
    }

    @ParameterizedTest(name = "{1} {0} is {2} {3} (exact by definition)")
    @CsvSource({
        "force,     1,        N,   1,                   N",
        "force,     1,        kN,  1000,                N",
        "force,     1,        lbf, 4.4482216152605,     N",
        "force,     1,        kip, 4448.2216152605,     N",
        "force,     12.5,     lbf, 55.60277019075625,   N",
        "force,     -3.2,     kip, -14234.3091688336,   N",
        "extension, 1,        in,  25.4,                mm",
        "extension, 0.1,      in,  2.54,                mm",
        "extension, 2500,     µm,  2.5,                 mm",
        "extension, 2500,     μm,  2.5,                 mm",
        "extension, 2500,     um,  2.5,                 mm",
        "crosshead, 3,        in,  76.2,                mm",
        "time,      1500,     ms,  1.5,                 s",
        "time,      2.5,      min, 150,                 s",
        "time,      0.001,    s,   0.001,               s",
    })
    void convertsEachUnitWithTheExactFactor(String channel, String value, String unit, String expected,
            String canonical) {
        String header = channel.equals("force") ? "force [" + unit + "],extension [mm]"
                : channel.equals("time") ? "time [" + unit + "],force [N],extension [mm]"
                : channel.equals("extension") ? "force [N],extension [" + unit + "]"
                : "force [N],extension [mm],crosshead [" + unit + "]";
        String row = channel.equals("force") ? value + ",0" : channel.equals("time") ? value + ",0,0"
                : channel.equals("extension") ? "0," + value : "0,0," + value;

        RawCurve curve = read(header + "\n" + row + "\n");
        double actual = switch (channel) {
            case "force" -> curve.forceN()[0];
            case "extension" -> curve.extensionMm()[0];
            case "crosshead" -> curve.crossheadMm()[0];
            default -> curve.timeS()[0];
        };

        double exact = new BigDecimal(expected).doubleValue();
        assertThat(Precision.equals(actual, exact, 1))
                .as("%s %s %s = %s %s within 1 ulp, got %s", value, unit, channel, expected, canonical, actual)
                .isTrue();
    }

    @Test
    void exactFactorsConvertWithoutAnyRoundingBeyondTheResult() {
        // kN, ms and µm are one correctly rounded operation: the result is the nearest double.
        RawCurve curve = read("time [ms],force [kN],extension [µm]\n0.3,0.1,0.7\n");

        assertThat(curve.forceN()[0]).isEqualTo(new BigDecimal(0.1).multiply(BigDecimal.valueOf(1000)).doubleValue());
        assertThat(curve.timeS()[0]).isEqualTo(new BigDecimal(0.3).divide(BigDecimal.valueOf(1000)).doubleValue());
        assertThat(curve.extensionMm()[0]).isEqualTo(new BigDecimal(0.7).divide(BigDecimal.valueOf(1000)).doubleValue());
    }

    @Test
    void inexactFactorsStayWithinOneUlpOfTheExactProductForManyValues() {
        // The double-double factor with a fused multiply-add keeps even worst cases within 1 ulp.
        String[][] units = {{"lbf", "4.4482216152605"}, {"kip", "4448.2216152605"}};
        for (String[] unit : units) {
            StringBuilder file = new StringBuilder("force [" + unit[0] + "],extension [mm]\n");
            double[] inputs = new double[2000];
            for (int i = 0; i < inputs.length; i++) {
                inputs[i] = 0.001 + i * 1.000123;
                file.append(Double.toString(inputs[i])).append(",0\n");
            }
            double[] force = read(file.toString()).forceN();
            for (int i = 0; i < inputs.length; i++) {
                double exact = new BigDecimal(inputs[i]).multiply(new BigDecimal(unit[1])).doubleValue();
                assertThat(Precision.equals(force[i], exact, 1)).as("%s %s", inputs[i], unit[0]).isTrue();
            }
        }
    }
}
