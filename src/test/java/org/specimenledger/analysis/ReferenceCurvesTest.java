package org.specimenledger.analysis;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvFileSource;

/**
 * Reference curves kept as CSV under {@code src/test/resources/analysis/} (written by
 * {@code generate_reference_curves.py} from closed-form models), each expected value with its source
 * and tolerance in {@code reference-curves.csv}.
 */
class ReferenceCurvesTest {

    private static final TensileSpecimen SPECIMEN = new TensileSpecimen(100, 50, 50, null, null);

    @ParameterizedTest(name = "{0} {1} = {2} ± {3}")
    @CsvFileSource(resources = "/analysis/reference-curves.csv", delimiter = ',')
    void referenceCurveGivesExpectedProperty(String file, String property, double expected, double tolerance,
            String source) throws IOException {
        double[][] columns = read("/analysis/" + file);
        TensileResult r = TensileAnalysis.analyse(columns[0], columns[1], columns[2], SPECIMEN,
                TensileParameters.defaults());
        assertThat(r.property(property).value()).as(source).isCloseTo(expected, within(tolerance));
    }

    static double[][] read(String resource) throws IOException {
        List<double[]> rows = new ArrayList<>();
        try (InputStream in = ReferenceCurvesTest.class.getResourceAsStream(resource);
                BufferedReader reader = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8))) {
            reader.readLine();
            for (String line = reader.readLine(); line != null; line = reader.readLine()) {
                String[] cells = line.split(",");
                rows.add(new double[] {Double.parseDouble(cells[0]), Double.parseDouble(cells[1]),
                        Double.parseDouble(cells[2])});
            }
        }
        double[][] columns = new double[3][rows.size()];
        for (int i = 0; i < rows.size(); i++) {
            for (int c = 0; c < 3; c++) {
                columns[c][i] = rows.get(i)[c];
            }
        }
        return columns;
    }
}
