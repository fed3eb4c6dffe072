package org.skyrota.bench;

import java.time.Duration;
import java.time.LocalDate;
import java.util.List;
import java.util.Locale;
import java.util.Set;

import org.skyrota.planning.model.Assignment;
import org.skyrota.planning.model.Closure;
import org.skyrota.planning.model.Site;
import org.skyrota.planning.model.Telescope;
import org.skyrota.planning.solver.PlanResult;
import org.skyrota.planning.solver.Planner;
import org.skyrota.planning.solver.SolveOptions;
import org.skyrota.sky.site.Night;

/**
 * replan: the planner-term plan, then one night at one site closed (weather) and a re-plan with a 3 s search limit.
 * seconds is the whole re-plan call (candidates, search, score explanation and reasons); unchanged is the fraction
 * of the visits planned outside the closed night that stay exactly where they were.
 */
public final class ReplanBench {
    public static void main(String[] args) {
        long seed = args.length > 0 ? Long.parseLong(args[0]) : 7L;
        double termSeconds = args.length > 1 ? Double.parseDouble(args[1]) : 60.0;
        PlannerTermBench.Outcome term = PlannerTermBench.run(seed, termSeconds);
        PlanResult before = term.result();
        String siteId = "mesa";
        LocalDate night = TermScenario.FIRST_NIGHT.plusDays(10);
        Site site = term.problem().sites().stream().filter(s -> s.id().equals(siteId)).findFirst().orElseThrow();
        List<String> closedTelescopes = term.problem().telescopes().stream().filter(t -> t.siteId().equals(siteId))
                .map(Telescope::id).toList();
        List<Assignment> outside = before.assignments().stream()
                .filter(a -> !(closedTelescopes.contains(a.telescopeId()) && nightOf(site, a).equals(night))).toList();
        long onClosedNight = before.assignments().size() - outside.size();

        long start = System.nanoTime();
        PlanResult after = term.planner().replanAfterClosures(before, List.of(Closure.site(siteId, night, "cloud")),
                SolveOptions.of(Duration.ofSeconds(3)).withSeed(seed), p -> { });
        double seconds = (System.nanoTime() - start) / 1e9;

        Set<String> kept = Planner.unchanged(after, outside);
        long stillOnClosedNight = after.assignments().stream()
                .filter(a -> closedTelescopes.contains(a.telescopeId()) && nightOf(site, a).equals(night)).count();
        System.out.println(String.format(Locale.ROOT,
                "BENCH replan seconds=%.1f unchanged=%.3f visitsOutsideNight=%d visitsOnClosedNight=%d"
                        + " stillOnClosedNight=%d hard=%d placedBefore=%d placedAfter=%d",
                seconds, (double) kept.size() / outside.size(), outside.size(), onClosedNight, stillOnClosedNight,
                after.hardViolations().size(), before.planned().size(), after.planned().size()));
    }

    private static LocalDate nightOf(Site site, Assignment a) {
        return Night.containing(site.nightZone(), a.start()).date();
    }
}
