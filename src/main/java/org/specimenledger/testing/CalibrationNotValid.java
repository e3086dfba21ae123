package org.specimenledger.testing;

import java.util.List;
import java.util.stream.Collectors;

/**
 * A test run refused by the calibration gate: which instruments fail and why. 422; a lab manager may
 * accept the run anyway with a written {@code calibrationOverrideReason}.
 */
public class CalibrationNotValid extends RuntimeException {

    private final List<CalibrationGate.Finding> findings;

    CalibrationNotValid(List<CalibrationGate.Finding> findings) {
        super(findings.stream().map(CalibrationGate.Finding::line).collect(Collectors.joining("; ")));
        this.findings = List.copyOf(findings);
    }

    List<CalibrationGate.Finding> findings() {
        return findings;
    }

    /** One line per refused instrument, for people (the pages show them above the form). */
    public List<String> lines() {
        return findings.stream().map(CalibrationGate.Finding::line).toList();
    }
}
