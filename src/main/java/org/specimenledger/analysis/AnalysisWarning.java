package org.specimenledger.analysis;

/**
 * Something a reviewer should look at; the values are still reported.
 *
 * @param code stable upper-case code, e.g. "ELASTIC_FIT_POOR", for filtering and translation
 * @param message human-readable explanation with the values concerned
 */
public record AnalysisWarning(String code, String message) {

    /** Requires both parts. */
    public AnalysisWarning {
        if (code == null || message == null) {
            throw new IllegalArgumentException("code and message are required");
        }
    }
}
