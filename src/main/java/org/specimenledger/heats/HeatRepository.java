package org.specimenledger.heats;

import java.util.List;
import java.util.UUID;
import org.springframework.data.jpa.repository.JpaRepository;
import org.springframework.data.jpa.repository.JpaSpecificationExecutor;

interface HeatRepository extends JpaRepository<Heat, UUID>, JpaSpecificationExecutor<Heat> {

    boolean existsByProducerIgnoreCaseAndHeatNumberIgnoreCase(String producer, String heatNumber);

    List<Heat> findAllByHeatNumberIgnoreCaseOrderByProducerAsc(String heatNumber);

    /** A customer's heats: one query whose plan Hibernate keeps, unlike a criteria query built per call. */
    List<Heat> findAllByIdInOrderByProducerAscHeatNumberAsc(java.util.Collection<UUID> ids);

    boolean existsByProducerIgnoreCaseAndHeatNumberIgnoreCaseAndIdNot(String producer, String heatNumber, UUID id);
}
