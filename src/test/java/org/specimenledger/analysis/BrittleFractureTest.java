package org.specimenledger.analysis;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;

/** A linear curve to fracture (brittle): no yielding [S: ISO 6892 Rp needs 0.2 % plastic extension]. */
class BrittleFractureTest {

    @Test
    void brittleCurveHasNoProofStrength() {
        AnalysisCurves.Curve c = AnalysisCurves.linear(70_000, 0.004, 2000);
        TensileResult r = c.analyse();

        assertThat(r.yielding()).isEqualTo(Yielding.NONE);
        assertThat(r.property("Rp0.2").status()).isEqualTo(PropertyStatus.NOT_DETERMINABLE);
        assertThat(r.property("Rp0.2").reason()).isEqualTo("fracture before 0.2 % plastic extension");
        assertThat(r.property("ReH").status()).isEqualTo(PropertyStatus.NOT_APPLICABLE);
        // Rm = Fmax/S0 [S], Fmax = 70 000 MPa × 0.004 × 100 mm² exactly at the last point before the drop.
        double fmax = c.force()[1999];
        assertThat(r.property("Rm").value()).isEqualTo(fmax / 100);
        assertThat(r.property("Rm").value()).isCloseTo(280, within(1e-9));
        assertThat(r.property("At").value()).isCloseTo(0.4, within(1e-9));
        // A from the extensometer with the elastic part removed: zero plastic strain at fracture.
        assertThat(r.property("A").value()).isCloseTo(0, within(1e-9));
        assertThat(r.property("A").reason()).isEqualTo("from extensometer, elastic part removed");
        assertThat(r.property("Welastic").status()).isEqualTo(PropertyStatus.NOT_DETERMINABLE);
    }
}
