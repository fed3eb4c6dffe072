package org.skyrota.planning.candidates;

import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneOffset;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;
import java.util.stream.IntStream;

import org.skyrota.planning.domain.ClosedNight;
import org.skyrota.planning.domain.Placement;
import org.skyrota.planning.domain.PlannerWeights;
import org.skyrota.planning.domain.ProgramGrant;
import org.skyrota.planning.domain.Schedule;
import org.skyrota.planning.domain.TelescopeMount;
import org.skyrota.planning.domain.Visit;
import org.skyrota.planning.model.Assignment;
import org.skyrota.planning.model.Closure;
import org.skyrota.planning.model.Instrument;
import org.skyrota.planning.model.Occupied;
import org.skyrota.planning.model.ObservingLimits;
import org.skyrota.planning.model.PlanningProblem;
import org.skyrota.planning.model.Program;
import org.skyrota.planning.model.Request;
import org.skyrota.planning.model.Site;
import org.skyrota.planning.model.Telescope;
import org.skyrota.planning.sky.SkyConditions;
import org.skyrota.planning.sky.SkyModel;
import org.skyrota.planning.sky.SkyWindow;
import org.skyrota.planning.sky.TelescopeWindows;
import org.skyrota.sky.site.Night;

/**
 * Turns a {@link PlanningProblem} into a {@link Schedule}: for every visit, every telescope that can take it,
 * every night of its range that is not closed, and every start on the candidate grid that keeps the whole
 * visit inside a visibility window. Conditions are sampled once per candidate here so that the score only reads
 * numbers. Placements are shared per telescope and grid slot.
 */
public final class CandidateGenerator {
    private final SkyModel sky;

    public CandidateGenerator(SkyModel sky) {
        this.sky = sky;
    }

    /** Priority weight of the medium rule: the priority itself, 1 (low) to 5 (high). */
    public static long priorityWeight(int priority) {
        return priority;
    }

    public PreparedProblem prepare(PlanningProblem problem, PlannerWeights weights) {
        List<Site> sites = problem.sites();
        List<Telescope> telescopes = problem.telescopes();
        Map<String, Integer> siteIndex = new HashMap<>();
        for (int i = 0; i < sites.size(); i++) {
            if (siteIndex.put(sites.get(i).id(), i) != null) {
                throw new IllegalArgumentException("duplicate site id '" + sites.get(i).id() + "'");
            }
        }
        for (Telescope t : telescopes) {
            if (!siteIndex.containsKey(t.siteId())) {
                throw new IllegalArgumentException("telescope " + t.id() + " stands at unknown site '" + t.siteId() + "'");
            }
        }
        Instant epoch = problem.firstNight().minusDays(1).atStartOfDay(ZoneOffset.UTC).toInstant();
        int grid = problem.gridMinutes();
        PlacementRegistry registry = new PlacementRegistry(epoch, telescopes, sites, siteIndex);

        Map<String, Program> programs = new LinkedHashMap<>();
        for (Program p : problem.programs()) {
            programs.put(p.id(), p);
        }
        GrantBook grantBook = new GrantBook(problem.grantsInForce(), programs);
        List<ProgramGrant> grants = grantBook.facts();

        List<ClosedNight> closedNights = new ArrayList<>();
        for (Closure c : problem.closures()) {
            for (int t = 0; t < telescopes.size(); t++) {
                if (c.covers(telescopes.get(t), c.night())) {
                    closedNights.add(new ClosedNight(t, (int) c.night().toEpochDay(), c.reason()));
                }
            }
        }

        Map<String, Assignment> forced = new HashMap<>();
        Map<String, Assignment> pins = new HashMap<>();
        for (Assignment a : problem.pins()) {
            pins.put(a.visitId(), a);
            forced.put(a.visitId(), a);
        }
        Map<String, Assignment> published = new HashMap<>();
        for (Assignment a : problem.published()) {
            published.put(a.visitId(), a);
        }

        List<Request> requests = problem.requests();
        Map<String, VisitStats> stats = new ConcurrentHashMap<>();
        Map<String, List<List<SkyWindow>>> prefetched = prefetch(problem);
        Map<String, List<Occupied>> occupied = new HashMap<>();
        for (Occupied o : problem.occupied()) {
            occupied.computeIfAbsent(o.telescopeId(), k -> new ArrayList<>()).add(o);
        }
        List<List<Visit>> perRequest = IntStream.range(0, requests.size()).parallel()
                .mapToObj(i -> {
                    Request r = requests.get(i);
                    RequestCandidates candidates = new RequestCandidates(problem, r, registry, grid,
                            programs.get(r.programId()), grantBook, pins, published, stats, prefetched.get(r.id()),
                            occupied);
                    try {
                        return candidates.build();
                    } catch (RuntimeException e) {
                        // One request the sky or its data cannot serve is left out with the reason; the run goes on.
                        return candidates.unprepared(e);
                    }
                })
                .toList();
        List<Visit> visits = new ArrayList<>();
        Map<String, Request> requestByVisit = new HashMap<>();
        long candidateCount = 0;
        for (int i = 0; i < requests.size(); i++) {
            for (Visit v : perRequest.get(i)) {
                visits.add(v);
                requestByVisit.put(v.id(), requests.get(i));
                candidateCount += v.candidateCount();
            }
        }
        for (String id : forced.keySet()) {
            if (!requestByVisit.containsKey(id)) {
                throw new IllegalArgumentException("pin names unknown visit '" + id + "'");
            }
        }
        List<String> telescopeIds = telescopes.stream().map(Telescope::id).toList();
        Schedule schedule = new Schedule(epoch, grid, telescopeIds, closedNights, grants, visits, weights);
        schedule.setMounts(mounts(telescopes));
        return new PreparedProblem(problem, schedule, telescopes, sites, requestByVisit, Map.copyOf(stats),
                candidateCount, registry.size());
    }

    /** Every telescope's mount as a problem fact, for score rules that look at mounts. */
    public static List<TelescopeMount> mounts(List<Telescope> telescopes) {
        List<TelescopeMount> mounts = new ArrayList<>();
        for (int t = 0; t < telescopes.size(); t++) {
            Telescope tel = telescopes.get(t);
            mounts.add(new TelescopeMount(t, tel.mount(), tel.needsMeridianFlip(), tel.eastHourAngleLimitDeg(),
                    tel.westHourAngleLimitDeg()));
        }
        return mounts;
    }

    /**
     * Windows of all fixed-target requests at every site over the whole horizon, asked in one batch per distinct set
     * of limits; by request id, then site index.
     */
    private Map<String, List<List<SkyWindow>>> prefetch(PlanningProblem problem) {
        Map<ObservingLimits, List<Request>> byLimits = new LinkedHashMap<>();
        for (Request r : problem.requests()) {
            // Moving targets have no batch path; they are asked night by night over their own nights only.
            if (!r.target().solar() && !r.target().isMoving()) {
                byLimits.computeIfAbsent(r.limits(), k -> new ArrayList<>()).add(r);
            }
        }
        Map<String, List<List<SkyWindow>>> result = new HashMap<>();
        for (Map.Entry<ObservingLimits, List<Request>> e : byLimits.entrySet()) {
            List<Request> group = e.getValue();
            List<org.skyrota.planning.model.Target> targets = group.stream().map(Request::target).toList();
            List<List<List<SkyWindow>>> windows = sky.windows(problem.sites(), targets, e.getKey(),
                    problem.firstNight(), problem.lastNight());
            for (int t = 0; t < group.size(); t++) {
                List<List<SkyWindow>> bySite = new ArrayList<>();
                for (int s = 0; s < problem.sites().size(); s++) {
                    bySite.add(windows.get(s).get(t));
                }
                result.put(group.get(t).id(), bySite);
            }
        }
        return result;
    }

    /** Shared placements, one per telescope and minute; thread-safe because requests are prepared in parallel. */
    static final class PlacementRegistry {
        private final Instant epoch;
        private final List<Telescope> telescopes;
        private final List<Site> sites;
        private final int[] siteOfTelescope;
        private final ConcurrentHashMap<Long, Placement> byKey = new ConcurrentHashMap<>();

        PlacementRegistry(Instant epoch, List<Telescope> telescopes, List<Site> sites, Map<String, Integer> siteIndex) {
            this.epoch = epoch;
            this.telescopes = telescopes;
            this.sites = sites;
            this.siteOfTelescope = telescopes.stream().mapToInt(t -> siteIndex.get(t.siteId())).toArray();
        }

        Placement get(int telescopeIndex, int startMinute) {
            long key = ((long) telescopeIndex << 32) | (startMinute & 0xffffffffL);
            return byKey.computeIfAbsent(key, k -> {
                int site = siteOfTelescope[telescopeIndex];
                // The id orders placements by telescope, then time, whatever order the threads create them in,
                // so that candidate lists (and with a fixed seed the whole search) are the same on every run.
                if (startMinute < 0 || startMinute >= (1 << 22) || telescopeIndex >= 500) {
                    throw new IllegalArgumentException("placement outside the planning horizon: telescope "
                            + telescopeIndex + ", minute " + startMinute);
                }
                return new Placement((telescopeIndex << 22) | startMinute, telescopeIndex, site, startMinute,
                        (int) nightOf(sites.get(site), instantOf(startMinute)).toEpochDay());
            });
        }

        Instant instantOf(int minute) {
            return epoch.plusSeconds(60L * minute);
        }

        int minuteOf(Instant instant) {
            return (int) Math.floorDiv(instant.getEpochSecond() - epoch.getEpochSecond(), 60);
        }

        int siteOf(int telescopeIndex) {
            return siteOfTelescope[telescopeIndex];
        }

        List<Telescope> telescopes() {
            return telescopes;
        }

        List<Site> sites() {
            return sites;
        }

        int size() {
            return byKey.size();
        }

        /** The night (date of the evening, local noon to local noon) an instant belongs to at a site. */
        static LocalDate nightOf(Site site, Instant instant) {
            return Night.containing(site.nightZone(), instant).date();
        }
    }

    /** Candidates of the visits of one request. */
    private final class RequestCandidates {
        private final PlanningProblem problem;
        private final Request request;
        private final PlacementRegistry registry;
        private final int grid;
        private final Program program;
        private final double grantShare;
        private final GrantBook grants;
        private final Map<String, List<Occupied>> occupied;
        private final Map<String, Assignment> pins;
        private final Map<String, Assignment> published;
        private final Map<String, VisitStats> stats;
        private final Map<Long, SkyConditions> sampled = new HashMap<>();
        private final Map<String, List<SkyWindow>> windowCache = new HashMap<>();
        /** When the repeats already observed were taken, and the least spacing every open repeat keeps from them. */
        private List<Instant> observed = List.of();
        private Duration spacing = Duration.ZERO;

        RequestCandidates(PlanningProblem problem, Request request, PlacementRegistry registry, int grid, Program program,
                          GrantBook grants, Map<String, Assignment> pins, Map<String, Assignment> published,
                          Map<String, VisitStats> stats, List<List<SkyWindow>> prefetched,
                          Map<String, List<Occupied>> occupied) {
            this.problem = problem;
            this.request = request;
            this.registry = registry;
            this.grid = grid;
            this.program = program;
            this.grants = grants;
            this.occupied = occupied;
            this.grantShare = grants.share(request.programId());
            this.pins = pins;
            this.published = published;
            this.stats = stats;
            if (prefetched != null) {
                for (int s = 0; s < prefetched.size(); s++) {
                    Site site = registry.sites().get(s);
                    // The site's horizon profile is part of the site, applied by the sky model: only the flat
                    // minimum altitudes go into the key.
                    double minAlt = request.limits().minAltitudeDeg();
                    Map<LocalDate, List<SkyWindow>> byNight = new HashMap<>();
                    for (SkyWindow w : prefetched.get(s)) {
                        byNight.computeIfAbsent(w.night(), k -> new ArrayList<>()).add(w);
                    }
                    for (LocalDate d = problem.firstNight(); !d.isAfter(problem.lastNight()); d = d.plusDays(1)) {
                        windowCache.put(site.id() + "|" + minAlt + "|" + d, byNight.getOrDefault(d, List.of()));
                    }
                }
            }
        }

        /**
         * The request's visits with no candidates, each saying why the request could not be prepared: its data or
         * the sky could not serve it, and the run goes on without it.
         */
        List<Visit> unprepared(RuntimeException e) {
            String why = e.getMessage() == null || e.getMessage().isBlank() ? "its data could not be read"
                    : e.getMessage();
            int n = registry.telescopes().size();
            int[] length = new int[n];
            java.util.Arrays.fill(length, grid);
            List<Visit> visits = new ArrayList<>();
            for (int k = 0; k < request.repeats(); k++) {
                String visitId = request.visitId(k);
                visits.add(new Visit(visitId, request.id(), k, request.programId(), grantShare,
                        program == null ? 1.0 : program.weight(), request.priority(), priorityWeight(request.priority()),
                        grid, 0, length, new int[n], List.of(), new int[0], new int[0], new int[0], new byte[0]));
                stats.put(visitId, VisitStats.unprepared(request.filters(), why));
            }
            return visits;
        }

        List<Visit> build() {
            if (program == null) {
                throw new IllegalArgumentException("it belongs to program " + request.programId()
                        + ", which is not among the programs planned");
            }
            List<Telescope> telescopes = registry.telescopes();
            int n = telescopes.size();
            int[] length = new int[n];
            int[] overhead = new int[n];
            boolean[] eligible = new boolean[n];
            int nominal = Integer.MAX_VALUE;
            int eligibleCount = 0;
            for (int t = 0; t < n; t++) {
                Instrument best = bestInstrument(telescopes.get(t));
                double exposure = request.exposureSeconds();
                Instrument timing = best != null ? best : anyInstrument(telescopes.get(t));
                double seconds = exposure + telescopes.get(t).slewAndSettleSeconds();
                if (timing != null) {
                    seconds += request.exposureCount() * timing.readoutSeconds()
                            + request.filterChanges() * timing.filterChangeSeconds();
                }
                length[t] = roundUp(seconds / 60.0);
                overhead[t] = Math.max(0, length[t] - (int) Math.round(exposure / 60.0));
                eligible[t] = best != null;
                if (eligible[t]) {
                    eligibleCount++;
                    nominal = Math.min(nominal, length[t]);
                }
            }
            if (nominal == Integer.MAX_VALUE) {
                nominal = IntStream.of(length).min().orElse(grid);
            }

            LocalDate from = max(request.earliestNight(), problem.firstNight());
            LocalDate to = min(request.latestNight(), problem.lastNight());
            spacing = request.minimumSpacing();
            // Rounded up: starts on whole minutes that are at least this many minutes apart keep the whole spacing.
            long gapMinutes = (spacing.getSeconds() + (spacing.getNano() > 0 ? 1 : 0) + 59) / 60;
            observed = request.observedStarts();
            // The earliest minute any visit of the request could start: night `from` begins at local noon, first at
            // the easternmost site.
            long firstMinute = Long.MAX_VALUE;
            for (Site site : registry.sites()) {
                firstMinute = Math.min(firstMinute, noonMinute(site, from));
            }
            // Nothing starts before now: the first possible minute is then now, rounded up to the minute.
            firstMinute = Math.max(firstMinute, notBeforeMinute());

            List<Visit> visits = new ArrayList<>();
            int rank = 0;
            for (int k = 0; k < request.repeats(); k++) {
                String visitId = request.visitId(k);
                // Counted in time order, the r-th placed repeat that is not pinned starts at least r spacings after
                // the request's first possible minute (pins keep their own places, so only the others are counted):
                // earlier starts are pruned, which also breaks the symmetry between repeats. Nothing is pruned at
                // the end: when the range or the horizon leaves room for fewer repeats than asked, those that fit
                // must still find a place, and any of them may be the last.
                long lowerMinute = firstMinute + rank * gapMinutes;
                if (!pins.containsKey(visitId)) {
                    rank++;
                }
                visits.add(buildVisit(visitId, k, lowerMinute, from, to, length, overhead, eligible, eligibleCount,
                        nominal, (int) gapMinutes));
            }
            return visits;
        }

        /** The first whole minute at or after the problem's "now", or the smallest minute when it has none. */
        private long notBeforeMinute() {
            Instant notBefore = problem.notBefore();
            if (notBefore == null) {
                return Long.MIN_VALUE;
            }
            long seconds = notBefore.getEpochSecond() - registry.instantOf(0).getEpochSecond();
            return Math.floorDiv(seconds + (notBefore.getNano() > 0 ? 1 : 0) + 59, 60);
        }

        /** Whether a visit of {@code length} minutes from {@code start} on telescope {@code t} overlaps taken time. */
        private boolean overlapsOccupied(int t, int start, int length) {
            List<Occupied> taken = occupied.get(registry.telescopes().get(t).id());
            if (taken == null) {
                return false;
            }
            Instant s = registry.instantOf(start);
            Instant e = registry.instantOf(start + length);
            for (Occupied o : taken) {
                if (s.isBefore(o.end()) && o.start().isBefore(e)) {
                    return true;
                }
            }
            return false;
        }

        private int noonMinute(Site site, LocalDate night) {
            return registry.minuteOf(Night.of(site.nightZone(), night).start());
        }

        private Visit buildVisit(String visitId, int k, long lowerMinute, LocalDate from, LocalDate to, int[] length,
                                 int[] overhead, boolean[] eligible, int eligibleCount, int nominal, int gapMinutes) {
            List<Telescope> telescopes = registry.telescopes();
            List<Site> sites = registry.sites();
            int step = problem.candidateStepMinutes();
            Map<Placement, int[]> costs = new HashMap<>();
            int windowNights = 0;
            int closedWindowNights = 0;
            int ungrantedWindowNights = 0;
            long observable = 0;
            long longest = 0;
            int nightsConsidered = 0;
            int rangeNights = Math.max(1, (int) (request.latestNight().toEpochDay() - request.earliestNight().toEpochDay() + 1));
            for (int s = 0; s < sites.size(); s++) {
                Site site = sites.get(s);
                // Skip the nights that end before the lower minute; local noons are a day apart give or take the
                // hour of a daylight-saving change, hence the hour of margin.
                LocalDate siteFrom = from.plusDays(Math.max(0,
                        Math.floorDiv(lowerMinute - noonMinute(site, from) - 60, 24 * 60)));
                nightsConsidered = Math.max(nightsConsidered,
                        siteFrom.isAfter(to) ? 0 : (int) (to.toEpochDay() - siteFrom.toEpochDay() + 1));
                for (LocalDate night = siteFrom; !night.isAfter(to); night = night.plusDays(1)) {
                    boolean nightCounted = false;
                    boolean nightOpen = false;
                    boolean nightGranted = false;
                    List<int[]> nightCandidates = new ArrayList<>();
                    for (int t = 0; t < telescopes.size(); t++) {
                        Telescope telescope = telescopes.get(t);
                        if (!eligible[t] || registry.siteOf(t) != s) {
                            continue;
                        }
                        List<SkyWindow> windows = windows(site, telescope, night);
                        for (SkyWindow w : windows) {
                            longest = Math.max(longest, Duration.between(w.start(), w.end()).toMinutes());
                        }
                        int needed = length[t];
                        List<SkyWindow> usable = windows.stream()
                                .filter(w -> Duration.between(w.start(), w.end()).toMinutes() >= needed)
                                .toList();
                        if (usable.isEmpty()) {
                            continue;
                        }
                        if (!nightCounted) {
                            nightCounted = true;
                            windowNights++;
                            observable += usable.stream()
                                    .mapToLong(w -> Duration.between(w.start(), w.end()).toMinutes()).sum();
                        }
                        if (closed(telescope, night)) {
                            continue;
                        }
                        nightOpen = true;
                        int grant = grants.pays(request.programId(), telescope, night);
                        if (grant < 0) {
                            continue;
                        }
                        nightGranted = true;
                        for (SkyWindow w : usable) {
                            int windowStart = registry.minuteOf(w.start()) + (w.start().getEpochSecond() % 60 == 0 ? 0 : 1);
                            int first = ceilTo((int) Math.max(windowStart, lowerMinute), step);
                            int lastStart = registry.minuteOf(w.end()) - length[t];
                            for (int m = first; m <= lastStart; m += step) {
                                if (tooCloseToObserved(m) || overlapsOccupied(t, m, length[t])) {
                                    continue;
                                }
                                SkyConditions c = conditionsAt(s, site, m + length[t] / 2);
                                if (!request.target().solar()
                                        && c.sunSeparationDeg() < request.limits().minSunSeparationDeg()) {
                                    continue;
                                }
                                nightCandidates.add(new int[] {t, m, (int) Math.round(c.airmass() * 1000),
                                        (int) Math.round(100 * Math.max(0, site.darkSkyZenithVMag() - c.skyBrightnessVMag())),
                                        grant});
                            }
                        }
                    }
                    if (nightCounted && !nightOpen) {
                        closedWindowNights++;
                    } else if (nightCounted && !nightGranted) {
                        ungrantedWindowNights++;
                    }
                    int bestAirmass = nightCandidates.stream().mapToInt(c -> c[2]).min().orElse(0);
                    int nightIndex = (int) (night.toEpochDay() - request.earliestNight().toEpochDay());
                    int urgency = (int) Math.round(100.0 * nightIndex / rangeNights);
                    for (int[] c : nightCandidates) {
                        Placement p = registry.get(c[0], c[1]);
                        int airmassCost = Math.max(0, (c[2] - bestAirmass) / 10);
                        costs.put(p, new int[] {airmassCost, c[3], urgency, 0, c[4]});
                    }
                }
            }

            Assignment pin = pins.get(visitId);
            Assignment pub = published.get(visitId);
            Placement pinPlacement = pin == null ? null : forcedPlacement(pin, length, eligible, costs, true);
            Placement pubPlacement = pub == null ? null : forcedPlacement(pub, length, eligible, costs, false);

            List<Placement> candidates = new ArrayList<>(costs.keySet());
            candidates.sort(Comparator.comparingInt(Placement::id));
            int c = candidates.size();
            int[] airmass = new int[c];
            int[] skyCost = new int[c];
            int[] urgency = new int[c];
            byte[] flags = new byte[c];
            int[] grantOf = new int[c];
            for (int i = 0; i < c; i++) {
                int[] v = costs.get(candidates.get(i));
                airmass[i] = v[0];
                skyCost[i] = v[1];
                urgency[i] = v[2];
                flags[i] = (byte) v[3];
                grantOf[i] = v[4];
            }
            Visit visit = new Visit(visitId, request.id(), k, request.programId(), grantShare, program.weight(),
                    request.priority(),
                    priorityWeight(request.priority()), nominal, gapMinutes, length, overhead, candidates, airmass,
                    skyCost, urgency, flags);
            visit.setHourAngles(hourAngles(candidates));
            visit.setGrants(grantOf);
            if (pubPlacement != null || pub != null) {
                visit.setPublished(pubPlacement != null ? pubPlacement : registry.get(telescopeIndex(pub.telescopeId()),
                        ceilTo(registry.minuteOf(pub.start()), grid)));
            }
            if (pinPlacement != null) {
                visit.setPlacement(pinPlacement);
                visit.setPinned(true);
            }
            stats.put(visitId, new VisitStats(eligibleCount, nightsConsidered, windowNights, closedWindowNights,
                    observable, longest, nominal, request.filters(), ungrantedWindowNights, null));
            return visit;
        }

        /**
         * The target's hour angle at each candidate's start, only on telescopes whose mount needs it (a flip or a
         * limit), NaN elsewhere; null when no telescope needs it, so that ordinary runs pay nothing. Asked once per
         * site and hour and carried on at the sidereal rate: within an hour a star's apparent right ascension moves by
         * well under 0.001° and the Sun's by 0.04°, far below any mount's limit.
         */
        private float[] hourAngles(List<Placement> candidates) {
            List<Telescope> telescopes = registry.telescopes();
            if (telescopes.stream().noneMatch(Telescope::hourAngleMatters)) {
                return null;
            }
            float[] out = new float[candidates.size()];
            Map<Long, double[]> reference = new HashMap<>();
            for (int i = 0; i < out.length; i++) {
                Placement p = candidates.get(i);
                if (!telescopes.get(p.telescopeIndex()).hourAngleMatters()) {
                    out[i] = Float.NaN;
                    continue;
                }
                long key = ((long) p.siteIndex() << 32) | (Math.floorDiv(p.startMinute(), 60) & 0xffffffffL);
                double[] ref = reference.computeIfAbsent(key, k -> new double[] {p.startMinute(),
                        sky.hourAngleDeg(registry.sites().get(p.siteIndex()), request.target(),
                                registry.instantOf(p.startMinute()))});
                out[i] = (float) org.skyrota.sky.coords.HourAngle.normalizeDeg(
                        ref[1] + (p.startMinute() - ref[0]) * org.skyrota.sky.coords.HourAngle.DEG_PER_MINUTE);
            }
            return out;
        }

        /** Whether a start at this minute lies closer than the spacing to a repeat of the request already observed. */
        private boolean tooCloseToObserved(int startMinute) {
            if (observed.isEmpty()) {
                return false;
            }
            Instant start = registry.instantOf(startMinute);
            for (Instant o : observed) {
                if (Duration.between(o, start).abs().compareTo(spacing) < 0) {
                    return true;
                }
            }
            return false;
        }

        /**
         * The placement of a pin or of the published plan. A pin is always accepted as a candidate, flagged with every
         * rule it breaks; a published placement only when it breaks nothing (else the visit is free to move).
         */
        private Placement forcedPlacement(Assignment a, int[] length, boolean[] eligible, Map<Placement, int[]> costs,
                                          boolean pin) {
            int t = telescopeIndex(a.telescopeId());
            int start = ceilTo(registry.minuteOf(a.start()), grid);
            if (!pin && (start < notBeforeMinute() || start < 0)) {
                // A published place that is already past (or before the horizon) is no anchor for stability.
                return null;
            }
            if (pin && start < 0) {
                throw new IllegalArgumentException("its visit " + a.visitId() + " is pinned at " + a.start()
                        + ", before the nights planned");
            }
            Placement p = registry.get(t, start);
            if (costs.containsKey(p)) {
                return p;
            }
            Telescope telescope = registry.telescopes().get(t);
            Site site = registry.sites().get(registry.siteOf(t));
            LocalDate night = PlacementRegistry.nightOf(site, registry.instantOf(start));
            int flags = 0;
            // A published place too close to a repeat observed since is given up like any other that breaks a rule;
            // a pin is the coordinator's word and stays, flagged so that the plan reports it.
            if (tooCloseToObserved(start)) {
                flags |= Visit.TOO_CLOSE_TO_OBSERVED;
            }
            if (!eligible[t]) {
                flags |= Visit.INSTRUMENT_MISSING;
            }
            Instant s = registry.instantOf(start);
            Instant e = registry.instantOf(start + length[t]);
            boolean inside = windows(site, telescope, night).stream()
                    .anyMatch(w -> !w.start().isAfter(s) && !w.end().isBefore(e));
            if (!inside) {
                flags |= Visit.OUTSIDE_WINDOW;
            }
            SkyConditions c = conditionsAt(registry.siteOf(t), site, start + length[t] / 2);
            if (request.target().solar() ? !solarCertified(telescope)
                    : c.sunSeparationDeg() < request.limits().minSunSeparationDeg()) {
                flags |= Visit.SUN_VIOLATION;
            }
            int grant = grants.pays(request.programId(), telescope, night);
            if (!pin && (flags != 0 || grant < 0 || closed(telescope, night) || overlapsOccupied(t, start, length[t]))) {
                return null;
            }
            int sky = (int) Math.round(100 * Math.max(0, site.darkSkyZenithVMag() - c.skyBrightnessVMag()));
            costs.put(p, new int[] {0, sky, 0, flags, grant < 0 ? grants.noGrant(request.programId()) : grant});
            return p;
        }

        private int telescopeIndex(String id) {
            List<Telescope> telescopes = registry.telescopes();
            for (int i = 0; i < telescopes.size(); i++) {
                if (telescopes.get(i).id().equals(id)) {
                    return i;
                }
            }
            throw new IllegalArgumentException("assignment names unknown telescope '" + id + "'");
        }

        private boolean closed(Telescope telescope, LocalDate night) {
            for (Closure c : problem.closures()) {
                if (c.covers(telescope, night)) {
                    return true;
                }
            }
            return false;
        }

        /** The shared rule ({@link TelescopeWindows}), cached per site, minimum altitude and night. */
        private List<SkyWindow> windows(Site site, Telescope telescope, LocalDate night) {
            double minAlt = TelescopeWindows.limitsOn(request.limits(), telescope).minAltitudeDeg();
            return windowCache.computeIfAbsent(site.id() + "|" + minAlt + "|" + night,
                    key -> TelescopeWindows.windows(sky, site, telescope, request, night));
        }

        private SkyConditions conditionsAt(int siteIndex, Site site, int minute) {
            long key = ((long) siteIndex << 32) | (minute & 0xffffffffL);
            return sampled.computeIfAbsent(key, k -> sky.conditions(site, request.target(), registry.instantOf(minute)));
        }

        private Instrument bestInstrument(Telescope telescope) {
            return TelescopeWindows.instrumentFor(request, telescope, problem.instruments()).orElse(null);
        }

        private Instrument anyInstrument(Telescope telescope) {
            return problem.instruments().stream().filter(i -> i.telescopeId().equals(telescope.id())).findFirst()
                    .orElse(null);
        }

        private boolean solarCertified(Telescope telescope) {
            return problem.instruments().stream()
                    .anyMatch(i -> i.telescopeId().equals(telescope.id()) && i.certifiedSolarFilter());
        }

        private int roundUp(double minutes) {
            return Math.max(grid, (int) Math.ceil(minutes / grid - 1e-9) * grid);
        }
    }

    private static int ceilTo(int minute, int step) {
        return Math.floorDiv(minute + step - 1, step) * step;
    }

    private static LocalDate max(LocalDate a, LocalDate b) {
        return a.isAfter(b) ? a : b;
    }

    private static LocalDate min(LocalDate a, LocalDate b) {
        return a.isBefore(b) ? a : b;
    }
}
