package org.skyrota.planning.solver;

import java.time.Duration;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.concurrent.CancellationException;
import java.util.concurrent.ExecutionException;
import java.util.function.Consumer;
import java.util.stream.Collectors;

import org.optaplanner.core.api.score.ScoreExplanation;
import org.optaplanner.core.api.score.buildin.hardmediumsoftlong.HardMediumSoftLongScore;
import org.optaplanner.core.api.score.constraint.ConstraintMatch;
import org.optaplanner.core.api.score.constraint.ConstraintMatchTotal;
import org.optaplanner.core.api.score.stream.ConstraintProvider;
import org.optaplanner.core.api.solver.SolutionManager;
import org.optaplanner.core.api.solver.Solver;
import org.optaplanner.core.api.solver.SolverFactory;
import org.optaplanner.core.api.solver.SolverJob;
import org.optaplanner.core.api.solver.SolverManager;
import org.optaplanner.core.config.heuristic.selector.move.composite.UnionMoveSelectorConfig;
import org.optaplanner.core.config.heuristic.selector.move.factory.MoveIteratorFactoryConfig;
import org.optaplanner.core.config.heuristic.selector.move.generic.ChangeMoveSelectorConfig;
import org.optaplanner.core.config.localsearch.LocalSearchPhaseConfig;
import org.optaplanner.core.config.localsearch.decider.acceptor.LocalSearchAcceptorConfig;
import org.optaplanner.core.config.localsearch.decider.forager.LocalSearchForagerConfig;
import org.optaplanner.core.config.score.director.ScoreDirectorFactoryConfig;
import org.optaplanner.core.config.solver.SolverConfig;
import org.optaplanner.core.api.score.stream.ConstraintStreamImplType;
import org.optaplanner.core.config.solver.termination.TerminationConfig;
import org.skyrota.planning.candidates.CandidateGenerator;
import org.skyrota.planning.candidates.PreparedProblem;
import org.skyrota.planning.domain.ClosedNight;
import org.skyrota.planning.domain.Placement;
import org.skyrota.planning.domain.PlannerWeights;
import org.skyrota.planning.domain.RuleNames;
import org.skyrota.planning.domain.Schedule;
import org.skyrota.planning.domain.Visit;
import org.skyrota.planning.explain.LeftOutExplainer;
import org.skyrota.planning.greedy.GreedyDispatcher;
import org.skyrota.planning.model.Assignment;
import org.skyrota.planning.model.Closure;
import org.skyrota.planning.model.PlanningProblem;
import org.skyrota.planning.model.SolarSafety;
import org.skyrota.planning.sky.SkyModel;
import org.skyrota.planning.solver.moves.EjectionMoveFactory;
import org.skyrota.planning.solver.moves.GrantTradeMoveFactory;
import org.skyrota.planning.solver.moves.RepackMoveFactory;

/**
 * The planner's front door: prepare the candidates from the sky, solve with OptaPlanner, explain the result.
 * The score rules are passed in as a {@link ConstraintProvider} class because they live in the constraints module,
 * which depends on this one. Thread-safe; each call runs its own solver.
 */
public final class Planner {
    private final SkyModel sky;
    private final Class<? extends ConstraintProvider> constraints;
    private final ExtraRules extraRules;

    public Planner(SkyModel sky, Class<? extends ConstraintProvider> constraints) {
        this(sky, constraints, ExtraRules.NONE);
    }

    /**
     * A planner whose provider adds score rules beyond the built-in ones (plugins). Their weights are overridden per
     * run by name, as the built-in ones are ({@link SolveOptions#weightOverrides()}).
     */
    public Planner(SkyModel sky, Class<? extends ConstraintProvider> constraints, ExtraRules extraRules) {
        if (sky == null || constraints == null || extraRules == null) {
            throw new IllegalArgumentException("sky model, constraint provider and extra rules must not be null");
        }
        this.sky = sky;
        this.constraints = constraints;
        this.extraRules = extraRules;
    }

    /** The rules this planner adds to the built-in ones, with their default weights. */
    public ExtraRules extraRules() {
        return extraRules;
    }

    /** A run's weights: the built-in rules' in the configuration OptaPlanner reads, the extra rules' beside them. */
    private PlannerWeights weightsOf(SolveOptions options) {
        Map<String, HardMediumSoftLongScore> extra = extraRules.weightsFor(options.weightOverrides());
        Map<String, HardMediumSoftLongScore> builtIn = new HashMap<>(options.weightOverrides());
        builtIn.keySet().removeIf(extra::containsKey);
        return PlannerWeights.defaults().withOverrides(builtIn).withExtra(extra);
    }

    /** Candidate generation only: the schedule with every candidate, nothing placed except the pins. */
    public PreparedProblem prepare(PlanningProblem problem, SolveOptions options) {
        return new CandidateGenerator(sky).prepare(problem, weightsOf(options));
    }

    /** Plans from scratch (pins stay where they are pinned). */
    public PlanResult solve(PlanningProblem problem, SolveOptions options) {
        return solve(problem, options, p -> { });
    }

    /**
     * Plans from scratch, calling {@code progress} with every new best plan (from the solver's thread) and once more
     * with the final plan.
     */
    public PlanResult solve(PlanningProblem problem, SolveOptions options, Consumer<Progress> progress) {
        return solvePrepared(prepare(problem, options), options, progress);
    }

    /**
     * Re-plans after a change (a closed night, a failed visit, new pins): the current plan becomes the plan to keep,
     * each visit starts where it is if that is still allowed, pinned visits never move, and only what must move does
     * (every move off the current plan costs the stability weight).
     */
    public PlanResult replan(PlanningProblem changed, PlanResult current, SolveOptions options, Consumer<Progress> progress) {
        options = withReplanStability(options);
        PreparedProblem prepared = prepare(changed.withPublished(current.assignments()), options);
        for (Visit v : prepared.schedule().visits()) {
            if (!v.isPinned() && v.hasCandidate(v.getPublished())) {
                v.setPlacement(v.getPublished());
            }
        }
        return solvePrepared(prepared, options, progress);
    }

    /**
     * Plans {@code problem} starting from its published plan ({@link PlanningProblem#published()}): each visit starts
     * where it is published if that place is still a candidate, the others are fitted around them, and moving a
     * published visit costs the re-planning stability weight (unless the run sets it), so that only what must move
     * does. Without published places it is {@link #solve}.
     */
    public PlanResult replanFromPublished(PlanningProblem problem, SolveOptions options, Consumer<Progress> progress) {
        if (problem.published().isEmpty()) {
            return solve(problem, options, progress);
        }
        options = withReplanStability(options);
        PreparedProblem prepared = prepare(problem, options);
        for (Visit v : prepared.schedule().visits()) {
            if (!v.isPinned() && v.hasCandidate(v.getPublished())) {
                v.setPlacement(v.getPublished());
            }
        }
        GreedyDispatcher.grantAware().fill(prepared);
        return solvePrepared(prepared, options, progress);
    }

    /**
     * Re-plans after nights were closed, reusing the candidates of {@code current} (no new sky computation, so it is
     * fast): the closed nights' candidates go, every other visit starts where it is and costs the stability weight
     * if it moves, pinned visits stay even on a closed night (which is then reported as a hard violation).
     */
    public PlanResult replanAfterClosures(PlanResult current, List<Closure> newClosures, SolveOptions options,
                                          Consumer<Progress> progress) {
        options = withReplanStability(options);
        PreparedProblem before = current.prepared();
        List<ClosedNight> closed = new ArrayList<>(before.schedule().closedNights());
        for (Closure c : newClosures) {
            for (int t = 0; t < before.telescopes().size(); t++) {
                if (c.covers(before.telescope(t), c.night())) {
                    closed.add(new ClosedNight(t, (int) c.night().toEpochDay(), c.reason()));
                }
            }
        }
        Set<Long> closedKeys = closed.stream()
                .map(c -> c.telescopeIndex() * 1_000_000L + c.nightEpochDay()).collect(Collectors.toSet());
        List<Visit> visits = new ArrayList<>();
        for (Visit old : before.schedule().visits()) {
            Placement was = old.getPlacement();
            Visit v = old.withoutCandidates(p -> p != was || !old.isPinned() ? closedKeys.contains(
                    p.telescopeIndex() * 1_000_000L + p.nightEpochDay()) : false);
            v.setPublished(was);
            if (was != null && v.hasCandidate(was)) {
                v.setPlacement(was);
                v.setPinned(old.isPinned());
            }
            visits.add(v);
        }
        Schedule schedule = new Schedule(before.schedule().epoch(), before.schedule().gridMinutes(),
                before.schedule().telescopeIds(), closed, before.schedule().grants(), visits,
                weightsOf(options));
        schedule.setMounts(before.schedule().mounts());
        List<Closure> allClosures = new ArrayList<>(before.problem().closures());
        allClosures.addAll(newClosures);
        PreparedProblem prepared = new PreparedProblem(before.problem().withClosures(allClosures)
                .withPublished(current.assignments()), schedule, before.telescopes(), before.sites(),
                before.requestByVisit(), before.statsByVisit(), before.candidateCount(), before.placementCount());
        return solvePrepared(prepared, options, progress);
    }

    /**
     * Moving a visit of the plan being re-planned costs {@link #REPLAN_STABILITY} at the medium level unless the run
     * sets that weight itself: a soft cost would let any small gain in placed time reshuffle the whole plan.
     */
    private static SolveOptions withReplanStability(SolveOptions options) {
        if (options.weightOverrides().containsKey(RuleNames.STABILITY)) {
            return options;
        }
        Map<String, HardMediumSoftLongScore> weights = new HashMap<>(options.weightOverrides());
        weights.put(RuleNames.STABILITY, REPLAN_STABILITY);
        return options.withWeights(weights);
    }

    /** Default weight of "Moved from published plan" when re-planning: two hours of priority-1 time per moved visit. */
    public static final HardMediumSoftLongScore REPLAN_STABILITY = HardMediumSoftLongScore.ofMedium(120);

    /**
     * Solves an already prepared problem in place. A cancelled {@link SolveOptions#cancellation()} ends the search
     * early with the best plan found so far, scored and explained like any other.
     */
    public PlanResult solvePrepared(PreparedProblem prepared, SolveOptions options, Consumer<Progress> progress) {
        // The search starts from a full plan: the current one when re-planning, else the greedy dispatch, which
        // builds a good first plan in well under a second where a construction heuristic that tries every
        // candidate of every visit would spend most of the time limit. The grant-aware walk keeps programs with
        // more requests than grant from spending it on their low priorities first (on planner-term its start plan
        // is worth 1.03 times the baseline's, the urgency-aware walk's 1.00).
        boolean started = prepared.schedule().visits().stream().anyMatch(v -> v.isPlaced() && !v.isPinned());
        if (!started) {
            GreedyDispatcher.grantAware().dispatch(prepared);
        }
        SolverConfig config = solverConfig(options, extraWeightsOf(prepared.schedule()));
        SolverFactory<Schedule> factory = SolverFactory.create(config);
        long startNanos = System.nanoTime();
        Cancellation cancellation = options.cancellation();
        Schedule solved;
        ProgressRelay relay = new ProgressRelay(progress);
        // New best plans are taken from the solver's own event (on its thread, where they are cheap to read) and
        // handed to the caller on a thread of its own, newest first. SolverManager.solveAndListen is not used: in
        // OptaPlanner 10.1.0 its hand-over to the best-solution consumer can lose a permit when a new best plan
        // arrives just as the previous one is taken, and then the job waits for ever for its final plan.
        SolverFactory<Schedule> listening = () -> {
            Solver<Schedule> solver = factory.buildSolver();
            solver.addEventListener(event -> relay.offer(progressOf(event.getNewBestSolution(), startNanos)));
            return solver;
        };
        try (SolverManager<Schedule, Long> manager = SolverManager.create(listening)) {
            if (cancellation != null && cancellation.isCancelled()) {
                // Cancelled while the candidates were prepared: the start plan is the best there is.
                solved = prepared.schedule();
            } else {
                SolverJob<Schedule, Long> job = manager.solve(1L, id -> prepared.schedule(), null);
                // Ending the job through the solver manager stops the search between two steps and keeps its best
                // plan; interrupting this thread instead would tear the solver down in the middle of a step.
                Runnable stopListening = cancellation == null ? () -> { } : cancellation.onCancel(job::terminateEarly);
                try {
                    solved = job.getFinalBestSolution();
                } catch (CancellationException e) {
                    // Cancelled before the solver's thread took the job up: nothing was searched yet.
                    solved = prepared.schedule();
                } finally {
                    stopListening.run();
                }
            }
            // Always report the final plan, also when the search found nothing better than its start.
            relay.offer(progressOf(solved, startNanos));
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException("planner run interrupted", e);
        } catch (ExecutionException e) {
            throw new IllegalStateException("planner run failed: " + e.getCause().getMessage(), e.getCause());
        } finally {
            relay.close();
        }
        PreparedProblem result = new PreparedProblem(prepared.problem(), solved, prepared.telescopes(), prepared.sites(),
                prepared.requestByVisit(), prepared.statsByVisit(), prepared.candidateCount(), prepared.placementCount());
        return evaluate(result);
    }

    /** Scores and explains a schedule as it stands (for example the greedy baseline's). */
    public PlanResult evaluate(PreparedProblem prepared) {
        SolverFactory<Schedule> factory = SolverFactory.create(solverConfig(SolveOptions.of(Duration.ofSeconds(1)),
                extraWeightsOf(prepared.schedule())));
        ScoreExplanation<Schedule, HardMediumSoftLongScore> explanation =
                SolutionManager.<Schedule, HardMediumSoftLongScore>create(factory).explain(prepared.schedule());
        Schedule schedule = prepared.schedule();
        Map<String, HardMediumSoftLongScore> byRule = new LinkedHashMap<>();
        List<String> hard = new ArrayList<>();
        List<Violation> violations = new ArrayList<>();
        for (ConstraintMatchTotal<HardMediumSoftLongScore> total : explanation.getConstraintMatchTotalMap().values()) {
            byRule.put(total.getConstraintName(), total.getScore());
            for (ConstraintMatch<HardMediumSoftLongScore> match : total.getConstraintMatchSet()) {
                if (match.getScore().hardScore() < 0) {
                    List<Visit> named = match.getIndictedObjectList().stream()
                            .filter(Visit.class::isInstance).map(Visit.class::cast).toList();
                    String who = named.stream().map(v -> describe(v, prepared)).collect(Collectors.joining(" and "));
                    hard.add(total.getConstraintName() + ": " + (who.isEmpty() ? match.getIndictedObjectList() : who)
                            + " (" + match.getScore().hardScore() + ")");
                    org.skyrota.planning.domain.ProgramGrant grant = match.getIndictedObjectList().stream()
                            .filter(org.skyrota.planning.domain.ProgramGrant.class::isInstance)
                            .map(org.skyrota.planning.domain.ProgramGrant.class::cast).findFirst().orElse(null);
                    violations.add(new Violation(total.getConstraintName(), named.stream().map(Visit::id).toList(),
                            match.getScore().hardScore(), grant == null ? null : grant.programId(),
                            grant == null ? null : grant.label()));
                }
            }
        }
        List<PlannedVisit> planned = new ArrayList<>();
        for (Visit v : schedule.visits()) {
            if (v.isPlaced()) {
                planned.add(new PlannedVisit(v.id(), v.requestId(), prepared.telescope(v.telescopeIndex()).id(),
                        schedule.instantOf(v.startMinute()), schedule.instantOf(v.endMinute()), v.isPinned(),
                        prepared.requestByVisit().get(v.id()).target().solar() ? SolarSafety.CAUTION : null));
            }
        }
        planned.sort(Comparator.comparing(PlannedVisit::start).thenComparing(PlannedVisit::telescopeId));
        Map<String, String> reasons = new LeftOutExplainer().explain(prepared);
        List<LeftOutVisit> leftOut = new ArrayList<>();
        for (Visit v : schedule.visits()) {
            if (!v.isPlaced()) {
                leftOut.add(new LeftOutVisit(v.id(), v.requestId(), v.priority(), reasons.get(v.id())));
            }
        }
        return new PlanResult(List.copyOf(planned), List.copyOf(leftOut), explanation.getScore(), byRule,
                List.copyOf(hard), prepared, violations);
    }

    private static String describe(Visit v, PreparedProblem prepared) {
        return v.id() + (v.isPinned() ? " (pinned)" : "") + " on " + prepared.telescope(v.telescopeIndex()).id()
                + " at " + prepared.schedule().instantOf(v.startMinute());
    }

    /** The extra rules' weights the schedule was prepared with; the defaults for one prepared without them. */
    private Map<String, HardMediumSoftLongScore> extraWeightsOf(Schedule schedule) {
        Map<String, HardMediumSoftLongScore> weights = new LinkedHashMap<>(extraRules.defaultWeights());
        Map<String, HardMediumSoftLongScore> used = schedule.weights() == null ? Map.of() : schedule.weights().extra();
        used.forEach((name, w) -> {
            if (weights.containsKey(name)) {
                weights.put(name, w);
            }
        });
        return weights;
    }

    private SolverConfig solverConfig(SolveOptions options, Map<String, HardMediumSoftLongScore> extraWeights) {
        TerminationConfig termination = new TerminationConfig()
                .withSpentLimit(options.timeLimit());
        if (options.unimprovedTimeLimit() != null) {
            termination.setUnimprovedSpentLimit(options.unimprovedTimeLimit());
        }
        if (options.evaluationLimit() > 0) {
            termination.setScoreCalculationCountLimit(options.evaluationLimit());
        }
        // OptaPlanner makes the provider from its class; the extra rules' weights for this run reach that instance as
        // a custom property, so two runs with different weights never share state.
        Map<String, String> properties = new HashMap<>(extraRules.providerProperties());
        if (!extraRules.defaultWeights().isEmpty()) {
            properties.put(ExtraRules.WEIGHTS_PROPERTY, ExtraRules.encode(extraWeights));
        }
        return new SolverConfig()
                .withSolutionClass(Schedule.class)
                .withEntityClasses(Visit.class)
                .withScoreDirectorFactory(new ScoreDirectorFactoryConfig()
                        .withConstraintProviderClass(constraints)
                        .withConstraintProviderCustomProperties(properties.isEmpty() ? null : properties)
                        // Bavet, not the Drools-based default: several times the score calculation speed here.
                        .withConstraintStreamImplType(ConstraintStreamImplType.BAVET))
                .withRandomSeed(options.randomSeed())
                .withTerminationConfig(termination)
                .withPhases(localSearch());
    }

    /**
     * Late acceptance over three kinds of move: change one visit's placement (or leave it out), place a visit while
     * ejecting and re-fitting what it overlaps ({@link EjectionMoveFactory}), and, half as often, repack a whole
     * telescope-night ({@link RepackMoveFactory}; without it the optimum test stalled 1% short). Measured on the benchmarks: late
     * acceptance beat tabu search and simulated annealing on the CP-SAT optimum test's instance; a short list
     * beat the usual 400 on planner-term (50: 1.06 against 1.03 times greedy in 60 s; with grant trades, at 300,000
     * evaluations, 20: 1.066, 50: 1.060, 200: worse; 10 left planner-small 1.1% short of the optimum); swap moves (two visits trade
     * placements, rarely possible with per-visit lengths) only took evaluations from the others. Grant trades
     * ({@link GrantTradeMoveFactory}: a visit comes in, cheaper visits of its program go out to keep the grant) are
     * the only way to improve a program that has used its whole grant.
     */
    private static final int LATE_ACCEPTANCE_SIZE = 20;
    private static final double GRANT_TRADE_WEIGHT = 0.5;

    private static LocalSearchPhaseConfig localSearch() {
        LocalSearchAcceptorConfig acceptor = new LocalSearchAcceptorConfig();
        acceptor.setLateAcceptanceSize(LATE_ACCEPTANCE_SIZE);
        LocalSearchForagerConfig forager = new LocalSearchForagerConfig();
        forager.setAcceptedCountLimit(1);
        return new LocalSearchPhaseConfig().withAcceptorConfig(acceptor).withForagerConfig(forager)
                .withMoveSelectorConfig(new UnionMoveSelectorConfig()
                        .withMoveSelectors(new ChangeMoveSelectorConfig().withFixedProbabilityWeight(1.0),
                                new MoveIteratorFactoryConfig().withMoveIteratorFactoryClass(EjectionMoveFactory.class)
                                        .withFixedProbabilityWeight(1.0),
                                new MoveIteratorFactoryConfig().withMoveIteratorFactoryClass(GrantTradeMoveFactory.class)
                                        .withFixedProbabilityWeight(GRANT_TRADE_WEIGHT),
                                // Repacking a night changes many visits at once: costly to score, so picked less often.
                                new MoveIteratorFactoryConfig().withMoveIteratorFactoryClass(RepackMoveFactory.class)
                                        .withFixedProbabilityWeight(0.5)));
    }

    private static Progress progressOf(Schedule best, long startNanos) {
        int placed = 0;
        long weighted = 0;
        for (Visit v : best.visits()) {
            if (v.isPlaced()) {
                placed++;
                weighted += v.priorityWeight() * v.nominalMinutes();
            }
        }
        return new Progress(best.score(), Duration.ofNanos(System.nanoTime() - startNanos), placed, weighted);
    }

    /** The visits of {@code result} that sit exactly where they sit in {@code assignments}. */
    public static Set<String> unchanged(PlanResult result, List<Assignment> assignments) {
        Map<String, Assignment> before = new HashMap<>();
        assignments.forEach(a -> before.put(a.visitId(), a));
        return result.planned().stream()
                .filter(p -> {
                    Assignment a = before.get(p.visitId());
                    return a != null && a.telescopeId().equals(p.telescopeId()) && a.start().equals(p.start());
                })
                .map(PlannedVisit::visitId)
                .collect(Collectors.toSet());
    }
}
