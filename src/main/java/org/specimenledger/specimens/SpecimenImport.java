package org.specimenledger.specimens;

import jakarta.validation.ConstraintViolation;
import jakarta.validation.Validator;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import java.util.UUID;
import org.specimenledger.customers.CustomerDirectory;
import org.specimenledger.heats.HeatDirectory;
import org.specimenledger.heats.HeatView;
import org.specimenledger.shared.FieldIssue;
import org.specimenledger.shared.RecordNotFound;
import org.specimenledger.shared.RuleViolation;
import org.springframework.stereotype.Service;
import org.springframework.transaction.annotation.Transactional;

/**
 * Registers the specimens of one order from a {@link SpecimenSheet}. Every row is checked first, by the same
 * bean constraints and {@link SpecimenRules} as a single registration, and every problem of every row is
 * reported at once (422, pointers {@code /rows/{row}/{column}}); only when no row has a problem are they all
 * registered, each through {@link SpecimenService#register} with its own ledger event, in one transaction.
 */
@Service
public class SpecimenImport {

    /** The outcome of an import: every specimen registered, in the order of the rows. */
    public record Imported(UUID orderId, int registered, List<SpecimenView> specimens) {
    }

    private final SpecimenService service;
    private final SpecimenRepository specimens;
    private final HeatDirectory heats;
    private final CustomerDirectory customers;
    private final Validator validator;

    SpecimenImport(SpecimenService service, SpecimenRepository specimens, HeatDirectory heats,
            CustomerDirectory customers, Validator validator) {
        this.service = service;
        this.specimens = specimens;
        this.heats = heats;
        this.customers = customers;
        this.validator = validator;
    }

    @Transactional
    public Imported importSheet(UUID orderId, byte[] sheet) {
        if (customers.order(orderId).isEmpty()) {
            throw new RecordNotFound("order", orderId);
        }
        SpecimenSheet.Read read = SpecimenSheet.read(sheet, orderId);
        List<FieldIssue> issues = new ArrayList<>(read.issues());
        Map<String, Integer> firstRowOfMark = new HashMap<>();
        Map<String, UUID> heatOf = new HashMap<>();
        List<SpecimenRequests.SpecimenRequest> checked = new ArrayList<>();
        for (SpecimenSheet.Row row : read.rows()) {
            String at = "/rows/" + row.number() + "/";
            Set<String> columnsWithIssues = new HashSet<>();
            for (FieldIssue i : issues) {
                if (i.pointer().startsWith(at)) {
                    columnsWithIssues.add(i.pointer().substring(at.length()));
                }
            }
            List<FieldIssue> found = new ArrayList<>();
            UUID heatId = heat(row.heat(), at, heatOf, found);
            SpecimenRequests.SpecimenRequest r = withHeat(row.request(), heatId);
            for (ConstraintViolation<SpecimenRequests.SpecimenRequest> v : validator.validate(r)) {
                String pointer = "/" + v.getPropertyPath().toString().replace('.', '/');
                String column = SpecimenSheet.columnOf(pointer, r.shape());
                if (!column.equals("heat")) { // the heat column has its own, clearer problem
                    found.add(new FieldIssue(at + column, column + " " + v.getMessage()));
                }
            }
            if (r.shape() != null && r.leMm() != null && r.lcMm() != null) {
                try {
                    SpecimenRules.checked(r, List.of());
                } catch (RuleViolation e) {
                    for (FieldIssue i : e.issues()) {
                        found.add(new FieldIssue(at + SpecimenSheet.columnOf(i.pointer(), r.shape()), i.detail()));
                    }
                }
            }
            if (r.labIdentifier() != null && !r.labIdentifier().isBlank()) {
                String mark = r.labIdentifier().trim().toLowerCase(Locale.ROOT);
                Integer earlier = firstRowOfMark.putIfAbsent(mark, row.number());
                if (earlier != null) {
                    found.add(new FieldIssue(at + "mark", "mark '" + r.labIdentifier() + "' is already on row " + earlier));
                } else if (specimens.existsByLabIdentifierIgnoreCase(r.labIdentifier().trim())) {
                    found.add(new FieldIssue(at + "mark", "a specimen marked '" + r.labIdentifier()
                            + "' is already registered"));
                }
            }
            for (FieldIssue i : found) {
                String column = i.pointer().substring(at.length());
                if (!columnsWithIssues.contains(column)) { // a cell that did not parse is reported once
                    issues.add(new FieldIssue(i.pointer(), "row " + row.number() + " (line " + row.line() + "): "
                            + i.detail()));
                }
            }
            checked.add(r);
        }
        if (!issues.isEmpty()) {
            throw new RuleViolation(issues);
        }
        List<SpecimenView> registered = new ArrayList<>();
        for (SpecimenRequests.SpecimenRequest r : checked) {
            registered.add(service.register(r));
        }
        return new Imported(orderId, registered.size(), List.copyOf(registered));
    }

    /** The heat a cell names: its number (unique among producers) or its id. */
    private UUID heat(String cell, String at, Map<String, UUID> cache, List<FieldIssue> found) {
        if (cell == null) {
            found.add(new FieldIssue(at + "heat", "heat is required: the heat number"));
            return null;
        }
        if (cache.containsKey(cell)) {
            return cache.get(cell);
        }
        UUID id = null;
        try {
            UUID given = UUID.fromString(cell);
            if (heats.exists(given)) {
                id = given;
            } else {
                found.add(new FieldIssue(at + "heat", "no heat with id " + cell));
            }
        } catch (IllegalArgumentException notAnId) {
            List<HeatView> same = heats.withNumber(cell);
            if (same.isEmpty()) {
                found.add(new FieldIssue(at + "heat", "no heat numbered '" + cell + "'; register the heat first"));
            } else if (same.size() > 1) {
                found.add(new FieldIssue(at + "heat", "heat number '" + cell + "' is used by "
                        + same.stream().map(h -> h.producer() + " (id " + h.id() + ")").toList()
                        + "; give the heat's id instead"));
            } else {
                id = same.get(0).id();
            }
        }
        if (id != null) {
            cache.put(cell, id);
        }
        return id;
    }

    private static SpecimenRequests.SpecimenRequest withHeat(SpecimenRequests.SpecimenRequest r, UUID heatId) {
        return new SpecimenRequests.SpecimenRequest(r.labIdentifier(), heatId, r.orderId(), r.orientation(),
                r.samplingPosition(), r.shape(), r.readings(), r.s0Mm2(), r.s0Method(), r.gaugeLength(), r.leMm(),
                r.lcMm(), r.reason());
    }
}
