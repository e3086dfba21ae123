package org.specimenledger.specimens;

import java.util.List;
import java.util.UUID;
import org.springframework.data.jpa.repository.JpaRepository;
import org.springframework.data.jpa.repository.JpaSpecificationExecutor;
import org.springframework.data.jpa.repository.Query;
import org.springframework.data.repository.query.Param;

interface SpecimenRepository extends JpaRepository<Specimen, UUID>, JpaSpecificationExecutor<Specimen> {

    boolean existsByLabIdentifierIgnoreCase(String labIdentifier);

    java.util.Optional<Specimen> findByLabIdentifierIgnoreCase(String labIdentifier);

    boolean existsByLabIdentifierIgnoreCaseAndIdNot(String labIdentifier, UUID id);

    List<Specimen> findAllByOrderIdOrderByLabIdentifierAsc(UUID orderId);

    boolean existsByHeatIdAndCustomerId(UUID heatId, UUID customerId);

    @Query("select distinct s.heatId from Specimen s where s.customerId = :customerId")
    List<UUID> heatIdsOfCustomer(@Param("customerId") UUID customerId);
}
