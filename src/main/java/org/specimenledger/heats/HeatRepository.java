package org.specimenledger.heats;

import java.util.List;
import java.util.UUID;
import org.springframework.data.jpa.repository.JpaRepository;
import org.springframework.data.jpa.repository.JpaSpecificationExecutor;

interface HeatRepository extends JpaRepository<Heat, UUID>, JpaSpecificationExecutor<Heat> {

    boolean existsByProducerIgnoreCaseAndHeatNumberIgnoreCase(String producer, String heatNumber);

    List<Heat> findAllByHeatNumberIgnoreCaseOrderByProducerAsc(String heatNumber);

    boolean existsByProducerIgnoreCaseAndHeatNumberIgnoreCaseAndIdNot(String producer, String heatNumber, UUID id);
}
