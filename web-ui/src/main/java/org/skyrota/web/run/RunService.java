package org.skyrota.web.run;

import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.HashSet;
import java.util.Objects;
import java.util.Set;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.stream.Collectors;

import jakarta.annotation.PreDestroy;

import org.optaplanner.core.api.score.buildin.hardmediumsoftlong.HardMediumSoftLongScore;
import org.skyrota.planning.domain.RuleNames;
import org.skyrota.planning.solver.Cancellation;
import org.skyrota.planning.solver.PlanResult;
import org.skyrota.planning.solver.Planner;
import org.skyrota.planning.solver.Progress;
import org.skyrota.planning.solver.SolveOptions;
import org.skyrota.web.account.CurrentUser;
import org.skyrota.web.plan.ConditionsClosures;
import org.skyrota.web.plan.PlanInputs;
import org.skyrota.web.plan.Drafts;
import org.skyrota.web.plan.TermKeeper;
import org.skyrota.web.plan.TermState;
import org.skyrota.web.site.Site;
import org.skyrota.web.plan.PlanNight;
import org.skyrota.web.plan.PlannerConfig;
import org.skyrota.web.plan.PlanRevision;
import org.skyrota.web.site.SiteRepository;
import org.skyrota.web.system.AuditLog;
import org.skyrota.web.system.ConflictException;
import org.skyrota.web.system.FieldProblem;
import org.skyrota.web.system.InvalidParametersException;
import org.skyrota.web.system.NotFoundException;
import org.skyrota.web.system.SupportedDates;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.dao.OptimisticLockingFailureException;
import org.springframework.stereotype.Service;
import org.springframework.transaction.PlatformTransactionManager;
import org.springframework.transaction.support.TransactionTemplate;
import org.springframework.web.servlet.mvc.method.annotation.SseEmitter;

import tools.jackson.databind.json.JsonMapper;

/**
 * Planner runs: started on a worker thread, solved by the facade (which runs OptaPlanner's {@code SolverManager}),
 * followed by server-sent events, ended by writing a new draft revision in one transaction. A run's state is
 * stored before and after the solve, so its status is always readable before its solution; a run interrupted by a
 * stop is failed at the next start ({@link RunRecovery}).
 */
@Service
public class RunService {

    private static final Logger log = LoggerFactory.getLogger(RunService.class);

    static final int MAX_SECONDS = 600;
    static final int DEFAULT_SECONDS = 30;
    static final int MAX_NIGHTS = 62;

    private final PlannerRunRepository runs;
    private final Drafts drafts;
    private final TermKeeper keeper;
    private final PlanInputs inputs;
    private final SiteRepository sites;
    private final PlannerConfig planners;
    private final ConditionsClosures conditions;
    private final RunEvents events;
    private final AuditLog audit;
    private final JsonMapper json;
    private final TransactionTemplate tx;
    private final java.time.Clock clock;
    private final ExecutorService workers;
    private final Map<Long, Future<?>> futures = new ConcurrentHashMap<>();
    private final Map<Long, Cancellation> cancellations = new ConcurrentHashMap<>();
    /** Runs being cancelled, with who cancelled them (the worker ends the run and names them). */
    private final Map<Long, String> cancelling = new ConcurrentHashMap<>();

    RunService(PlannerRunRepository runs, Drafts drafts, TermKeeper keeper, PlanInputs inputs, PlannerConfig planners,
               RunEvents events, AuditLog audit, JsonMapper json, PlatformTransactionManager transactions,
               ConditionsClosures conditions, SiteRepository sites, java.time.Clock clock) {
        this.drafts = drafts;
        this.keeper = keeper;
        this.clock = clock;
        this.conditions = conditions;
        this.runs = runs;
        this.sites = sites;
        this.inputs = inputs;
        this.planners = planners;
        this.events = events;
        this.audit = audit;
        this.json = json;
        this.tx = new TransactionTemplate(transactions);
        AtomicInteger n = new AtomicInteger();
        this.workers = Executors.newFixedThreadPool(2, r -> {
            Thread t = new Thread(r, "planner-run-" + n.incrementAndGet());
            t.setDaemon(true);
            return t;
        });
    }

    @PreDestroy
    void stop() {
        workers.shutdownNow();
    }

    /** Queues a run; refused with 409 while another queued or running run covers any of its nights. */
    public RunView start(RunForm form) {
        return start(form, null);
    }

    /**
     * Queues a run started for {@code purpose} (for example an alert), which the run's record keeps; a run that fails
     * is then also recorded in the audit log under its purpose, so that whoever started it learns why.
     */
    public synchronized RunView start(RunForm form, String purpose) {
        List<FieldProblem> problems = new ArrayList<>();
        if (form.firstNight() == null) {
            problems.add(new FieldProblem("firstNight", "must be given"));
        }
        if (form.lastNight() == null) {
            problems.add(new FieldProblem("lastNight", "must be given"));
        }
        if (form.firstNight() != null && form.lastNight() != null) {
            long nights = ChronoUnit.DAYS.between(form.firstNight(), form.lastNight()) + 1;
            if (nights < 1) {
                problems.add(new FieldProblem("lastNight", "must not be before firstNight"));
            } else if (nights > MAX_NIGHTS) {
                problems.add(new FieldProblem("lastNight", "at most " + MAX_NIGHTS + " nights per run"));
            }
        }
        int seconds = form.seconds() == null ? DEFAULT_SECONDS : form.seconds();
        if (seconds < 1 || seconds > MAX_SECONDS) {
            problems.add(new FieldProblem("seconds", "must be 1.." + MAX_SECONDS));
        }
        Map<String, HardMediumSoftLongScore> weights = weights(form, problems);
        unknownSite(form.siteIds(), problems);
        nightsOutOfRange(form, problems);
        if (!problems.isEmpty()) {
            throw new InvalidParametersException(problems);
        }
        String sites = form.siteIds() == null || form.siteIds().isEmpty() ? null
                : form.siteIds().stream().map(String::valueOf).collect(Collectors.joining(","));
        String user = CurrentUser.get().username();
        PlannerRun run = tx.execute(status -> {
            for (PlannerRun other : runs.findByStateIn(List.of(RunState.QUEUED, RunState.RUNNING))) {
                if (other.overlaps(form.firstNight(), form.lastNight())) {
                    throw new ConflictException("Run " + other.getId() + " (" + other.getFirstNight() + " to "
                            + other.getLastNight() + ") is still " + other.getState().apiName()
                            + " over some of these nights; wait for it or cancel it");
                }
            }
            PlannerRun run0 = new PlannerRun(form.firstNight(), form.lastNight(), sites, seconds,
                    weights.isEmpty() ? null : json.writeValueAsString(form.weights()), user);
            run0.setPurpose(purpose);
            PlannerRun saved = runs.save(run0);
            audit.record("create", "planner-run", saved.getId(), null, RunView.of(saved));
            return saved;
        });
        long id = run.getId();
        cancellations.put(id, new Cancellation());
        futures.put(id, workers.submit(() -> execute(id, weights)));
        return RunView.of(run);
    }

    /**
     * The first of {@code siteIds} that is null or names no stored site. Unchecked, such a run planned nothing for it
     * without a word (an unknown id) or failed when it started (a null).
     */
    private void unknownSite(List<Long> siteIds, List<FieldProblem> problems) {
        if (siteIds == null || siteIds.isEmpty()) {
            return;
        }
        Set<Long> known = new HashSet<>();
        List<Long> asked = siteIds.stream().filter(Objects::nonNull).distinct().toList();
        sites.findAllById(asked).forEach(s -> known.add(s.getId()));
        for (int i = 0; i < siteIds.size(); i++) {
            Long id = siteIds.get(i);
            if (id == null || !known.contains(id)) {
                problems.add(new FieldProblem("siteIds[" + i + "]", id == null ? "must be a site id" : "no site with id " + id));
                return;
            }
        }
    }

    /**
     * Nights outside the server's dates ({@link SupportedDates}; a JSON body is held to them as it is read, a run an
     * alert starts here), and nights out of order named on {@code firstNight} too, beside the check above that names
     * {@code lastNight}: a conflict between two fields names both.
     */
    private static void nightsOutOfRange(RunForm form, List<FieldProblem> problems) {
        SupportedDates.check("firstNight", form.firstNight(), problems);
        SupportedDates.check("lastNight", form.lastNight(), problems);
        if (form.firstNight() != null && form.lastNight() != null && form.lastNight().isBefore(form.firstNight())) {
            problems.add(new FieldProblem("firstNight", "must not be after lastNight (" + form.lastNight() + ")"));
        }
    }

    private Map<String, HardMediumSoftLongScore> weights(RunForm form, List<FieldProblem> problems) {
        Map<String, HardMediumSoftLongScore> out = new LinkedHashMap<>();
        if (form.weights() == null) {
            return out;
        }
        List<String> rules = planners.ruleNames();
        form.weights().forEach((rule, w) -> {
            if (!rules.contains(rule)) {
                problems.add(new FieldProblem("weights." + rule, "no such rule; the rules are " + rules));
            } else if (w == null) {
                problems.add(new FieldProblem("weights." + rule, "must be {hard, medium, soft}"));
            } else {
                out.put(rule, HardMediumSoftLongScore.of(w.hard() == null ? 0 : w.hard(),
                        w.medium() == null ? 0 : w.medium(), w.soft() == null ? 0 : w.soft()));
            }
        });
        return out;
    }

    public RunView get(long id) {
        return RunView.of(find(id));
    }

    private PlannerRun find(long id) {
        return runs.findById(id).orElseThrow(() -> new NotFoundException("planner run", id));
    }

    public SseEmitter events(long id) {
        PlannerRun run = find(id);
        return events.subscribe(id, run.getTimeLimitSeconds(), run.getState().isActive() ? null : doneData(run));
    }

    /** Cancels a queued or running run and waits a little for it to stop; an ended run cannot be cancelled (409). */
    public RunView cancel(long id) {
        PlannerRun run = find(id);
        if (!run.getState().isActive()) {
            throw new ConflictException("Run " + id + " has already ended (" + run.getState().apiName() + ")");
        }
        String by = "cancelled by " + CurrentUser.get().username();
        cancelling.put(id, by);
        // The planner stops its search at the next step and hands back its best plan; the worker then ends the run.
        // Interrupting the worker instead would tear the solver down mid-step.
        Cancellation cancellation = cancellations.get(id);
        if (cancellation != null) {
            cancellation.cancel();
        }
        Future<?> future = futures.get(id);
        if (future == null || run.getState() == RunState.QUEUED) {
            // It may never have started (or its worker is gone): keep it from starting and end it here, unless the
            // worker already did.
            if (future != null) {
                future.cancel(false);
            }
            endIfActive(id, RunState.CANCELLED, null, by);
        }
        long until = System.nanoTime() + Duration.ofSeconds(10).toNanos();
        while (find(id).getState().isActive() && System.nanoTime() < until) {
            try {
                Thread.sleep(50);
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                break;
            }
        }
        return get(id);
    }

    private void execute(long id, Map<String, HardMediumSoftLongScore> weights) {
        try {
            PlannerRun run = tx.execute(status -> {
                PlannerRun r = find(id);
                if (r.getState() != RunState.QUEUED) {
                    return null;
                }
                r.start(clock.instant());
                return r;
            });
            if (run == null) {
                return;
            }
            Set<Long> siteIds = run.getSiteIds() == null ? null : java.util.Arrays.stream(run.getSiteIds().split(","))
                    .map(Long::valueOf).collect(Collectors.toSet());
            LocalDate first = run.getFirstNight();
            LocalDate last = run.getLastNight();
            keeper.catchUp();
            List<PlanNight> fed = new ArrayList<>();
            List<String> feedNotes = new ArrayList<>();
            PlanInputs.Problem problem = tx.execute(status -> {
                TermState term = inputs.term();
                List<PlanNight> draftNights = term.draftNights();
                ConditionsClosures.Closures closures = conditions.between(first, last);
                feedNotes.addAll(closures.notes());
                for (PlanNight n : closures.nights()) {
                    // A coordinator's own lock or closure of that night stands.
                    if (draftNights.stream().noneMatch(d -> d.is(n.getTelescopeId(), n.getNight()))) {
                        fed.add(n);
                    }
                }
                List<PlanNight> nights = new ArrayList<>(fed);
                nights.addAll(draftNights);
                return inputs.forRun(term, first, last, siteIds, nights);
            });
            SolveOptions options = SolveOptions.of(Duration.ofSeconds(run.getTimeLimitSeconds())).withWeights(weights)
                    .withCancellation(cancellations.get(id));
            long limitNanos = Duration.ofSeconds(run.getTimeLimitSeconds()).toNanos();
            PlanResult result = planners.fresh().replanFromPublished(problem.mapped().problem(), options,
                    p -> events.progress(id, progressData(p, limitNanos)));
            if (cancelling.containsKey(id) || Thread.currentThread().isInterrupted()) {
                // The best plan so far is not written as a draft: a cancelled run changes nothing but its own state.
                endIfActive(id, RunState.CANCELLED, result.score().toString(),
                        cancelling.getOrDefault(id, "cancelled"));
                return;
            }
            String siteWords = siteIds == null || siteIds.isEmpty() ? null : tx.execute(status ->
                    sites.findAllById(siteIds).stream().map(Site::getName).sorted().collect(Collectors.joining(", ")));
            RunSummary summary = RunSummary.of(problem, result);
            tx.executeWithoutResult(status -> {
                PlanRevision draft = drafts.applyRun(id, problem, result, fed, siteWords);
                PlannerRun r = find(id);
                String message = summary.sentence()
                        + (fed.isEmpty() ? "" : " Before planning, telescope nights closed by conditions feeds: "
                        + fed.size() + ".")
                        + (feedNotes.isEmpty() ? "" : " " + String.join("; ", feedNotes) + ".");
                r.end(RunState.FINISHED, clock.instant(), result.score().toString(), message);
                r.setSummaryJson(json.writeValueAsString(summary.withGrants(inputs.accounts(inputs.term(), null))));
                r.setRevisionId(draft.getId());
            });
            events.done(id, doneData(find(id)));
        } catch (RuntimeException | Error e) {
            boolean cancelled = cancelling.containsKey(id);
            if (!cancelled) {
                log.warn("Planner run {} failed", id, e);
            }
            endIfActive(id, cancelled ? RunState.CANCELLED : RunState.FAILED, null,
                    cancelled ? cancelling.getOrDefault(id, "cancelled") : failure(e));
        } finally {
            futures.remove(id);
            cancellations.remove(id);
            cancelling.remove(id);
        }
    }

    /**
     * Why a run failed, in plain words: the planner's own message where it gives one, never an exception's class;
     * the details are in the server's log.
     */
    static String failure(Throwable e) {
        Throwable cause = e;
        while (cause.getCause() != null && cause.getCause() != cause
                && (cause.getMessage() == null || cause.getMessage().isBlank())) {
            cause = cause.getCause();
        }
        String why = cause.getMessage();
        if (why == null || why.isBlank() || cause instanceof NullPointerException || cause instanceof ClassCastException
                || cause instanceof IndexOutOfBoundsException || cause instanceof Error) {
            return "The planner could not finish this run because of a fault in the server; it is in the server's log."
                    + " Nothing was written to the draft.";
        }
        return "The planner could not finish this run: " + why + ". Nothing was written to the draft.";
    }

    /** Ends a run that is still queued or running; when the worker and a cancel race, the first one to end it wins. */
    private void endIfActive(long id, RunState how, String score, String message) {
        try {
            tx.executeWithoutResult(status -> {
                PlannerRun r = find(id);
                if (r.getState().isActive()) {
                    r.end(how, clock.instant(), score, message);
                    if (how == RunState.FAILED) {
                        Map<String, Object> failed = new LinkedHashMap<>();
                        failed.put("state", "failed");
                        failed.put("message", message);
                        failed.put("purpose", r.getPurpose());
                        audit.record("state:failed", "planner-run", id, null, failed);
                    }
                }
            });
        } catch (OptimisticLockingFailureException e) {
            log.debug("Run {} was ended by someone else at the same moment", id);
        } catch (RuntimeException e) {
            // The database may be what failed; the readers of the stream still hear that the run is over.
            log.warn("Could not record the end of planner run {}", id, e);
        }
        String done;
        try {
            done = doneData(find(id));
        } catch (RuntimeException e) {
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("state", how.apiName());
            m.put("score", score);
            m.put("message", message);
            m.put("revision", null);
            done = json.writeValueAsString(m);
        }
        events.done(id, done);
    }

    private String progressData(Progress p, long limitNanos) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("fraction", Math.min(1.0, Math.round(p.elapsed().toNanos() * 1000.0 / limitNanos) / 1000.0));
        m.put("score", p.bestScore() == null ? null : p.bestScore().toString());
        m.put("elapsedSeconds", Math.round(p.elapsed().toMillis() / 100.0) / 10.0);
        m.put("placedVisits", p.placedVisits());
        return json.writeValueAsString(m);
    }

    private String doneData(PlannerRun run) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("state", run.getState().apiName());
        m.put("score", run.getBestScore());
        m.put("message", run.getMessage());
        m.put("revision", run.getRevisionId());
        return json.writeValueAsString(m);
    }

    /** Fails every run that was queued or running when the server stopped; called once at start. */
    int failInterrupted() {
        Integer n = tx.execute(status -> {
            List<PlannerRun> stale = runs.findByStateIn(List.of(RunState.QUEUED, RunState.RUNNING));
            stale.forEach(r -> r.end(RunState.FAILED, clock.instant(), null,
                    "The server stopped while this run was " + r.getState().apiName() + "; start it again"));
            return stale.size();
        });
        return n == null ? 0 : n;
    }
}
