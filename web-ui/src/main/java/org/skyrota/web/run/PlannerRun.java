package org.skyrota.web.run;

import java.time.Instant;
import java.time.LocalDate;

import jakarta.persistence.Column;
import jakarta.persistence.Entity;
import jakarta.persistence.EnumType;
import jakarta.persistence.Enumerated;
import jakarta.persistence.Table;

import org.skyrota.web.system.StoredEntity;

/** One planner run over a horizon of nights, and how it ended. */
@Entity
@Table(name = "planner_run")
public class PlannerRun extends StoredEntity {

    @Enumerated(EnumType.STRING)
    @Column(nullable = false, length = 16)
    private RunState state;

    @Column(name = "first_night", nullable = false)
    private LocalDate firstNight;

    @Column(name = "last_night", nullable = false)
    private LocalDate lastNight;

    /** Comma-separated site ids, or null for every site. */
    @Column(name = "site_ids", length = 1000)
    private String siteIds;

    @Column(name = "time_limit_seconds", nullable = false)
    private int timeLimitSeconds;

    @Column(name = "weights_json", length = 4000)
    private String weightsJson;

    @Column(name = "requested_by", nullable = false, length = 100)
    private String requestedBy;

    @Column(name = "started_at")
    private Instant startedAt;

    @Column(name = "finished_at")
    private Instant finishedAt;

    @Column(name = "best_score", length = 100)
    private String bestScore;

    @Column(length = 2000)
    private String message;

    @Column(name = "revision_id")
    private Long revisionId;

    /** What a finished run did ({@link RunSummary}, as JSON). */
    @Column(name = "summary_json")
    private String summaryJson;

    /** Why the run was started, when not by hand (an alert names itself here). */
    @Column(length = 200)
    private String purpose;

    protected PlannerRun() {}

    public PlannerRun(LocalDate firstNight, LocalDate lastNight, String siteIds, int timeLimitSeconds, String weightsJson,
                      String requestedBy) {
        this.state = RunState.QUEUED;
        this.firstNight = firstNight;
        this.lastNight = lastNight;
        this.siteIds = siteIds;
        this.timeLimitSeconds = timeLimitSeconds;
        this.weightsJson = weightsJson;
        this.requestedBy = requestedBy;
    }

    public void start(Instant at) {
        state = RunState.RUNNING;
        startedAt = at;
    }

    public void end(RunState how, Instant at, String score, String message) {
        state = how;
        finishedAt = at;
        if (score != null) {
            bestScore = score;
        }
        this.message = message == null ? null : message.length() > 2000 ? message.substring(0, 2000) : message;
    }

    public boolean overlaps(LocalDate first, LocalDate last) {
        return !first.isAfter(lastNight) && !last.isBefore(firstNight);
    }

    public RunState getState() {
        return state;
    }

    public LocalDate getFirstNight() {
        return firstNight;
    }

    public LocalDate getLastNight() {
        return lastNight;
    }

    public String getSiteIds() {
        return siteIds;
    }

    public int getTimeLimitSeconds() {
        return timeLimitSeconds;
    }

    public String getWeightsJson() {
        return weightsJson;
    }

    public String getRequestedBy() {
        return requestedBy;
    }

    public Instant getStartedAt() {
        return startedAt;
    }

    public Instant getFinishedAt() {
        return finishedAt;
    }

    public String getBestScore() {
        return bestScore;
    }

    public String getMessage() {
        return message;
    }

    public Long getRevisionId() {
        return revisionId;
    }

    public void setRevisionId(Long revisionId) {
        this.revisionId = revisionId;
    }

    public String getSummaryJson() {
        return summaryJson;
    }

    public void setSummaryJson(String summaryJson) {
        this.summaryJson = summaryJson;
    }

    public String getPurpose() {
        return purpose;
    }

    public void setPurpose(String purpose) {
        this.purpose = purpose == null || purpose.length() <= 200 ? purpose : purpose.substring(0, 200);
    }
}
