package org.skyrota.web.plan;

import java.util.List;
import java.util.Optional;

import org.springframework.data.jpa.repository.JpaRepository;

public interface PlanRevisionRepository extends JpaRepository<PlanRevision, Long> {

    Optional<PlanRevision> findFirstByStateOrderByIdDesc(PlanRevision.State state);

    List<PlanRevision> findByState(PlanRevision.State state);
}
