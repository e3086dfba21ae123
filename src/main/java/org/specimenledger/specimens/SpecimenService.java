package org.specimenledger.specimens;

import jakarta.persistence.criteria.Predicate;
import java.time.Clock;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.UUID;
import org.specimenledger.audit.Ledger;
import org.specimenledger.customers.CustomerDirectory;
import org.specimenledger.customers.OrderView;
import org.specimenledger.heats.HeatDirectory;
import org.specimenledger.shared.ChangeReason;
import org.specimenledger.shared.CurrentUser;
import org.specimenledger.shared.DuplicateRecord;
import org.specimenledger.shared.FieldIssue;
import org.specimenledger.shared.RecordNotFound;
import org.specimenledger.shared.StateConflict;
import org.springframework.data.domain.Sort;
import org.springframework.data.jpa.domain.Specification;
import org.springframework.stereotype.Service;
import org.springframework.transaction.annotation.Transactional;

/**
 * Registers specimens, corrects their register data before testing and records the after-fracture
 * measurements; each write is one ledger event in the same transaction. A customer sees only the specimens
 * of their own organisation's orders; any other specimen is "not found".
 */
@Service
public class SpecimenService {

    private final SpecimenRepository specimens;
    private final HeatDirectory heats;
    private final CustomerDirectory customers;
    private final Ledger ledger;
    private final Clock clock;

    SpecimenService(SpecimenRepository specimens, HeatDirectory heats, CustomerDirectory customers, Ledger ledger,
            Clock clock) {
        this.specimens = specimens;
        this.heats = heats;
        this.customers = customers;
        this.ledger = ledger;
        this.clock = clock;
    }

    /**
     * Registers a specimen with its geometry; S0 and L0 are computed here. 422 for an unknown heat or order
     * ({@code /heatId}, {@code /orderId}) or refused geometry, 409 at {@code /labIdentifier} for a mark in use.
     */
    @Transactional
    public SpecimenView register(SpecimenRequests.SpecimenRequest request) {
        List<FieldIssue> found = new ArrayList<>();
        UUID customerId = references(request, found);
        Geometry geometry = SpecimenRules.checked(request, found);
        String mark = request.labIdentifier().trim();
        if (specimens.existsByLabIdentifierIgnoreCase(mark)) {
            throw duplicate(mark);
        }
        Specimen specimen = specimens.saveAndFlush(new Specimen(mark, request.heatId(), request.orderId(), customerId,
                request.orientation(), trimmed(request.samplingPosition()), geometry, now()));
        SpecimenView view = SpecimenView.of(specimen);
        ledger.record("specimen.registered", "specimen", specimen.id(), request.reason(), null, view);
        return view;
    }

    @Transactional
    SpecimenView correct(UUID id, SpecimenRequests.SpecimenRequest request) {
        String reason = ChangeReason.required(request.reason());
        Specimen specimen = specimens.findById(id).orElseThrow(() -> new RecordNotFound("specimen", id));
        if (specimen.isBroken()) {
            throw new StateConflict("specimen '" + specimen.labIdentifier() + "' is already tested (after-fracture "
                    + "measurements recorded at " + specimen.fractureRecordedAt() + "); its register data can no "
                    + "longer be corrected");
        }
        List<FieldIssue> found = new ArrayList<>();
        UUID customerId = references(request, found);
        Geometry geometry = SpecimenRules.checked(request, found);
        String mark = request.labIdentifier().trim();
        if (specimens.existsByLabIdentifierIgnoreCaseAndIdNot(mark, id)) {
            throw duplicate(mark);
        }
        SpecimenView before = SpecimenView.of(specimen);
        specimen.correct(mark, request.heatId(), request.orderId(), customerId, request.orientation(),
                trimmed(request.samplingPosition()), geometry);
        specimens.saveAndFlush(specimen);
        SpecimenView after = SpecimenView.of(specimen);
        ledger.record("specimen.changed", "specimen", id, reason, before, after);
        return after;
    }

    /**
     * Records what was measured on the broken pieces: Lu, the fracture readings (Su computed like S0) and
     * the fracture position. The first recording needs no reason; replacing recorded values needs one.
     */
    @Transactional
    public SpecimenView recordAfterFracture(UUID id, SpecimenRequests.AfterFractureRequest request) {
        Specimen specimen = specimens.findById(id).orElseThrow(() -> new RecordNotFound("specimen", id));
        boolean replacing = specimen.isBroken();
        String reason = replacing ? ChangeReason.required(request.reason()) : request.reason();
        FractureMeasurement measurement = SpecimenRules.afterFracture(specimen.shape(), specimen.s0Mm2(),
                specimen.l0Mm(), request);
        SpecimenView before = SpecimenView.of(specimen);
        specimen.recordAfterFracture(measurement, now());
        specimens.saveAndFlush(specimen);
        SpecimenView after = SpecimenView.of(specimen);
        ledger.record(replacing ? "specimen.after-fracture-changed" : "specimen.after-fracture-recorded", "specimen",
                id, reason, before, after);
        return after;
    }

    /** Specimens in order of registration; filters are exact (the lab identifier ignoring case). */
    @Transactional(readOnly = true)
    List<SpecimenView> list(UUID heatId, UUID orderId, String labIdentifier) {
        UUID scope = CurrentUser.customerOrganisation().orElse(null);
        Specification<Specimen> filter = (root, query, cb) -> {
            List<Predicate> where = new ArrayList<>();
            if (heatId != null) {
                where.add(cb.equal(root.get("heatId"), heatId));
            }
            if (orderId != null) {
                where.add(cb.equal(root.get("orderId"), orderId));
            }
            if (labIdentifier != null && !labIdentifier.isBlank()) {
                where.add(cb.equal(cb.lower(root.get("labIdentifier")),
                        labIdentifier.trim().toLowerCase(Locale.ROOT)));
            }
            if (scope != null) {
                where.add(cb.equal(root.get("customerId"), scope));
            }
            return cb.and(where.toArray(Predicate[]::new));
        };
        return specimens.findAll(filter, Sort.by("createdAt", "labIdentifier")).stream().map(SpecimenView::of)
                .toList();
    }

    @Transactional(readOnly = true)
    SpecimenView get(UUID id) {
        Specimen specimen = specimens.findById(id)
                .filter(s -> CurrentUser.customerOrganisation().map(org -> org.equals(s.customerId())).orElse(true))
                .orElseThrow(() -> new RecordNotFound("specimen", id));
        return SpecimenView.of(specimen);
    }

    /** Checks the heat and order the body names; returns the order's customer (null when the order is unknown). */
    private UUID references(SpecimenRequests.SpecimenRequest request, List<FieldIssue> found) {
        if (!heats.exists(request.heatId())) {
            found.add(new FieldIssue("/heatId", "no heat with id " + request.heatId()));
        }
        OrderView order = customers.order(request.orderId()).orElse(null);
        if (order == null) {
            found.add(new FieldIssue("/orderId", "no order with id " + request.orderId()));
            return null;
        }
        return order.customerId();
    }

    private static DuplicateRecord duplicate(String mark) {
        return new DuplicateRecord("/labIdentifier", "a specimen marked '" + mark + "' is already registered");
    }

    private static String trimmed(String text) {
        return text == null || text.isBlank() ? null : text.trim();
    }

    /** PostgreSQL keeps microseconds: truncate so that the view the ledger records equals the stored row. */
    private Instant now() {
        return clock.instant().truncatedTo(ChronoUnit.MICROS);
    }
}
