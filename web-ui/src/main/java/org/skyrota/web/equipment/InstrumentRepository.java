package org.skyrota.web.equipment;

import org.springframework.data.domain.Page;
import org.springframework.data.domain.Pageable;
import org.springframework.data.jpa.repository.JpaRepository;

public interface InstrumentRepository extends JpaRepository<Instrument, Long> {

    Page<Instrument> findByTelescopeId(long telescopeId, Pageable pageable);

    boolean existsByTelescopeIdAndNameIgnoreCase(long telescopeId, String name);
}
