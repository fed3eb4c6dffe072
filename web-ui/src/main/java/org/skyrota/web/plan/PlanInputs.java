package org.skyrota.web.plan;

import java.time.Clock;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneId;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashMap;
import java.util.HashSet;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;

import org.skyrota.planning.model.Occupied;
import org.skyrota.web.equipment.InstrumentRepository;
import org.skyrota.web.equipment.Telescope;
import org.skyrota.web.equipment.TelescopeRepository;
import org.skyrota.web.plugin.TargetKinds;
import org.skyrota.web.program.Program;
import org.skyrota.web.program.ProgramRepository;
import org.skyrota.web.report.ObservationReport;
import org.skyrota.web.report.ObservationReportRepository;
import org.skyrota.web.request.ObservingRequest;
import org.skyrota.web.request.ObservingRequestRepository;
import org.skyrota.web.request.RequestState;
import org.skyrota.web.site.Site;
import org.skyrota.web.site.SiteRepository;
import org.springframework.stereotype.Component;
import org.springframework.transaction.annotation.Propagation;
import org.springframework.transaction.annotation.Transactional;

/**
 * Reads what the planner needs from storage, as the term stands now, and hands it to {@link PlanningMapper}.
 *
 * <p>A run over some nights (and sites) plans the open repeats of every accepted request there; everything else is
 * a fact it plans around: history (observed repeats, and published visits under way or awaiting their report, which
 * also keep their telescope busy), and the draft's visits outside the run's nights or sites, which stay where they
 * are. Both kinds use grant hours and keep the open repeats at their spacing.
 */
@Component
public class PlanInputs {

    private final SiteRepository sites;
    private final TelescopeRepository telescopes;
    private final InstrumentRepository instruments;
    private final ProgramRepository programs;
    private final ObservingRequestRepository requests;
    private final ObservationReportRepository reports;
    private final PlanRevisionRepository revisions;
    private final TargetKinds targetKinds;
    private final Clock clock;
    private final TermSettings settings;

    PlanInputs(SiteRepository sites, TelescopeRepository telescopes, InstrumentRepository instruments,
               ProgramRepository programs, ObservingRequestRepository requests, ObservationReportRepository reports,
               PlanRevisionRepository revisions, TargetKinds targetKinds, Clock clock, TermSettings settings) {
        this.targetKinds = targetKinds;
        this.sites = sites;
        this.telescopes = telescopes;
        this.instruments = instruments;
        this.programs = programs;
        this.requests = requests;
        this.reports = reports;
        this.revisions = revisions;
        this.clock = clock;
        this.settings = settings;
    }

    /**
     * What a run or a scoring plans, with what it needs to write its result back.
     *
     * @param kept      the draft's visits ahead that the run does not re-plan (other nights or sites): they stay
     * @param planned   the telescopes the run plans
     */
    public record Problem(PlanningMapper.Mapped mapped, TermState term, List<PlanVisit> kept, Set<Long> planned,
                          LocalDate first, LocalDate last, Set<Long> siteIds) {}

    /** The term as it stands now: one read of the plans and the reports. */
    @Transactional(readOnly = true, propagation = Propagation.SUPPORTS)
    public TermState term() {
        return TermState.of(clock.instant(), settings, revisions.findFirstByStateOrderByIdDesc(PlanRevision.State.PUBLISHED),
                revisions.findFirstByStateOrderByIdDesc(PlanRevision.State.DRAFT), reports.findAll());
    }

    /** The term at a given moment (for tests of the term's rules). */
    @Transactional(readOnly = true, propagation = Propagation.SUPPORTS)
    public TermState termAt(Instant now) {
        return TermState.of(now, settings, revisions.findFirstByStateOrderByIdDesc(PlanRevision.State.PUBLISHED),
                revisions.findFirstByStateOrderByIdDesc(PlanRevision.State.DRAFT), reports.findAll());
    }

    /**
     * A run over {@code first}..{@code last} at {@code siteIds} (every site when null or empty): the draft's pinned
     * visits and those on locked nights there stay, the rest of what is open there is planned afresh.
     */
    @Transactional(readOnly = true, propagation = Propagation.SUPPORTS)
    public Problem forRun(TermState term, LocalDate first, LocalDate last, Set<Long> siteIds, List<PlanNight> nights) {
        return build(term, first, last, siteIds, term.draftVisits(), nights, null);
    }

    /**
     * The draft's visits ahead of now held where they stand, so that the plan can be scored as it is; {@code free},
     * when given, is the one visit not held (to score its other places). The horizon is the nights the visits ahead
     * use, and never nights already past.
     */
    @Transactional(readOnly = true, propagation = Propagation.SUPPORTS)
    public Problem forScoring(TermState term, List<PlanVisit> visits, List<PlanNight> nights, LocalDate first,
                              LocalDate last, VisitKey free) {
        LocalDate from = first;
        LocalDate to = last;
        for (PlanVisit v : visits) {
            if (v.isPlaced() && !term.hasStarted(v)) {
                from = v.getNight().isBefore(from) ? v.getNight() : from;
                to = v.getNight().isAfter(to) ? v.getNight() : to;
            }
        }
        LocalDate current = currentNight(term.now());
        if (from.isBefore(current)) {
            from = current;
        }
        if (to.isBefore(from)) {
            to = from;
        }
        return build(term, from, to, null, visits, nights, free == null ? Holding.ALL : Holding.allBut(free));
    }

    /** Which of the draft's visits in the run's nights are held: the pinned ones and those on locked nights, or all. */
    private record Holding(boolean all, VisitKey except) {
        static final Holding ALL = new Holding(true, null);

        static Holding allBut(VisitKey key) {
            return new Holding(true, key);
        }

        boolean holds(PlanVisit v, boolean pinnedOrLocked) {
            return all ? !v.key().equals(except) : pinnedOrLocked;
        }
    }

    /** The earliest night any site is in now (nights run noon to noon, so some sites may still be in yesterday's). */
    public LocalDate currentNight(Instant now) {
        LocalDate earliest = null;
        for (Site s : sites.findAll()) {
            LocalDate n = PlanningMapper.nightOf(now, PlanningMapper.site(s).nightZone());
            earliest = earliest == null || n.isBefore(earliest) ? n : earliest;
        }
        return earliest != null ? earliest : PlanningMapper.nightOf(now, java.time.ZoneOffset.UTC);
    }

    private Problem build(TermState term, LocalDate first, LocalDate last, Set<Long> siteIds, List<PlanVisit> draft,
                          List<PlanNight> nights, Holding holding) {
        Instant now = term.now();
        List<Site> allSites = sites.findAll();
        List<Site> chosen = allSites.stream()
                .filter(s -> siteIds == null || siteIds.isEmpty() || siteIds.contains(s.getId())).toList();
        Set<Long> chosenIds = new HashSet<>();
        chosen.forEach(s -> chosenIds.add(s.getId()));
        List<Telescope> allTelescopes = telescopes.findAll();
        Set<Long> planned = new HashSet<>();
        Map<Long, ZoneId> zones = new HashMap<>();
        for (Telescope t : allTelescopes) {
            zones.put(t.getId(), PlanningMapper.site(t.getSite()).nightZone());
            if (t.isActive() && chosenIds.contains(t.getSite().getId())) {
                planned.add(t.getId());
            }
        }
        List<ObservingRequest> accepted = requests.findAll().stream()
                .filter(r -> r.getState() == RequestState.ACCEPTED).toList();
        Map<Long, Long> programOf = new HashMap<>();
        requests.findAll().forEach(r -> programOf.put(r.getId(), r.getProgram().getId()));

        Map<Long, List<PlanVisit>> draftByRequest = new HashMap<>();
        for (PlanVisit v : draft) {
            if (!term.hasStarted(v)) {
                draftByRequest.computeIfAbsent(v.getRequestId(), k -> new ArrayList<>()).add(v);
            }
        }
        // The published places ahead, in the run's nights: a visit that moves from one costs the stability weight.
        List<PlanVisit> publishedAnchors = new ArrayList<>();
        term.published().ifPresent(p -> p.getVisits().stream()
                .filter(v -> v.isPlaced() && !v.getStart().isBefore(term.notBefore())
                        && !v.getNight().isBefore(first) && !v.getNight().isAfter(last))
                .forEach(publishedAnchors::add));

        Map<Long, PlanningMapper.Repeats> repeats = new HashMap<>();
        List<PlanVisit> pins = new ArrayList<>();
        List<PlanVisit> kept = new ArrayList<>();
        for (ObservingRequest r : accepted) {
            long id = r.getId();
            Set<Integer> used = term.usedRepeatNumbers(id);
            List<Instant> anchors = new ArrayList<>();
            Set<VisitKey> taken = new HashSet<>();
            for (Map.Entry<VisitKey, ObservationReport> e : term.observed().entrySet()) {
                if (e.getKey().requestId() == id) {
                    taken.add(e.getKey());
                    anchors.add(e.getValue().getObservedAt());
                }
            }
            for (PlanVisit h : term.history()) {
                if (h.getRequestId() == id && term.standing(h).takesTheRepeat() && taken.add(h.key())) {
                    anchors.add(h.getStart());
                }
            }
            List<Integer> preferred = new ArrayList<>();
            List<Integer> leftOut = new ArrayList<>();
            int keptCount = 0;
            List<PlanVisit> ahead = new ArrayList<>(draftByRequest.getOrDefault(id, List.of()));
            ahead.sort(Comparator.comparing((PlanVisit v) -> !v.isPinned()).thenComparing(PlanVisit::getRepeatNo));
            for (PlanVisit v : ahead) {
                if (used.contains(v.getRepeatNo())) {
                    continue;
                }
                if (!v.isPlaced()) {
                    leftOut.add(v.getRepeatNo());
                    continue;
                }
                boolean inRun = !v.getNight().isBefore(first) && !v.getNight().isAfter(last)
                        && planned.contains(v.getTelescopeId());
                if (!inRun) {
                    kept.add(v);
                    anchors.add(v.getStart());
                    used.add(v.getRepeatNo());
                    keptCount++;
                    continue;
                }
                preferred.add(v.getRepeatNo());
                boolean locked = nights.stream().anyMatch(n -> n.getState() == PlanNight.State.LOCKED
                        && n.is(v.getTelescopeId(), v.getNight()));
                if (holding == null ? v.isPinned() || locked : holding.holds(v, v.isPinned() || locked)) {
                    pins.add(v);
                }
            }
            int open = r.getRepeats() - taken.size() - keptCount;
            List<Integer> numbers = new ArrayList<>();
            Set<Integer> candidates = new LinkedHashSet<>(preferred);
            candidates.addAll(leftOut);
            for (int n : candidates) {
                if (numbers.size() < open && !used.contains(n)) {
                    numbers.add(n);
                }
            }
            for (int n = 1; numbers.size() < open; n++) {
                if (!used.contains(n) && !numbers.contains(n) && !candidates.contains(n)) {
                    numbers.add(n);
                }
            }
            repeats.put(id, new PlanningMapper.Repeats(numbers, anchors));
            // A pin whose repeat is no longer open (the count was lowered) is not held.
            pins.removeIf(v -> v.getRequestId() == id && !numbers.contains(v.getRepeatNo()));
        }

        List<Occupied> occupied = new ArrayList<>();
        for (PlanVisit h : term.history()) {
            if (planned.contains(h.getTelescopeId()) && h.getEnd().isAfter(now)) {
                occupied.add(new Occupied(String.valueOf(h.getTelescopeId()), h.getStart(), h.getEnd()));
            }
        }
        List<Program> allPrograms = programs.findAll();
        GrantLedger ledger = new GrantLedger(allPrograms, allTelescopes);
        List<GrantLedger.Use> outside = new ArrayList<>(GrantLedger.history(term, programOf, zones));
        kept.forEach(v -> GrantLedger.add(outside, programOf, v, GrantLedger.Kind.DRAFT));

        PlanningMapper.Mapped mapped = PlanningMapper.map(new PlanningMapper.Input(chosen, allTelescopes,
                instruments.findAll(), allPrograms, accepted, repeats, first, last, pins, nights, publishedAnchors,
                term.notBefore(), ledger.remainingFor(first, last, outside), occupied), targetKinds);
        return new Problem(mapped, term, List.copyOf(kept), Set.copyOf(planned), first, last,
                siteIds == null ? Set.of() : Set.copyOf(siteIds));
    }

    /** The program of every stored request. */
    @Transactional(readOnly = true, propagation = Propagation.SUPPORTS)
    public Map<Long, Long> programOfRequests() {
        Map<Long, Long> out = new HashMap<>();
        requests.findAll().forEach(r -> out.put(r.getId(), r.getProgram().getId()));
        return out;
    }

    /** Each telescope's night zone. */
    @Transactional(readOnly = true, propagation = Propagation.SUPPORTS)
    public Map<Long, ZoneId> telescopeZones() {
        Map<Long, ZoneId> out = new HashMap<>();
        telescopes.findAll().forEach(t -> out.put(t.getId(), PlanningMapper.site(t.getSite()).nightZone()));
        return out;
    }

    /** The ledger of every program's grants, as the term stands. */
    @Transactional(readOnly = true, propagation = Propagation.SUPPORTS)
    public List<GrantLedger.Account> accounts(TermState term, Long programId) {
        GrantLedger ledger = new GrantLedger(programs.findAll(), telescopes.findAll());
        return ledger.accounts(programId, GrantLedger.uses(term, programOfRequests(), telescopeZones()));
    }
}
