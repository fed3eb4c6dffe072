package org.skyrota.planning.domain;

/**
 * A telescope and a start on the planning grid: the value of a visit's planning variable. One object per
 * telescope and grid slot, shared by every visit that may start there, so that candidates stay small.
 */
public final class Placement {
    private final int id;
    private final int telescopeIndex;
    private final int siteIndex;
    private final int startMinute;
    private final int nightEpochDay;

    public Placement(int id, int telescopeIndex, int siteIndex, int startMinute, int nightEpochDay) {
        this.id = id;
        this.telescopeIndex = telescopeIndex;
        this.siteIndex = siteIndex;
        this.startMinute = startMinute;
        this.nightEpochDay = nightEpochDay;
    }

    public int id() {
        return id;
    }

    public int telescopeIndex() {
        return telescopeIndex;
    }

    public int siteIndex() {
        return siteIndex;
    }

    /** Minutes from the schedule's epoch. */
    public int startMinute() {
        return startMinute;
    }

    /** The site-local date of the evening of the night this start falls in, as an epoch day. */
    public int nightEpochDay() {
        return nightEpochDay;
    }

    @Override
    public String toString() {
        return "T" + telescopeIndex + "@" + startMinute;
    }
}
