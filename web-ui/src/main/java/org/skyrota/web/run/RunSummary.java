package org.skyrota.web.run;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;

import org.skyrota.planning.candidates.PreparedProblem;
import org.skyrota.planning.domain.RuleNames;
import org.skyrota.planning.domain.Visit;
import org.skyrota.planning.model.Grant;
import org.skyrota.planning.model.Program;
import org.skyrota.planning.solver.PlanBound;
import org.skyrota.planning.solver.PlanResult;
import org.skyrota.planning.solver.PlannedVisit;
import org.skyrota.planning.solver.Violation;
import org.skyrota.web.plan.GrantLedger;
import org.skyrota.web.plan.PlanInputs;
import org.skyrota.web.plan.VisitKey;

/**
 * What a finished run did, in numbers and in plain words: the visits and hours it placed and left out, how close its
 * plan is to the best any plan could be (an upper bound, {@link PlanBound}), each program's share of the placed time
 * against its share of the grants, the programs it would take over a grant, and what moved against the published
 * plan.
 *
 * @param gapPercent   how far the plan's priority-weighted time is below the upper bound, per cent (0 = it is the best)
 * @param sentence     all of it in one or two sentences
 * @param grants       every grant's ledger once the run's draft is written (granted, observed, published, draft,
 *                     remaining hours)
 */
public record RunSummary(int placedVisits, double placedHours, int leftOutVisits, double leftOutHours,
                         long weightedMinutes, long upperBoundWeightedMinutes, double gapPercent,
                         List<ProgramShare> programs, List<String> overGrant, Against published,
                         List<Unplannable> unplannable, String sentence, List<GrantLedger.Account> grants) {

    /** This summary with the grants' ledger as it stands after the run. */
    RunSummary withGrants(List<GrantLedger.Account> accounts) {
        return new RunSummary(placedVisits, placedHours, leftOutVisits, leftOutHours, weightedMinutes,
                upperBoundWeightedMinutes, gapPercent, programs, overGrant, published, unplannable, sentence,
                List.copyOf(accounts));
    }

    /** A program's share of the time placed by the run against its share of the grants the run could spend. */
    public record ProgramShare(long programId, String code, double placedHours, double sharePercent,
                               double grantSharePercent) {}

    /** The run's visits that the published plan held in its nights: left in place, moved, or dropped. */
    public record Against(int kept, int moved, int dropped) {}

    /** A visit the run could not plan at all, and why. */
    public record Unplannable(String visitId, String reason) {}

    static RunSummary of(PlanInputs.Problem problem, PlanResult result) {
        PreparedProblem prepared = result.prepared();
        int placed = result.planned().size();
        double placedHours = 0;
        for (PlannedVisit p : result.planned()) {
            placedHours += (p.end().getEpochSecond() - p.start().getEpochSecond()) / 3600.0;
        }
        Map<String, Visit> byId = new HashMap<>();
        prepared.schedule().visits().forEach(v -> byId.put(v.id(), v));
        double leftOutHours = 0;
        for (var l : result.leftOut()) {
            Visit v = byId.get(l.visitId());
            leftOutHours += v == null ? 0 : v.nominalMinutes() / 60.0;
        }
        long weighted = PlanBound.weighted(prepared);
        long bound = Math.max(weighted, PlanBound.of(prepared));
        double gap = bound == 0 ? 0 : 100.0 * (bound - weighted) / bound;

        Map<String, Double> programHours = new TreeMap<>();
        for (Visit v : prepared.schedule().visits()) {
            if (v.isPlaced()) {
                programHours.merge(v.programId(), v.placedMinutes() / 60.0, Double::sum);
            }
        }
        Map<String, Double> grantHours = new HashMap<>();
        double totalGrant = 0;
        for (Grant g : prepared.problem().grantsInForce()) {
            grantHours.merge(g.programId(), g.hours(), Double::sum);
            totalGrant += g.hours();
        }
        List<ProgramShare> programs = new ArrayList<>();
        for (Program p : prepared.problem().programs()) {
            double hours = programHours.getOrDefault(p.id(), 0.0);
            double granted = grantHours.getOrDefault(p.id(), 0.0);
            if (hours == 0 && granted == 0) {
                continue;
            }
            programs.add(new ProgramShare(Long.parseLong(p.id()), p.name(), round(hours),
                    round(placedHours == 0 ? 0 : 100 * hours / placedHours),
                    round(totalGrant == 0 ? 0 : 100 * granted / totalGrant)));
        }

        Map<String, String> codeOf = new HashMap<>();
        prepared.problem().programs().forEach(p -> codeOf.put(p.id(), p.name()));
        List<String> over = new ArrayList<>();
        for (Violation v : result.violations()) {
            if (v.rule().equals(RuleNames.PROGRAM_OVER_GRANT) && v.programId() != null) {
                over.add(String.format(Locale.ROOT, "%s: %s (%.1f h over)", codeOf.getOrDefault(v.programId(),
                        v.programId()), v.grant(), -v.hardScore() / 60.0));
            }
        }

        Map<String, PlannedVisit> plannedById = new HashMap<>();
        result.planned().forEach(p -> plannedById.put(p.visitId(), p));
        int kept = 0;
        int moved = 0;
        int dropped = 0;
        for (var a : prepared.problem().published()) {
            PlannedVisit now = plannedById.get(a.visitId());
            if (now == null) {
                dropped++;
            } else if (now.telescopeId().equals(a.telescopeId()) && now.start().equals(a.start())) {
                kept++;
            } else {
                moved++;
            }
        }
        List<Unplannable> unplannable = new ArrayList<>();
        Map<VisitKey, String> sorted = new TreeMap<>(java.util.Comparator.comparing(VisitKey::requestId)
                .thenComparing(VisitKey::repeatNo));
        sorted.putAll(problem.mapped().unplannable());
        sorted.forEach((k, why) -> unplannable.add(new Unplannable(k.toString(), why)));

        StringBuilder s = new StringBuilder(String.format(Locale.ROOT, "Placed %d of %d visits (%.1f h of %.1f h)",
                placed, placed + result.leftOut().size(), placedHours, placedHours + leftOutHours));
        if (bound > 0) {
            s.append(gap < 0.05 ? ", as good as any plan can be" : String.format(Locale.ROOT,
                    ", within %.1f %% of the best possible plan", gap));
        }
        s.append('.');
        if (kept + moved + dropped > 0) {
            s.append(String.format(Locale.ROOT, " Against the published plan: %d kept, %d moved, %d dropped.", kept,
                    moved, dropped));
        }
        if (!over.isEmpty()) {
            s.append(" Over a grant: ").append(String.join("; ", over)).append('.');
        }
        if (!unplannable.isEmpty()) {
            s.append(String.format(Locale.ROOT, " %d visit%s could not be planned at all (see their reasons).",
                    unplannable.size(), unplannable.size() == 1 ? "" : "s"));
        }
        return new RunSummary(placed, round(placedHours), result.leftOut().size(), round(leftOutHours), weighted, bound,
                round(gap), programs, over, new Against(kept, moved, dropped), unplannable, s.toString(), List.of());
    }

    private static double round(double x) {
        return Math.round(x * 10) / 10.0;
    }

}
