package org.specimenledger.specimens;

import java.util.Set;
import java.util.UUID;
import org.specimenledger.heats.HeatUsage;
import org.springframework.stereotype.Component;
import org.springframework.transaction.annotation.Transactional;

/** Tells the heats feature which heats a customer organisation has specimens of (their visibility rule). */
@Component
class SpecimenHeatUsage implements HeatUsage {

    private final SpecimenRepository specimens;

    SpecimenHeatUsage(SpecimenRepository specimens) {
        this.specimens = specimens;
    }

    @Override
    @Transactional(readOnly = true)
    public Set<UUID> heatsUsedBy(UUID organisationId) {
        return Set.copyOf(specimens.heatIdsOfCustomer(organisationId));
    }

    @Override
    @Transactional(readOnly = true)
    public boolean isUsedBy(UUID heatId, UUID organisationId) {
        return specimens.existsByHeatIdAndCustomerId(heatId, organisationId);
    }
}
