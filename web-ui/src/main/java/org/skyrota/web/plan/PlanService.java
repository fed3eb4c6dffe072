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
 * Reading the plans: the draft and the published plan (each visit with how it stands now), the comparison of the two,
 * each program's grant ledger, and where a request's visits stand. Changes are made by {@link Drafts} and
 * {@link Publishing}.
 */
@Service
@Transactional
public class PlanService {

    private final PlanRevisionRepository revisions;
    private final ObservingRequestRepository requests;
    private final TelescopeRepository telescopes;
    private final ProgramRepository programs;
    private final RequestService requestService;
    private final PlanInputs inputs;
    private final StoredChanges changes;
    private final TransactionTemplate readOnly;

    /** How long a kept published view may be used at most, even when nothing this server saw has changed. */
    static final Duration PUBLISHED_VIEW_MAX_AGE = Duration.ofSeconds(5);

    /** The published plan as every reader gets it before narrowing, with the change count it was built at. */
    private record PublishedSnapshot(long changeCount, long builtAtNanos, PlanView full, Map<Long, Long> siteOf) {}

    private final AtomicReference<PublishedSnapshot> publishedSnapshot = new AtomicReference<>();

    PlanService(PlanRevisionRepository revisions, ObservingRequestRepository requests, TelescopeRepository telescopes,
                ProgramRepository programs, RequestService requestService, PlanInputs inputs, StoredChanges changes,
                PlatformTransactionManager transactions) {
        this.revisions = revisions;
        this.requests = requests;
        this.telescopes = telescopes;
        this.programs = programs;
        this.requestService = requestService;
        this.inputs = inputs;
        this.changes = changes;
        this.readOnly = new TransactionTemplate(transactions);
        readOnly.setReadOnly(true);
    }

    // ---- reading ----

    /** The draft as it stands now: history as published, then the draft's visits ahead. */
    @Transactional(readOnly = true)
    public PlanView draft(LocalDate from, LocalDate to, Long siteId) {
        Map<Long, Long> siteOf = siteByTelescope();
        TermState term = inputs.term();
        PlanView full = term.draft().map(d -> view(term, d, term.draftVisits(), "draft", siteOf))
                .orElseGet(() -> empty("draft", term));
        return narrowed(full, siteOf, from, to, siteId, CurrentUser.get());
    }

    /**
     * The published plan, narrowed to nights and a site. It is read by every requester and every observatory's
     * script, and changes only when a plan is published, a report comes in, or a request or telescope in it is
     * edited, so the view is built once and kept until then (or for {@link #PUBLISHED_VIEW_MAX_AGE}, so that visits
     * pass into history as time goes on); each reader gets it narrowed and with other people's names left out.
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
                        TermState term = inputs.term();
                        PlanView full = term.published()
                                .map(p -> view(term, p, publishedVisits(term, p), "published", siteOf))
                                .orElseGet(() -> empty("published", term));
                        return new PublishedSnapshot(count, builtAt, full, Map.copyOf(siteOf));
                    });
                    publishedSnapshot.set(kept);
                }
            }
        }
        return narrowed(kept.full(), kept.siteOf(), from, to, siteId, CurrentUser.get());
    }

    /**
     * The published plan's visits as they stand: history, and the visits ahead of requests still accepted (a
     * withdrawn request's visits leave the plan at once; calendars get them as cancelled).
     */
    private List<PlanVisit> publishedVisits(TermState term, PlanRevision p) {
        java.util.Set<Long> accepted = new java.util.HashSet<>();
        requests.findAll().stream().filter(r -> r.getState() == org.skyrota.web.request.RequestState.ACCEPTED)
                .forEach(r -> accepted.add(r.getId()));
        return p.getVisits().stream().filter(v -> !v.isCancelled())
                .filter(v -> term.hasStarted(v) || accepted.contains(v.getRequestId())).toList();
    }

    private static boolean current(PublishedSnapshot kept, long count) {
        return kept != null && kept.changeCount() >= count
                && System.nanoTime() - kept.builtAtNanos() <= PUBLISHED_VIEW_MAX_AGE.toNanos();
    }

    private long publishedInputChanges() {
        // New requests cannot be in a published plan yet, so only their edits and deletions count.
        return changes.anyChange(PlanRevision.class) + changes.updatedOrDeleted(ObservingRequest.class)
                + changes.updatedOrDeleted(Telescope.class) + changes.anyChange(ObservationReport.class);
    }

    private static PlanView empty(String kind, TermState term) {
        return new PlanView(null, null, kind, null, null, null, null, List.of(), List.of(), List.of(), term.now());
    }

    /** {@code full} narrowed to nights and a site, naming only the owners {@code user} may see. */
    private static PlanView narrowed(PlanView full, Map<Long, Long> siteOf, LocalDate from, LocalDate to, Long siteId,
                                     CurrentUser user) {
        if (full.revision() == null) {
            return new PlanView(null, null, full.state(), from, to, null, null, List.of(), List.of(), List.of(), full.now());
        }
        List<VisitView> visits = new ArrayList<>();
        for (VisitView v : full.visits()) {
            if (!inRange(v.night(), from, to) || (siteId != null && siteId != v.siteId())) {
                continue;
            }
            boolean mayName = user.reviewer() || user.username().equals(v.owner());
            visits.add(mayName ? v : v.withoutOwner());
        }
        List<NightView> nights = full.closedNights().stream()
                .filter(n -> inRange(n.night(), from, to))
                .filter(n -> siteId == null || siteId.equals(siteOf.get(n.telescopeId())))
                .toList();
        return new PlanView(full.revision(), full.version(), full.state(), full.firstNight(), full.lastNight(),
                full.publishedAt(), full.score(), visits, full.unplaced(), nights, full.now());
    }

    /** Every visit given, each naming its owner and how it stands now; {@link #narrowed} fits it to a reader. */
    private PlanView view(TermState term, PlanRevision rev, List<PlanVisit> revisionVisits, String kind,
                          Map<Long, Long> siteOf) {
        Map<Long, ObservingRequest> byId = requestsOf(revisionVisits);
        List<VisitView> visits = new ArrayList<>();
        List<UnplacedView> unplaced = new ArrayList<>();
        for (PlanVisit v : revisionVisits) {
            ObservingRequest r = byId.get(v.getRequestId());
            if (r == null || v.isCancelled()) {
                continue;
            }
            if (!v.isPlaced()) {
                unplaced.add(new UnplacedView(v.getRequestId(), v.key().toString(), r.getTargetName(), v.getReason()));
                continue;
            }
            Long site = siteOf.get(v.getTelescopeId());
            visits.add(new VisitView(v.key().toString(), v.getRequestId(), r.getTargetName(), r.getRaDeg(), r.getDecDeg(),
                    v.getTelescopeId(), site == null ? 0 : site, v.getNight(), v.getStart(), v.getEnd(), v.isPinned(),
                    r.getOwner(), r.getOwner(), r.getProgram().getId(), r.getTargetKind(), term.standing(v).words()));
        }
        visits.sort(Comparator.comparing(VisitView::start).thenComparing(VisitView::telescopeId));
        List<NightView> nights = rev.getNights().stream()
                .map(n -> new NightView(n.getTelescopeId(), n.getNight(), n.getState().name().toLowerCase(), n.getReason()))
                .toList();
        return new PlanView(rev.getId(), rev.getVersion(), rev.getState().name().toLowerCase(), rev.getFirstNight(),
                rev.getLastNight(), rev.getPublishedAt(), rev.getScore(), visits, unplaced, nights, term.now());
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

    /** Per program: its grants' hours, and what is observed, published and in the draft, as the grant ledger has it. */
    @Transactional(readOnly = true)
    public List<UsageView> usage() {
        TermState term = inputs.term();
        Map<Long, List<GrantLedger.Account>> byProgram = new LinkedHashMap<>();
        inputs.accounts(term, null).forEach(a -> byProgram.computeIfAbsent(a.programId(), k -> new ArrayList<>()).add(a));
        List<UsageView> out = new ArrayList<>();
        for (Program p : programs.findAll(org.springframework.data.domain.Sort.by("code"))) {
            out.add(UsageView.of(p, byProgram.getOrDefault(p.getId(), List.of())));
        }
        return out;
    }

    /** One program's grant ledger. */
    @Transactional(readOnly = true)
    public UsageView usage(long programId) {
        Program p = programs.findById(programId).orElseThrow(() -> new NotFoundException("program", programId));
        return UsageView.of(p, inputs.accounts(inputs.term(), programId));
    }

    /** Where each visit of a request stands: in the latest draft ahead of now, and in history. */
    @Transactional(readOnly = true)
    public PlanStatusView planStatus(long requestId) {
        requestService.get(requestId);
        TermState term = inputs.term();
        Map<Long, Long> siteOf = siteByTelescope();
        List<VisitStatus> visits = new ArrayList<>();
        java.util.Set<VisitKey> seen = new java.util.HashSet<>();
        for (PlanVisit v : term.draftVisits()) {
            if (v.getRequestId() != requestId || !seen.add(v.key())) {
                continue;
            }
            if (v.isPlaced()) {
                TermState.Standing standing = term.standing(v);
                String status = standing != TermState.Standing.PLANNED ? standing.words() : v.isPinned() ? "pinned" : "placed";
                visits.add(new VisitStatus(v.key().toString(), status, v.getTelescopeId(), siteOf.get(v.getTelescopeId()),
                        v.getNight(), v.getStart(), v.getEnd(), null));
            } else {
                visits.add(new VisitStatus(v.key().toString(), "unplaced", null, null, null, null, null, v.getReason()));
            }
        }
        for (ObservationReport r : term.observed().values()) {
            VisitKey key = new VisitKey(requestId, r.getRepeatNo());
            if (r.getRequestId() == requestId && seen.add(key)) {
                visits.add(new VisitStatus(key.toString(), "observed", r.getTelescopeId(), siteOf.get(r.getTelescopeId()),
                        null, r.getObservedAt(), null, null));
            }
        }
        visits.sort(Comparator.comparing(VisitStatus::visitId));
        return new PlanStatusView(requestId, term.draft().map(PlanRevision::getId).orElse(null), visits);
    }
}
