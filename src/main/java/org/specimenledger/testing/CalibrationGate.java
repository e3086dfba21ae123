package org.specimenledger.testing;

import java.util.ArrayList;
import java.util.Collection;
import java.util.List;

/**
 * Decides whether a test run's instruments may be used for it: each needs a calibration valid on the test
 * date (a test on equipment whose calibration was not valid then is not a valid test [CP]), and the class
 * that the standard requires for the properties to be reported ({@link StandardRequirements}). Pure: the
 * caller passes what the equipment register said.
 */
final class CalibrationGate {

    /** Why one instrument fails the gate, with the calibration looked at (its fields may be null). */
    record Finding(InstrumentRole role, CalibrationUsed calibration, String reason) {

        String pointer() {
            return role.pointer();
        }

        /** One line naming the instrument, its calibration and the failure. */
        String line() {
            return role.title() + " " + calibration.assetId() + ": " + reason;
        }
    }

    private CalibrationGate() {
    }

    /**
     * Every failure at once, in the order the instruments are given.
     *
     * @param instruments the machine, transducer and extensometer with their calibration on the test date
     * @param standard    the standard of the run
     * @param reported    the properties the run is to report, or null for all
     */
    static List<Finding> check(List<CalibrationUsed> instruments, TestStandard standard, Collection<String> reported) {
        return check(StandardRequirements.DEFAULTS, instruments, standard, reported);
    }

    /** As {@link #check(List, TestStandard, Collection)}, against the given requirement table. */
    static List<Finding> check(StandardRequirements table, List<CalibrationUsed> instruments, TestStandard standard,
            Collection<String> reported) {
        StandardRequirements.Requirement requirement = table.of(standard);
        List<Finding> findings = new ArrayList<>();
        for (CalibrationUsed c : instruments) {
            if (!c.validOnTestDate()) {
                findings.add(new Finding(c.role(), c, c.reason() + lastCalibration(c)));
                continue;
            }
            switch (c.role()) {
                case FORCE_TRANSDUCER -> {
                    String limit = requirement.forceClass();
                    if (c.accuracyClass() == null && limit != null) {
                        findings.add(new Finding(c.role(), c, "calibration " + c.certificateReference()
                                + " gives no class for the " + c.rangeN().toPlainString() + " N range used; "
                                + standard.title() + " needs class " + limit + " or better (" + requirement.source()
                                + ")"));
                    } else if (!StandardRequirements.meets(c.accuracyClass(), limit)) {
                        findings.add(new Finding(c.role(), c, "the " + c.rangeN().toPlainString()
                                + " N range used is class " + c.accuracyClass() + " (calibration "
                                + c.certificateReference() + "); " + standard.title() + " needs class " + limit
                                + " or better (" + requirement.source() + ")"));
                    }
                }
                case EXTENSOMETER -> {
                    String limit = table.extensometerClassFor(standard, reported);
                    if (!StandardRequirements.meets(c.accuracyClass(), limit)) {
                        findings.add(new Finding(c.role(), c, "class " + c.accuracyClass() + " (calibration "
                                + c.certificateReference() + "); " + standard.title() + " needs class " + limit
                                + " or better for " + (reported == null ? "all properties" : String.join(", ", reported))
                                + " (" + requirement.source() + ")"));
                    }
                }
                default -> {
                    // the testing machine needs a valid calibration; its force class is judged on the
                    // transducer range actually used
                }
            }
        }
        return findings;
    }

    private static String lastCalibration(CalibrationUsed c) {
        if (c.calibrationId() == null) {
            return "";
        }
        return " (governing calibration " + c.certificateReference() + " of " + c.calibratedOn() + ", due "
                + c.dueOn() + ")";
    }
}
