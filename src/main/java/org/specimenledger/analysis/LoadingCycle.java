package org.specimenledger.analysis;

/**
 * One loading–unloading cycle. Energies are ∫F dx by the trapezoidal rule in J (N·mm / 1000);
 * definitions [CP, DOMAIN.md "Energy"]: the hysteresis (dissipated) energy is the area between the
 * loading and unloading branches, the loss ratio 100·(W_load − W_return)/W_load.
 *
 * @param number 1-based cycle number
 * @param startIndex first point of the loading branch (a turning point of extension, or the start)
 * @param peakIndex turning point at the largest extension of the cycle (end of loading)
 * @param endIndex end of the unloading branch (the next turning point, or the lowest extension
 *     reached when the record ends while unloading)
 * @param peakForceN force at the peak point, N
 * @param peakExtensionMm extension at the peak point, mm
 * @param loadingEnergyJ ∫F dx over the loading branch, J
 * @param returnedEnergyJ −∫F dx over the unloading branch (positive when the piece pushes back), J
 * @param hysteresisEnergyJ loading − returned, J
 * @param lossRatioPercent 100·hysteresis/loading in %; NaN when the loading energy is not positive
 * @param residualExtensionMm extension where the unloading force first falls to the residual
 *     threshold (linearly interpolated), or the extension at the end of unloading if it never does, mm
 * @param residualAtZeroForce true when the threshold was reached, false when the end of unloading was used
 */
public record LoadingCycle(int number, int startIndex, int peakIndex, int endIndex, double peakForceN,
        double peakExtensionMm, double loadingEnergyJ, double returnedEnergyJ, double hysteresisEnergyJ,
        double lossRatioPercent, double residualExtensionMm, boolean residualAtZeroForce) {
}
