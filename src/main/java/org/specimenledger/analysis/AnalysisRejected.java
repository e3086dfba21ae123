package org.specimenledger.analysis;

/**
 * Thrown when the input to an analysis cannot be analysed at all: arrays of different length, too
 * few points, a non-finite value, a non-positive specimen dimension or an invalid parameter. The
 * message names the bad value (array and index, or field and value) so the caller can show it as is.
 *
 * <p>A curve that can be analysed but from which a property cannot be found (for example fracture
 * before the 0.2 % offset) is not rejected: that property gets {@link PropertyStatus#NOT_DETERMINABLE}.
 */
public class AnalysisRejected extends IllegalArgumentException {

    private static final long serialVersionUID = 1L;

    /**
     * Creates the rejection.
     *
     * @param message what is wrong, naming the bad value
     */
    public AnalysisRejected(String message) {
        super(message);
    }
}
