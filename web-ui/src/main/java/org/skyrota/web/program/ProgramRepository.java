package org.skyrota.web.program;

import org.springframework.data.domain.Page;
import org.springframework.data.domain.Pageable;
import org.springframework.data.jpa.repository.JpaRepository;

public interface ProgramRepository extends JpaRepository<Program, Long> {

    Page<Program> findByActive(boolean active, Pageable pageable);

    boolean existsByCodeIgnoreCase(String code);
}
