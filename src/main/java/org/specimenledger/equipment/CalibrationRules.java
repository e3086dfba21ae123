package org.specimenledger.equipment;

import java.math.BigDecimal;
import java.time.LocalDate;
import java.time.Period;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.UUID;
import java.util.stream.Collectors;
import org.specimenledger.shared.FieldIssue;
import org.specimenledger.shared.RuleViolation;

/**
 * Checks a calibration record before it is stored: dates in order and not in the future, an interval
 * no longer than the configured maximum, and the class a standard allows for that kind of instrument —
 * one class for every range of a force transducer. All problems are reported at once.
 */
final class CalibrationRules {

    /** Force-measuring system classes, ISO 7500-1 [from memory]: 0.5, 1, 2, 3. */
    static final List<String> FORCE_CLASSES = List.of("0.5", "1", "2", "3");
    /** Extensometer classes, ISO 9513 [from memory]: 0.5, 1, 2. */
    static final List<String> EXTENSOMETER_CLASSES = List.of("0.5", "1", "2");

    /** What passed the checks: the class (normalised, e.g. {@code "1.0"} → {@code "1"}) or per-range classes. */
    record Checked(String accuracyClass, List<RangeClass> rangeClasses) {
    }

    private CalibrationRules() {
    }

    static Checked checked(UUID instrumentId, InstrumentKind kind, List<ForceRange> ranges,
            EquipmentRequests.CalibrationRequest r, LocalDate today, Period maxInterval) {
        List<FieldIssue> issues = new ArrayList<>();
        checkDates(r, today, maxInterval, issues);
        String accuracyClass = null;
        List<RangeClass> rangeClasses = new ArrayList<>();
        List<EquipmentRequests.RangeClassRequest> classes = r.classes() == null ? List.of() : r.classes();

        if (kind == InstrumentKind.FORCE_TRANSDUCER) {
            if (r.accuracyClass() != null) {
                issues.add(new FieldIssue("/accuracyClass", "a force transducer is classed per force range;"
                        + " give classes with rangeN and accuracyClass for each range"));
            }
            for (int i = 0; i < classes.size(); i++) {
                EquipmentRequests.RangeClassRequest c = classes.get(i);
                String at = "/classes/" + i;
                Optional<ForceRange> range = ranges.stream().filter(fr -> fr.hasUpperLimit(c.rangeN())).findFirst();
                if (range.isEmpty()) {
                    issues.add(new FieldIssue(at + "/rangeN", "the instrument has no force range of "
                            + c.rangeN().toPlainString() + " N; its ranges are " + rangeList(ranges)));
                } else if (classedBefore(classes, i)) {
                    issues.add(new FieldIssue(at + "/rangeN", "force range " + c.rangeN().toPlainString()
                            + " N is classed twice"));
                }
                String normalised = normalised(c.accuracyClass(), FORCE_CLASSES, at + "/accuracyClass",
                        "ISO 7500-1 force class", issues);
                if (range.isPresent() && normalised != null) {
                    rangeClasses.add(new RangeClass(instrumentId, range.get().upperLimitN(), normalised));
                }
            }
            for (ForceRange range : ranges) {
                if (classes.stream().noneMatch(c -> range.hasUpperLimit(c.rangeN()))) {
                    issues.add(new FieldIssue("/classes", "force range " + range.upperLimitN().toPlainString()
                            + " N has no class; every range of the instrument must receive one"));
                }
            }
        } else {
            if (!classes.isEmpty()) {
                issues.add(new FieldIssue("/classes", "only a force transducer is classed per force range;"
                        + " give the class of this " + kind + " in accuracyClass"));
            }
            if (kind == InstrumentKind.EXTENSOMETER) {
                if (r.accuracyClass() == null) {
                    issues.add(new FieldIssue("/accuracyClass", "an extensometer calibration needs its ISO 9513 class"
                            + " (" + String.join(", ", EXTENSOMETER_CLASSES) + ")"));
                } else {
                    accuracyClass = normalised(r.accuracyClass(), EXTENSOMETER_CLASSES, "/accuracyClass",
                            "ISO 9513 extensometer class", issues);
                }
            } else if (r.accuracyClass() != null) {
                accuracyClass = normalised(r.accuracyClass(), FORCE_CLASSES, "/accuracyClass",
                        "ISO 7500-1 testing machine class", issues);
            }
        }
        if (!issues.isEmpty()) {
            throw new RuleViolation(issues);
        }
        return new Checked(accuracyClass, rangeClasses);
    }

    private static void checkDates(EquipmentRequests.CalibrationRequest r, LocalDate today, Period maxInterval,
            List<FieldIssue> issues) {
        if (r.calibratedOn().isAfter(today)) {
            issues.add(new FieldIssue("/calibratedOn", "calibration date " + r.calibratedOn()
                    + " is in the future (today is " + today + ")"));
        }
        if (!r.dueOn().isAfter(r.calibratedOn())) {
            issues.add(new FieldIssue("/dueOn", "calibration due before calibration date: due " + r.dueOn()
                    + ", calibrated " + r.calibratedOn()));
        } else if (r.dueOn().isAfter(r.calibratedOn().plus(maxInterval))) {
            issues.add(new FieldIssue("/dueOn", "calibration interval longer than the maximum: from "
                    + r.calibratedOn() + " to " + r.dueOn() + " exceeds " + maxInterval
                    + " (rule ledger.equipment.max-calibration-interval)"));
        }
    }

    /** The class in its plain form ({@code "1.0"} and {@code "1"} are the same class), or null with an issue. */
    static String normalised(String given, List<String> allowed, String pointer, String what,
            List<FieldIssue> issues) {
        String plain = given == null ? "" : given.trim();
        try {
            plain = new BigDecimal(plain).stripTrailingZeros().toPlainString();
        } catch (NumberFormatException notANumber) {
            // keep it as typed for the message
        }
        if (allowed.contains(plain)) {
            return plain;
        }
        issues.add(new FieldIssue(pointer, "class '" + given + "' is not an " + what + "; allowed: "
                + String.join(", ", allowed)));
        return null;
    }

    private static boolean classedBefore(List<EquipmentRequests.RangeClassRequest> classes, int i) {
        for (int j = 0; j < i; j++) {
            if (classes.get(j).rangeN().compareTo(classes.get(i).rangeN()) == 0) {
                return true;
            }
        }
        return false;
    }

    private static String rangeList(List<ForceRange> ranges) {
        return ranges.stream().map(r -> r.upperLimitN().toPlainString() + " N").collect(Collectors.joining(", "));
    }
}
