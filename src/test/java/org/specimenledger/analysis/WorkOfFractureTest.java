package org.specimenledger.analysis;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;

/** Energies against closed forms [CP, textbook: work of a linear spring ½·F·ΔL = ½·k·x²]. */
class WorkOfFractureTest {

    @Test
    void linearRecordWorkIsHalfForceTimesExtension() {
        // The trapezoidal rule is exact for a straight line, so only rounding of the sum remains:
        // relative 1e-12.
        AnalysisCurves.Curve c = AnalysisCurves.linear(200_000, 0.002, 1001);
        TensileResult r = c.analyse();
        double f = c.force()[1000];
        double x = c.extension()[1000];
        double expectedJ = 0.5 * f * x / 1000;
        assertThat(r.property("W").value()).isCloseTo(expectedJ, within(expectedJ * 1e-12));
        assertThat(r.property("W").unit()).isEqualTo("J");
        assertThat(r.property("W").reported()).isEqualTo("2.000");
    }

    @Test
    void elasticEnergyAtProofPointIsModulusOfResilienceTimesVolume() {
        // Welastic = ½·Fp·(Fp/(mE·S0))·Le = σp²/(2E)·S0·Le [CP: modulus of resilience σ²/(2E)].
        AnalysisCurves.Curve c = AnalysisCurves.rambergOsgood(200_000, 300, 10, 0.02, 20_000);
        TensileResult r = c.analyse();
        double rp = r.property("Rp0.2").value();
        double mE = r.property("E").value();
        double expected = rp * rp / (2 * mE) * 100 * 50 / 1000;
        assertThat(r.property("Welastic").value()).isCloseTo(expected, within(expected * 1e-12));
        assertThat(r.property("Welastic").value()).isCloseTo(300.0 * 300 / 400_000 * 5, within(1e-3));
    }
}
