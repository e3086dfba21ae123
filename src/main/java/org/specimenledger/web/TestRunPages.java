package org.specimenledger.web;

import jakarta.servlet.http.HttpServletResponse;
import java.math.BigDecimal;
import java.time.OffsetDateTime;
import java.time.ZoneOffset;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.UUID;
import org.specimenledger.equipment.EquipmentDirectory;
import org.specimenledger.equipment.EquipmentView;
import org.specimenledger.equipment.InstrumentKind;
import org.specimenledger.shared.Access;
import org.specimenledger.shared.CurrentUser;
import org.specimenledger.shared.FieldIssue;
import org.specimenledger.shared.RecordNotFound;
import org.specimenledger.shared.Role;
import org.specimenledger.shared.RuleViolation;
import org.specimenledger.shared.StateConflict;
import org.specimenledger.specimens.SpecimenDirectory;
import org.specimenledger.specimens.SpecimenView;
import org.specimenledger.testing.AnalysisRunView;
import org.specimenledger.testing.AnalysisService;
import org.specimenledger.testing.CalibrationNotValid;
import org.specimenledger.testing.TestRunDirectory;
import org.specimenledger.testing.TestRunRequests;
import org.specimenledger.testing.TestRunService;
import org.specimenledger.testing.TestRunView;
import org.springframework.security.access.prepost.PreAuthorize;
import org.springframework.stereotype.Controller;
import org.springframework.ui.Model;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.ModelAttribute;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.servlet.mvc.support.RedirectAttributes;

/**
 * Test runs on the workbench: register one (the calibration gate's findings shown above the form, a lab
 * manager's override with a reason), see one with its upload, diagram, property table and analyses,
 * re-analyse with other parameters, and compare two analyses side by side.
 */
@Controller
class TestRunPages {

    private final TestRunService service;
    private final TestRunDirectory runs;
    private final AnalysisService analyses;
    private final SpecimenDirectory specimens;
    private final EquipmentDirectory equipment;
    private final RequestChecks checks;

    TestRunPages(TestRunService service, TestRunDirectory runs, AnalysisService analyses, SpecimenDirectory specimens,
            EquipmentDirectory equipment, RequestChecks checks) {
        this.service = service;
        this.runs = runs;
        this.analyses = analyses;
        this.specimens = specimens;
        this.equipment = equipment;
        this.checks = checks;
    }

    @GetMapping("/lab/tests/new")
    @PreAuthorize(Access.LAB_WORKERS)
    String newRun(@RequestParam UUID specimenId, Model model) {
        TestRunForm form = new TestRunForm();
        form.setSpecimenId(specimenId.toString());
        form.setTestedAt(OffsetDateTime.now(ZoneOffset.UTC).truncatedTo(ChronoUnit.MINUTES).toString());
        return form(model, form, List.of(), List.of(), null);
    }

    @PostMapping("/lab/tests")
    @PreAuthorize(Access.LAB_WORKERS)
    String register(@ModelAttribute("form") TestRunForm form, Model model, HttpServletResponse response) {
        List<FieldIssue> problems = new ArrayList<>();
        TestRunRequests.TestRunRequest request = form.toRequest(problems);
        problems.addAll(checks.of(request));
        if (!problems.isEmpty()) {
            return form(model, form, problems, List.of(), response);
        }
        try {
            TestRunView run = service.register(request);
            return "redirect:/lab/tests/" + run.id();
        } catch (RuleViolation e) {
            return form(model, form, e.issues(), List.of(), response);
        } catch (CalibrationNotValid e) {
            return form(model, form, List.of(), e.lines(), response);
        } catch (StateConflict e) {
            return form(model, form, List.of(new FieldIssue("/retestReason", e.getMessage())), List.of(), response);
        }
    }

    @GetMapping("/lab/tests/{id}")
    @PreAuthorize(Access.LAB_WORKERS)
    String run(@PathVariable UUID id, @RequestParam(required = false) UUID analysis, Model model) {
        TestRunView run = runs.find(id).orElseThrow(() -> new RecordNotFound("test run", id));
        model.addAttribute("run", run);
        model.addAttribute("specimen", specimens.find(run.specimenId()).orElse(null));
        List<AnalysisRunView> all = run.rawCurve() == null ? List.of() : runs.analysesOf(id);
        model.addAttribute("analyses", all);
        AnalysisRunView shown = all.stream()
                .filter(a -> a.id().equals(analysis == null ? run.currentAnalysisId() : analysis))
                .findFirst().orElse(null);
        model.addAttribute("shown", shown);
        if (shown != null) {
            model.addAttribute("plot", CurvePlot.of(shown, runs.curveBytes(id)));
            model.addAttribute("table", PropertyTable.of(shown));
        }
        model.addAttribute("instruments", instrumentNames());
        if (!model.containsAttribute("reanalysisProblems")) {
            model.addAttribute("reanalysisProblems", List.of());
        }
        return "test-run";
    }

    @PostMapping("/lab/tests/{id}/reanalyse")
    @PreAuthorize(Access.LAB_WORKERS)
    String reanalyse(@PathVariable UUID id, @RequestParam(defaultValue = "") String proofOffsets,
            @RequestParam(defaultValue = "") String reason, RedirectAttributes redirect) {
        Map<String, Object> parameters = new LinkedHashMap<>();
        List<FieldIssue> problems = new ArrayList<>();
        List<BigDecimal> offsets = FormValues.numbers(proofOffsets, "/parameters/proofOffsetsPercent", problems);
        if (offsets != null && !offsets.isEmpty()) {
            parameters.put("proofOffsetsPercent", offsets);
        }
        if (problems.isEmpty()) {
            try {
                AnalysisRunView made = analyses.reanalyse(id, new TestRunRequests.AnalysisRequest(parameters,
                        FormValues.text(reason)));
                return "redirect:/lab/tests/" + id + "?analysis=" + made.id();
            } catch (RuleViolation e) {
                problems.addAll(e.issues());
            } catch (StateConflict e) {
                problems.add(new FieldIssue("", e.getMessage()));
            }
        }
        redirect.addFlashAttribute("reanalysisProblems", problems);
        return "redirect:/lab/tests/" + id;
    }

    @GetMapping("/lab/compare")
    @PreAuthorize(Access.LAB_WORKERS)
    String compare(@RequestParam UUID left, @RequestParam UUID right, Model model) {
        AnalysisRunView a = runs.analysis(left).orElseThrow(() -> new RecordNotFound("analysis", left));
        AnalysisRunView b = runs.analysis(right).orElseThrow(() -> new RecordNotFound("analysis", right));
        PropertyTable ta = PropertyTable.of(a);
        PropertyTable tb = PropertyTable.of(b);
        Set<String> symbols = new LinkedHashSet<>();
        ta.rows().forEach(r -> symbols.add(r.symbol()));
        tb.rows().forEach(r -> symbols.add(r.symbol()));
        List<PropertyTable.Pair> pairs = symbols.stream().map(s -> new PropertyTable.Pair(s, ta.row(s), tb.row(s)))
                .toList();
        model.addAttribute("left", a);
        model.addAttribute("right", b);
        model.addAttribute("pairs", pairs);
        model.addAttribute("parameterPairs", PropertyTable.parameterPairs(a, b));
        return "compare";
    }

    private Map<UUID, String> instrumentNames() {
        Map<UUID, String> names = new LinkedHashMap<>();
        for (EquipmentView e : equipment.all()) {
            names.put(e.id(), e.assetId() + " — " + e.description());
        }
        return names;
    }

    private String form(Model model, TestRunForm form, List<FieldIssue> problems, List<String> gate,
            HttpServletResponse response) {
        // the form comes back (200, as a browser expects of a form page) with what to correct above it
        UUID specimenId = FormValues.uuid(form.getSpecimenId(), "", new ArrayList<>());
        SpecimenView specimen = specimenId == null ? null : specimens.find(specimenId).orElse(null);
        List<EquipmentView> all = equipment.all();
        model.addAttribute("form", form);
        model.addAttribute("specimen", specimen);
        model.addAttribute("problems", problems);
        model.addAttribute("gate", gate);
        model.addAttribute("manager", CurrentUser.get().map(u -> u.role() == Role.LAB_MANAGER).orElse(false));
        model.addAttribute("retest", specimenId != null && runs.validRunOf(specimenId).isPresent());
        model.addAttribute("machines", all.stream().filter(e -> e.kind() == InstrumentKind.TESTING_MACHINE).toList());
        model.addAttribute("transducers",
                all.stream().filter(e -> e.kind() == InstrumentKind.FORCE_TRANSDUCER).toList());
        model.addAttribute("extensometers", all.stream().filter(e -> e.kind() == InstrumentKind.EXTENSOMETER).toList());
        model.addAttribute("standards", org.specimenledger.testing.TestStandard.values());
        model.addAttribute("modes", org.specimenledger.testing.TestMode.values());
        return "test-run-form";
    }
}
