package org.specimenledger.analysis;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import org.junit.jupiter.api.Test;

/** Edge cases: bad input is rejected with a message naming the bad value; thin records get reasons. */
class TensileInputRejectionTest {

    private static final TensileParameters P = TensileParameters.defaults();
    private static final TensileSpecimen S = AnalysisCurves.FLAT_100;

    @Test
    void rejectsTooFewPoints() {
        assertThatThrownBy(() -> TensileAnalysis.analyse(new double[3], new double[3], null, S, P))
                .isInstanceOf(AnalysisRejected.class).hasMessage("a curve needs at least 10 points, got 3");
    }

    @Test
    void rejectsNaNNamingTheIndex() {
        AnalysisCurves.Curve c = AnalysisCurves.linear(200_000, 0.002, 100);
        double[] f = c.force().clone();
        f[17] = Double.NaN;
        assertThatThrownBy(() -> TensileAnalysis.analyse(f, c.extension(), null, S, P))
                .isInstanceOf(AnalysisRejected.class).hasMessage("forceN[17] is NaN; every force must be finite");
        double[] x = c.extension().clone();
        x[5] = Double.POSITIVE_INFINITY;
        assertThatThrownBy(() -> TensileAnalysis.analyse(c.force(), x, null, S, P))
                .hasMessage("extensionMm[5] is Infinity; every extension must be finite");
    }

    @Test
    void rejectsArraysOfDifferentLength() {
        assertThatThrownBy(() -> TensileAnalysis.analyse(new double[20], new double[21], null, S, P))
                .isInstanceOf(AnalysisRejected.class)
                .hasMessage("forceN has 20 points but extensionMm has 21; the arrays must have equal length");
        assertThatThrownBy(() -> TensileAnalysis.analyse(new double[20], new double[20], new double[19], S, P))
                .hasMessageContaining("timeS has 19 points");
    }

    @Test
    void rejectsDecreasingTime() {
        AnalysisCurves.Curve c = AnalysisCurves.linear(200_000, 0.002, 100);
        double[] t = c.time().clone();
        t[40] = t[38];
        assertThatThrownBy(() -> TensileAnalysis.analyse(c.force(), c.extension(), t, S, P))
                .hasMessageContaining("timeS[40]").hasMessageContaining("time must not decrease");
    }

    @Test
    void rejectsNonPositiveSpecimenDimensions() {
        assertThatThrownBy(() -> new TensileSpecimen(0, 50, 50, null, null))
                .isInstanceOf(AnalysisRejected.class).hasMessage("S0 must be positive and finite, got 0.0 mm²");
        assertThatThrownBy(() -> new TensileSpecimen(100, -50, 50, null, null))
                .hasMessage("Le must be positive and finite, got -50.0 mm");
        assertThatThrownBy(() -> new TensileSpecimen(100, 50, 50, null, 120.0))
                .hasMessage("Su = 120.0 mm² exceeds S0 = 100.0 mm²");
    }

    @Test
    void curveEndingBeforeMaximumForceLeavesFmNotDeterminable() {
        // Ramberg–Osgood rises monotonically: cut without fracture, the maximum is never passed.
        AnalysisCurves.Curve full = AnalysisCurves.rambergOsgood(200_000, 300, 10, 0.02, 2000);
        int n = 2000;
        double[] f = java.util.Arrays.copyOf(full.force(), n);
        double[] x = java.util.Arrays.copyOf(full.extension(), n);
        TensileResult r = TensileAnalysis.analyse(f, x, null, S, P);

        assertThat(r.property("Fm").status()).isEqualTo(PropertyStatus.NOT_DETERMINABLE);
        assertThat(r.property("Fm").reason()).startsWith("record ends before the maximum force");
        assertThat(r.property("Rm").status()).isEqualTo(PropertyStatus.NOT_DETERMINABLE);
        assertThat(r.property("At").reason()).startsWith("no fracture in the record");
        assertThat(r.property("W").status()).isEqualTo(PropertyStatus.NOT_DETERMINABLE);
        assertThat(r.property("Rp0.2").isDetermined()).isTrue();
    }

    @Test
    void curveWithoutClearElasticPartLeavesModulusNotDeterminable() {
        // Force jumps from zero to 80 % of its maximum in one step: no points in the 10–40 % window.
        double[] f = new double[50];
        double[] x = new double[50];
        for (int i = 1; i < 40; i++) {
            f[i] = 80_000 + 500 * i;
            x[i] = 0.01 * i;
        }
        for (int i = 40; i < 50; i++) {
            f[i] = 100;
            x[i] = 0.4;
        }
        TensileResult r = TensileAnalysis.analyse(f, x, null, S, P);

        assertThat(r.property("E").status()).isEqualTo(PropertyStatus.NOT_DETERMINABLE);
        assertThat(r.property("E").reason()).startsWith("no clear elastic part: 0 points between");
        assertThat(r.property("Rp0.2").reason()).isEqualTo("no elastic slope (E not determinable)");
        assertThat(r.hasWarning("YIELDING_NOT_CLASSIFIED")).isTrue();
        assertThat(r.property("Rm").isDetermined()).isTrue();
    }

    @Test
    void unmeasuredReductionOfAreaIsNotDeterminable() {
        TensileResult r = AnalysisCurves.linear(200_000, 0.002, 100).analyse();
        assertThat(r.property("Z").status()).isEqualTo(PropertyStatus.NOT_DETERMINABLE);
        assertThat(r.property("Z").reason()).isEqualTo("Su not measured");
    }

    @Test
    void brokenPiecesGiveElongationAndReduction() {
        AnalysisCurves.Curve c = AnalysisCurves.hollomon(800, 0.2, 200_000, 0.0005, 0.35, 2000);
        TensileSpecimen measured = new TensileSpecimen(100, 50, 50, 66.25, 42.5);
        TensileResult r = TensileAnalysis.analyse(c.force(), c.extension(), null, measured, P);
        // A = 100·(66.25 − 50)/50 = 32.5 %, Z = 100·(100 − 42.5)/100 = 57.5 % → "58" [M formulas].
        assertThat(r.property("A").value()).isEqualTo(32.5);
        assertThat(r.property("A").reason()).isEqualTo("from broken pieces");
        assertThat(r.property("Z").value()).isEqualTo(57.5);
        assertThat(r.property("Z").reported()).isEqualTo("58");
    }
}
