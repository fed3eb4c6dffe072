package org.skyrota.web.plan;

import java.time.LocalDate;

import jakarta.persistence.Column;
import jakarta.persistence.Embeddable;
import jakarta.persistence.EnumType;
import jakarta.persistence.Enumerated;

/** A telescope night a coordinator locked (its visits stay on re-plan) or closed (weather, maintenance). */
@Embeddable
public class PlanNight {

    public enum State { LOCKED, CLOSED }

    @Column(name = "telescope_id", nullable = false)
    private long telescopeId;

    @Column(nullable = false)
    private LocalDate night;

    @Enumerated(EnumType.STRING)
    @Column(nullable = false, length = 16)
    private State state;

    @Column(length = 500)
    private String reason;

    protected PlanNight() {}

    public PlanNight(long telescopeId, LocalDate night, State state, String reason) {
        this.telescopeId = telescopeId;
        this.night = night;
        this.state = state;
        this.reason = reason;
    }

    public PlanNight copy() {
        return new PlanNight(telescopeId, night, state, reason);
    }

    public boolean is(long telescopeId, LocalDate night) {
        return this.telescopeId == telescopeId && this.night.equals(night);
    }

    public long getTelescopeId() {
        return telescopeId;
    }

    public LocalDate getNight() {
        return night;
    }

    public State getState() {
        return state;
    }

    public String getReason() {
        return reason;
    }
}
