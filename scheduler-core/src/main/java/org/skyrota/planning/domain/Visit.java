package org.skyrota.planning.domain;

import java.util.Arrays;
import java.util.List;

import org.optaplanner.core.api.domain.entity.PlanningEntity;
import org.optaplanner.core.api.domain.entity.PlanningPin;
import org.optaplanner.core.api.domain.lookup.PlanningId;
import org.optaplanner.core.api.domain.valuerange.ValueRangeProvider;
import org.optaplanner.core.api.domain.variable.PlanningVariable;

/**
 * One execution of a request: the planning entity. Its only variable is its placement, chosen from its own
 * candidates (precomputed from the visibility windows) or left empty. Every number the score reads is
 * precomputed per candidate; the setter looks the candidate up once so that the rules only read arrays.
 */
@PlanningEntity(difficultyComparatorClass = VisitDifficulty.class)
public class Visit {
    /** Candidate flag: the placement lies (partly) outside the visibility windows; only pins and forced placements. */
    public static final byte OUTSIDE_WINDOW = 1;
    /** Candidate flag: no instrument on that telescope carries every filter of the plan. */
    public static final byte INSTRUMENT_MISSING = 2;
    /** Candidate flag: too close to the Sun, or a solar target without a certified solar filter. */
    public static final byte SUN_VIOLATION = 4;
    /** Candidate flag: starts closer to an already observed repeat of its request than the spacing; only pins. */
    public static final byte TOO_CLOSE_TO_OBSERVED = 8;

    @PlanningId
    private String id;
    private String requestId;
    private int repeatIndex;
    private String programId;
    private double programGrantShare;
    private double programWeight;
    private int priority;
    private long priorityWeight;
    private int nominalMinutes;
    private int repeatMinGapMinutes;
    private int[] lengthByTelescope;
    private int[] overheadByTelescope;

    private List<Placement> candidates;
    private int[] candidateIds;
    private int[] airmassCost;
    private int[] skyCost;
    private int[] urgencyCost;
    private byte[] flags;
    /** The target's hour angle at each candidate's start, degrees; null when no telescope's mount needs it. */
    private float[] hourAngleAtStart;
    /** The grant (index into the schedule's grants) each candidate pays from; null when the schedule has none. */
    private int[] grantOfCandidate;

    private Placement published;
    @PlanningPin
    private boolean pinned;

    private Placement placement;
    private int candidateIndex = -1;

    @SuppressWarnings("unused")
    private Visit() {
        // for the solution cloner
    }

    /**
     * @param programWeight the program's weight in the fairness rule, positive (1 for an ordinary program)
     * @param candidates    sorted by {@link Placement#id()}, with the cost arrays in the same order
     */
    public Visit(String id, String requestId, int repeatIndex, String programId, double programGrantShare,
                 double programWeight, int priority, long priorityWeight,
                 int nominalMinutes, int repeatMinGapMinutes, int[] lengthByTelescope, int[] overheadByTelescope,
                 List<Placement> candidates, int[] airmassCost, int[] skyCost, int[] urgencyCost, byte[] flags) {
        this.id = id;
        this.requestId = requestId;
        this.repeatIndex = repeatIndex;
        this.programId = programId;
        this.programGrantShare = programGrantShare;
        if (!(programWeight > 0) || Double.isInfinite(programWeight)) {
            throw new IllegalArgumentException("programWeight of visit " + id + " must be positive, got " + programWeight);
        }
        this.programWeight = programWeight;
        this.priority = priority;
        this.priorityWeight = priorityWeight;
        this.nominalMinutes = nominalMinutes;
        this.repeatMinGapMinutes = repeatMinGapMinutes;
        this.lengthByTelescope = lengthByTelescope;
        this.overheadByTelescope = overheadByTelescope;
        this.candidates = List.copyOf(candidates);
        int n = candidates.size();
        if (airmassCost.length != n || skyCost.length != n || urgencyCost.length != n || flags.length != n) {
            throw new IllegalArgumentException("cost arrays of visit " + id + " must have " + n + " entries");
        }
        this.candidateIds = new int[n];
        for (int i = 0; i < n; i++) {
            candidateIds[i] = candidates.get(i).id();
            if (i > 0 && candidateIds[i] <= candidateIds[i - 1]) {
                throw new IllegalArgumentException("candidates of visit " + id + " must be sorted by placement id");
            }
        }
        this.airmassCost = airmassCost;
        this.skyCost = skyCost;
        this.urgencyCost = urgencyCost;
        this.flags = flags;
    }

    @ValueRangeProvider(id = "candidates")
    public List<Placement> getCandidates() {
        return candidates;
    }

    @PlanningVariable(valueRangeProviderRefs = "candidates", nullable = true)
    public Placement getPlacement() {
        return placement;
    }

    public void setPlacement(Placement placement) {
        this.placement = placement;
        this.candidateIndex = placement == null ? -1 : Arrays.binarySearch(candidateIds, placement.id());
        if (placement != null && candidateIndex < 0) {
            throw new IllegalArgumentException("placement " + placement + " is not a candidate of visit " + id);
        }
    }

    public boolean isPinned() {
        return pinned;
    }

    public void setPinned(boolean pinned) {
        this.pinned = pinned;
    }

    public Placement getPublished() {
        return published;
    }

    public void setPublished(Placement published) {
        this.published = published;
    }

    /**
     * The target's hour angle at the start of each candidate (same order as the candidates), degrees in [-180, 180),
     * NaN where it was not computed; or null when no telescope's mount needs hour angles.
     */
    public void setHourAngles(float[] atStartDeg) {
        if (atStartDeg != null && atStartDeg.length != candidateIds.length) {
            throw new IllegalArgumentException("hour angles of visit " + id + " must have " + candidateIds.length + " entries");
        }
        this.hourAngleAtStart = atStartDeg;
    }

    /**
     * The grant each candidate pays from, as an index into the schedule's {@link Schedule#grants()} (same order as the
     * candidates); null when the visit's schedule has no grants.
     */
    public void setGrants(int[] grantByCandidate) {
        if (grantByCandidate != null && grantByCandidate.length != candidateIds.length) {
            throw new IllegalArgumentException("grants of visit " + id + " must have " + candidateIds.length + " entries");
        }
        this.grantOfCandidate = grantByCandidate;
    }

    /** The grant the current placement pays from (an index into the schedule's grants), or -1 when unplaced. */
    public int grantIndex() {
        return placement == null || grantOfCandidate == null ? -1 : grantOfCandidate[candidateIndex];
    }

    /** The grant candidate {@code p} would pay from, or -1 when it is not a candidate or the schedule has no grants. */
    public int grantOf(Placement p) {
        int i = p == null || grantOfCandidate == null ? -1 : Arrays.binarySearch(candidateIds, p.id());
        return i < 0 ? -1 : grantOfCandidate[i];
    }

    /**
     * A fresh copy of this visit (unplaced, not pinned, nothing published) without the candidates {@code drop} rejects,
     * for re-planning without asking the sky again.
     */
    public Visit withoutCandidates(java.util.function.Predicate<Placement> drop) {
        List<Placement> kept = new java.util.ArrayList<>();
        java.util.List<Integer> indexes = new java.util.ArrayList<>();
        for (int i = 0; i < candidates.size(); i++) {
            if (!drop.test(candidates.get(i))) {
                kept.add(candidates.get(i));
                indexes.add(i);
            }
        }
        int n = kept.size();
        int[] a = new int[n];
        int[] s = new int[n];
        int[] u = new int[n];
        byte[] f = new byte[n];
        for (int j = 0; j < n; j++) {
            int i = indexes.get(j);
            a[j] = airmassCost[i];
            s[j] = skyCost[i];
            u[j] = urgencyCost[i];
            f[j] = flags[i];
        }
        Visit copy = new Visit(id, requestId, repeatIndex, programId, programGrantShare, programWeight, priority,
                priorityWeight, nominalMinutes, repeatMinGapMinutes, lengthByTelescope, overheadByTelescope, kept, a, s, u, f);
        if (hourAngleAtStart != null) {
            float[] h = new float[n];
            for (int j = 0; j < n; j++) {
                h[j] = hourAngleAtStart[indexes.get(j)];
            }
            copy.setHourAngles(h);
        }
        if (grantOfCandidate != null) {
            int[] g = new int[n];
            for (int j = 0; j < n; j++) {
                g[j] = grantOfCandidate[indexes.get(j)];
            }
            copy.setGrants(g);
        }
        return copy;
    }

    public boolean hasCandidate(Placement p) {
        return p != null && Arrays.binarySearch(candidateIds, p.id()) >= 0;
    }

    // Numbers the score rules read.

    public String id() {
        return id;
    }

    public String requestId() {
        return requestId;
    }

    public int repeatIndex() {
        return repeatIndex;
    }

    public String programId() {
        return programId;
    }

    /** The program's share of all grants, 0..1. */
    public double programGrantShare() {
        return programGrantShare;
    }

    /** The program's weight in the fairness rule: a program of weight 2 counts twice there. */
    public double programWeight() {
        return programWeight;
    }

    public int priority() {
        return priority;
    }

    public long priorityWeight() {
        return priorityWeight;
    }

    /** Length on the fastest eligible telescope, minutes: what an unplaced visit costs per unit of priority weight. */
    public int nominalMinutes() {
        return nominalMinutes;
    }

    /** Least start-to-start spacing to another visit of the same request: interval minus tolerance, minutes. */
    public int repeatMinGapMinutes() {
        return repeatMinGapMinutes;
    }

    public boolean isPlaced() {
        return placement != null;
    }

    public int telescopeIndex() {
        return placement.telescopeIndex();
    }

    public int startMinute() {
        return placement.startMinute();
    }

    public int endMinute() {
        return placement.startMinute() + lengthByTelescope[placement.telescopeIndex()];
    }

    /** Minutes this visit occupies its telescope, 0 when unplaced. */
    public int placedMinutes() {
        return placement == null ? 0 : lengthByTelescope[placement.telescopeIndex()];
    }

    public int lengthOn(int telescopeIndex) {
        return lengthByTelescope[telescopeIndex];
    }

    public int overheadMinutes() {
        return placement == null ? 0 : overheadByTelescope[placement.telescopeIndex()];
    }

    /** Telescope and night in one key, for rules that look at a telescope's night as a whole. */
    public long telescopeNightKey() {
        return placement.telescopeIndex() * 1_000_000L + placement.nightEpochDay();
    }

    public int airmassCost() {
        return placement == null ? 0 : airmassCost[candidateIndex];
    }

    public int skyCost() {
        return placement == null ? 0 : skyCost[candidateIndex];
    }

    public int urgencyCost() {
        return placement == null ? 0 : urgencyCost[candidateIndex];
    }

    /**
     * The target's hour angle when the placed visit starts, degrees in [-180, 180), positive west; NaN when unplaced
     * or not computed for this telescope.
     */
    public double hourAngleAtStartDeg() {
        return placement == null || hourAngleAtStart == null ? Double.NaN : hourAngleAtStart[candidateIndex];
    }

    /**
     * The target's hour angle when the placed visit ends, counted on from the start without wrapping (so it may pass
     * 180): the start's hour angle plus the visit's length at the sidereal rate. NaN as {@link #hourAngleAtStartDeg()}.
     */
    public double hourAngleAtEndDeg() {
        return hourAngleAtStartDeg() + placedMinutes() * org.skyrota.sky.coords.HourAngle.DEG_PER_MINUTE;
    }

    public boolean has(byte flag) {
        return placement != null && (flags[candidateIndex] & flag) != 0;
    }

    public boolean movedFromPublished() {
        return published != null && placement != published;
    }

    public int candidateCount() {
        return candidates.size();
    }

    @Override
    public String toString() {
        return id + (placement == null ? "(unplaced)" : "@" + placement);
    }
}
