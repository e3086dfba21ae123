package org.specimenledger.equipment;

import java.math.BigDecimal;
import java.math.RoundingMode;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Optional;
import java.util.Set;
import java.util.UUID;
import java.util.function.Function;
import org.specimenledger.shared.FieldIssue;
import org.specimenledger.shared.RuleViolation;

/**
 * Checks the kind-specific data of an instrument before it is stored: a force transducer has at least
 * one force range with distinct upper limits and a lower limit below the upper; an extensometer has a
 * gauge length; a testing machine may name existing force transducers. Data of another kind is
 * refused rather than silently dropped. All problems are reported at once.
 */
final class InstrumentRules {

    /** ISO 7500-1 verifies a force range from 20 % of its upper limit upward [from memory]. */
    static final BigDecimal DEFAULT_LOWER_LIMIT_FRACTION = new BigDecimal("0.2");

    private InstrumentRules() {
    }

    /**
     * The force ranges to store (with the default lower limit filled in), or a {@link RuleViolation}.
     *
     * @param kindOf the kind of another stored instrument, for the built-in transducers of a machine
     */
    static List<ForceRange> checked(EquipmentRequests.InstrumentRequest r,
            Function<UUID, Optional<InstrumentKind>> kindOf) {
        List<FieldIssue> issues = new ArrayList<>();
        List<ForceRange> ranges = new ArrayList<>();
        List<EquipmentRequests.ForceRangeRequest> requested = r.forceRanges() == null ? List.of() : r.forceRanges();
        List<UUID> transducers = r.builtInTransducerIds() == null ? List.of() : r.builtInTransducerIds();
        InstrumentKind kind = r.kind();

        if (kind == InstrumentKind.FORCE_TRANSDUCER) {
            if (requested.isEmpty()) {
                issues.add(new FieldIssue("/forceRanges", "a force transducer needs at least one force range"));
            }
            for (int i = 0; i < requested.size(); i++) {
                EquipmentRequests.ForceRangeRequest range = requested.get(i);
                String at = "/forceRanges/" + i;
                BigDecimal upper = range.upperLimitN();
                for (int j = 0; j < i; j++) {
                    if (requested.get(j).upperLimitN().compareTo(upper) == 0) {
                        issues.add(new FieldIssue(at + "/upperLimitN", "force range " + upper.toPlainString()
                                + " N is given twice (also at /forceRanges/" + j + ")"));
                        break;
                    }
                }
                BigDecimal lower = range.lowerLimitN() != null ? range.lowerLimitN() : defaultLowerLimit(upper);
                if (lower.compareTo(upper) >= 0) {
                    issues.add(new FieldIssue(at + "/lowerLimitN", "lower limit " + lower.toPlainString()
                            + " N is not below the range's upper limit " + upper.toPlainString() + " N"));
                }
                ranges.add(new ForceRange(upper, lower));
            }
        } else if (!requested.isEmpty()) {
            issues.add(new FieldIssue("/forceRanges", "only a force transducer has force ranges; this is a " + kind));
        }

        if (kind == InstrumentKind.EXTENSOMETER) {
            if (r.gaugeLengthMm() == null) {
                issues.add(new FieldIssue("/gaugeLengthMm", "an extensometer needs its gauge length Le in mm"));
            }
        } else {
            if (r.gaugeLengthMm() != null) {
                issues.add(new FieldIssue("/gaugeLengthMm", "only an extensometer has a gauge length; this is a "
                        + kind));
            }
            if (r.travelMm() != null) {
                issues.add(new FieldIssue("/travelMm", "only an extensometer has a travel; this is a " + kind));
            }
        }

        if (kind == InstrumentKind.TESTING_MACHINE) {
            Set<UUID> seen = new HashSet<>();
            for (int i = 0; i < transducers.size(); i++) {
                UUID id = transducers.get(i);
                String at = "/builtInTransducerIds/" + i;
                if (!seen.add(id)) {
                    issues.add(new FieldIssue(at, "force transducer " + id + " is named twice"));
                    continue;
                }
                Optional<InstrumentKind> found = kindOf.apply(id);
                if (found.isEmpty()) {
                    issues.add(new FieldIssue(at, "no instrument with id " + id));
                } else if (found.get() != InstrumentKind.FORCE_TRANSDUCER) {
                    issues.add(new FieldIssue(at, "instrument " + id + " is a " + found.get()
                            + ", not a FORCE_TRANSDUCER"));
                }
            }
        } else if (!transducers.isEmpty()) {
            issues.add(new FieldIssue("/builtInTransducerIds", "only a testing machine has built-in force transducers;"
                    + " this is a " + kind));
        }

        if (!issues.isEmpty()) {
            throw new RuleViolation(issues);
        }
        return ranges;
    }

    /** 20 % of the upper limit, without spurious trailing zeros and never in exponent notation. */
    static BigDecimal defaultLowerLimit(BigDecimal upperLimitN) {
        BigDecimal lower = upperLimitN.multiply(DEFAULT_LOWER_LIMIT_FRACTION).stripTrailingZeros();
        return lower.scale() < 0 ? lower.setScale(0, RoundingMode.UNNECESSARY) : lower;
    }
}
