package org.specimenledger.analysis;

import java.util.List;

/**
 * Mutable builder for {@link TensileParameters}; each setter names the component it sets (see the
 * record for units, ranges and sources). Validation happens in {@link #build()}.
 */
public final class TensileParametersBuilder {
    List<Double> proofOffsetsPercent;
    List<Double> totalExtensionsPercent;
    double modulusWindowLowerFraction;
    double modulusWindowUpperFraction;
    int modulusMaxIterations;
    int modulusMinimumPoints;
    double modulusMinimumRSquared;
    boolean originCorrection;
    double yieldDropPercent;
    double yieldHoldStrainPercent;
    double turningPointHysteresisPercent;
    double fractureDropPercentOfFmax;
    int fractureDropWindowPoints;
    double fractureFallbackPercentOfFmax;
    double flatMaximumTolerancePercent;
    int minimumPoints;
    List<Double> elasticStrainRatesPerS;
    List<Double> yieldStrainRatesPerS;
    List<Double> hardeningStrainRatesPerS;
    double strainRateTolerancePercent;
    UncertaintyInputs uncertainty;
    RoundingRule rounding;
    Double machineComplianceMmPerN;
    boolean modulusFromCrosshead;
    boolean slopeFromLoop;
    double loopMinimumDropPercent;
    int extensometerFreezePoints;
    int yieldDropMinimumPoints;

    TensileParametersBuilder(TensileParameters p) {
        proofOffsetsPercent = p.proofOffsetsPercent();
        totalExtensionsPercent = p.totalExtensionsPercent();
        modulusWindowLowerFraction = p.modulusWindowLowerFraction();
        modulusWindowUpperFraction = p.modulusWindowUpperFraction();
        modulusMaxIterations = p.modulusMaxIterations();
        modulusMinimumPoints = p.modulusMinimumPoints();
        modulusMinimumRSquared = p.modulusMinimumRSquared();
        originCorrection = p.originCorrection();
        yieldDropPercent = p.yieldDropPercent();
        yieldHoldStrainPercent = p.yieldHoldStrainPercent();
        turningPointHysteresisPercent = p.turningPointHysteresisPercent();
        fractureDropPercentOfFmax = p.fractureDropPercentOfFmax();
        fractureDropWindowPoints = p.fractureDropWindowPoints();
        fractureFallbackPercentOfFmax = p.fractureFallbackPercentOfFmax();
        flatMaximumTolerancePercent = p.flatMaximumTolerancePercent();
        minimumPoints = p.minimumPoints();
        elasticStrainRatesPerS = p.elasticStrainRatesPerS();
        yieldStrainRatesPerS = p.yieldStrainRatesPerS();
        hardeningStrainRatesPerS = p.hardeningStrainRatesPerS();
        strainRateTolerancePercent = p.strainRateTolerancePercent();
        uncertainty = p.uncertainty();
        rounding = p.rounding();
        machineComplianceMmPerN = p.machineComplianceMmPerN();
        modulusFromCrosshead = p.modulusFromCrosshead();
        slopeFromLoop = p.slopeFromLoop();
        loopMinimumDropPercent = p.loopMinimumDropPercent();
        extensometerFreezePoints = p.extensometerFreezePoints();
        yieldDropMinimumPoints = p.yieldDropMinimumPoints();
    }

    /** @param v offsets in % @return this builder */
    public TensileParametersBuilder proofOffsetsPercent(List<Double> v) { proofOffsetsPercent = v; return this; }
    /** @param v total extensions in % @return this builder */
    public TensileParametersBuilder totalExtensionsPercent(List<Double> v) { totalExtensionsPercent = v; return this; }
    /** @param lower fraction @param upper fraction @return this builder */
    public TensileParametersBuilder modulusWindow(double lower, double upper) {
        modulusWindowLowerFraction = lower;
        modulusWindowUpperFraction = upper;
        return this;
    }
    /** @param v iterations @return this builder */
    public TensileParametersBuilder modulusMaxIterations(int v) { modulusMaxIterations = v; return this; }
    /** @param v points @return this builder */
    public TensileParametersBuilder modulusMinimumPoints(int v) { modulusMinimumPoints = v; return this; }
    /** @param v R² threshold @return this builder */
    public TensileParametersBuilder modulusMinimumRSquared(double v) { modulusMinimumRSquared = v; return this; }
    /** @param v whether to correct the origin @return this builder */
    public TensileParametersBuilder originCorrection(boolean v) { originCorrection = v; return this; }
    /** @param v % of the maximum @return this builder */
    public TensileParametersBuilder yieldDropPercent(double v) { yieldDropPercent = v; return this; }
    /** @param v % strain @return this builder */
    public TensileParametersBuilder yieldHoldStrainPercent(double v) { yieldHoldStrainPercent = v; return this; }
    /** @param v % of FeH @return this builder */
    public TensileParametersBuilder turningPointHysteresisPercent(double v) { turningPointHysteresisPercent = v; return this; }
    /** @param v % of Fmax @return this builder */
    public TensileParametersBuilder fractureDropPercentOfFmax(double v) { fractureDropPercentOfFmax = v; return this; }
    /** @param v points @return this builder */
    public TensileParametersBuilder fractureDropWindowPoints(int v) { fractureDropWindowPoints = v; return this; }
    /** @param v % of Fmax @return this builder */
    public TensileParametersBuilder fractureFallbackPercentOfFmax(double v) { fractureFallbackPercentOfFmax = v; return this; }
    /** @param v % of Fm @return this builder */
    public TensileParametersBuilder flatMaximumTolerancePercent(double v) { flatMaximumTolerancePercent = v; return this; }
    /** @param v points @return this builder */
    public TensileParametersBuilder minimumPoints(int v) { minimumPoints = v; return this; }
    /** @param v rates in s⁻¹ @return this builder */
    public TensileParametersBuilder elasticStrainRatesPerS(List<Double> v) { elasticStrainRatesPerS = v; return this; }
    /** @param v rates in s⁻¹ @return this builder */
    public TensileParametersBuilder yieldStrainRatesPerS(List<Double> v) { yieldStrainRatesPerS = v; return this; }
    /** @param v rates in s⁻¹ @return this builder */
    public TensileParametersBuilder hardeningStrainRatesPerS(List<Double> v) { hardeningStrainRatesPerS = v; return this; }
    /** @param v % @return this builder */
    public TensileParametersBuilder strainRateTolerancePercent(double v) { strainRateTolerancePercent = v; return this; }
    /** @param v inputs @return this builder */
    public TensileParametersBuilder uncertainty(UncertaintyInputs v) { uncertainty = v; return this; }
    /** @param v rule set @return this builder */
    public TensileParametersBuilder rounding(RoundingRule v) { rounding = v; return this; }
    /** @param v compliance in mm/N, or null @return this builder */
    public TensileParametersBuilder machineComplianceMmPerN(Double v) { machineComplianceMmPerN = v; return this; }
    /** @param v whether crosshead-only records report E @return this builder */
    public TensileParametersBuilder modulusFromCrosshead(boolean v) { modulusFromCrosshead = v; return this; }
    /** @param v whether a loop sets mE @return this builder */
    public TensileParametersBuilder slopeFromLoop(boolean v) { slopeFromLoop = v; return this; }
    /** @param v % of the force at unloading @return this builder */
    public TensileParametersBuilder loopMinimumDropPercent(double v) { loopMinimumDropPercent = v; return this; }
    /** @param v points @return this builder */
    public TensileParametersBuilder extensometerFreezePoints(int v) { extensometerFreezePoints = v; return this; }
    /** @param v points @return this builder */
    public TensileParametersBuilder yieldDropMinimumPoints(int v) { yieldDropMinimumPoints = v; return this; }

    /**
     * Builds and validates.
     *
     * @return the parameters
     * @throws AnalysisRejected naming the first invalid value
     */
    public TensileParameters build() {
        return new TensileParameters(proofOffsetsPercent, totalExtensionsPercent, modulusWindowLowerFraction,
                modulusWindowUpperFraction, modulusMaxIterations, modulusMinimumPoints, modulusMinimumRSquared,
                originCorrection, yieldDropPercent, yieldHoldStrainPercent, turningPointHysteresisPercent,
                fractureDropPercentOfFmax, fractureDropWindowPoints, fractureFallbackPercentOfFmax,
                flatMaximumTolerancePercent, minimumPoints, elasticStrainRatesPerS, yieldStrainRatesPerS,
                hardeningStrainRatesPerS, strainRateTolerancePercent, uncertainty, rounding, machineComplianceMmPerN,
                modulusFromCrosshead, slopeFromLoop, loopMinimumDropPercent, extensometerFreezePoints,
                yieldDropMinimumPoints);
    }
}
