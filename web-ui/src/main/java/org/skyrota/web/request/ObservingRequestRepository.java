package org.skyrota.web.request;

import java.util.Optional;

import org.springframework.data.jpa.repository.JpaRepository;
import org.springframework.data.jpa.repository.JpaSpecificationExecutor;

public interface ObservingRequestRepository extends JpaRepository<ObservingRequest, Long>, JpaSpecificationExecutor<ObservingRequest> {

    long countByState(RequestState state);

    Optional<ObservingRequest> findByAlertIvorn(String alertIvorn);
}
