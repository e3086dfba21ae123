package org.specimenledger.testing;

import java.math.BigDecimal;
import java.math.MathContext;
import java.time.Duration;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Optional;
import java.util.Set;
import java.util.UUID;
import java.util.stream.Collectors;
import org.specimenledger.accounts.AccountDirectory;
import org.specimenledger.accounts.AccountView;
import org.specimenledger.equipment.EquipmentDirectory;
import org.specimenledger.equipment.EquipmentView;
import org.specimenledger.shared.CurrentUser;
import org.specimenledger.shared.FieldIssue;
import org.specimenledger.shared.Role;
import org.specimenledger.shared.RuleViolation;
import org.specimenledger.shared.SignedInUser;
import org.specimenledger.specimens.SpecimenDirectory;
import org.specimenledger.specimens.SpecimenView;
import org.springframework.stereotype.Component;

/**
 * Checks a test run registration before the calibration gate, reporting every problem at once with the
 * field it concerns: the specimen and instruments exist and are of the right kind, the force range is one
 * of the transducer's, the extensometer's gauge length is the specimen's Le, the standard's method and
 * reference are given as it needs, the operator may run tests, the date is not in the future.
 *
 * <p>A gauge length that differs from Le is refused rather than warned about: the analysis divides every
 * extension by Le, so a wrong Le makes every strain, Rp, Rt and elongation wrong, and nothing downstream
 * could repair it. The tolerance is the ISO 9513 class 1 gauge-length tolerance [M]; the fix is to choose the
 * right extensometer or to correct the specimen's Le before the run is registered.
 */
@Component
class TestRunRules {

    /** A test can be registered just before it starts, but not a day ahead: a later date is a typing error [CP]. */
    static final Duration FUTURE_ALLOWANCE = Duration.ofDays(1);

    private final SpecimenDirectory specimens;
    private final EquipmentDirectory equipment;
    private final AccountDirectory accounts;

    TestRunRules(SpecimenDirectory specimens, EquipmentDirectory equipment, AccountDirectory accounts) {
        this.specimens = specimens;
        this.equipment = equipment;
        this.accounts = accounts;
    }

    /** What passed: the facts to store (calibration ids still empty) and the records they refer to. */
    record Checked(TestRun.Facts facts, SpecimenView specimen, EquipmentView machine, EquipmentView transducer,
            EquipmentView extensometer) {
    }

    Checked checked(TestRunRequests.TestRunRequest r, Instant now) {
        List<FieldIssue> issues = new ArrayList<>();
        SpecimenView specimen = specimens.find(r.specimenId()).orElse(null);
        if (specimen == null) {
            issues.add(new FieldIssue("/specimenId", "no specimen with id " + r.specimenId()));
        }
        EquipmentView machine = instrument(InstrumentRole.TESTING_MACHINE, r.machineId(), issues);
        EquipmentView transducer = instrument(InstrumentRole.FORCE_TRANSDUCER, r.forceTransducerId(), issues);
        EquipmentView extensometer = instrument(InstrumentRole.EXTENSOMETER, r.extensometerId(), issues);
        BigDecimal range = null;
        if (transducer != null) {
            range = transducer.forceRanges().stream().map(EquipmentView.ForceRangeView::upperLimitN)
                    .filter(u -> u.compareTo(r.forceRangeN()) == 0).findFirst().orElse(null);
            if (range == null) {
                issues.add(new FieldIssue("/forceRangeN", "force transducer " + transducer.assetId() + " has no "
                        + r.forceRangeN().toPlainString() + " N range; its ranges are " + transducer.forceRanges()
                        .stream().map(f -> f.upperLimitN().toPlainString() + " N").collect(Collectors.joining(", "))));
            }
        }
        if (specimen != null && extensometer != null && extensometer.gaugeLengthMm() != null) {
            checkGaugeLength(specimen, extensometer, issues);
        }
        if (machine != null && transducer != null) {
            List<UUID> builtIn = machine.builtInTransducerIds() == null ? List.of() : machine.builtInTransducerIds();
            // a machine that names its transducers takes only those; one that names none takes any
            if (!builtIn.isEmpty() && !builtIn.contains(transducer.id())) {
                issues.add(new FieldIssue("/forceTransducerId", "force transducer " + transducer.assetId()
                        + " is not among the transducers of testing machine " + machine.assetId()));
            }
        }
        if (r.standard() == TestStandard.ISO_6892_1 && r.method() == null) {
            issues.add(new FieldIssue("/method", "ISO 6892-1 runs name their control method: A1, A2 or B"));
        } else if (r.standard() != TestStandard.ISO_6892_1 && r.method() != null) {
            issues.add(new FieldIssue("/method", "only ISO 6892-1 runs take a control method (A1, A2, B); "
                    + r.standard().title() + " does not"));
        }
        String reference = blankToNull(r.standardReference());
        if (r.standard() == TestStandard.OTHER && reference == null) {
            issues.add(new FieldIssue("/standardReference", "a run to another procedure must name it"));
        }
        List<String> reported = reported(r.reportedProperties(), issues);
        String operator = operator(r.operator(), issues);
        Instant testedAt = r.testedAt().toInstant().truncatedTo(ChronoUnit.MICROS);
        if (testedAt.isAfter(now.plus(FUTURE_ALLOWANCE))) {
            issues.add(new FieldIssue("/testedAt", "test date " + r.testedAt() + " is more than a day in the future"));
        }
        if (r.temperatureC().compareTo(new BigDecimal("-273.15")) <= 0) {
            issues.add(new FieldIssue("/temperatureC", "temperature " + r.temperatureC().toPlainString()
                    + " °C is not above absolute zero"));
        }
        if (!issues.isEmpty()) {
            throw new RuleViolation(issues);
        }
        TestRun.Facts facts = new TestRun.Facts(specimen.id(), machine.id(), transducer.id(), range, extensometer.id(),
                null, null, null, operator, testedAt, r.testedAt().toLocalDate(), r.temperatureC(), r.standard(),
                r.method(), reference, r.nominalStrainRatePerS(), r.nominalStressRateMPaPerS(),
                r.crossheadSpeedMmPerMin(), r.mode(), blankToNull(r.remarks()), reported);
        return new Checked(facts, specimen, machine, transducer, extensometer);
    }

    private EquipmentView instrument(InstrumentRole role, UUID id, List<FieldIssue> issues) {
        Optional<EquipmentView> found = equipment.find(id);
        if (found.isEmpty()) {
            issues.add(new FieldIssue(role.pointer(), "no instrument with id " + id));
            return null;
        }
        if (found.get().kind() != role.kind()) {
            issues.add(new FieldIssue(role.pointer(), found.get().assetId() + " is a " + found.get().kind()
                    + ", not a " + role.kind()));
            return null;
        }
        return found.get();
    }

    private static void checkGaugeLength(SpecimenView specimen, EquipmentView extensometer, List<FieldIssue> issues) {
        BigDecimal gauge = extensometer.gaugeLengthMm();
        BigDecimal le = specimen.leMm();
        BigDecimal deviationPercent = le.subtract(gauge).abs().multiply(BigDecimal.valueOf(100))
                .divide(gauge, MathContext.DECIMAL64);
        if (deviationPercent.compareTo(StandardRequirements.GAUGE_LENGTH_TOLERANCE_PERCENT) > 0) {
            issues.add(new FieldIssue("/extensometerId", "extensometer " + extensometer.assetId() + " has gauge length "
                    + gauge.toPlainString() + " mm but specimen " + specimen.labIdentifier() + " has Le = "
                    + le.toPlainString() + " mm; they must agree within "
                    + StandardRequirements.GAUGE_LENGTH_TOLERANCE_PERCENT.toPlainString()
                    + " % (ISO 9513 class 1 gauge length [M]), because every strain is extension / Le"));
        }
    }

    private static List<String> reported(List<String> requested, List<FieldIssue> issues) {
        if (requested == null) {
            return null;
        }
        Set<String> seen = new LinkedHashSet<>();
        for (int i = 0; i < requested.size(); i++) {
            String p = requested.get(i).trim();
            if (!StandardRequirements.isKnownProperty(p)) {
                issues.add(new FieldIssue("/reportedProperties/" + i, "unknown property '" + p + "'; use ISO 6892-1"
                        + " symbols such as " + String.join(", ", StandardRequirements.KNOWN_PROPERTIES)));
            } else if (!seen.add(p)) {
                issues.add(new FieldIssue("/reportedProperties/" + i, p + " is named twice"));
            }
        }
        if (requested.isEmpty()) {
            issues.add(new FieldIssue("/reportedProperties", "name at least one property, or leave the list out"
                    + " to report all"));
        }
        return List.copyOf(seen);
    }

    /** The named operator, or the signed-in user; either must be a laboratory worker with an enabled account. */
    private String operator(String requested, List<FieldIssue> issues) {
        String name = blankToNull(requested);
        if (name == null) {
            Optional<SignedInUser> me = CurrentUser.get();
            if (me.isEmpty()) {
                issues.add(new FieldIssue("/operator", "name the operator who ran the test"));
                return null;
            }
            name = me.get().username();
        }
        Optional<AccountView> account = accounts.findByUsername(name);
        if (account.isEmpty()) {
            issues.add(new FieldIssue("/operator", "no account with username '" + name + "'"));
        } else if (!account.get().enabled()) {
            issues.add(new FieldIssue("/operator", "the account of '" + name + "' is disabled"));
        } else if (account.get().role() != Role.TECHNICIAN && account.get().role() != Role.LAB_MANAGER) {
            issues.add(new FieldIssue("/operator", "'" + name + "' is " + account.get().role()
                    + "; an operator is a technician or a lab manager"));
        }
        return name;
    }

    private static String blankToNull(String s) {
        return s == null || s.isBlank() ? null : s.trim();
    }
}
