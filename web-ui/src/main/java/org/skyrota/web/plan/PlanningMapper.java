package org.skyrota.web.plan;

import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneId;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.stream.Collectors;

import org.skyrota.planning.model.Assignment;
import org.skyrota.planning.model.Closure;
import org.skyrota.planning.model.DarknessLimit;
import org.skyrota.planning.model.ExposureStep;
import org.skyrota.planning.model.MountKind;
import org.skyrota.planning.model.Occupied;
import org.skyrota.planning.model.ObservingLimits;
import org.skyrota.planning.model.PlanningProblem;
import org.skyrota.planning.model.Request;
import org.skyrota.planning.model.Target;
import org.skyrota.planning.solver.LeftOutVisit;
import org.skyrota.planning.solver.PlanResult;
import org.skyrota.planning.solver.PlannedVisit;
import org.skyrota.sky.site.HorizonProfile;
import org.skyrota.web.equipment.Instrument;
import org.skyrota.web.equipment.Telescope;
import org.skyrota.web.plugin.TargetKinds;
import org.skyrota.web.program.Grant;
import org.skyrota.web.program.Program;
import org.skyrota.web.request.ObservingRequest;
import org.skyrota.web.site.Site;
import org.skyrota.web.site.SiteMapper;
import org.skyrota.web.system.InvalidParametersException;

/**
 * The one place where stored sites, equipment, programs and accepted requests become the planner's
 * {@link PlanningProblem}, and where the planner's visits become stored plan visits again.
 *
 * <p>Ids cross as decimal text ({@code "12"}). The planner numbers the visits of a request from its own repeat count,
 * so the repeats already observed are left out and the rest are renumbered; {@link Mapped} keeps the translation
 * between the planner's visit ids and the stable {@link VisitKey}s.
 */
public final class PlanningMapper {

    private static final org.slf4j.Logger LOG = org.slf4j.LoggerFactory.getLogger(PlanningMapper.class);

    private PlanningMapper() {}

    /** Planner time grid and candidate spacing, minutes (the planner's default grid; coarser starts keep runs short). */
    static final int GRID_MINUTES = PlanningProblem.DEFAULT_GRID_MINUTES;
    static final int CANDIDATE_STEP_MINUTES = 10;

    /**
     * For one request: the repeat numbers this run plans, and the starts those keep their spacing from (repeats
     * observed, awaiting their report, or kept in place outside the run).
     */
    public record Repeats(List<Integer> open, List<Instant> anchors) {
        public Repeats {
            open = List.copyOf(open);
            anchors = anchors.stream().sorted().toList();
        }
    }

    /**
     * What the planner is given.
     *
     * @param repeats   per request, what to plan of it; a request without an entry is planned whole (no repeat
     *                  observed, nothing kept elsewhere)
     * @param pins      visits that must stay where they are (pinned, or on a locked night)
     * @param nights    locked and closed nights
     * @param published the published plan's placed visits ahead of now, for stability
     * @param notBefore no visit starts before this instant; null for no limit
     * @param grants    what each program may still spend in this run; null to give each program the hours of its
     *                  stored grants that cover the planned telescopes and nights, pooled (only for tests that plan
     *                  without history)
     * @param occupied  telescope time the run must keep clear of (visits under way)
     */
    public record Input(List<Site> sites, List<Telescope> telescopes, List<Instrument> instruments, List<Program> programs,
                        List<ObservingRequest> requests, Map<Long, Repeats> repeats,
                        LocalDate firstNight, LocalDate lastNight, List<PlanVisit> pins, List<PlanNight> nights,
                        List<PlanVisit> published, Instant notBefore, List<org.skyrota.planning.model.Grant> grants,
                        List<Occupied> occupied) {}

    /**
     * The problem and the translations back.
     *
     * @param unplannable visits of requests that cannot be planned at all (their data or target cannot be read), with
     *                    why in plain words; they are left out of the problem and of no concern to the run otherwise
     */
    public record Mapped(PlanningProblem problem, Map<String, VisitKey> keyByVisitId, Map<Long, ZoneId> zoneByTelescope,
                         Map<VisitKey, String> unplannable) {

        /** The planner's visits as stored plan visits. */
        public List<PlanVisit> visits(PlanResult result) {
            List<PlanVisit> out = new ArrayList<>();
            for (PlannedVisit p : result.planned()) {
                long telescopeId = Long.parseLong(p.telescopeId());
                out.add(PlanVisit.placed(keyByVisitId.get(p.visitId()), telescopeId,
                        nightOf(p.start(), zoneByTelescope.get(telescopeId)), p.start(), p.end(), p.pinned()));
            }
            for (LeftOutVisit l : result.leftOut()) {
                out.add(PlanVisit.leftOut(keyByVisitId.get(l.visitId()), l.reason()));
            }
            return out;
        }

        public boolean covers(VisitKey key) {
            return keyByVisitId.containsValue(key);
        }

        /** The planner's id of a stored visit, if the problem holds it. */
        public java.util.Optional<String> visitIdOf(VisitKey key) {
            return keyByVisitId.entrySet().stream().filter(e -> e.getValue().equals(key)).map(Map.Entry::getKey)
                    .findFirst();
        }
    }

    /** The site-local date of the evening a visit starting at {@code start} belongs to (nights run noon to noon). */
    public static LocalDate nightOf(Instant start, ZoneId zone) {
        return org.skyrota.sky.site.Night.containing(zone, start).date();
    }

    /** When the night of {@code night} ends at a stored site: local noon of the next day. */
    public static Instant nightEnd(Site site, LocalDate night) {
        return org.skyrota.sky.site.Night.of(SiteMapper.toLocation(site), night).end();
    }

    /** As {@link #map(Input, TargetKinds)} without plugins' target kinds: only fixed targets are planned. */
    public static Mapped map(Input in) {
        return map(in, null);
    }

    /** The problem; requests of a kind {@code kinds} cannot resolve (a plugin since removed) are left out of it. */
    public static Mapped map(Input in, TargetKinds kinds) {
        List<org.skyrota.planning.model.Site> sites = in.sites().stream().map(PlanningMapper::site).toList();
        Map<Long, ZoneId> zones = new HashMap<>();
        Map<Long, Long> siteByTelescope = new HashMap<>();
        Set<Long> siteIds = in.sites().stream().map(Site::getId).collect(Collectors.toSet());
        List<org.skyrota.planning.model.Telescope> telescopes = new ArrayList<>();
        for (Telescope t : in.telescopes()) {
            if (!t.isActive() || !siteIds.contains(t.getSite().getId())) {
                continue;
            }
            telescopes.add(telescope(t));
            zones.put(t.getId(), site(t.getSite()).nightZone());
            siteByTelescope.put(t.getId(), t.getSite().getId());
        }
        List<org.skyrota.planning.model.Instrument> instruments = in.instruments().stream()
                .filter(i -> zones.containsKey(i.getTelescope().getId()))
                .map(PlanningMapper::instrument).toList();
        List<org.skyrota.planning.model.Grant> grants = in.grants() != null ? in.grants()
                : in.programs().stream().map(p -> org.skyrota.planning.model.Grant.anywhere(String.valueOf(p.getId()),
                        pooledHours(p, in.firstNight(), in.lastNight(), zones.keySet()))).toList();
        Map<String, Double> grantedHours = new HashMap<>();
        grants.forEach(g -> grantedHours.merge(g.programId(), g.hours(), Double::sum));
        List<org.skyrota.planning.model.Program> programs = in.programs().stream()
                .map(p -> new org.skyrota.planning.model.Program(String.valueOf(p.getId()), p.getCode(),
                        grantedHours.getOrDefault(String.valueOf(p.getId()), 0.0), 1.0)).toList();
        Set<String> programIds = programs.stream().map(org.skyrota.planning.model.Program::id).collect(Collectors.toSet());

        Map<String, VisitKey> keys = new HashMap<>();
        Map<VisitKey, String> ids = new HashMap<>();
        Map<VisitKey, String> unplannable = new HashMap<>();
        List<Request> requests = new ArrayList<>();
        for (ObservingRequest r : in.requests()) {
            Repeats repeats = in.repeats().getOrDefault(r.getId(),
                    new Repeats(openRepeats(r.getRepeats(), Set.of()), List.of()));
            List<Integer> open = repeats.open();
            if (open.isEmpty()) {
                continue;
            }
            String why = null;
            Request request = null;
            if (!programIds.contains(String.valueOf(r.getProgram().getId()))) {
                why = "its program " + r.getProgram().getCode() + " is not planned";
            } else {
                Target target = target(r, kinds);
                if (target == null) {
                    why = "its target of kind '" + r.getTargetKind() + "' cannot be computed by any plugin loaded now";
                } else {
                    try {
                        request = request(r, target, open.size(), repeats.anchors(), in.firstNight(), in.lastNight());
                    } catch (IllegalArgumentException e) {
                        why = plainWords(e.getMessage(), r.getId());
                    }
                }
            }
            if (request == null) {
                LOG.warn("Request {} left out of the plan: {}", r.getId(), why);
                for (int n : open) {
                    unplannable.put(new VisitKey(r.getId(), n), "cannot be planned: " + why);
                }
                continue;
            }
            requests.add(request);
            for (int i = 0; i < open.size(); i++) {
                VisitKey key = new VisitKey(r.getId(), open.get(i));
                keys.put(request.visitId(i), key);
                ids.put(key, request.visitId(i));
            }
        }
        List<Assignment> pins = assignments(in.pins(), ids, zones.keySet());
        List<Assignment> published = assignments(in.published(), ids, zones.keySet());
        List<Closure> closures = new ArrayList<>();
        for (PlanNight n : in.nights()) {
            if (n.getState() == PlanNight.State.CLOSED && zones.containsKey(n.getTelescopeId())) {
                closures.add(Closure.telescope(String.valueOf(siteByTelescope.get(n.getTelescopeId())),
                        String.valueOf(n.getTelescopeId()), n.getNight(), n.getReason()));
            }
        }
        PlanningProblem problem = new PlanningProblem(sites, telescopes, instruments, programs, requests, closures,
                pins, published, in.firstNight(), in.lastNight(), GRID_MINUTES, CANDIDATE_STEP_MINUTES,
                in.notBefore(), grants, in.occupied() == null ? List.of() : in.occupied());
        return new Mapped(problem, Map.copyOf(keys), Map.copyOf(zones), Map.copyOf(unplannable));
    }

    /** A model check's message about request {@code id}, without the id it repeats (the reason sits beside it). */
    static String plainWords(String message, long id) {
        if (message == null || message.isBlank()) {
            return "its data cannot be read";
        }
        return message.replace(" of request " + id, "").replace("request " + id + " ", "");
    }

    private static List<Assignment> assignments(List<PlanVisit> visits, Map<VisitKey, String> ids, Set<Long> telescopes) {
        List<Assignment> out = new ArrayList<>();
        Set<String> seen = new HashSet<>();
        for (PlanVisit v : visits) {
            String id = ids.get(v.key());
            if (v.isPlaced() && id != null && telescopes.contains(v.getTelescopeId()) && seen.add(id)) {
                out.add(new Assignment(id, String.valueOf(v.getTelescopeId()), v.getStart()));
            }
        }
        return out;
    }

    static org.skyrota.planning.model.Site site(Site s) {
        // The whole stored horizon profile goes to the planner, converted where the compute endpoints convert it, so
        // that a plan and /api/visibility agree about a wall in one direction.
        HorizonProfile horizon = SiteMapper.toLocation(s).horizon();
        double darkSky = s.getDarkSkyZenithVMag() == null ? DEFAULT_DARK_SKY_VMAG : s.getDarkSkyZenithVMag();
        return new org.skyrota.planning.model.Site(String.valueOf(s.getId()), s.getName(), s.getLatitudeDeg(),
                s.getLongitudeDeg(), s.getElevationM(), s.getTimeZone() == null ? null : ZoneId.of(s.getTimeZone()),
                horizon, darkSky);
    }

    /** Zenith sky brightness assumed where a site has none stored: a rural dark site (common practice, no source). */
    static final double DEFAULT_DARK_SKY_VMAG = 21.5;

    static org.skyrota.planning.model.Telescope telescope(Telescope t) {
        // The server stores no upper altitude limit: an equatorial mount tracks through the zenith, and an
        // alt-azimuth mount's zenith gap is left to its own control system.
        boolean altAz = t.getMountKind() == org.skyrota.web.equipment.MountKind.ALT_AZIMUTH;
        return new org.skyrota.planning.model.Telescope(String.valueOf(t.getId()), String.valueOf(t.getSite().getId()),
                t.getApertureMm() / 1000.0, altAz ? MountKind.ALT_AZIMUTH : MountKind.EQUATORIAL,
                t.getSlewRateDegPerS(), t.getSettleSeconds(), t.getMinAltitudeDeg(), 90,
                !altAz && t.needsMeridianFlip(), altAz ? -180 : t.getEastHourAngleLimitDeg(),
                altAz ? 180 : t.getWestHourAngleLimitDeg());
    }

    static org.skyrota.planning.model.Instrument instrument(Instrument i) {
        return new org.skyrota.planning.model.Instrument(String.valueOf(i.getId()), String.valueOf(i.getTelescope().getId()),
                Set.copyOf(i.getFilters()), i.getReadoutSeconds(), i.getFilterChangeSeconds(), i.hasCertifiedSolarFilter());
    }

    /** The hours of the program's stored grants for the planned telescopes whose nights overlap the horizon. */
    static double pooledHours(Program p, LocalDate first, LocalDate last, Set<Long> telescopes) {
        double hours = 0;
        for (Grant g : p.getGrants()) {
            boolean overlaps = (g.getFirstNight() == null || !g.getFirstNight().isAfter(last))
                    && (g.getLastNight() == null || !g.getLastNight().isBefore(first));
            if (overlaps && (g.getTelescopeId() == null || telescopes.contains(g.getTelescopeId()))) {
                hours += g.getHours();
            }
        }
        return hours;
    }

    /**
     * The planner's target of a stored request: its ICRS position, or the position its kind's plugin resolves (solar
     * when the position says so, and then planned like the Sun: certified solar filter only). Null when the kind
     * cannot be resolved any more.
     */
    static Target target(ObservingRequest r, TargetKinds kinds) {
        if (TargetKinds.isFixed(r.getTargetKind())) {
            return Target.fixed(r.getTargetName(), r.getRaDeg(), r.getDecDeg());
        }
        if (kinds == null) {
            return null;
        }
        try {
            return Target.moving(r.getTargetName(), kinds.resolve(r.getTargetKind(), r.getTargetParameters()));
        } catch (InvalidParametersException e) {
            LOG.warn("Request {} left out of the plan: its {} target cannot be resolved: {}", r.getId(),
                    r.getTargetKind(), e.getMessage());
            return null;
        }
    }

    static Request request(ObservingRequest r, Target target, int openRepeats, LocalDate first, LocalDate last) {
        return request(r, target, openRepeats, List.of(), first, last);
    }

    /**
     * The repeat numbers still to plan: as many as were asked and not yet observed (an observation numbered above a
     * since-lowered count still counts), by the lowest numbers not observed.
     */
    static List<Integer> openRepeats(int repeats, Set<Integer> observed) {
        int stillOpen = Math.max(0, repeats - observed.size());
        List<Integer> open = new ArrayList<>();
        for (int n = 1; open.size() < stillOpen; n++) {
            if (!observed.contains(n)) {
                open.add(n);
            }
        }
        return open;
    }

    /** @param observedStarts when the repeats already observed were taken: the open ones keep their spacing from them */
    static Request request(ObservingRequest r, Target target, int openRepeats, List<Instant> observedStarts,
                           LocalDate first, LocalDate last) {
        ObservingLimits limits = ObservingLimits.dark(r.getMinAltitudeDeg())
                .withDarkness(darkness(r.getDarkness()))
                .withMoon(r.getMinMoonSeparationDeg() == null ? 0 : r.getMinMoonSeparationDeg(),
                        r.getMaxMoonIllumination() == null ? 1 : r.getMaxMoonIllumination())
                .withMaxAirmass(r.getMaxAirmass() == null ? Double.POSITIVE_INFINITY : r.getMaxAirmass());
        List<ExposureStep> steps = r.getExposures().stream()
                .map(e -> new ExposureStep(e.getFilterName(), e.getSeconds(), e.getCount())).toList();
        // A lone visit with nothing observed before it needs no spacing; requests stored before the spacing fields
        // existed have none either.
        boolean spaced = (openRepeats > 1 || !observedStarts.isEmpty()) && r.getRepeatIntervalHours() != null;
        Duration interval = spaced ? hours(r.getRepeatIntervalHours()) : Duration.ZERO;
        Duration tolerance = spaced && r.getRepeatToleranceHours() != null ? hours(r.getRepeatToleranceHours()) : Duration.ZERO;
        // Stored priorities count as the planner's do: 1 lowest, 5 highest.
        return new Request(String.valueOf(r.getId()), String.valueOf(r.getProgram().getId()), r.getOwner(),
                target, steps, limits,
                r.getEarliestNight() == null ? first : r.getEarliestNight(),
                r.getLatestNight() == null ? last : r.getLatestNight(),
                openRepeats, interval, tolerance, r.getPriority(), observedStarts);
    }

    /** Whole seconds: the planner's grid is minutes, so finer is never used. */
    static Duration hours(double h) {
        return Duration.ofSeconds(Math.round(h * 3600));
    }

    static DarknessLimit darkness(org.skyrota.web.request.DarknessLimit d) {
        return switch (d) {
            case ASTRONOMICAL -> DarknessLimit.ASTRONOMICAL;
            case NAUTICAL -> DarknessLimit.NAUTICAL;
            case CIVIL -> DarknessLimit.CIVIL;
        };
    }
}
