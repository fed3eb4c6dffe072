package org.skyrota.web.plan;

import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;

import jakarta.persistence.CollectionTable;
import jakarta.persistence.Column;
import jakarta.persistence.ElementCollection;
import jakarta.persistence.Entity;
import jakarta.persistence.EnumType;
import jakarta.persistence.Enumerated;
import jakarta.persistence.JoinColumn;
import jakarta.persistence.OrderColumn;
import jakarta.persistence.Table;

import org.skyrota.web.system.StoredEntity;

/**
 * A whole plan: every visit placed or left out, and the nights locked or closed. There is at most one draft (what
 * runs and overrides change) and one published revision (what telescopes carry out); older ones are retired.
 * Its version guards overrides: an override made against an older version is refused.
 */
@Entity
@Table(name = "plan_revision")
public class PlanRevision extends StoredEntity {

    public enum State { DRAFT, PUBLISHED, RETIRED }

    @Enumerated(EnumType.STRING)
    @Column(nullable = false, length = 16)
    private State state;

    @Column(name = "first_night", nullable = false)
    private LocalDate firstNight;

    @Column(name = "last_night", nullable = false)
    private LocalDate lastNight;

    @Column(length = 100)
    private String score;

    @Column(name = "run_id")
    private Long runId;

    @Column(name = "published_at")
    private Instant publishedAt;

    @Column(name = "published_by", length = 100)
    private String publishedBy;

    @ElementCollection
    @CollectionTable(name = "plan_visit", joinColumns = @JoinColumn(name = "revision_id"))
    @OrderColumn(name = "seq")
    private List<PlanVisit> visits = new ArrayList<>();

    @ElementCollection
    @CollectionTable(name = "plan_night", joinColumns = @JoinColumn(name = "revision_id"))
    @OrderColumn(name = "seq")
    private List<PlanNight> nights = new ArrayList<>();

    protected PlanRevision() {}

    public PlanRevision(State state, LocalDate firstNight, LocalDate lastNight) {
        this.state = state;
        this.firstNight = firstNight;
        this.lastNight = lastNight;
    }

    public State getState() {
        return state;
    }

    public void setState(State state) {
        this.state = state;
    }

    public LocalDate getFirstNight() {
        return firstNight;
    }

    public LocalDate getLastNight() {
        return lastNight;
    }

    public String getScore() {
        return score;
    }

    public void setScore(String score) {
        this.score = score;
    }

    public Long getRunId() {
        return runId;
    }

    public void setRunId(Long runId) {
        this.runId = runId;
    }

    public Instant getPublishedAt() {
        return publishedAt;
    }

    public String getPublishedBy() {
        return publishedBy;
    }

    public void markPublished(Instant at, String by) {
        state = State.PUBLISHED;
        publishedAt = at;
        publishedBy = by;
    }

    public List<PlanVisit> getVisits() {
        return visits;
    }

    public List<PlanNight> getNights() {
        return nights;
    }

    public void widenTo(LocalDate first, LocalDate last) {
        if (first.isBefore(firstNight)) {
            firstNight = first;
        }
        if (last.isAfter(lastNight)) {
            lastNight = last;
        }
    }
}
