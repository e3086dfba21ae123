package org.specimenledger.analysis;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

/** Parameters as plain data: stable ordered keys and an exact round trip. */
class TensileParametersMapTest {

    @Test
    void defaultsRoundTrip() {
        Map<String, Object> m = TensileParameters.defaults().asMap();
        assertThat(TensileParameters.fromMap(m)).isEqualTo(TensileParameters.defaults());
        assertThat(m.keySet()).startsWith("proofOffsetsPercent", "totalExtensionsPercent").contains("rounding")
                .endsWith("machineComplianceMmPerN", "modulusFromCrosshead", "slopeFromLoop", "loopMinimumDropPercent",
                        "extensometerFreezePoints", "yieldDropMinimumPoints");
        assertThat(m.get("yieldDropPercent")).isEqualTo(0.5);
        assertThat(m.get("uncertainty.forceClassPercent")).isEqualTo(1.0);
        assertThat(m).containsEntry("machineComplianceMmPerN", null);
        assertThat(m).hasSize(37);
    }

    @Test
    void mapStoredBeforeTheRealRecordSettingsStillReads() {
        // tensile/1.0.0 stored 31 keys ending with "rounding"; the settings added later take their defaults
        Map<String, Object> old = new LinkedHashMap<>(TensileParameters.defaults().asMap());
        List.of("machineComplianceMmPerN", "modulusFromCrosshead", "slopeFromLoop", "loopMinimumDropPercent",
                "extensometerFreezePoints", "yieldDropMinimumPoints").forEach(old::remove);
        assertThat(old).hasSize(31);
        assertThat(TensileParameters.fromMap(old)).isEqualTo(TensileParameters.defaults());
    }

    @Test
    void complianceSettingRoundTrips() {
        TensileParameters p = TensileParameters.defaults().toBuilder().machineComplianceMmPerN(2.5e-6)
                .modulusFromCrosshead(true).slopeFromLoop(false).build();
        assertThat(TensileParameters.fromMap(new LinkedHashMap<>(p.asMap()))).isEqualTo(p);
        assertThatThrownBy(() -> TensileParameters.defaults().toBuilder().machineComplianceMmPerN(-1e-6).build())
                .isInstanceOf(AnalysisRejected.class).hasMessageContaining("machineComplianceMmPerN");
    }

    @Test
    void customParametersRoundTripThroughJsonLikeNumbers() {
        TensileParameters p = TensileParameters.defaults().toBuilder()
                .proofOffsetsPercent(List.of(0.1, 0.2, 1.0)).modulusWindow(0.15, 0.5).rounding(RoundingRule.ASTM_PRACTICE)
                .uncertainty(UncertaintyInputs.defaults().withCrossSection(CrossSectionShape.FLAT, 4, 0.005, 20, 0.01))
                .originCorrection(false).build();
        Map<String, Object> m = new LinkedHashMap<>(p.asMap());
        m.put("modulusMaxIterations", 20L); // a JSON reader may give Long or Integer
        m.put("proofOffsetsPercent", List.of(0.1, 0.2, 1)); // and an integer for 1.0
        assertThat(TensileParameters.fromMap(m)).isEqualTo(p);
    }

    @Test
    void unknownKeyIsRejected() {
        Map<String, Object> m = new LinkedHashMap<>(TensileParameters.defaults().asMap());
        m.put("yieldDropPrecent", 0.5);
        assertThatThrownBy(() -> TensileParameters.fromMap(m)).isInstanceOf(AnalysisRejected.class)
                .hasMessageStartingWith("unknown tensile parameter 'yieldDropPrecent'");
    }

    @Test
    void invalidValuesNameTheParameter() {
        assertThatThrownBy(() -> TensileParameters.defaults().withProofOffsetsPercent(0.2, 0.2))
                .hasMessageContaining("proofOffsetsPercent must not repeat");
        assertThatThrownBy(() -> TensileParameters.defaults().toBuilder().modulusWindow(0.5, 0.4).build())
                .hasMessageContaining("0 ≤ lower < upper < 1");
    }
}
