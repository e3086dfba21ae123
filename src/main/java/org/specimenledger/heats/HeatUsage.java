package org.specimenledger.heats;

import java.util.Set;
import java.util.UUID;

/**
 * Which heats a customer organisation has specimens of; the specimens feature answers it. A customer
 * may see a heat only when one of their organisation's specimens was taken from it. Declared here and
 * implemented there so that heats need not know specimens (the dependency runs specimens → heats only).
 */
public interface HeatUsage {

    /** Ids of the heats that at least one specimen of the organisation's orders was taken from. */
    Set<UUID> heatsUsedBy(UUID organisationId);

    /** Whether at least one specimen of the organisation's orders was taken from this heat. */
    boolean isUsedBy(UUID heatId, UUID organisationId);
}
