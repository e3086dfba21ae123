package org.specimenledger.demo;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.specimenledger.analysis.CyclicAnalysis;
import org.specimenledger.analysis.CyclicParameters;
import org.specimenledger.analysis.CyclicResult;
import org.specimenledger.analysis.TensileAnalysis;
import org.specimenledger.analysis.TensileParameters;
import org.specimenledger.analysis.TensileResult;
import org.specimenledger.analysis.TensileSpecimen;
import org.specimenledger.analysis.Yielding;
import org.specimenledger.curve.CurveReader;
import org.specimenledger.curve.RawCurve;

/**
 * The demo laboratory's invented curves read and analyse as their models say, so that the first start shows
 * sensible results: each value is checked against the model parameter it comes from.
 */
class DemoCurvesTest {

    private static TensileResult tensile(byte[] file, double s0, double le) {
        RawCurve c = new CurveReader().read(file);
        return TensileAnalysis.analyse(c.forceN(), c.extensionMm(), c.timeS(), new TensileSpecimen(s0, le, le, null, null),
                TensileParameters.defaults());
    }

    @Test
    void structuralSteelYieldsDiscontinuously() {
        TensileResult r = tensile(DemoCurves.structuralSteel(300, 50, "t"), 300, 50);
        assertThat(r.yielding()).isEqualTo(Yielding.DISCONTINUOUS);
        assertThat(r.property("ReH").value()).isCloseTo(398, within(2.0));
        assertThat(r.property("ReL").value()).isCloseTo(370, within(4.0));
        assertThat(r.property("Rm").value()).isCloseTo(528, within(2.0));
        assertThat(r.property("E").value()).isCloseTo(205_000, within(205_000 * 0.02));
        assertThat(r.property("Ae").isDetermined()).isTrue();
        assertThat(r.hasWarning("STRAIN_RATE_OUTSIDE_RANGE")).as(r.warnings().toString()).isFalse();
    }

    @Test
    void alloySteelAndAluminiumYieldContinuously() {
        TensileResult steel = tensile(DemoCurves.alloySteel(78.54, 50, "t"), 78.54, 50);
        assertThat(steel.yielding()).isEqualTo(Yielding.CONTINUOUS);
        // Ramberg & Osgood 1943: the 0.2 % offset proof strength is the model's sigma0.2
        assertThat(steel.property("Rp0.2").value()).isCloseTo(820, within(4.0));
        assertThat(steel.hasWarning("STRAIN_RATE_OUTSIDE_RANGE")).as(steel.warnings().toString()).isFalse();
        TensileResult al = tensile(DemoCurves.aluminiumAlloy(113.1, 50, "t"), 113.1, 50);
        assertThat(al.property("Rp0.2").value()).isCloseTo(292, within(2.0));
        assertThat(al.property("E").value()).isCloseTo(70_000, within(70_000 * 0.03));
        assertThat(al.hasWarning("STRAIN_RATE_OUTSIDE_RANGE")).as(al.warnings().toString()).isFalse();
    }

    @Test
    void brittleCastPieceBreaksBeforeProofStrength() {
        TensileResult r = tensile(DemoCurves.brittleCast(48.6, 25, "t"), 48.6, 25);
        assertThat(r.property("Rp0.2").isDetermined()).isFalse();
        assertThat(r.property("Rm").value()).isCloseTo(195, within(1.5));
    }

    @Test
    void elastomerStripShowsThreeLoopsWithHysteresis() {
        RawCurve c = new CurveReader().read(DemoCurves.elastomerCycles(50, 50, "t"));
        CyclicResult r = CyclicAnalysis.analyse(c.forceN(), c.extensionMm(), CyclicParameters.defaults());
        assertThat(r.cycles()).hasSize(3);
        assertThat(r.cycles().get(0).lossRatioPercent()).isBetween(10.0, 80.0);
        // neo-Hookean peak: G (2 - 1/4) S0 = 1.5 * 1.75 * 50 = 131.25 N at 100 % strain
        assertThat(r.cycles().get(0).peakForceN()).isCloseTo(131.25, within(0.5));
    }
}
