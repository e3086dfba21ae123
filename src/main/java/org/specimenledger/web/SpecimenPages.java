package org.specimenledger.web;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.UUID;
import org.specimenledger.customers.CustomerDirectory;
import org.specimenledger.heats.HeatDirectory;
import org.specimenledger.shared.Access;
import org.specimenledger.shared.FieldIssue;
import org.specimenledger.shared.RecordNotFound;
import org.specimenledger.shared.RuleViolation;
import org.specimenledger.specimens.CrossSection;
import org.specimenledger.specimens.GaugeLength;
import org.specimenledger.specimens.GeometryRefused;
import org.specimenledger.specimens.SpecimenDirectory;
import org.specimenledger.specimens.SpecimenRequests;
import org.specimenledger.specimens.SpecimenService;
import org.specimenledger.specimens.SpecimenShape;
import org.specimenledger.specimens.SpecimenView;
import org.specimenledger.testing.TestRunDirectory;
import org.springframework.security.access.prepost.PreAuthorize;
import org.springframework.stereotype.Controller;
import org.springframework.ui.Model;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.ModelAttribute;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.ResponseBody;

/**
 * The workbench's start and the specimen pages: register a specimen with its measured readings (S0 and L0
 * computed by the server as they are typed, through {@code /lab/geometry-preview}), and see one.
 */
@Controller
class SpecimenPages {

    private final SpecimenService specimens;
    private final SpecimenDirectory specimenDirectory;
    private final HeatDirectory heats;
    private final CustomerDirectory customers;
    private final TestRunDirectory runs;
    private final RequestChecks checks;

    SpecimenPages(SpecimenService specimens, SpecimenDirectory specimenDirectory, HeatDirectory heats,
            CustomerDirectory customers, TestRunDirectory runs, RequestChecks checks) {
        this.specimens = specimens;
        this.specimenDirectory = specimenDirectory;
        this.heats = heats;
        this.customers = customers;
        this.runs = runs;
        this.checks = checks;
    }

    /** A specimen on the workbench list, with the state of its valid run. */
    record Row(SpecimenView specimen, String heatNumber, String runState, UUID runId) {
    }

    @GetMapping("/lab")
    @PreAuthorize(Access.LAB_WORKERS)
    String workbench(Model model) {
        List<Row> rows = new ArrayList<>();
        for (SpecimenView s : specimenDirectory.recent(50)) {
            var run = runs.validRunOf(s.id());
            String state = run.map(r -> r.rawCurve() == null ? "registered, no curve" : "analysed").orElse("no test");
            rows.add(new Row(s, heats.find(s.heatId()).map(h -> h.heatNumber()).orElse("?"), state,
                    run.map(r -> r.id()).orElse(null)));
        }
        model.addAttribute("rows", rows);
        return "workbench";
    }

    @GetMapping("/lab/specimens/new")
    @PreAuthorize(Access.LAB_WORKERS)
    String newSpecimen(Model model) {
        return form(model, new SpecimenForm(), List.of());
    }

    @PostMapping("/lab/specimens")
    @PreAuthorize(Access.LAB_WORKERS)
    String register(@ModelAttribute("form") SpecimenForm form, Model model) {
        List<FieldIssue> problems = new ArrayList<>();
        SpecimenRequests.SpecimenRequest request = form.toRequest(problems);
        problems.addAll(checks.of(request));
        if (!problems.isEmpty()) {
            return form(model, form, problems);
        }
        try {
            SpecimenView created = specimens.register(request);
            return "redirect:/lab/specimens/" + created.id();
        } catch (RuleViolation e) {
            return form(model, form, e.issues());
        }
    }

    @GetMapping("/lab/specimens/{id}")
    @PreAuthorize(Access.LAB_WORKERS)
    String specimen(@PathVariable UUID id, Model model) {
        SpecimenView s = specimenDirectory.find(id).orElseThrow(() -> new RecordNotFound("specimen", id));
        model.addAttribute("specimen", s);
        model.addAttribute("heat", heats.find(s.heatId()).orElse(null));
        model.addAttribute("order", customers.order(s.orderId()).orElse(null));
        model.addAttribute("runs", runs.runsOf(id));
        return "specimen";
    }

    /**
     * S0 and L0 from the readings typed so far, computed by the specimens feature's own geometry (the same
     * code registration uses), for the form's live display; nothing is stored.
     */
    @PostMapping("/lab/geometry-preview")
    @PreAuthorize(Access.LAB_WORKERS)
    @ResponseBody
    Map<String, Object> geometryPreview(@ModelAttribute SpecimenForm form) {
        Map<String, Object> out = new LinkedHashMap<>();
        try {
            SpecimenShape shape = SpecimenShape.valueOf(form.getShape());
            double s0;
            if (shape == SpecimenShape.OTHER) {
                s0 = Double.parseDouble(form.getS0Mm2().replace(',', '.'));
                out.put("s0", String.format(java.util.Locale.ROOT, "S0 = %.4g mm² (given)", s0));
            } else {
                Map<String, double[]> readings = form.readingsForPreview(shape);
                if (readings == null) {
                    out.put("s0", "S0: type every reading to see it");
                    return out;
                }
                CrossSection cs = CrossSection.measured(shape, CrossSection.Stage.ORIGINAL, readings);
                s0 = cs.areaMm2();
                out.put("s0", cs.formula());
            }
            GaugeLength gl = "FIXED".equals(form.getBasis())
                    ? GaugeLength.fixed(Double.parseDouble(form.getL0Mm().replace(',', '.')))
                    : GaugeLength.proportional(Double.parseDouble(form.getK().replace(',', '.')), s0,
                            form.isRoundToFiveMm());
            out.put("l0", String.format(java.util.Locale.ROOT, "L0 = %s mm (%s)", trim(gl.l0Mm()), gl.rule()));
        } catch (GeometryRefused e) {
            out.put("problem", e.getMessage());
        } catch (IllegalArgumentException | NullPointerException e) {
            out.putIfAbsent("l0", "L0: complete the gauge length fields to see it");
        }
        return out;
    }

    private static String trim(double v) {
        return java.math.BigDecimal.valueOf(v).stripTrailingZeros().toPlainString();
    }

    private String form(Model model, SpecimenForm form, List<FieldIssue> problems) {
        model.addAttribute("form", form);
        model.addAttribute("problems", problems);
        model.addAttribute("heats", heats.all());
        model.addAttribute("orders", customers.allOrders());
        model.addAttribute("shapes", SpecimenShape.values());
        model.addAttribute("orientations", org.specimenledger.specimens.Orientation.values());
        return "specimen-form";
    }

}
