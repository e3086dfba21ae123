package org.specimenledger.testing;

import java.math.BigDecimal;

/** The registered facts of a test run that the flags depend on. Taken from the run, which never changes them. */
record RunConditions(TestStandard standard, ControlMethod method, BigDecimal temperatureC, String overrideReason,
        String overrideBy) {

    static RunConditions of(TestRun r) {
        return new RunConditions(r.standard(), r.method(), r.temperatureC(), r.calibrationOverrideReason(),
                r.calibrationOverrideBy());
    }
}
