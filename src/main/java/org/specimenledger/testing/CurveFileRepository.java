package org.specimenledger.testing;

import java.util.List;
import java.util.Optional;
import java.util.UUID;
import org.springframework.data.jpa.repository.JpaRepository;

interface CurveFileRepository extends JpaRepository<CurveFile, UUID> {

    Optional<CurveFile> findByTestRunId(UUID testRunId);

    boolean existsByTestRunId(UUID testRunId);

    List<CurveFile> findAllBySha256AndTestRunIdNotOrderByReceivedAtAsc(String sha256, UUID testRunId);
}
