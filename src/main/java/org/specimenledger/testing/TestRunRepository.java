package org.specimenledger.testing;

import java.util.List;
import java.util.Optional;
import java.util.UUID;
import org.springframework.data.jpa.repository.JpaRepository;

interface TestRunRepository extends JpaRepository<TestRun, UUID> {

    Optional<TestRun> findBySpecimenIdAndValidity(UUID specimenId, Validity validity);

    List<TestRun> findAllBySpecimenIdOrderByCreatedAtAsc(UUID specimenId);

    List<TestRun> findAllByOrderByCreatedAtAsc();
}
