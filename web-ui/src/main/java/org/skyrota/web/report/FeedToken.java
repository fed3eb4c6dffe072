package org.skyrota.web.report;

import java.time.Instant;

import jakarta.persistence.Column;
import jakarta.persistence.Entity;
import jakarta.persistence.Id;
import jakarta.persistence.Table;

/** A person's calendar-feed token, for feed readers that cannot sign in; only its SHA-256 is stored. */
@Entity
@Table(name = "feed_token")
public class FeedToken {

    @Id
    @Column(length = 100)
    private String username;

    @Column(name = "token_hash", nullable = false, length = 64)
    private String tokenHash;

    @Column(name = "created_at", nullable = false)
    private Instant createdAt;

    protected FeedToken() {}

    public FeedToken(String username, String tokenHash, Instant createdAt) {
        this.username = username;
        this.tokenHash = tokenHash;
        this.createdAt = createdAt;
    }

    public String getUsername() {
        return username;
    }

    public void replace(String tokenHash, Instant at) {
        this.tokenHash = tokenHash;
        this.createdAt = at;
    }
}
