package org.skyrota.web.report;

import java.time.Instant;

import jakarta.persistence.Column;
import jakarta.persistence.Entity;
import jakarta.persistence.EnumType;
import jakarta.persistence.Enumerated;
import jakarta.persistence.Table;

import org.skyrota.web.system.StoredEntity;

/** A telescope's word on one published visit. */
@Entity
@Table(name = "observation_report")
public class ObservationReport extends StoredEntity {

    @Column(name = "request_id", nullable = false)
    private long requestId;

    @Column(name = "repeat_no", nullable = false)
    private int repeatNo;

    @Column(name = "telescope_id", nullable = false)
    private long telescopeId;

    @Enumerated(EnumType.STRING)
    @Column(nullable = false, length = 16)
    private Outcome outcome;

    @Column(length = 1000)
    private String reason;

    @Column(name = "observed_at", nullable = false)
    private Instant observedAt;

    /** The visit's planned length when done, else zero: what counts as observed time. */
    @Column(name = "observed_seconds", nullable = false)
    private long observedSeconds;

    @Column(name = "token_id", nullable = false)
    private long tokenId;

    protected ObservationReport() {}

    public ObservationReport(long requestId, int repeatNo, long telescopeId, Outcome outcome, String reason,
                             Instant observedAt, long observedSeconds, long tokenId) {
        this.requestId = requestId;
        this.repeatNo = repeatNo;
        this.telescopeId = telescopeId;
        this.outcome = outcome;
        this.reason = reason;
        this.observedAt = observedAt;
        this.observedSeconds = observedSeconds;
        this.tokenId = tokenId;
    }

    public long getRequestId() {
        return requestId;
    }

    public int getRepeatNo() {
        return repeatNo;
    }

    public long getTelescopeId() {
        return telescopeId;
    }

    public Outcome getOutcome() {
        return outcome;
    }

    public String getReason() {
        return reason;
    }

    public Instant getObservedAt() {
        return observedAt;
    }

    public long getObservedSeconds() {
        return observedSeconds;
    }

    public long getTokenId() {
        return tokenId;
    }
}
