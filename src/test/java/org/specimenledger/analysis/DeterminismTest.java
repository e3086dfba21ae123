package org.specimenledger.analysis;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;

/** Same arrays and parameters give equal results, bit for bit. */
class DeterminismTest {

    @Test
    void analysingTwiceGivesBitIdenticalResults() {
        AnalysisCurves.Curve c = AnalysisCurves.discontinuous(205_000, 380, 340, 355, 1.5, 0.002,
                380 / 205_000.0 + 0.0009 + 0.016, 150, 0.05, 0.25, 25_000).withNoise(11, 10, 0.0001);
        TensileResult a = c.analyse();
        TensileResult b = TensileAnalysis.analyse(c.force().clone(), c.extension().clone(), c.time().clone(),
                c.specimen(), TensileParameters.fromMap(TensileParameters.defaults().asMap()));

        assertThat(a).isEqualTo(b);
        for (String key : a.properties().keySet()) {
            assertThat(Double.doubleToRawLongBits(a.property(key).value()))
                    .as(key).isEqualTo(Double.doubleToRawLongBits(b.property(key).value()));
        }
        assertThat(a.properties().keySet()).containsExactly("E", "ReH", "ReL", "Rp0.2", "Rt0.5", "Fm", "Rm", "Ae",
                "Agt", "Ag", "At", "A", "Z", "W", "Welastic");
    }
}
