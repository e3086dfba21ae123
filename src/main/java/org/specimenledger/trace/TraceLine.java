package org.specimenledger.trace;

import java.util.Objects;
import java.util.UUID;

/**
 * One line to trace: what the root calls it (a certificate line's label, a specimen's identifier) and
 * the analysis run whose values it reports.
 */
public record TraceLine(String label, UUID analysisId) {

    public TraceLine {
        Objects.requireNonNull(label, "label");
        Objects.requireNonNull(analysisId, "analysisId");
    }
}
