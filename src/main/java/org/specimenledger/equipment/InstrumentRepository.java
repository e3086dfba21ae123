package org.specimenledger.equipment;

import java.util.List;
import java.util.UUID;
import org.springframework.data.jpa.repository.JpaRepository;

interface InstrumentRepository extends JpaRepository<Instrument, UUID> {

    boolean existsByAssetIdIgnoreCase(String assetId);

    boolean existsByAssetIdIgnoreCaseAndIdNot(String assetId, UUID id);

    List<Instrument> findAllByOrderByAssetIdAsc();

    List<Instrument> findAllByKindOrderByAssetIdAsc(InstrumentKind kind);
}
