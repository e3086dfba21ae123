package org.specimenledger.jobs;

import java.util.Collection;
import java.util.List;
import java.util.UUID;
import org.springframework.data.domain.Page;
import org.springframework.data.domain.Pageable;
import org.springframework.data.jpa.repository.JpaRepository;

interface JobRepository extends JpaRepository<Job, UUID> {

    Page<Job> findAllByOwner(String owner, Pageable page);

    List<Job> findAllByStateIn(Collection<JobState> states);
}
