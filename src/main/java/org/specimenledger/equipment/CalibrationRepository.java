package org.specimenledger.equipment;

import java.util.Collection;
import java.util.List;
import java.util.Optional;
import java.util.UUID;
import org.springframework.data.jpa.repository.JpaRepository;

interface CalibrationRepository extends JpaRepository<Calibration, UUID> {

    List<Calibration> findAllByInstrumentIdOrderByCalibratedOnAscRecordedAtAsc(UUID instrumentId);

    List<Calibration> findAllByInstrumentIdIn(Collection<UUID> instrumentIds);

    Optional<Calibration> findByIdAndInstrumentId(UUID id, UUID instrumentId);

    boolean existsByInstrumentIdAndCertificateReferenceIgnoreCaseAndWithdrawnAtIsNull(UUID instrumentId,
            String certificateReference);
}
