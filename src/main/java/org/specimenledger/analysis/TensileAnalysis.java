package org.specimenledger.analysis;

/**
 * Recomputes the tensile properties of one test from its raw force–extension record, to ISO 6892-1
 * (clauses and confidence marks on each algorithm class and on {@link TensileParameters}).
 *
 * <p>Steps, each documented where it is implemented: stress R = F/S0 (MPa) and strain e = ΔL/Le;
 * fracture point ({@code FracturePoint}); upper yield point by the digitised rule
 * ({@code UpperYieldPoint}); elastic slope mE by iterated least squares ({@code ElasticSlope});
 * yielding classification; Rp by the parallel-line method ({@code OffsetIntersection}); Rt; Fm and Rm;
 * Agt and Ag at the middle of a flat maximum; ReL and Ae ({@code YieldRange}); At, A, Z; work W to
 * fracture (trapezoidal rule) and elastic energy at the proof point; strain rates per phase
 * ({@code StrainRates}); expanded uncertainties ({@code StrengthUncertainty}).
 *
 * <p>Units: E and strengths in MPa (E is the slope of stress on strain as a fraction, so steel gives
 * about 2.1·10⁵ MPa), Fm in N, elongations and Z in % , energies in J.
 *
 * <p>Deterministic: no clock, randomness, logging, I/O or parallelism; the same arrays and parameters
 * give bit-identical results. Memory: two temporary double[n] (stress and strain), no per-point
 * objects; every pass is O(n) and searches stop at the first hit.
 */
public final class TensileAnalysis {

    /**
     * Version of the tensile method. It must change whenever any algorithm, default parameter or
     * rounding rule changes, so a stored result can always be traced to the code that produced it.
     */
    public static final String METHOD_VERSION = "tensile/1.1.0";

    private TensileAnalysis() {
    }

    /**
     * Analyses one tensile record.
     *
     * @param forceN force in N, finite, same length as {@code extensionMm}, at least
     *     {@code p.minimumPoints()} points; not modified
     * @param extensionMm extensometer extension ΔL over Le in mm, finite; not modified
     * @param timeS time in s, finite and non-decreasing, or {@code null} (strain rates then not
     *     determinable); not modified
     * @param specimen the test piece's geometry
     * @param p parameters; {@link TensileParameters#defaults()} for ISO 6892-1 defaults
     * @return the result with every property key present and a status for each
     * @throws AnalysisRejected when the arrays or specimen are invalid (null, different lengths, too
     *     few points, NaN or infinite values, decreasing time); the message names the bad value
     */
    public static TensileResult analyse(double[] forceN, double[] extensionMm, double[] timeS,
            TensileSpecimen specimen, TensileParameters p) {
        if (p == null) {
            throw new AnalysisRejected("parameters are required");
        }
        return analyse(forceN, extensionMm, timeS, null, specimen, p);
    }

    /**
     * Analyses one tensile record that may carry a crosshead channel beside the extensometer: when the
     * extensometer stops (its values end in NaN, or it freezes) the extension continues from the
     * crosshead with the machine compliance removed; with no extensometer at all the strains come from
     * the crosshead alone (see {@code ExtensionSource}; warnings and evidence say which points did).
     *
     * @param forceN force in N, finite
     * @param extensionMm extensometer extension over Le in mm: finite, or ending in NaN from the point the
     *     extensometer was removed (only with a crosshead), or {@code null} for a crosshead-only record
     * @param timeS time in s or {@code null}
     * @param crossheadMm crosshead (machine) displacement in mm, finite, or {@code null}
     * @param specimen the test piece's geometry
     * @param p parameters
     * @return the result
     * @throws AnalysisRejected as {@link #analyse(double[], double[], double[], TensileSpecimen,
     *     TensileParameters)}, and when neither extension nor crosshead is given or a removed extensometer
     *     resumes
     */
    public static TensileResult analyse(double[] forceN, double[] extensionMm, double[] timeS, double[] crossheadMm,
            TensileSpecimen specimen, TensileParameters p) {
        if (p == null) {
            throw new AnalysisRejected("parameters are required");
        }
        CurveArrays c = CurveArrays.validated(forceN, extensionMm, timeS, crossheadMm, specimen, p);
        return new TensileRun(c, specimen, p).run();
    }
}
