package org.specimenledger.heats;

import jakarta.persistence.criteria.Predicate;
import java.math.BigDecimal;
import java.time.Clock;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.UUID;
import org.specimenledger.audit.Ledger;
import org.specimenledger.shared.ChangeReason;
import org.specimenledger.shared.CurrentUser;
import org.specimenledger.shared.DuplicateRecord;
import org.specimenledger.shared.RecordNotFound;
import org.springframework.data.domain.Sort;
import org.springframework.data.jpa.domain.Specification;
import org.springframework.stereotype.Service;
import org.springframework.transaction.annotation.Transactional;

/**
 * Registers and corrects heats; each write is one ledger event in the same transaction. A customer
 * sees only the heats their organisation's specimens were taken from; any other heat is "not found".
 */
@Service
public class HeatService {

    private final HeatRepository heats;
    private final HeatUsage usage;
    private final Ledger ledger;
    private final Clock clock;

    HeatService(HeatRepository heats, HeatUsage usage, Ledger ledger, Clock clock) {
        this.heats = heats;
        this.usage = usage;
        this.ledger = ledger;
        this.clock = clock;
    }

    /** Registers a heat; 409 at {@code /heatNumber} when the producer already has that heat number. */
    @Transactional
    public HeatView register(HeatRequests.HeatRequest request) {
        Map<String, BigDecimal> composition = HeatRules.checked(request);
        String producer = request.producer().trim();
        String number = request.heatNumber().trim();
        if (heats.existsByProducerIgnoreCaseAndHeatNumberIgnoreCase(producer, number)) {
            throw duplicate(producer, number);
        }
        Heat heat = heats.saveAndFlush(new Heat(number, producer, request.grade().trim(), request.productForm(),
                request.nominalThicknessMm(), composition, now()));
        HeatView view = HeatView.of(heat);
        ledger.record("heat.registered", "heat", heat.id(), request.reason(), null, view);
        return view;
    }

    @Transactional
    HeatView change(UUID id, HeatRequests.HeatRequest request) {
        String reason = ChangeReason.required(request.reason());
        Heat heat = heats.findById(id).orElseThrow(() -> new RecordNotFound("heat", id));
        Map<String, BigDecimal> composition = HeatRules.checked(request);
        String producer = request.producer().trim();
        String number = request.heatNumber().trim();
        if (heats.existsByProducerIgnoreCaseAndHeatNumberIgnoreCaseAndIdNot(producer, number, id)) {
            throw duplicate(producer, number);
        }
        HeatView before = HeatView.of(heat);
        heat.correct(number, producer, request.grade().trim(), request.productForm(), request.nominalThicknessMm(),
                composition);
        heats.saveAndFlush(heat);
        HeatView after = HeatView.of(heat);
        ledger.record("heat.changed", "heat", id, reason, before, after);
        return after;
    }

    /** Heats ordered by producer and heat number; filters match whole values, ignoring case. */
    @Transactional(readOnly = true)
    List<HeatView> list(String producer, String heatNumber) {
        Optional<UUID> organisation = CurrentUser.customerOrganisation();
        Set<UUID> visible = organisation.map(usage::heatsUsedBy).orElse(null);
        if (visible != null && visible.isEmpty()) {
            return List.of();
        }
        boolean unfiltered = (producer == null || producer.isBlank()) && (heatNumber == null || heatNumber.isBlank());
        if (visible != null && unfiltered) {
            // the portal's everyday list
            return heats.findAllByIdInOrderByProducerAscHeatNumberAsc(visible).stream().map(HeatView::of).toList();
        }
        Specification<Heat> filter = (root, query, cb) -> {
            List<Predicate> where = new ArrayList<>();
            if (producer != null && !producer.isBlank()) {
                where.add(cb.equal(cb.lower(root.get("producer")), producer.trim().toLowerCase(Locale.ROOT)));
            }
            if (heatNumber != null && !heatNumber.isBlank()) {
                where.add(cb.equal(cb.lower(root.get("heatNumber")), heatNumber.trim().toLowerCase(Locale.ROOT)));
            }
            if (visible != null) {
                where.add(root.get("id").in(visible));
            }
            return cb.and(where.toArray(Predicate[]::new));
        };
        return heats.findAll(filter, Sort.by("producer", "heatNumber")).stream().map(HeatView::of).toList();
    }

    @Transactional(readOnly = true)
    HeatView get(UUID id) {
        Heat heat = heats.findById(id)
                .filter(h -> CurrentUser.customerOrganisation().map(org -> usage.isUsedBy(h.id(), org)).orElse(true))
                .orElseThrow(() -> new RecordNotFound("heat", id));
        return HeatView.of(heat);
    }

    private static DuplicateRecord duplicate(String producer, String number) {
        return new DuplicateRecord("/heatNumber", "producer '" + producer + "' already has a heat numbered '"
                + number + "'");
    }

    /** PostgreSQL keeps microseconds: truncate so that the view the ledger records equals the stored row. */
    private Instant now() {
        return clock.instant().truncatedTo(ChronoUnit.MICROS);
    }
}
