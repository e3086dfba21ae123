package org.specimenledger.heats;

import org.springframework.data.domain.Sort;
import java.util.List;
import java.util.Optional;
import java.util.UUID;
import org.springframework.stereotype.Component;
import org.springframework.transaction.annotation.Transactional;

/** What other features may ask of heats, by identifier, without the visibility rules of the API. */
@Component
public class HeatDirectory {

    private final HeatRepository heats;

    HeatDirectory(HeatRepository heats) {
        this.heats = heats;
    }

    @Transactional(readOnly = true)
    public boolean exists(UUID id) {
        return id != null && heats.existsById(id);
    }

    @Transactional(readOnly = true)
    public Optional<HeatView> find(UUID id) {
        return id == null ? Optional.empty() : heats.findById(id).map(HeatView::of);
    }

    /** Heats with this heat number (ignoring case), by producer; heat numbers are unique per producer only. */
    @Transactional(readOnly = true)
    public List<HeatView> withNumber(String heatNumber) {
        return heatNumber == null || heatNumber.isBlank() ? List.of()
                : heats.findAllByHeatNumberIgnoreCaseOrderByProducerAsc(heatNumber.trim()).stream().map(HeatView::of)
                        .toList();
    }

    /** Every heat by heat number, for the laboratory's pick lists (laboratory roles only, no customer scope). */
    @Transactional(readOnly = true)
    public List<HeatView> all() {
        return heats.findAll(Sort.by("heatNumber")).stream().map(HeatView::of).toList();
    }
}
