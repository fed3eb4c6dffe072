package org.skyrota.web.report;

import java.time.Instant;

import jakarta.persistence.Column;
import jakarta.persistence.Entity;
import jakarta.persistence.Table;

import org.skyrota.web.system.StoredEntity;

/** A machine's token (a telescope's control computer): only its SHA-256 is stored. */
@Entity
@Table(name = "api_token")
public class ApiToken extends StoredEntity {

    @Column(nullable = false, length = 100)
    private String name;

    @Column(name = "telescope_id", nullable = false)
    private long telescopeId;

    @Column(nullable = false, length = 32)
    private String scope;

    @Column(name = "token_hash", nullable = false, length = 64)
    private String tokenHash;

    @Column(name = "created_by", nullable = false, length = 100)
    private String createdBy;

    @Column(name = "revoked_at")
    private Instant revokedAt;

    protected ApiToken() {}

    public ApiToken(String name, long telescopeId, String scope, String tokenHash, String createdBy) {
        this.name = name;
        this.telescopeId = telescopeId;
        this.scope = scope;
        this.tokenHash = tokenHash;
        this.createdBy = createdBy;
    }

    public void revoke(Instant at) {
        if (revokedAt == null) {
            revokedAt = at;
        }
    }

    public boolean isRevoked() {
        return revokedAt != null;
    }

    public String getName() {
        return name;
    }

    public long getTelescopeId() {
        return telescopeId;
    }

    public String getScope() {
        return scope;
    }

    public String getCreatedBy() {
        return createdBy;
    }

    public Instant getRevokedAt() {
        return revokedAt;
    }
}
