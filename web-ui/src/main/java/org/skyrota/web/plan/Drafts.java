package org.skyrota.web.plan;

import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.stream.Collectors;

import org.skyrota.planning.solver.PlanResult;
import org.skyrota.web.account.CurrentUser;
import org.skyrota.web.equipment.Telescope;
import org.skyrota.web.equipment.TelescopeRepository;
import org.skyrota.web.plan.PlanViews.EffectView;
import org.skyrota.web.request.ObservingRequestRepository;
import org.skyrota.web.request.RequestState;
import org.skyrota.web.request.RequestStateChanged;
import org.skyrota.web.site.SiteRepository;
import org.skyrota.web.system.AuditLog;
import org.skyrota.web.system.ConflictException;
import org.skyrota.web.system.FieldProblem;
import org.skyrota.web.system.InvalidParametersException;
import org.skyrota.web.system.NotFoundException;
import org.springframework.context.event.EventListener;
import org.springframework.stereotype.Service;
import org.springframework.transaction.annotation.Transactional;

/**
 * The one draft: what a planner run writes into it, and a coordinator's overrides on it (each scored before it is
 * made). History (published visits that have started) is never changed here; a draft visit can only be placed from
 * now plus the lead time on.
 */
@Service
@Transactional
public class Drafts {

    private final PlanRevisionRepository revisions;
    private final TelescopeRepository telescopes;
    private final SiteRepository sites;
    private final ObservingRequestRepository requests;
    private final PlanInputs inputs;
    private final PlanScorer scorer;
    private final AuditLog audit;

    Drafts(PlanRevisionRepository revisions, TelescopeRepository telescopes, SiteRepository sites,
           ObservingRequestRepository requests, PlanInputs inputs, PlanScorer scorer, AuditLog audit) {
        this.revisions = revisions;
        this.telescopes = telescopes;
        this.sites = sites;
        this.requests = requests;
        this.inputs = inputs;
        this.scorer = scorer;
        this.audit = audit;
    }

    // ---- a run's result ----

    /**
     * Writes a run's result as the new draft: history as published, the draft's visits the run did not re-plan as
     * they were, the run's visits, and the visits it could not plan with why; the old draft is retired.
     *
     * @param fed        closed nights the conditions feeds gave for this run
     * @param siteWords  the names of the sites a site-restricted run planned, else null
     */
    public PlanRevision applyRun(long runId, PlanInputs.Problem problem, PlanResult result, List<PlanNight> fed,
                                 String siteWords) {
        TermState term = inputs.term();
        PlanRevision old = term.draft().orElse(null);
        LocalDate first = problem.first();
        LocalDate last = problem.last();
        PlanningMapper.Mapped mapped = problem.mapped();
        Set<Long> accepted = acceptedRequests();
        Set<Long> planned = mapped.problem().requests().stream().map(r -> Long.valueOf(r.id())).collect(Collectors.toSet());
        mapped.unplannable().keySet().forEach(k -> planned.add(k.requestId()));

        Map<VisitKey, PlanVisit> before = new HashMap<>();
        Map<VisitKey, PlanVisit> visits = new LinkedHashMap<>();
        for (PlanVisit v : term.draftVisits()) {
            before.putIfAbsent(v.key(), v);
            if (term.hasStarted(v)) {
                visits.put(v.key(), v.copy());
                continue;
            }
            if (!accepted.contains(v.getRequestId())) {
                continue;
            }
            boolean inRun = v.isPlaced() && !v.getNight().isBefore(first) && !v.getNight().isAfter(last)
                    && problem.planned().contains(v.getTelescopeId());
            boolean keep = v.isPlaced() ? !inRun : !planned.contains(v.getRequestId());
            if (keep) {
                visits.put(v.key(), v.copy());
            }
        }
        for (PlanVisit v : mapped.visits(result)) {
            if (visits.containsKey(v.key()) || !accepted.contains(v.getRequestId())) {
                continue;
            }
            if (!v.isPlaced() && siteWords != null) {
                PlanVisit was = before.get(v.key());
                String reason = was != null && !was.isPlaced() && was.getReason() != null ? was.getReason()
                        : "not placed by the re-plan of " + siteWords + ": " + v.getReason();
                v = PlanVisit.leftOut(v.key(), reason);
            }
            visits.put(v.key(), v);
        }
        mapped.unplannable().forEach((key, why) -> {
            if (!visits.containsKey(key)) {
                visits.put(key, PlanVisit.leftOut(key, why));
            }
        });

        PlanRevision draft = new PlanRevision(PlanRevision.State.DRAFT, first, last);
        if (old != null) {
            old.getNights().forEach(n -> draft.getNights().add(n.copy()));
            draft.widenTo(old.getFirstNight(), old.getLastNight());
            old.setState(PlanRevision.State.RETIRED);
        }
        for (PlanNight n : fed) {
            if (draft.getNights().stream().noneMatch(d -> d.is(n.getTelescopeId(), n.getNight()))) {
                draft.getNights().add(n.copy());
            }
        }
        draft.getVisits().addAll(visits.values());
        draft.setRunId(runId);
        boolean whole = problem.siteIds().isEmpty() && visits.values().stream()
                .filter(v -> v.isPlaced() && !term.hasStarted(v))
                .allMatch(v -> !v.getNight().isBefore(first) && !v.getNight().isAfter(last));
        // A run that planned everything ahead scored the whole draft; otherwise the merged draft is scored as it is.
        draft.setScore(whole ? result.score().toString()
                : scorer.score(term, draft.getFirstNight(), draft.getLastNight(), draft.getVisits(), draft.getNights())
                .score().toString());
        return revisions.saveAndFlush(draft);
    }

    private Set<Long> acceptedRequests() {
        Set<Long> out = new HashSet<>();
        requests.findAll().stream().filter(r -> r.getState() == RequestState.ACCEPTED).forEach(r -> out.add(r.getId()));
        return out;
    }

    // ---- a request that leaves the queue ----

    /**
     * A request withdrawn (or otherwise no longer accepted) leaves the draft at once: its visits ahead and its
     * left-out ones go; its history stays. The published plan shows its visits ahead no more, and calendars get
     * them as cancelled.
     */
    @EventListener
    public void requestLeft(RequestStateChanged change) {
        if (change.from() != RequestState.ACCEPTED || change.to() == RequestState.ACCEPTED) {
            return;
        }
        TermState term = inputs.term();
        PlanRevision draft = term.draft().orElse(null);
        if (draft == null) {
            return;
        }
        List<PlanVisit> kept = new ArrayList<>();
        int removed = 0;
        for (PlanVisit v : term.draftVisits()) {
            if (v.getRequestId() == change.requestId() && !term.hasStarted(v)) {
                removed++;
            } else {
                kept.add(v.copy());
            }
        }
        if (removed == 0) {
            return;
        }
        Map<String, Object> was = summary(draft);
        draft.getVisits().clear();
        draft.getVisits().addAll(kept);
        revisions.saveAndFlush(draft);
        Map<String, Object> now = summary(draft);
        now.put("change", "request " + change.requestId() + " " + change.to().name().toLowerCase()
                + ": its visits ahead left the draft");
        audit.record("override", "plan", draft.getId(), was, now);
    }

    // ---- overrides ----

    /** Pins a visit where it stands, or at {@code telescopeId} and {@code start} when given. */
    public EffectView pin(String visitId, Long telescopeId, Instant start, Long version, boolean dryRun) {
        if ((telescopeId == null) != (start == null)) {
            throw new InvalidParametersException(List.of(new FieldProblem(telescopeId == null ? "telescopeId" : "start",
                    "give both telescopeId and start, or neither")));
        }
        return override("pin", visitId, version, dryRun, (term, v) -> {
            if (telescopeId != null) {
                place(term, v, telescopeId, start);
            } else if (!v.isPlaced()) {
                throw new ConflictException("Visit " + visitId + " is not placed; give telescopeId and start to pin it");
            }
            v.setPinned(true);
        });
    }

    public EffectView move(String visitId, Long telescopeId, Instant start, Long version, boolean dryRun) {
        if (telescopeId == null || start == null) {
            throw new InvalidParametersException(List.of(new FieldProblem(telescopeId == null ? "telescopeId" : "start",
                    "must be given")));
        }
        // A moved visit is pinned there: a re-run would otherwise be free to move it back.
        return override("move", visitId, version, dryRun, (term, v) -> {
            place(term, v, telescopeId, start);
            v.setPinned(true);
        });
    }

    public EffectView unpin(String visitId, Long version, boolean dryRun) {
        return override("unpin", visitId, version, dryRun, (term, v) -> v.setPinned(false));
    }

    public EffectView unplace(String visitId, Long version, boolean dryRun) {
        String by = CurrentUser.get().username();
        return override("unplace", visitId, version, dryRun, (term, v) -> v.unplace("taken out of the plan by " + by));
    }

    private void place(TermState term, PlanVisit v, long telescopeId, Instant start) {
        Telescope t = telescopes.findById(telescopeId).orElseThrow(() -> new NotFoundException("telescope", telescopeId));
        if (start.isBefore(term.notBefore())) {
            throw new InvalidParametersException(List.of(new FieldProblem("start", "must be at "
                    + term.notBefore().truncatedTo(java.time.temporal.ChronoUnit.SECONDS) + " or later (now plus "
                    + term.settings().leadTime().toMinutes() + " minutes): nothing is planned in the past, was " + start)));
        }
        LocalDate night = PlanningMapper.nightOf(start, PlanningMapper.site(t.getSite()).nightZone());
        Duration length = v.isPlaced() ? Duration.between(v.getStart(), v.getEnd()) : Duration.ofMinutes(PlanningMapper.GRID_MINUTES);
        // The length is the planner's: it is set from the scored plan below.
        v.place(telescopeId, night, start, start.plus(length), v.isPinned());
    }

    private interface Change {
        void apply(TermState term, PlanVisit visit);
    }

    private EffectView override(String what, String visitId, Long version, boolean dryRun, Change change) {
        VisitKey key = VisitKey.parse(visitId);
        TermState term = inputs.term();
        PlanRevision rev = draftForChange(term, version);
        List<PlanVisit> changed = term.draftVisits().stream().map(PlanVisit::copy).toList();
        PlanVisit target = changed.stream().filter(v -> v.key().equals(key)).findFirst()
                .orElseThrow(() -> new NotFoundException("visit", visitId));
        if (term.hasStarted(target)) {
            throw new ConflictException("Visit " + visitId + " started at " + target.getStart() + " and is history ("
                    + term.standing(target).words() + "); only visits ahead can be changed");
        }
        change.apply(term, target);
        return apply(term, rev, what + " " + visitId, changed, rev.getNights().stream().map(PlanNight::copy).toList(),
                dryRun);
    }

    /** Opens, locks or closes a telescope's night (or every telescope's of a site). */
    public EffectView setNight(Long telescopeId, Long siteId, LocalDate night, String state, String reason, Long version,
                               boolean dryRun) {
        if (night == null) {
            throw new InvalidParametersException(List.of(new FieldProblem("night", "must be given")));
        }
        if ((telescopeId == null) == (siteId == null)) {
            // Both members are at fault together (one too many, or one too few), so both are named.
            throw new InvalidParametersException(List.of(new FieldProblem("telescopeId", "give telescopeId or siteId, not both"),
                    new FieldProblem("siteId", "give telescopeId or siteId, not both")));
        }
        String s = state == null ? "" : state.trim().toLowerCase();
        if (!List.of("open", "locked", "closed").contains(s)) {
            throw new InvalidParametersException(List.of(new FieldProblem("state", "must be open, locked or closed")));
        }
        List<Long> scope = telescopeId != null
                ? List.of(telescopes.findById(telescopeId).orElseThrow(() -> new NotFoundException("telescope", telescopeId)).getId())
                : telescopes.findAll().stream().filter(t -> t.getSite().getId().equals(siteId)).map(Telescope::getId).toList();
        if (scope.isEmpty()) {
            if (siteId != null && sites.existsById(siteId)) {
                throw new ConflictException("Site " + siteId + " has no telescope whose night could be marked");
            }
            throw new NotFoundException("site", siteId);
        }
        TermState term = inputs.term();
        PlanRevision rev = draftForChange(term, version);
        List<PlanVisit> visits = term.draftVisits().stream().map(PlanVisit::copy).toList();
        List<PlanNight> nights = new ArrayList<>(rev.getNights().stream().map(PlanNight::copy)
                .filter(n -> scope.stream().noneMatch(t -> n.is(t, night))).toList());
        String why = reason == null || reason.isBlank() ? null : reason.trim();
        for (long t : scope) {
            if (s.equals("locked")) {
                nights.add(new PlanNight(t, night, PlanNight.State.LOCKED, why));
            } else if (s.equals("closed")) {
                nights.add(new PlanNight(t, night, PlanNight.State.CLOSED, why));
                for (PlanVisit v : visits) {
                    // History stays as it was: a night closed while under way closes what is left of it.
                    if (v.isPlaced() && v.getTelescopeId() == t && v.getNight().equals(night) && !term.hasStarted(v)) {
                        v.unplace("the night of " + night + " is closed" + (why == null ? "" : ": " + why));
                    }
                }
            }
        }
        return apply(term, rev, "night " + night + " " + s, visits, nights, dryRun);
    }

    private PlanRevision draftForChange(TermState term, Long version) {
        PlanRevision rev = term.draft()
                .orElseThrow(() -> new ConflictException("There is no draft plan yet; start a planner run first"));
        if (version != null) {
            rev.requireVersion("draft plan revision", version);
        }
        return rev;
    }

    private EffectView apply(TermState term, PlanRevision rev, String what, List<PlanVisit> visits,
                             List<PlanNight> nights, boolean dryRun) {
        LocalDate first = rev.getFirstNight();
        LocalDate last = rev.getLastNight();
        for (PlanVisit v : visits) {
            if (v.isPlaced() && !term.hasStarted(v)) {
                first = v.getNight().isBefore(first) ? v.getNight() : first;
                last = v.getNight().isAfter(last) ? v.getNight() : last;
            }
        }
        PlanScorer.Scored before = scorer.score(term, rev.getFirstNight(), rev.getLastNight(), term.draftVisits(),
                rev.getNights());
        PlanScorer.Scored after = scorer.score(term, first, last, visits, nights);
        List<String> broken = after.hardBrokenSince(before);
        if (dryRun) {
            return new EffectView(true, before.score().toString(), after.score().toString(), broken, rev.getId(), rev.getVersion());
        }
        Map<VisitKey, PlanVisit> scored = new HashMap<>();
        after.visits().forEach(v -> scored.put(v.key(), v));
        Map<String, Object> was = summary(rev);
        rev.getVisits().clear();
        for (PlanVisit v : visits) {
            PlanVisit s = scored.get(v.key());
            if (v.isPlaced() && !term.hasStarted(v) && s != null && s.isPlaced()) {
                v.place(v.getTelescopeId(), v.getNight(), v.getStart(), s.getEnd(), v.isPinned());
            }
            rev.getVisits().add(v);
        }
        rev.getNights().clear();
        rev.getNights().addAll(nights);
        rev.widenTo(first, last);
        rev.setScore(after.score().toString());
        revisions.saveAndFlush(rev);
        Map<String, Object> now = summary(rev);
        now.put("change", what);
        audit.record("override", "plan", rev.getId(), was, now);
        return new EffectView(false, before.score().toString(), after.score().toString(), broken, rev.getId(), rev.getVersion());
    }

    /** A plan revision in a few numbers, for the audit log. */
    static Map<String, Object> summary(PlanRevision rev) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("revision", rev.getId());
        m.put("version", rev.getVersion());
        m.put("state", rev.getState().name().toLowerCase());
        m.put("firstNight", rev.getFirstNight());
        m.put("lastNight", rev.getLastNight());
        m.put("score", rev.getScore());
        m.put("placed", rev.getVisits().stream().filter(PlanVisit::isPlaced).count());
        m.put("pinned", rev.getVisits().stream().filter(PlanVisit::isPinned).count());
        m.put("leftOut", rev.getVisits().stream().filter(v -> !v.isPlaced() && !v.isCancelled()).count());
        m.put("nights", rev.getNights().size());
        return m;
    }

    /** A placement the visit could move to, and what that does to the score. */
    public record CandidateView(long telescopeId, Instant start, Instant end, String scoreChange,
                                List<String> hardBroken) {}

    /** Up to 12 other placements of a draft visit, each scored as if it moved there. */
    @Transactional(readOnly = true)
    public List<CandidateView> candidates(String visitId) {
        VisitKey key = VisitKey.parse(visitId);
        TermState term = inputs.term();
        PlanRevision rev = term.draft()
                .orElseThrow(() -> new ConflictException("There is no draft plan yet; start a planner run first"));
        List<PlanVisit> visits = term.draftVisits();
        PlanVisit visit = visits.stream().filter(v -> v.key().equals(key)).findFirst()
                .orElseThrow(() -> new NotFoundException("visit", visitId));
        if (term.hasStarted(visit)) {
            return List.of();
        }
        return scorer.candidates(term, rev.getFirstNight(), rev.getLastNight(), visits, rev.getNights(), key, 12)
                .stream().map(c -> new CandidateView(c.telescopeId(), c.start(), c.end(), c.scoreChange(),
                        c.hardBroken())).toList();
    }
}
