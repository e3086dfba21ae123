package org.specimenledger.analysis;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;

/** Strain rate per phase against ISO 6892-1 method A ranges [M, DOMAIN.md: values ± 20 %]. */
class StrainRateTest {

    @Test
    void constantRateRecordIsMeasuredExactly() {
        // Time is extension/(Le·0.00025): the least-squares slope is 0.00025 s⁻¹ to rounding.
        TensileResult r = AnalysisCurves.rambergOsgood(200_000, 300, 10, 0.02, 4000).analyse();
        StrainRateCheck elastic = r.strainRates().get(0);
        assertThat(elastic.phase()).isEqualTo(StrainRatePhase.ELASTIC);
        assertThat(elastic.measuredPerS()).isCloseTo(0.00025, within(1e-12));
        assertThat(elastic.withinRange()).isTrue();
        assertThat(elastic.lowerPerS()).isCloseTo(0.0002, within(1e-15));
        assertThat(elastic.upperPerS()).isCloseTo(0.0003, within(1e-15));
        // The same rate to Fm is far below range 4 (0.0067 s⁻¹ ± 20 %).
        StrainRateCheck hardening = r.strainRates().get(2);
        assertThat(hardening.withinRange()).isFalse();
        assertThat(hardening.nominalPerS()).isEqualTo(0.0067);
        assertThat(r.hasWarning("STRAIN_RATE_OUTSIDE_RANGE")).isTrue();
        assertThat(r.strainRates().get(1).status()).isEqualTo(PropertyStatus.NOT_APPLICABLE);
    }

    @Test
    void noTimeChannelMeansNotDeterminable() {
        TensileResult r = AnalysisCurves.rambergOsgood(200_000, 300, 10, 0.02, 4000).withoutTime().analyse();
        assertThat(r.strainRates()).allSatisfy(s -> {
            assertThat(s.status()).isNotEqualTo(PropertyStatus.DETERMINED);
            assertThat(s.measuredPerS()).isNaN();
        });
        assertThat(r.strainRates().get(0).reason()).isEqualTo("no time channel in the record");
    }

    @Test
    void yieldPhaseAcceptsRangeTwoOrThree() {
        AnalysisCurves.Curve c = AnalysisCurves.discontinuous(205_000, 380, 340, 355, 1.5, 0.002,
                380 / 205_000.0 + 0.0009 + 0.016, 150, 0.05, 0.25, 25_000);
        double[] t = new double[c.time().length];
        for (int i = 0; i < t.length; i++) {
            t[i] = c.extension()[i] / 50 / 0.002; // 0.002 s⁻¹ throughout: range 3
        }
        TensileResult r = TensileAnalysis.analyse(c.force(), c.extension(), t, c.specimen(), TensileParameters.defaults());
        StrainRateCheck yield = r.strainRates().get(1);
        assertThat(yield.status()).isEqualTo(PropertyStatus.DETERMINED);
        assertThat(yield.nominalPerS()).isEqualTo(0.002);
        assertThat(yield.withinRange()).isTrue();
        assertThat(r.strainRates().get(0).withinRange()).isFalse();
    }
}
