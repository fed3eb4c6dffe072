package org.skyrota.web.plan;

import java.time.Instant;
import java.time.LocalDate;

import jakarta.persistence.Column;
import jakarta.persistence.Embeddable;

/** One visit in a plan revision: placed (telescope, night, start, end) or left out with the planner's reason. */
@Embeddable
public class PlanVisit {

    @Column(name = "request_id", nullable = false)
    private long requestId;

    @Column(name = "repeat_no", nullable = false)
    private int repeatNo;

    @Column(name = "telescope_id")
    private Long telescopeId;

    private LocalDate night;

    @Column(name = "start_at")
    private Instant start;

    @Column(name = "end_at")
    private Instant end;

    @Column(nullable = false)
    private boolean pinned;

    @Column(length = 1000)
    private String reason;

    protected PlanVisit() {}

    public static PlanVisit placed(VisitKey key, long telescopeId, LocalDate night, Instant start, Instant end, boolean pinned) {
        PlanVisit v = new PlanVisit();
        v.requestId = key.requestId();
        v.repeatNo = key.repeatNo();
        v.place(telescopeId, night, start, end, pinned);
        return v;
    }

    public static PlanVisit leftOut(VisitKey key, String reason) {
        PlanVisit v = new PlanVisit();
        v.requestId = key.requestId();
        v.repeatNo = key.repeatNo();
        v.unplace(reason);
        return v;
    }

    public PlanVisit copy() {
        PlanVisit v = new PlanVisit();
        v.requestId = requestId;
        v.repeatNo = repeatNo;
        v.telescopeId = telescopeId;
        v.night = night;
        v.start = start;
        v.end = end;
        v.pinned = pinned;
        v.reason = reason;
        return v;
    }

    public void place(long telescopeId, LocalDate night, Instant start, Instant end, boolean pinned) {
        this.telescopeId = telescopeId;
        this.night = night;
        this.start = start;
        this.end = end;
        this.pinned = pinned;
        this.reason = null;
    }

    public void unplace(String reason) {
        telescopeId = null;
        night = null;
        start = null;
        end = null;
        pinned = false;
        this.reason = reason;
    }

    public void setPinned(boolean pinned) {
        this.pinned = pinned;
    }

    public VisitKey key() {
        return new VisitKey(requestId, repeatNo);
    }

    public boolean isPlaced() {
        return telescopeId != null;
    }

    public long getRequestId() {
        return requestId;
    }

    public int getRepeatNo() {
        return repeatNo;
    }

    public Long getTelescopeId() {
        return telescopeId;
    }

    public LocalDate getNight() {
        return night;
    }

    public Instant getStart() {
        return start;
    }

    public Instant getEnd() {
        return end;
    }

    public boolean isPinned() {
        return pinned;
    }

    public String getReason() {
        return reason;
    }
}
