package org.skyrota.web.equipment;

import org.springframework.data.domain.Page;
import org.springframework.data.domain.Pageable;
import org.springframework.data.jpa.repository.JpaRepository;

public interface TelescopeRepository extends JpaRepository<Telescope, Long> {

    Page<Telescope> findBySiteId(long siteId, Pageable pageable);

    boolean existsBySiteIdAndNameIgnoreCase(long siteId, String name);
}
