package org.skyrota.web.request;

import java.time.LocalDate;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import jakarta.persistence.CollectionTable;
import jakarta.persistence.Column;
import jakarta.persistence.ElementCollection;
import jakarta.persistence.Entity;
import jakarta.persistence.EnumType;
import jakarta.persistence.Enumerated;
import jakarta.persistence.FetchType;
import jakarta.persistence.JoinColumn;
import jakarta.persistence.ManyToOne;
import jakarta.persistence.MapKeyColumn;
import jakarta.persistence.OrderColumn;
import jakarta.persistence.Table;

import org.hibernate.annotations.BatchSize;
import org.skyrota.web.program.Program;
import org.skyrota.web.system.ConflictException;
import org.skyrota.web.system.StoredEntity;

/**
 * A request to observe one target, fixed (ICRS ra/dec) or of a plugin's kind (a planet, a comet: kind and parameters,
 * resolved to a position when planned): what to take, under which sky, between which nights.
 */
@Entity
@Table(name = "observing_request")
public class ObservingRequest extends StoredEntity {

    @ManyToOne(fetch = FetchType.LAZY, optional = false)
    @JoinColumn(name = "program_id", nullable = false)
    private Program program;

    /** User name of the person who asked. */
    @Column(nullable = false, length = 100)
    private String owner;

    @Column(name = "target_name", nullable = false, length = 100)
    private String targetName;

    /** ICRS (J2000) right ascension, degrees. */
    @Column(name = "ra_deg", nullable = false)
    private double raDeg;

    @Column(name = "dec_deg", nullable = false)
    private double decDeg;

    @Column(name = "min_altitude_deg", nullable = false)
    private double minAltitudeDeg;

    @Enumerated(EnumType.STRING)
    @Column(nullable = false, length = 16)
    private DarknessLimit darkness;

    @Column(name = "min_moon_separation_deg")
    private Double minMoonSeparationDeg;

    @Column(name = "max_moon_illumination")
    private Double maxMoonIllumination;

    /** Highest Kasten–Young airmass, 1 to 10; null for no limit beyond the minimum altitude. */
    @Column(name = "max_airmass")
    private Double maxAirmass;

    @Column(name = "earliest_night")
    private LocalDate earliestNight;

    @Column(name = "latest_night")
    private LocalDate latestNight;

    /** How many times the exposure plan is to be carried out, each on its own visit. */
    @Column(nullable = false)
    private int repeats;

    /**
     * Least start-to-start spacing between two visits, hours; null where no spacing was asked (stored before the
     * field existed, or a single visit).
     */
    @Column(name = "repeat_interval_hours")
    private Double repeatIntervalHours;

    /** How much closer than the interval a repeat may still start, hours; null reads as none. */
    @Column(name = "repeat_tolerance_hours")
    private Double repeatToleranceHours;

    /** 1 (lowest) to 5 (highest), as the planner and the import formats count. */
    @Column(nullable = false)
    private int priority;

    @Enumerated(EnumType.STRING)
    @Column(nullable = false, length = 16)
    private RequestState state;

    @Column(name = "rejection_reason", length = 500)
    private String rejectionReason;

    @ElementCollection
    @BatchSize(size = 64)
    @CollectionTable(name = "request_exposure", joinColumns = @JoinColumn(name = "request_id"))
    @OrderColumn(name = "seq")
    private List<Exposure> exposures = new ArrayList<>();

    /** {@code fixed} (ra/dec above) or a plugin's target kind, resolved from {@link #targetParameters}. */
    @Column(name = "target_kind", nullable = false, length = 40)
    private String targetKind = "fixed";

    // Eager: a few short strings, read wherever the target is resolved, also outside a transaction. Fetched in
    // batches, so that a page of requests costs one more query, not one per request.
    @ElementCollection(fetch = FetchType.EAGER)
    @BatchSize(size = 64)
    @CollectionTable(name = "request_target_parameter", joinColumns = @JoinColumn(name = "request_id"))
    @MapKeyColumn(name = "param_name", length = 40)
    @Column(name = "param_value", nullable = false, length = 200)
    private Map<String, String> targetParameters = new LinkedHashMap<>();

    /**
     * The IVORN of the VOEvent packet this request was made from, or null when it was not made from an alert. Unique:
     * a packet sent again finds this request.
     */
    @Column(name = "alert_ivorn", length = MAX_IVORN_LENGTH, unique = true)
    private String alertIvorn;

    /** The longest IVORN stored (IVORNs are URIs of some tens of characters). */
    public static final int MAX_IVORN_LENGTH = 500;

    protected ObservingRequest() {}

    public ObservingRequest(Program program, String owner) {
        this.program = program;
        this.owner = owner;
        this.state = RequestState.DRAFT;
    }

    /** Moves to {@code target}, or refuses naming both states. */
    public void moveTo(RequestState target, String reason) {
        if (!state.canBecome(target)) {
            throw new ConflictException("A request in state " + state.name().toLowerCase() + " cannot become "
                    + target.name().toLowerCase() + "; allowed: " + state.next().stream().map(s -> s.name().toLowerCase()).toList());
        }
        state = target;
        rejectionReason = target == RequestState.REJECTED ? reason : null;
    }

    public void setTarget(String targetName, double raDeg, double decDeg) {
        this.targetName = targetName;
        this.raDeg = raDeg;
        this.decDeg = decDeg;
    }

    public void setConditions(double minAltitudeDeg, DarknessLimit darkness, Double minMoonSeparationDeg, Double maxMoonIllumination) {
        this.minAltitudeDeg = minAltitudeDeg;
        this.darkness = darkness;
        this.minMoonSeparationDeg = minMoonSeparationDeg;
        this.maxMoonIllumination = maxMoonIllumination;
    }

    public void setMaxAirmass(Double maxAirmass) {
        this.maxAirmass = maxAirmass;
    }

    public void setSchedule(LocalDate earliestNight, LocalDate latestNight, int repeats, int priority) {
        this.earliestNight = earliestNight;
        this.latestNight = latestNight;
        this.repeats = repeats;
        this.priority = priority;
    }

    public void setRepeatSpacing(Double intervalHours, Double toleranceHours) {
        this.repeatIntervalHours = intervalHours;
        this.repeatToleranceHours = toleranceHours;
    }

    public void setExposures(List<Exposure> plan) {
        exposures.clear();
        exposures.addAll(plan);
    }

    public void setProgram(Program program) {
        this.program = program;
    }

    public Program getProgram() {
        return program;
    }

    public String getOwner() {
        return owner;
    }

    public String getTargetName() {
        return targetName;
    }

    public double getRaDeg() {
        return raDeg;
    }

    public double getDecDeg() {
        return decDeg;
    }

    public double getMinAltitudeDeg() {
        return minAltitudeDeg;
    }

    public DarknessLimit getDarkness() {
        return darkness;
    }

    public Double getMinMoonSeparationDeg() {
        return minMoonSeparationDeg;
    }

    public Double getMaxMoonIllumination() {
        return maxMoonIllumination;
    }

    public Double getMaxAirmass() {
        return maxAirmass;
    }

    public LocalDate getEarliestNight() {
        return earliestNight;
    }

    public LocalDate getLatestNight() {
        return latestNight;
    }

    public int getRepeats() {
        return repeats;
    }

    public Double getRepeatIntervalHours() {
        return repeatIntervalHours;
    }

    public Double getRepeatToleranceHours() {
        return repeatToleranceHours;
    }

    public int getPriority() {
        return priority;
    }

    public RequestState getState() {
        return state;
    }

    public String getRejectionReason() {
        return rejectionReason;
    }

    public List<Exposure> getExposures() {
        return List.copyOf(exposures);
    }

    /** The target's kind and, for a plugin's kind, its parameters (none for {@code fixed}). */
    public void setTargetKind(String kind, Map<String, String> parameters) {
        this.targetKind = kind;
        targetParameters.clear();
        targetParameters.putAll(parameters);
    }

    public String getTargetKind() {
        return targetKind;
    }

    public Map<String, String> getTargetParameters() {
        return Map.copyOf(targetParameters);
    }

    /** Marks the request as made from the VOEvent packet {@code ivorn} (at most {@link #MAX_IVORN_LENGTH} characters). */
    public void setAlertIvorn(String ivorn) {
        this.alertIvorn = ivorn;
    }

    public String getAlertIvorn() {
        return alertIvorn;
    }
}
