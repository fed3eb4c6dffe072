package org.skyrota.web.system;

import java.time.Instant;
import java.time.temporal.ChronoUnit;

import jakarta.persistence.Column;
import jakarta.persistence.GeneratedValue;
import jakarta.persistence.GenerationType;
import jakarta.persistence.Id;
import jakarta.persistence.MappedSuperclass;
import jakarta.persistence.PrePersist;
import jakarta.persistence.PreUpdate;
import jakarta.persistence.Version;

/**
 * What every stored entity has: an identity, a version for optimistic locking (an edit made
 * against an older version is refused, never silently applied), and when it was made and last changed.
 */
@MappedSuperclass
public abstract class StoredEntity {

    @Id
    @GeneratedValue(strategy = GenerationType.IDENTITY)
    private Long id;

    @Version
    @Column(nullable = false)
    private long version;

    @Column(name = "created_at", nullable = false, updatable = false)
    private Instant createdAt;

    @Column(name = "updated_at", nullable = false)
    private Instant updatedAt;

    public Long getId() {
        return id;
    }

    public long getVersion() {
        return version;
    }

    public Instant getCreatedAt() {
        return createdAt;
    }

    public Instant getUpdatedAt() {
        return updatedAt;
    }

    /**
     * Refuses an edit made against another version than the stored one.
     *
     * @throws StaleVersionException naming the current version
     */
    public void requireVersion(String kind, long expectedVersion) {
        if (expectedVersion != version) {
            throw new StaleVersionException(kind, id, expectedVersion, version);
        }
    }

    /** Microseconds: what H2 and PostgreSQL keep, so that the answer to a write equals what a later read gives. */
    private static Instant now() {
        return ServerClock.currentInstant().truncatedTo(ChronoUnit.MICROS);
    }

    @PrePersist
    void stampCreation() {
        createdAt = now();
        updatedAt = createdAt;
    }

    @PreUpdate
    void stampUpdate() {
        updatedAt = now();
    }
}
