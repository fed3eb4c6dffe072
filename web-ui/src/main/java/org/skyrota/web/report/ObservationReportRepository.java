package org.skyrota.web.report;

import org.springframework.data.jpa.repository.JpaRepository;

public interface ObservationReportRepository extends JpaRepository<ObservationReport, Long> {
}
