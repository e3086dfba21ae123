package org.specimenledger.analysis;

import java.util.List;

/**
 * The outcome of a loading–unloading analysis.
 *
 * @param methodVersion {@link CyclicAnalysis#METHOD_VERSION}
 * @param parameters the parameters used
 * @param turningPoints indices of the accepted turning points of extension, in order (start, peak,
 *     valley, peak, …)
 * @param cycles the complete cycles, in order
 * @param warnings e.g. an incomplete last cycle
 */
public record CyclicResult(String methodVersion, CyclicParameters parameters, List<Integer> turningPoints,
        List<LoadingCycle> cycles, List<AnalysisWarning> warnings) {

    /** Freezes the lists. */
    public CyclicResult {
        turningPoints = List.copyOf(turningPoints);
        cycles = List.copyOf(cycles);
        warnings = List.copyOf(warnings);
    }
}
