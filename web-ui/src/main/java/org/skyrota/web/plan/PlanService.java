package org.skyrota.web.plan;

import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.atomic.AtomicReference;
import java.util.function.Consumer;

import org.skyrota.web.account.CurrentUser;
import org.skyrota.web.equipment.Telescope;
import org.skyrota.web.equipment.TelescopeRepository;
import org.skyrota.web.plan.PlanViews.ChangeView;
import org.skyrota.web.plan.PlanViews.CompareView;
import org.skyrota.web.plan.PlanViews.EffectView;
import org.skyrota.web.plan.PlanViews.NightView;
import org.skyrota.web.plan.PlanViews.PlanStatusView;
import org.skyrota.web.plan.PlanViews.PlanView;
import org.skyrota.web.plan.PlanViews.UnplacedView;
import org.skyrota.web.plan.PlanViews.UsageView;
import org.skyrota.web.plan.PlanViews.VisitStatus;
import org.skyrota.web.plan.PlanViews.VisitView;
import org.skyrota.web.program.Grant;
import org.skyrota.web.program.Program;
import org.skyrota.web.program.ProgramRepository;
import org.skyrota.web.report.ObservationReport;
import org.skyrota.web.report.ObservationReportRepository;
import org.skyrota.web.report.StandingReports;
import org.skyrota.web.request.ObservingRequest;
import org.skyrota.web.request.ObservingRequestRepository;
import org.skyrota.web.request.RequestService;
import org.skyrota.web.system.AuditLog;
import org.skyrota.web.system.ConflictException;
import org.skyrota.web.system.FieldProblem;
import org.skyrota.web.system.InvalidParametersException;
import org.skyrota.web.system.NotFoundException;
import org.skyrota.web.system.StoredChanges;
import org.springframework.stereotype.Service;
import org.springframework.transaction.PlatformTransactionManager;
import org.springframework.transaction.annotation.Propagation;
import org.springframework.transaction.annotation.Transactional;
import org.springframework.transaction.support.TransactionTemplate;

/**
 * The draft and the published plan: reading them, a coordinator's overrides on the draft (each scored before it is
 * made), publishing, and comparing the two.
 */
@Service
@Transactional
public class PlanService {

    private final PlanRevisionRepository revisions;
    private final ObservingRequestRepository requests;
    private final TelescopeRepository telescopes;
    private final ProgramRepository programs;
    private final ObservationReportRepository reports;
    private final RequestService requestService;
    private final PlanScorer scorer;
    private final AuditLog audit;
    private final StoredChanges changes;
    private final TransactionTemplate readOnly;
    private final java.time.Clock clock;

    /** How long a kept published view may be used at most, even when nothing this server saw has changed. */
    static final Duration PUBLISHED_VIEW_MAX_AGE = Duration.ofSeconds(5);

    /** The published plan as every reader gets it before narrowing, with the change count it was built at. */
    private record PublishedSnapshot(long changeCount, long builtAtNanos, PlanView full, Map<Long, Long> siteOf) {}

    private final AtomicReference<PublishedSnapshot> publishedSnapshot = new AtomicReference<>();

    PlanService(PlanRevisionRepository revisions, ObservingRequestRepository requests, TelescopeRepository telescopes,
                ProgramRepository programs, ObservationReportRepository reports, RequestService requestService,
                PlanScorer scorer, AuditLog audit, StoredChanges changes, PlatformTransactionManager transactions,
                java.time.Clock clock) {
        this.clock = clock;
        this.revisions = revisions;
        this.requests = requests;
        this.telescopes = telescopes;
        this.programs = programs;
        this.reports = reports;
        this.requestService = requestService;
        this.scorer = scorer;
        this.audit = audit;
        this.changes = changes;
        this.readOnly = new TransactionTemplate(transactions);
        readOnly.setReadOnly(true);
    }

    // ---- reading ----

    @Transactional(readOnly = true)
    public PlanView draft(LocalDate from, LocalDate to, Long siteId) {
        Map<Long, Long> siteOf = siteByTelescope();
        return narrowed(view(revisions.findFirstByStateOrderByIdDesc(PlanRevision.State.DRAFT), "draft", siteOf), siteOf,
                from, to, siteId, CurrentUser.get());
    }

    /**
     * The published plan, narrowed to nights and a site. It is read by every requester and every observatory's
     * script, and changes only when a plan is published or a request or telescope in it is edited, so the view is
     * built once and kept until then (or for {@link #PUBLISHED_VIEW_MAX_AGE}); each reader gets it narrowed and with
     * other people's names left out.
     */
    @Transactional(propagation = Propagation.NOT_SUPPORTED)
    public PlanView published(LocalDate from, LocalDate to, Long siteId) {
        // The count is taken before the rows are read: a change committed meanwhile makes the next reader rebuild.
        long count = publishedInputChanges();
        PublishedSnapshot kept = publishedSnapshot.get();
        if (!current(kept, count)) {
            // One reader rebuilds; the others that found it stale at the same moment wait and take its view.
            synchronized (publishedSnapshot) {
                kept = publishedSnapshot.get();
                if (!current(kept, count)) {
                    long builtAt = System.nanoTime();
                    kept = readOnly.execute(status -> {
                        Map<Long, Long> siteOf = siteByTelescope();
                        PlanView full = view(revisions.findFirstByStateOrderByIdDesc(PlanRevision.State.PUBLISHED),
                                "published", siteOf);
                        return new PublishedSnapshot(count, builtAt, full, Map.copyOf(siteOf));
                    });
                    publishedSnapshot.set(kept);
                }
            }
        }
        return narrowed(kept.full(), kept.siteOf(), from, to, siteId, CurrentUser.get());
    }

    private static boolean current(PublishedSnapshot kept, long count) {
        return kept != null && kept.changeCount() >= count
                && System.nanoTime() - kept.builtAtNanos() <= PUBLISHED_VIEW_MAX_AGE.toNanos();
    }

    private long publishedInputChanges() {
        // New requests cannot be in a published plan yet, so only their edits and deletions count.
        return changes.anyChange(PlanRevision.class) + changes.updatedOrDeleted(ObservingRequest.class)
                + changes.updatedOrDeleted(Telescope.class);
    }

    /** {@code full} narrowed to nights and a site, naming only the owners {@code user} may see. */
    private static PlanView narrowed(PlanView full, Map<Long, Long> siteOf, LocalDate from, LocalDate to, Long siteId,
                                     CurrentUser user) {
        if (full.revision() == null) {
            return new PlanView(null, null, full.state(), from, to, null, null, List.of(), List.of(), List.of());
        }
        List<VisitView> visits = new ArrayList<>();
        for (VisitView v : full.visits()) {
            if (!inRange(v.night(), from, to) || (siteId != null && siteId != v.siteId())) {
                continue;
            }
            boolean mayName = user.reviewer() || user.username().equals(v.owner());
            visits.add(mayName ? v : new VisitView(v.id(), v.requestId(), v.targetName(), v.raDeg(), v.decDeg(),
                    v.telescopeId(), v.siteId(), v.night(), v.start(), v.end(), v.pinned(), null, null, v.programId(),
                    v.targetKind()));
        }
        List<NightView> nights = full.closedNights().stream()
                .filter(n -> inRange(n.night(), from, to))
                .filter(n -> siteId == null || siteId.equals(siteOf.get(n.telescopeId())))
                .toList();
        return new PlanView(full.revision(), full.version(), full.state(), full.firstNight(), full.lastNight(),
                full.publishedAt(), full.score(), visits, full.unplaced(), nights);
    }

    /** The published revision itself, for the exports (null when nothing is published). */
    @Transactional(readOnly = true)
    public Optional<PlanRevision> publishedRevision() {
        Optional<PlanRevision> rev = revisions.findFirstByStateOrderByIdDesc(PlanRevision.State.PUBLISHED);
        rev.ifPresent(r -> r.getVisits().size());
        return rev;
    }

    /** Every visit of the revision, each naming its owner; {@link #narrowed} fits it to a reader. */
    private PlanView view(Optional<PlanRevision> found, String kind, Map<Long, Long> siteOf) {
        if (found.isEmpty()) {
            return new PlanView(null, null, kind, null, null, null, null, List.of(), List.of(), List.of());
        }
        PlanRevision rev = found.get();
        Map<Long, ObservingRequest> byId = requestsOf(rev.getVisits());
        List<VisitView> visits = new ArrayList<>();
        List<UnplacedView> unplaced = new ArrayList<>();
        for (PlanVisit v : rev.getVisits()) {
            ObservingRequest r = byId.get(v.getRequestId());
            if (r == null) {
                continue;
            }
            if (!v.isPlaced()) {
                unplaced.add(new UnplacedView(v.getRequestId(), v.key().toString(), r.getTargetName(), v.getReason()));
                continue;
            }
            Long site = siteOf.get(v.getTelescopeId());
            visits.add(new VisitView(v.key().toString(), v.getRequestId(), r.getTargetName(), r.getRaDeg(), r.getDecDeg(),
                    v.getTelescopeId(), site == null ? 0 : site, v.getNight(), v.getStart(), v.getEnd(), v.isPinned(),
                    r.getOwner(), r.getOwner(), r.getProgram().getId(), r.getTargetKind()));
        }
        visits.sort(Comparator.comparing(VisitView::start).thenComparing(VisitView::telescopeId));
        List<NightView> nights = rev.getNights().stream()
                .map(n -> new NightView(n.getTelescopeId(), n.getNight(), n.getState().name().toLowerCase(), n.getReason()))
                .toList();
        return new PlanView(rev.getId(), rev.getVersion(), rev.getState().name().toLowerCase(), rev.getFirstNight(),
                rev.getLastNight(), rev.getPublishedAt(), rev.getScore(), visits, unplaced, nights);
    }

    private static boolean inRange(LocalDate night, LocalDate from, LocalDate to) {
        return (from == null || !night.isBefore(from)) && (to == null || !night.isAfter(to));
    }

    private Map<Long, ObservingRequest> requestsOf(List<PlanVisit> visits) {
        Map<Long, ObservingRequest> out = new HashMap<>();
        requests.findAllById(visits.stream().map(PlanVisit::getRequestId).distinct().toList())
                .forEach(r -> out.put(r.getId(), r));
        return out;
    }

    private Map<Long, Long> siteByTelescope() {
        Map<Long, Long> out = new HashMap<>();
        telescopes.findAll().forEach(t -> out.put(t.getId(), t.getSite().getId()));
        return out;
    }

    // ---- overrides on the draft ----

    /** Pins a visit where it stands, or at {@code telescopeId} and {@code start} when given. */
    public EffectView pin(String visitId, Long telescopeId, Instant start, Long version, boolean dryRun) {
        if ((telescopeId == null) != (start == null)) {
            throw new InvalidParametersException(List.of(new FieldProblem(telescopeId == null ? "telescopeId" : "start",
                    "give both telescopeId and start, or neither")));
        }
        return override("pin", visitId, version, dryRun, v -> {
            if (telescopeId != null) {
                place(v, telescopeId, start);
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
        return override("move", visitId, version, dryRun, v -> {
            place(v, telescopeId, start);
            v.setPinned(true);
        });
    }

    public EffectView unpin(String visitId, Long version, boolean dryRun) {
        return override("unpin", visitId, version, dryRun, v -> v.setPinned(false));
    }

    public EffectView unplace(String visitId, Long version, boolean dryRun) {
        String by = CurrentUser.get().username();
        return override("unplace", visitId, version, dryRun, v -> v.unplace("taken out of the plan by " + by));
    }

    private void place(PlanVisit v, long telescopeId, Instant start) {
        Telescope t = telescopes.findById(telescopeId).orElseThrow(() -> new NotFoundException("telescope", telescopeId));
        LocalDate night = PlanningMapper.nightOf(start, PlanningMapper.site(t.getSite()).nightZone());
        Duration length = v.isPlaced() ? Duration.between(v.getStart(), v.getEnd()) : Duration.ofMinutes(PlanningMapper.GRID_MINUTES);
        // The length is the planner's: it is set from the scored plan below.
        v.place(telescopeId, night, start, start.plus(length), v.isPinned());
    }

    private EffectView override(String what, String visitId, Long version, boolean dryRun, Consumer<PlanVisit> change) {
        VisitKey key = VisitKey.parse(visitId);
        PlanRevision rev = draftForChange(version);
        List<PlanVisit> changed = rev.getVisits().stream().map(PlanVisit::copy).toList();
        PlanVisit target = changed.stream().filter(v -> v.key().equals(key)).findFirst()
                .orElseThrow(() -> new NotFoundException("visit", visitId));
        change.accept(target);
        return apply(rev, what + " " + visitId, changed, rev.getNights().stream().map(PlanNight::copy).toList(), dryRun);
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
            throw new NotFoundException("site", siteId);
        }
        PlanRevision rev = draftForChange(version);
        List<PlanVisit> visits = rev.getVisits().stream().map(PlanVisit::copy).toList();
        List<PlanNight> nights = new ArrayList<>(rev.getNights().stream().map(PlanNight::copy)
                .filter(n -> scope.stream().noneMatch(t -> n.is(t, night))).toList());
        String why = reason == null || reason.isBlank() ? null : reason.trim();
        for (long t : scope) {
            if (s.equals("locked")) {
                nights.add(new PlanNight(t, night, PlanNight.State.LOCKED, why));
            } else if (s.equals("closed")) {
                nights.add(new PlanNight(t, night, PlanNight.State.CLOSED, why));
                for (PlanVisit v : visits) {
                    if (v.isPlaced() && v.getTelescopeId() == t && v.getNight().equals(night)) {
                        v.unplace("the night of " + night + " is closed" + (why == null ? "" : ": " + why));
                    }
                }
            }
        }
        return apply(rev, "night " + night + " " + s, visits, nights, dryRun);
    }

    private PlanRevision draftForChange(Long version) {
        PlanRevision rev = revisions.findFirstByStateOrderByIdDesc(PlanRevision.State.DRAFT)
                .orElseThrow(() -> new ConflictException("There is no draft plan yet; start a planner run first"));
        if (version != null) {
            rev.requireVersion("draft plan revision", version);
        }
        return rev;
    }

    private EffectView apply(PlanRevision rev, String what, List<PlanVisit> visits, List<PlanNight> nights, boolean dryRun) {
        LocalDate first = rev.getFirstNight();
        LocalDate last = rev.getLastNight();
        for (PlanVisit v : visits) {
            if (v.isPlaced()) {
                first = v.getNight().isBefore(first) ? v.getNight() : first;
                last = v.getNight().isAfter(last) ? v.getNight() : last;
            }
        }
        PlanScorer.Scored before = scorer.score(rev.getFirstNight(), rev.getLastNight(), rev.getVisits(), rev.getNights());
        PlanScorer.Scored after = scorer.score(first, last, visits, nights);
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
            if (v.isPlaced() && s != null && s.isPlaced()) {
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

    private static Map<String, Object> summary(PlanRevision rev) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("revision", rev.getId());
        m.put("version", rev.getVersion());
        m.put("state", rev.getState().name().toLowerCase());
        m.put("firstNight", rev.getFirstNight());
        m.put("lastNight", rev.getLastNight());
        m.put("score", rev.getScore());
        m.put("placed", rev.getVisits().stream().filter(PlanVisit::isPlaced).count());
        m.put("pinned", rev.getVisits().stream().filter(PlanVisit::isPinned).count());
        m.put("leftOut", rev.getVisits().stream().filter(v -> !v.isPlaced()).count());
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
        PlanRevision rev = revisions.findFirstByStateOrderByIdDesc(PlanRevision.State.DRAFT)
                .orElseThrow(() -> new ConflictException("There is no draft plan yet; start a planner run first"));
        if (rev.getVisits().stream().noneMatch(v -> v.key().equals(key))) {
            throw new NotFoundException("visit", visitId);
        }
        return scorer.candidates(rev.getFirstNight(), rev.getLastNight(), rev.getVisits(), rev.getNights(), key, 12)
                .stream().map(c -> new CandidateView(c.telescopeId(), c.start(), c.end(), c.scoreChange(),
                        c.hardBroken())).toList();
    }

    // ---- publishing and comparing ----

    /** Copies the draft {@code revision} into a new published revision; the previous published one is retired. */
    public PlanView publish(long revision) {
        PlanRevision draft = revisions.findFirstByStateOrderByIdDesc(PlanRevision.State.DRAFT)
                .orElseThrow(() -> new ConflictException("There is no draft plan to publish"));
        if (draft.getId() != revision) {
            throw new ConflictException("The draft is revision " + draft.getId() + ", not " + revision
                    + "; read the draft again before publishing");
        }
        Map<String, Object> before = null;
        for (PlanRevision old : revisions.findByState(PlanRevision.State.PUBLISHED)) {
            before = summary(old);
            old.setState(PlanRevision.State.RETIRED);
        }
        PlanRevision copy = new PlanRevision(PlanRevision.State.DRAFT, draft.getFirstNight(), draft.getLastNight());
        draft.getVisits().forEach(v -> copy.getVisits().add(v.copy()));
        draft.getNights().forEach(n -> copy.getNights().add(n.copy()));
        copy.setScore(draft.getScore());
        copy.setRunId(draft.getRunId());
        copy.markPublished(clock.instant(), CurrentUser.get().username());
        revisions.saveAndFlush(copy);
        Map<String, Object> after = summary(copy);
        after.put("fromDraft", draft.getId());
        audit.record("publish", "plan", copy.getId(), before, after);
        Map<Long, Long> siteOf = siteByTelescope();
        return narrowed(view(Optional.of(copy), "published", siteOf), siteOf, null, null, null, CurrentUser.get());
    }

    @Transactional(readOnly = true)
    public CompareView compare(LocalDate from, LocalDate to) {
        Optional<PlanRevision> draft = revisions.findFirstByStateOrderByIdDesc(PlanRevision.State.DRAFT);
        Optional<PlanRevision> published = revisions.findFirstByStateOrderByIdDesc(PlanRevision.State.PUBLISHED);
        Map<VisitKey, PlanVisit> d = placedIn(draft, from, to);
        Map<VisitKey, PlanVisit> p = placedIn(published, from, to);
        List<PlanVisit> all = new ArrayList<>(d.values());
        all.addAll(p.values());
        Map<Long, ObservingRequest> byId = requestsOf(all);
        List<ChangeView> placed = new ArrayList<>();
        List<ChangeView> moved = new ArrayList<>();
        List<ChangeView> dropped = new ArrayList<>();
        d.forEach((key, v) -> {
            PlanVisit old = p.get(key);
            if (old == null) {
                placed.add(change(key, byId, v, null));
            } else if (!old.getTelescopeId().equals(v.getTelescopeId()) || !old.getStart().equals(v.getStart())) {
                moved.add(change(key, byId, v, old));
            }
        });
        p.forEach((key, old) -> {
            if (!d.containsKey(key)) {
                dropped.add(change(key, byId, null, old));
            }
        });
        Comparator<ChangeView> order = Comparator.comparing(ChangeView::id);
        placed.sort(order);
        moved.sort(order);
        dropped.sort(order);
        return new CompareView(draft.map(PlanRevision::getId).orElse(null), published.map(PlanRevision::getId).orElse(null),
                placed, moved, dropped);
    }

    private static Map<VisitKey, PlanVisit> placedIn(Optional<PlanRevision> rev, LocalDate from, LocalDate to) {
        Map<VisitKey, PlanVisit> out = new LinkedHashMap<>();
        rev.ifPresent(r -> r.getVisits().stream().filter(PlanVisit::isPlaced).filter(v -> inRange(v.getNight(), from, to))
                .forEach(v -> out.put(v.key(), v)));
        return out;
    }

    private static ChangeView change(VisitKey key, Map<Long, ObservingRequest> byId, PlanVisit now, PlanVisit was) {
        ObservingRequest r = byId.get(key.requestId());
        return new ChangeView(key.toString(), key.requestId(), r == null ? null : r.getTargetName(),
                now == null ? null : now.getTelescopeId(), now == null ? null : now.getStart(), now == null ? null : now.getEnd(),
                was == null ? null : was.getTelescopeId(), was == null ? null : was.getStart(), was == null ? null : was.getEnd());
    }

    // ---- per program and per request ----

    /** Granted hours (all grants), hours in the published plan, and hours reported done, per program. */
    @Transactional(readOnly = true)
    public List<UsageView> usage() {
        Map<Long, Long> programOfRequest = new HashMap<>();
        requests.findAll().forEach(r -> programOfRequest.put(r.getId(), r.getProgram().getId()));
        Map<Long, Double> planned = new HashMap<>();
        revisions.findFirstByStateOrderByIdDesc(PlanRevision.State.PUBLISHED).ifPresent(rev -> rev.getVisits().stream()
                .filter(PlanVisit::isPlaced)
                .forEach(v -> planned.merge(programOfRequest.getOrDefault(v.getRequestId(), -1L),
                        Duration.between(v.getStart(), v.getEnd()).toSeconds() / 3600.0, Double::sum)));
        Map<Long, Double> observed = new HashMap<>();
        for (ObservationReport r : StandingReports.done(reports.findAll()).values()) {
            observed.merge(programOfRequest.getOrDefault(r.getRequestId(), -1L), r.getObservedSeconds() / 3600.0,
                    Double::sum);
        }
        List<UsageView> out = new ArrayList<>();
        for (Program p : programs.findAll(org.springframework.data.domain.Sort.by("code"))) {
            double granted = p.getGrants().stream().mapToDouble(Grant::getHours).sum();
            out.add(new UsageView(p.getId(), granted, round(planned.getOrDefault(p.getId(), 0.0)),
                    round(observed.getOrDefault(p.getId(), 0.0))));
        }
        return out;
    }

    private static double round(double hours) {
        return Math.round(hours * 100) / 100.0;
    }

    /** Where each visit of a request stands in the latest draft. A requester asks only about their own requests. */
    @Transactional(readOnly = true)
    public PlanStatusView planStatus(long requestId) {
        requestService.get(requestId);
        Optional<PlanRevision> draft = revisions.findFirstByStateOrderByIdDesc(PlanRevision.State.DRAFT);
        Map<Long, Long> siteOf = siteByTelescope();
        List<VisitStatus> visits = new ArrayList<>();
        draft.ifPresent(rev -> rev.getVisits().stream().filter(v -> v.getRequestId() == requestId).forEach(v -> visits.add(
                v.isPlaced()
                        ? new VisitStatus(v.key().toString(), v.isPinned() ? "pinned" : "placed", v.getTelescopeId(),
                        siteOf.get(v.getTelescopeId()), v.getNight(), v.getStart(), v.getEnd(), null)
                        : new VisitStatus(v.key().toString(), "unplaced", null, null, null, null, null, v.getReason()))));
        for (ObservationReport r : StandingReports.done(reports.findAll()).values()) {
            if (r.getRequestId() == requestId
                    && visits.stream().noneMatch(v -> v.visitId().equals(new VisitKey(requestId, r.getRepeatNo()).toString()))) {
                visits.add(new VisitStatus(new VisitKey(requestId, r.getRepeatNo()).toString(), "observed", r.getTelescopeId(),
                        siteOf.get(r.getTelescopeId()), null, r.getObservedAt(), null, null));
            }
        }
        visits.sort(Comparator.comparing(VisitStatus::visitId));
        return new PlanStatusView(requestId, draft.map(PlanRevision::getId).orElse(null), visits);
    }
}
