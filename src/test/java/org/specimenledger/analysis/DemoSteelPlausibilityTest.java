package org.specimenledger.analysis;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;

/**
 * Plausibility on an invented demo record (the sample laboratory's structural-steel plate, all
 * numbers invented): E must fall in the handbook range for steel, 193–210 GPa [S, textbook tables in
 * DOMAIN.md], and the strengths in a sensible order.
 */
class DemoSteelPlausibilityTest {

    @Test
    void demoSteelModulusIsWithinHandbookRange() {
        // Invented: E 207 GPa, yield point 372 MPa, preload offset of 0.002 mm, slight noise.
        AnalysisCurves.Curve c = AnalysisCurves.discontinuous(207_000, 372, 348, 360, 2.0, 0.0025,
                372 / 207_000.0 + 0.0009 + 0.0025 * 6, 160, 0.06, 0.26, 26_000).withNoise(2024, 15, 0.00015);
        double[] shifted = c.extension().clone();
        for (int i = 0; i < shifted.length; i++) {
            shifted[i] += 0.002;
        }
        TensileResult r = TensileAnalysis.analyse(c.force(), shifted, c.time(), c.specimen(), TensileParameters.defaults());

        assertThat(r.property("E").value()).isBetween(193_000.0, 210_000.0);
        assertThat(r.yielding()).isEqualTo(Yielding.DISCONTINUOUS);
        assertThat(r.property("ReL").value()).isLessThan(r.property("ReH").value());
        assertThat(r.property("Rm").value()).isGreaterThan(r.property("ReL").value());
        // The origin correction removes the 0.002 mm (0.004 % strain) offset: At equals the total
        // strain at fracture minus it, within the noise (0.15 µm / 50 mm = 3e-4 %) — bound 0.002 %.
        double eF = c.extension()[(Integer) r.property("At").evidence().get("fractureIndex")] / 50 * 100;
        assertThat(r.property("At").value()).isCloseTo(eF, org.assertj.core.api.Assertions.within(0.002));
    }
}
