package org.specimenledger.testing;

import java.time.Clock;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.UUID;
import org.specimenledger.audit.Ledger;
import org.specimenledger.equipment.CalibrationOnDate;
import org.specimenledger.equipment.EquipmentDirectory;
import org.specimenledger.equipment.EquipmentView;
import org.specimenledger.shared.ChangeReason;
import org.specimenledger.shared.CurrentUser;
import org.specimenledger.shared.Paged;
import org.specimenledger.shared.RecordNotFound;
import org.specimenledger.shared.Role;
import org.specimenledger.shared.RuleViolation;
import org.specimenledger.shared.SignedInUser;
import org.specimenledger.shared.StateConflict;
import org.specimenledger.specimens.SpecimenDirectory;
import org.specimenledger.specimens.SpecimenView;
import org.springframework.security.access.AccessDeniedException;
import org.springframework.stereotype.Service;
import org.springframework.transaction.annotation.Transactional;

/**
 * Registers test runs through the calibration gate, and invalidates or reinstates them; each write is one
 * ledger event per record changed, in the same transaction. Customers read only their own organisation's
 * runs; any other is "not found".
 */
@Service
public class TestRunService {

    static final String ENTITY = "test-run";

    private final TestRunRepository runs;
    private final CurveFileRepository curves;
    private final TestRunRules rules;
    private final EquipmentDirectory equipment;
    private final SpecimenDirectory specimens;
    private final Ledger ledger;
    private final Clock clock;
    private final StandardRequirements requirements;
    private final org.springframework.jdbc.core.simple.JdbcClient jdbc;

    TestRunService(TestRunRepository runs, CurveFileRepository curves, TestRunRules rules, EquipmentDirectory equipment,
            SpecimenDirectory specimens, Ledger ledger, Clock clock, StandardRequirements requirements,
            org.springframework.jdbc.core.simple.JdbcClient jdbc) {
        this.requirements = requirements;
        this.jdbc = jdbc;
        this.runs = runs;
        this.curves = curves;
        this.rules = rules;
        this.equipment = equipment;
        this.specimens = specimens;
        this.ledger = ledger;
        this.clock = clock;
    }

    /**
     * Registers a test run. Refused with {@link CalibrationNotValid} when an instrument's calibration was not
     * valid on the test date or its class is below what the standard requires, unless a lab manager gives a
     * {@code calibrationOverrideReason}. When the specimen already has a valid run, a {@code retestReason}
     * invalidates it and the new run becomes the valid one.
     */
    @Transactional
    public TestRunView register(TestRunRequests.TestRunRequest request) {
        String override = blankToNull(request.calibrationOverrideReason());
        if (override != null && !CurrentUser.get().map(u -> u.role() == Role.LAB_MANAGER).orElse(false)) {
            throw new AccessDeniedException("only a lab manager may accept a run against the calibration gate");
        }
        TestRunRules.Checked checked = rules.checked(request, now());
        List<CalibrationUsed> used = calibrationsOn(checked);
        List<CalibrationGate.Finding> findings = CalibrationGate.check(requirements, used, request.standard(),
                checked.facts().reportedProperties());
        if (!findings.isEmpty() && override == null) {
            throw new CalibrationNotValid(findings);
        }
        if (findings.isEmpty() && override != null) {
            throw new RuleViolation("/calibrationOverrideReason",
                    "every instrument passes the calibration gate; there is nothing to accept");
        }
        String retest = blankToNull(request.retestReason());
        Optional<TestRun> previous = runs.findBySpecimenIdAndValidity(request.specimenId(), Validity.VALID);
        if (previous.isPresent() && retest == null) {
            throw new StateConflict("specimen " + checked.specimen().labIdentifier() + " already has a valid test run "
                    + previous.get().id() + " (tested " + previous.get().testDate() + "); give a retestReason to "
                    + "register a retest, which invalidates that run");
        }
        if (previous.isEmpty() && retest != null) {
            throw new RuleViolation("/retestReason", "specimen "
                    + checked.specimen().labIdentifier() + " has no valid test run to repeat");
        }
        Instant now = now();
        String actor = actor();
        if (previous.isPresent()) {
            invalidate(previous.get(), "retest: " + retest, now, actor, "test-run.invalidated");
        }
        TestRun.Facts f = checked.facts();
        TestRun.Facts withCalibrations = new TestRun.Facts(f.specimenId(), f.machineId(), f.forceTransducerId(),
                f.forceRangeN(), f.extensometerId(), calibrationId(used, InstrumentRole.TESTING_MACHINE),
                calibrationId(used, InstrumentRole.FORCE_TRANSDUCER), calibrationId(used, InstrumentRole.EXTENSOMETER),
                f.operator(), f.testedAt(), f.testDate(), f.temperatureC(), f.standard(), f.method(),
                f.standardReference(), f.nominalStrainRatePerS(), f.nominalStressRateMPaPerS(),
                f.crossheadSpeedMmPerMin(), f.mode(), f.remarks(), f.reportedProperties());
        String findingText = String.join("\n", findings.stream().map(CalibrationGate.Finding::line).toList());
        TestRun run = runs.saveAndFlush(new TestRun(withCalibrations, override, actor, findingText, now, actor));
        TestRunView view = TestRunView.of(run, null);
        List<String> reasons = new ArrayList<>();
        if (override != null) {
            reasons.add("calibration override: " + override);
        }
        if (retest != null) {
            reasons.add("retest of " + previous.get().id() + ": " + retest);
        }
        ledger.record("test-run.registered", ENTITY, run.id(), reasons.isEmpty() ? null : String.join("; ", reasons),
                null, view);
        return view;
    }

    /** Takes a run out of count (reason required); its curve and analyses stay. */
    @Transactional
    TestRunView invalidate(UUID id, String reason) {
        String why = ChangeReason.required(reason);
        TestRun run = runs.findById(id).orElseThrow(() -> new RecordNotFound(ENTITY, id));
        return invalidate(run, why, now(), actor(), "test-run.invalidated");
    }

    /**
     * Makes an invalidated run the specimen's valid one again (reason required); the specimen's other valid
     * run, if any, is invalidated with the same reason.
     */
    @Transactional
    TestRunView reinstate(UUID id, String reason) {
        String why = ChangeReason.required(reason);
        TestRun run = runs.findById(id).orElseThrow(() -> new RecordNotFound(ENTITY, id));
        TestRunView before = view(run);
        if (run.validity() == Validity.VALID) {
            throw new StateConflict("test run " + id + " is already the valid run of its specimen");
        }
        Optional<TestRun> other = runs.findBySpecimenIdAndValidity(run.specimenId(), Validity.VALID);
        if (other.isPresent()) {
            invalidate(other.get(), "superseded by reinstated run " + id + ": " + why, now(), actor(),
                    "test-run.invalidated");
        }
        run.reinstate();
        runs.saveAndFlush(run);
        TestRunView after = view(run);
        ledger.record("test-run.reinstated", ENTITY, id, why, before, after);
        return after;
    }

    @Transactional(readOnly = true)
    TestRunView get(UUID id) {
        return view(visible(id));
    }

    /**
     * One page of test runs, oldest registration first (then by id, a stable order), optionally of one
     * specimen; a customer's pages hold only their own organisation's runs.
     */
    @Transactional(readOnly = true)
    Paged<TestRunView> list(UUID specimenId, int page, int size) {
        Paged.check(page, size);
        StringBuilder where = new StringBuilder(" FROM test_run t JOIN specimen s ON s.id = t.specimen_id WHERE TRUE");
        java.util.List<Object> params = new java.util.ArrayList<>();
        if (specimenId != null) {
            where.append(" AND t.specimen_id = ?");
            params.add(specimenId);
        }
        Optional<UUID> scope = CurrentUser.customerOrganisation();
        if (scope.isPresent()) {
            where.append(" AND s.customer_id = ?");
            params.add(scope.get());
        }
        long total = jdbc.sql("SELECT count(*)" + where).params(params).query(Long.class).single();
        List<UUID> ids = jdbc.sql("SELECT t.id" + where + " ORDER BY t.created_at, t.id LIMIT " + size + " OFFSET "
                + ((long) page * size)).params(params).query(UUID.class).list();
        java.util.Map<UUID, TestRun> found = new java.util.HashMap<>();
        runs.findAllById(ids).forEach(r -> found.put(r.id(), r));
        return new Paged<>(ids.stream().map(found::get).map(this::view).toList(), page, size, total);
    }

    /** The run, if the caller may see it: a customer only their own organisation's, otherwise 404. */
    TestRun visible(UUID id) {
        TestRun run = runs.findById(id).orElseThrow(() -> new RecordNotFound(ENTITY, id));
        Optional<UUID> scope = CurrentUser.customerOrganisation();
        if (scope.isPresent() && !scope.equals(specimens.find(run.specimenId()).map(SpecimenView::customerId))) {
            throw new RecordNotFound(ENTITY, id);
        }
        return run;
    }

    TestRunView view(TestRun run) {
        return TestRunView.of(run, curves.findByTestRunId(run.id()).map(RawCurveView::of).orElse(null));
    }

    private TestRunView invalidate(TestRun run, String reason, Instant at, String by, String action) {
        TestRunView before = view(run);
        run.invalidate(reason, at, by);
        runs.saveAndFlush(run);
        TestRunView after = view(run);
        ledger.record(action, ENTITY, run.id(), reason, before, after);
        return after;
    }

    private List<CalibrationUsed> calibrationsOn(TestRunRules.Checked c) {
        List<CalibrationUsed> out = new ArrayList<>();
        out.add(used(InstrumentRole.TESTING_MACHINE, c.machine(), c));
        out.add(used(InstrumentRole.FORCE_TRANSDUCER, c.transducer(), c));
        out.add(used(InstrumentRole.EXTENSOMETER, c.extensometer(), c));
        return out;
    }

    private CalibrationUsed used(InstrumentRole role, EquipmentView instrument, TestRunRules.Checked c) {
        CalibrationOnDate on = equipment.calibrationOn(instrument.id(), c.facts().testDate());
        return CalibrationSnapshot.of(role, instrument, on, c.facts().forceRangeN());
    }

    private static UUID calibrationId(List<CalibrationUsed> used, InstrumentRole role) {
        return used.stream().filter(u -> u.role() == role).findFirst().map(CalibrationUsed::calibrationId).orElse(null);
    }

    static String actor() {
        return CurrentUser.get().map(SignedInUser::username).orElseGet(() -> {
            var auth = org.springframework.security.core.context.SecurityContextHolder.getContext().getAuthentication();
            return auth == null ? "system" : auth.getName();
        });
    }

    private Instant now() {
        return clock.instant().truncatedTo(ChronoUnit.MICROS);
    }

    private static String blankToNull(String s) {
        return s == null || s.isBlank() ? null : s.trim();
    }
}
