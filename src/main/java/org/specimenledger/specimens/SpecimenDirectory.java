package org.specimenledger.specimens;

import org.springframework.data.domain.Sort;
import org.springframework.data.domain.PageRequest;
import java.util.List;
import java.util.Optional;
import java.util.UUID;
import org.springframework.stereotype.Component;
import org.springframework.transaction.annotation.Transactional;

/**
 * What other features (testing, certificates, trace) may ask of specimens, by identifier, without the
 * visibility rules of the API: S0, L0, Le, Lc, Lu, Su, the heat, the order and its customer organisation.
 */
@Component
public class SpecimenDirectory {

    private final SpecimenRepository specimens;

    SpecimenDirectory(SpecimenRepository specimens) {
        this.specimens = specimens;
    }

    @Transactional(readOnly = true)
    public Optional<SpecimenView> find(UUID id) {
        return id == null ? Optional.empty() : specimens.findById(id).map(SpecimenView::of);
    }

    /** The specimen of an order with this mark (ignoring case, as marks are unique that way), if any. */
    @Transactional(readOnly = true)
    public Optional<SpecimenView> inOrderWithMark(UUID orderId, String mark) {
        return mark == null || mark.isBlank() ? Optional.empty()
                : specimens.findByLabIdentifierIgnoreCase(mark.trim()).filter(s -> s.orderId().equals(orderId))
                        .map(SpecimenView::of);
    }

    /** The most recently registered specimens, newest first (laboratory pages; no customer scope). */
    @Transactional(readOnly = true)
    public List<SpecimenView> recent(int limit) {
        return specimens.findAll(PageRequest.of(0, limit, Sort.by(Sort.Direction.DESC, "createdAt"))).stream()
                .map(SpecimenView::of).toList();
    }

    /** The specimens of one order in mark order (laboratory pages; no customer scope). */
    @Transactional(readOnly = true)
    public List<SpecimenView> ofOrder(UUID orderId) {
        return specimens.findAllByOrderIdOrderByLabIdentifierAsc(orderId).stream().map(SpecimenView::of).toList();
    }
}
