package org.specimenledger.analysis;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;

/**
 * The engine on records shaped like real machine records. Every expected value is a closed form of the
 * model that generated the record (named beside each check), never a figure from this engine.
 */
class RealLaboratoryRecordsTest {

    private static final double E = 200_000;
    private static final double SIGMA02 = 350;
    private static final double N_RO = 12;
    /** Hollomon K = 800 MPa, n = 0.2: Agt = 100·(e^0.2 − 1) = 22.14 % [S: Considère; DOMAIN.md, recomputed]. */
    private static final double K = 800;
    private static final double N_H = 0.2;
    /** A frame of 500 kN/mm: C = 2·10⁻⁶ mm/N (an invented, plausible value). */
    private static final double C = 2e-6;

    private static AnalysisCurves.Curve hollomon() {
        return AnalysisCurves.hollomon(K, N_H, E, 0.0005, 0.35, 20_000);
    }

    // --- item 1: toe region -----------------------------------------------------------------------------

    @Test
    void quadraticToeGivesTheSameRp02AndAgtAsTheCurveWithoutIt() {
        double a = 0.0001; // 5 µm on Le = 50 mm; the foot ends at E·a = 20 MPa, below the fit window (35 MPa)
        TensileResult plain = RealRecordCurves.rambergOsgoodWithToe(E, SIGMA02, N_RO, 0, 0.05, 20_000).analyse();
        TensileResult toe = RealRecordCurves.rambergOsgoodWithToe(E, SIGMA02, N_RO, a, 0.05, 20_000).analyse();

        // Rp0.2 = σ0.2 exactly [S: Ramberg & Osgood 1943]; tolerance 0.5 MPa covers the grid and the fit window
        assertThat(toe.property("Rp0.2").value()).isCloseTo(SIGMA02, within(0.5));
        assertThat(toe.property("Rp0.2").value()).isCloseTo(plain.property("Rp0.2").value(), within(0.05));
        // Agt: both records end at the same stress, so the same total strain from the corrected origin
        assertThat(toe.property("Agt").value()).isCloseTo(plain.property("Agt").value(), within(0.005));
        // the origin moved to where the elastic line meets zero force: x = a by construction of the toe
        assertThat((Double) toe.property("E").evidence().get("originShiftMm")).isCloseTo(a * 50, within(0.0002));
        assertThat(toe.hasWarning("TOE_COMPENSATED")).isTrue();
        assertThat(plain.hasWarning("TOE_COMPENSATED")).isFalse();
    }

    @Test
    void toeIsNotReportedWithoutOriginCorrection() {
        TensileResult r = RealRecordCurves.rambergOsgoodWithToe(E, SIGMA02, N_RO, 0.0001, 0.05, 20_000)
                .analyse(TensileParameters.defaults().toBuilder().originCorrection(false).build());
        assertThat(r.hasWarning("TOE_COMPENSATED")).isFalse();
    }

    // --- item 2: extensometer removed -------------------------------------------------------------------

    @Test
    void extensometerStoppingAt2PercentReproducesAtAndAgtOfTheFullRecord() {
        AnalysisCurves.Curve full = hollomon();
        TensileResult whole = full.analyse();
        double[] head = RealRecordCurves.crosshead(full, C, 3.7);
        double[] removed = RealRecordCurves.removedAfter(full, 0.02);

        TensileResult r = TensileAnalysis.analyse(full.force(), removed, full.time(), head, full.specimen(),
                TensileParameters.defaults());

        // crosshead = extension + C·F exactly [CP, series spring], so the corrected crosshead is the extension:
        // At and Agt equal the full record's to rounding error (tolerance 0.001 % of Le)
        assertThat(r.property("Agt").value()).isCloseTo(whole.property("Agt").value(), within(0.001));
        assertThat(r.property("At").value()).isCloseTo(whole.property("At").value(), within(0.001));
        // and Ag is still the Considère value 100·(e^n − 1) = 22.14 % [S: Considère], within the 0.15 % that the
        // 0.1 % flat-maximum rule moves it (HollomonUniformElongationTest explains the plateau asymmetry)
        assertThat(r.property("Ag").value()).isCloseTo(100 * Math.expm1(N_H), within(0.15));
        // properties before the removal are the extensometer's, bit for bit
        assertThat(r.property("E").value()).isEqualTo(whole.property("E").value());
        assertThat(r.property("Rp0.2").value()).isEqualTo(whole.property("Rp0.2").value());
        assertThat(r.property("Agt").evidence()).containsEntry("extensionSource", ExtensionSource.FROM_CROSSHEAD);
        assertThat(r.property("At").evidence()).containsEntry("extensionSource", ExtensionSource.FROM_CROSSHEAD);
        assertThat(r.property("Rp0.2").evidence()).doesNotContainKey("extensionSource");
        assertThat(r.hasWarning("EXTENSOMETER_REMOVED")).isTrue();
        AnalysisWarning w = r.warnings().stream().filter(x -> x.code().equals("EXTENSOMETER_REMOVED")).findFirst()
                .orElseThrow();
        assertThat(w.message()).contains("elastic part of both channels");
    }

    @Test
    void complianceFromTheElasticPartOfBothChannelsIsTheSpringInSeries() {
        AnalysisCurves.Curve full = hollomon();
        CurveArrays c = CurveArrays.validated(full.force(), RealRecordCurves.removedAfter(full, 0.02), full.time(),
                RealRecordCurves.crosshead(full, C, 0), full.specimen(), TensileParameters.defaults());
        assertThat(c.source.kind()).isEqualTo(ExtensionSource.Kind.SWITCHED_TO_CROSSHEAD);
        assertThat(c.source.complianceMmPerN()).isCloseTo(C, within(C * 1e-6));
        assertThat(c.source.scale()).isCloseTo(1, within(1e-9));
    }

    @Test
    void frozenExtensometerIsTreatedAsRemoved() {
        AnalysisCurves.Curve full = hollomon();
        TensileResult whole = full.analyse();
        TensileResult r = TensileAnalysis.analyse(full.force(), RealRecordCurves.frozenAfter(full, 0.02), full.time(),
                RealRecordCurves.crosshead(full, C, 0), full.specimen(), TensileParameters.defaults());
        assertThat(r.hasWarning("EXTENSOMETER_FROZEN")).isTrue();
        assertThat(r.property("At").value()).isCloseTo(whole.property("At").value(), within(0.001));
        assertThat(r.property("Agt").value()).isCloseTo(whole.property("Agt").value(), within(0.001));
    }

    @Test
    void frozenExtensometerWithoutCrossheadIsWarnedAbout() {
        AnalysisCurves.Curve full = hollomon();
        TensileResult r = TensileAnalysis.analyse(full.force(), RealRecordCurves.frozenAfter(full, 0.02), full.time(),
                null, full.specimen(), TensileParameters.defaults());
        assertThat(r.hasWarning("EXTENSOMETER_FROZEN")).isTrue();
    }

    @Test
    void complianceFromAnEquipmentSettingIsUsedAsGiven() {
        AnalysisCurves.Curve full = hollomon();
        TensileResult whole = full.analyse();
        TensileParameters p = TensileParameters.defaults().toBuilder().machineComplianceMmPerN(C).build();
        TensileResult r = TensileAnalysis.analyse(full.force(), RealRecordCurves.removedAfter(full, 0.02), full.time(),
                RealRecordCurves.crosshead(full, C, 1.0), full.specimen(), p);
        assertThat(r.property("At").value()).isCloseTo(whole.property("At").value(), within(0.001));
        assertThat(r.warnings()).anyMatch(w -> w.message().contains("equipment setting"));
    }

    @Test
    void extensometerThatResumesIsRefused() {
        AnalysisCurves.Curve full = hollomon();
        double[] x = RealRecordCurves.removedAfter(full, 0.02);
        x[x.length - 1] = 1.0;
        assertThatThrownBy(() -> TensileAnalysis.analyse(full.force(), x, full.time(),
                RealRecordCurves.crosshead(full, C, 0), full.specimen(), TensileParameters.defaults()))
                .isInstanceOf(AnalysisRejected.class).hasMessageContaining("may not resume");
    }

    @Test
    void removedExtensometerWithoutCrossheadIsRefused() {
        AnalysisCurves.Curve full = hollomon();
        assertThatThrownBy(() -> TensileAnalysis.analyse(full.force(), RealRecordCurves.removedAfter(full, 0.02),
                full.time(), full.specimen(), TensileParameters.defaults())).isInstanceOf(AnalysisRejected.class)
                .hasMessageContaining("must be finite");
    }

    // --- item 3: crosshead only -------------------------------------------------------------------------

    @Test
    void crossheadOnlyRecordGivesComplianceCorrectedStrainAndNoModulus() {
        AnalysisCurves.Curve full = hollomon();
        TensileResult whole = full.analyse();
        TensileParameters p = TensileParameters.defaults().toBuilder().machineComplianceMmPerN(C).build();
        double[] head = RealRecordCurves.crosshead(full, C, 12.5);

        TensileResult r = TensileAnalysis.analyse(full.force(), null, full.time(), head, full.specimen(), p);

        assertThat(r.property("E").status()).isEqualTo(PropertyStatus.NOT_DETERMINABLE);
        assertThat(r.property("E").reason()).contains("not determinable from crosshead data");
        // corrected crosshead = extension exactly [CP, series spring]: the same Agt, At and Rp0.2
        assertThat(r.property("Agt").value()).isCloseTo(whole.property("Agt").value(), within(0.001));
        assertThat(r.property("At").value()).isCloseTo(whole.property("At").value(), within(0.001));
        assertThat(r.property("Rp0.2").value()).isCloseTo(whole.property("Rp0.2").value(), within(0.01));
        assertThat(r.hasWarning("CROSSHEAD_ONLY")).isTrue();
        assertThat(r.property("At").evidence()).containsEntry("extensionSource", ExtensionSource.FROM_CROSSHEAD);

        TensileResult asked = TensileAnalysis.analyse(full.force(), null, full.time(), head, full.specimen(),
                p.toBuilder().modulusFromCrosshead(true).build());
        assertThat(asked.property("E").value()).isCloseTo(E, within(E * 0.001));
    }

    @Test
    void crossheadOnlyWithoutComplianceSettingWarnsThatMachineDeflectionIsIncluded() {
        AnalysisCurves.Curve full = hollomon();
        TensileResult r = TensileAnalysis.analyse(full.force(), null, full.time(), RealRecordCurves.crosshead(full, C, 0),
                full.specimen(), TensileParameters.defaults().toBuilder().modulusFromCrosshead(true).build());
        assertThat(r.hasWarning("COMPLIANCE_NOT_GIVEN")).isTrue();
        // apparent slope of a spring in series: 1/(1/E + C·S0/Le) [CP, textbook]
        double apparent = 1 / (1 / E + C * 100 / 50);
        assertThat(r.property("E").value()).isCloseTo(apparent, within(apparent * 0.001));
    }

    // --- item 4: unload–reload loop ---------------------------------------------------------------------

    @Test
    void oneUnloadReloadLoopGivesEAndRp02FromTheLoop() {
        // the toe (shift 0.04 %, foot up to 80 MPa) reaches into the fit window, so the first loading is unclear
        AnalysisCurves.Curve c = RealRecordCurves.rambergOsgoodWithLoop(E, SIGMA02, N_RO, 0.0004, 380, 38, 0.05, 20_000);
        TensileResult r = c.analyse();
        TensileResult firstLoading = c.analyse(TensileParameters.defaults().toBuilder().slopeFromLoop(false).build());

        // the loop is a line of slope E by construction: E within 0.1 %
        assertThat(r.property("E").value()).isCloseTo(E, within(E * 0.001));
        assertThat(r.property("E").evidence()).containsKeys("loopUnloadIndex", "loopRejoinIndex", "reloadingFit");
        // Rp0.2 = σ0.2 [S: Ramberg & Osgood 1943], tolerance 1 MPa
        assertThat(r.property("Rp0.2").value()).isCloseTo(SIGMA02, within(1.0));
        assertThat(r.property("Rp0.2").evidence()).containsEntry("lineSlopeSource", "unload-reload loop");
        // without the loop the slope from the curved first loading is off by more than 1 %
        assertThat(Math.abs(firstLoading.property("E").value() - E)).isGreaterThan(0.01 * E);
        // the loop is not a yield drop and not the maximum
        assertThat(r.yielding()).isEqualTo(Yielding.CONTINUOUS);
        assertThat(r.property("ReH").status()).isEqualTo(PropertyStatus.NOT_APPLICABLE);
        assertThat((Integer) r.property("Fm").evidence().get("index"))
                .isGreaterThan((Integer) r.property("E").evidence().get("loopRejoinIndex"));
        assertThat(r.hasWarning("UNLOAD_RELOAD_LOOP")).isTrue();
    }

    @Test
    void loopDoesNotChangeAgtOrRm() {
        AnalysisCurves.Curve loop = RealRecordCurves.rambergOsgoodWithLoop(E, SIGMA02, N_RO, 0, 380, 38, 0.05, 20_000);
        AnalysisCurves.Curve none = RealRecordCurves.rambergOsgoodWithToe(E, SIGMA02, N_RO, 0, 0.05, 20_000);
        TensileResult a = loop.analyse();
        TensileResult b = none.analyse();
        assertThat(a.property("Rm").value()).isCloseTo(b.property("Rm").value(), within(1e-9));
        assertThat(a.property("Agt").value()).isCloseTo(b.property("Agt").value(), within(0.005));
    }

    @Test
    void noiseAroundZeroForceIsNotALoop() {
        // 20 N force noise and 0.2 µm extension noise make the first points go up and down at near-zero force
        TensileResult r = AnalysisCurves.rambergOsgood(E, SIGMA02, 10, 0.02, 4000).withNoise(3, 20, 0.0002).analyse();
        assertThat(r.hasWarning("UNLOAD_RELOAD_LOOP")).isFalse();
        assertThat(r.hasWarning("TOE_COMPENSATED")).isFalse();
    }

    // --- item 5: data quality ---------------------------------------------------------------------------

    @Test
    void duplicatedTimeStampsAreWarnedWithTheFirstIndex() {
        AnalysisCurves.Curve c = hollomon();
        double[] t = c.time().clone();
        t[101] = t[100];
        TensileResult r = TensileAnalysis.analyse(c.force(), c.extension(), t, c.specimen(), TensileParameters.defaults());
        assertThat(r.warnings()).anyMatch(w -> w.code().equals("DUPLICATED_TIME_STAMPS") && w.message().contains("101"));
        assertThat(c.analyse().hasWarning("DUPLICATED_TIME_STAMPS")).isFalse();
    }

    @Test
    void coarseForceResolutionIsWarned() {
        AnalysisCurves.Curve c = AnalysisCurves.rambergOsgood(E, SIGMA02, 10, 0.05, 20_000);
        double[] f = c.force().clone();
        for (int i = 0; i < f.length; i++) {
            f[i] = Math.round(f[i] / 300) * 300.0; // 300 N steps: 0.86 % of the 35 kN proof force, class 1 allows 0.5 %
        }
        TensileResult r = TensileAnalysis.analyse(f, c.extension(), c.time(), c.specimen(), TensileParameters.defaults());
        assertThat(r.hasWarning("FORCE_RESOLUTION_COARSE")).isTrue();
        assertThat(c.analyse().hasWarning("FORCE_RESOLUTION_COARSE")).isFalse();
    }

    @Test
    void clippedForceChannelIsWarned() {
        AnalysisCurves.Curve c = hollomon();
        double[] f = c.force().clone();
        double cap = 0.98 * c.analyse().property("Fm").value();
        for (int j = 0; j < f.length; j++) {
            f[j] = Math.min(f[j], cap); // an amplifier saturating at 98 % of the true maximum
        }
        TensileResult r = TensileAnalysis.analyse(f, c.extension(), c.time(), c.specimen(), TensileParameters.defaults());
        assertThat(r.hasWarning("FORCE_CLIPPED")).isTrue();
        assertThat(c.analyse().hasWarning("FORCE_CLIPPED")).isFalse();
    }

    @Test
    void upperYieldDropResolvedByTooFewPointsIsWarned() {
        double eL = 0.0185 + 0.002 * 4;
        AnalysisCurves.Curve sparse = AnalysisCurves.discontinuous(E, 380, 340, 355, 1.5, 0.002, eL, 150, 0.05, 0.25,
                4_000);
        AnalysisCurves.Curve dense = AnalysisCurves.discontinuous(E, 380, 340, 355, 1.5, 0.002, eL, 150, 0.05, 0.25,
                25_000);
        TensileResult r = sparse.analyse();
        assertThat(r.yielding()).isEqualTo(Yielding.DISCONTINUOUS);
        assertThat(r.hasWarning("YIELD_DROP_UNDER_SAMPLED")).isTrue();
        assertThat(dense.analyse().hasWarning("YIELD_DROP_UNDER_SAMPLED")).isFalse();
    }
}
