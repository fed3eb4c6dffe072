package org.skyrota.web.run;

import java.util.Collection;
import java.util.List;

import org.springframework.data.jpa.repository.JpaRepository;

public interface PlannerRunRepository extends JpaRepository<PlannerRun, Long> {

    List<PlannerRun> findByStateIn(Collection<RunState> states);
}
