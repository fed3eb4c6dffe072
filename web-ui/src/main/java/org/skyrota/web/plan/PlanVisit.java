package org.skyrota.web.plan;

import java.time.Instant;
import java.time.LocalDate;

import jakarta.persistence.Column;
import jakarta.persistence.Embeddable;

/**
 * One visit in a plan revision: placed (telescope, night, start, end) or left out with the planner's reason. In a
 * published revision a visit also has its calendar sequence (it grows each time the visit changes), and a visit the
 * previous published plan had and this one gave up stays as a cancelled entry, with its last place, so that
 * subscribed calendars learn it is cancelled.
 */
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

    @Column(name = "sequence_no", nullable = false)
    private int sequence;

    @Column(nullable = false)
    private boolean cancelled;

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
        v.sequence = sequence;
        v.cancelled = cancelled;
        return v;
    }

    /** This visit as a cancelled entry: its last place, and why; its sequence is stamped when it is published. */
    public PlanVisit cancelled(String why) {
        PlanVisit v = copy();
        v.pinned = false;
        v.cancelled = true;
        v.sequence = UNSTAMPED;
        v.reason = why;
        return v;
    }

    /** The sequence of a visit that changed in a revision about to be published: it becomes that revision's id. */
    public static final int UNSTAMPED = -1;

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

    public void setSequence(int sequence) {
        this.sequence = sequence;
    }

    public int getSequence() {
        return sequence;
    }

    /** A visit the plan gave up, kept with its last place for calendars; never planned, never shown as placed. */
    public boolean isCancelled() {
        return cancelled;
    }

    /** Same telescope, start and end as {@code other}. */
    public boolean samePlaceAs(PlanVisit other) {
        return java.util.Objects.equals(telescopeId, other.telescopeId) && java.util.Objects.equals(start, other.start)
                && java.util.Objects.equals(end, other.end);
    }

    public VisitKey key() {
        return new VisitKey(requestId, repeatNo);
    }

    /** Placed on a telescope, and not a cancelled entry. */
    public boolean isPlaced() {
        return telescopeId != null && !cancelled;
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
