package org.specimenledger.testing;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.specimenledger.analysis.TensileAnalysis;
import org.specimenledger.analysis.TensileParameters;
import org.specimenledger.analysis.TensileResult;
import org.specimenledger.analysis.TensileSpecimen;
import org.specimenledger.curve.CurveReader;
import org.specimenledger.curve.CurveReadingLimits;
import org.specimenledger.curve.RawCurve;

/** The warm-up's generated record goes through the same reader and engine paths an upload does. */
class IntakeWarmUpTest {

    @Test
    void theWarmUpRecordIsReadAndAnalysedEndToEnd() {
        RawCurve raw = new CurveReader(new CurveReadingLimits(64L << 20, 20)).read(IntakeWarmUp.curve());
        assertThat(raw.size()).isEqualTo(300_001);
        TensileResult r = TensileAnalysis.analyse(raw.forceN(), raw.extensionMm(), raw.timeS(),
                new TensileSpecimen(100, 50, 50, null, null), TensileParameters.defaults());
        // the generator's maximum: 300·(0.15/0.0015)^0.09 MPa (its own closed form)
        assertThat(r.property("Rm").value()).isCloseTo(300 * Math.pow(100, 0.09), within(0.5));
        assertThat(r.property("E").value()).isCloseTo(200_000, within(2_000.0));
    }
}
