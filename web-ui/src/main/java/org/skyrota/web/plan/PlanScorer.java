package org.skyrota.web.plan;

import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;

import org.optaplanner.core.api.score.buildin.hardmediumsoftlong.HardMediumSoftLongScore;
import org.skyrota.planning.candidates.PreparedProblem;
import org.skyrota.planning.domain.Placement;
import org.skyrota.planning.domain.Visit;
import org.skyrota.planning.solver.PlanResult;
import org.skyrota.planning.solver.Planner;
import org.skyrota.planning.solver.SolveOptions;
import org.skyrota.planning.solver.Violation;
import org.springframework.stereotype.Component;

/**
 * Scores a plan as it stands with the constraints module's rules (the facade's {@link Planner#evaluate}, which is
 * OptaPlanner's {@code SolutionManager.explain}): every placed visit ahead of now is held where it is, so nothing
 * moves; history is a fact the plan keeps around (its telescope time, its grant hours, the spacing of the repeats).
 */
@Component
class PlanScorer {

    private final PlannerConfig planners;
    private final PlanInputs inputs;

    PlanScorer(PlannerConfig planners, PlanInputs inputs) {
        this.planners = planners;
        this.inputs = inputs;
    }

    /** A broken hard rule: the rule, the visits it names (as "12-1"), and for a grant the program and grant. */
    record Broken(String rule, List<String> visits, long penalty, Long programId, String grant) {}

    /** The score, the score per rule, the planner's view of every visit, and the hard rules broken. */
    record Scored(HardMediumSoftLongScore score, Map<String, HardMediumSoftLongScore> byRule, List<PlanVisit> visits,
                  List<Broken> broken) {

        /** Hard rules broken worse in {@code this} than in {@code before}. */
        List<String> hardBrokenSince(Scored before) {
            List<String> out = new ArrayList<>();
            byRule.forEach((rule, s) -> {
                long was = before.byRule.getOrDefault(rule, HardMediumSoftLongScore.ZERO).hardScore();
                if (s.hardScore() < 0 && s.hardScore() < was) {
                    out.add(rule);
                }
            });
            return out;
        }
    }

    Scored score(TermState term, LocalDate first, LocalDate last, List<PlanVisit> visits, List<PlanNight> nights) {
        PlanInputs.Problem p = inputs.forScoring(term, visits, nights, first, last, null);
        Planner planner = planners.fresh();
        PlanResult result = planner.evaluate(planner.prepare(p.mapped().problem(), SolveOptions.of(Duration.ofSeconds(1))));
        return new Scored(result.score(), result.scoreByRule(), p.mapped().visits(result), broken(result, p.mapped()));
    }

    private static List<Broken> broken(PlanResult result, PlanningMapper.Mapped mapped) {
        List<Broken> out = new ArrayList<>();
        for (Violation v : result.violations()) {
            List<String> keys = v.visitIds().stream().map(id -> {
                VisitKey key = mapped.keyByVisitId().get(id);
                return key == null ? id : key.toString();
            }).toList();
            out.add(new Broken(v.rule(), keys, v.hardScore(), v.programId() == null ? null : Long.valueOf(v.programId()),
                    v.grant()));
        }
        return out;
    }

    /** One other placement of a visit and what moving it there does to the score. */
    record Candidate(long telescopeId, Instant start, Instant end, String scoreChange, List<String> hardBroken) {}

    /**
     * Up to {@code max} of the visit's candidate placements (spread over all of them), each scored with every other
     * placed visit held where it is.
     */
    List<Candidate> candidates(TermState term, LocalDate first, LocalDate last, List<PlanVisit> visits,
                               List<PlanNight> nights, VisitKey key, int max) {
        PlanInputs.Problem problem = inputs.forScoring(term, visits, nights, first, last, key);
        PlanningMapper.Mapped mapped = problem.mapped();
        String visitId = mapped.visitIdOf(key).orElse(null);
        if (visitId == null) {
            return List.of();
        }
        Planner planner = planners.fresh();
        PreparedProblem prepared = planner.prepare(mapped.problem(), SolveOptions.of(Duration.ofSeconds(1)));
        Visit visit = prepared.schedule().visits().stream().filter(v -> v.id().equals(visitId)).findFirst().orElse(null);
        if (visit == null || visit.getCandidates().isEmpty()) {
            return List.of();
        }
        PlanVisit current = visits.stream().filter(v -> v.key().equals(key) && v.isPlaced()).findFirst().orElse(null);
        Placement now = current == null ? null : visit.getCandidates().stream()
                .filter(p -> prepared.telescope(p.telescopeIndex()).id().equals(String.valueOf(current.getTelescopeId()))
                        && prepared.schedule().instantOf(p.startMinute()).equals(current.getStart()))
                .findFirst().orElse(null);
        visit.setPlacement(now);
        PlanResult before = planner.evaluate(prepared);
        List<Placement> all = visit.getCandidates();
        int step = Math.max(1, (all.size() + max - 1) / max);
        List<Candidate> out = new ArrayList<>();
        for (int i = 0; i < all.size() && out.size() < max; i += step) {
            Placement p = all.get(i);
            if (p == now) {
                continue;
            }
            visit.setPlacement(p);
            PlanResult after = planner.evaluate(prepared);
            Scored was = new Scored(before.score(), before.scoreByRule(), List.of(), List.of());
            Scored is = new Scored(after.score(), after.scoreByRule(), List.of(), List.of());
            Instant start = prepared.schedule().instantOf(p.startMinute());
            out.add(new Candidate(Long.parseLong(prepared.telescope(p.telescopeIndex()).id()), start,
                    prepared.schedule().instantOf(p.startMinute() + visit.lengthOn(p.telescopeIndex())),
                    after.score().subtract(before.score()).toString(), is.hardBrokenSince(was)));
        }
        visit.setPlacement(now);
        return out;
    }
}
