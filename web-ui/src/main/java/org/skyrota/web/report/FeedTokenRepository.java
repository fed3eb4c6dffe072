package org.skyrota.web.report;

import java.util.Optional;

import org.springframework.data.jpa.repository.JpaRepository;

public interface FeedTokenRepository extends JpaRepository<FeedToken, String> {

    Optional<FeedToken> findByTokenHash(String tokenHash);
}
