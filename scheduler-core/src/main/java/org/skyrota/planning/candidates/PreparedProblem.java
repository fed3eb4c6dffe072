package org.skyrota.planning.candidates;

import java.util.List;
import java.util.Map;

import org.skyrota.planning.domain.Schedule;
import org.skyrota.planning.model.PlanningProblem;
import org.skyrota.planning.model.Request;
import org.skyrota.planning.model.Site;
import org.skyrota.planning.model.Telescope;

/**
 * A problem turned into a planning solution with every candidate precomputed, plus what the reasons need.
 * Telescopes and sites are indexed as in the schedule's placements.
 */
public record PreparedProblem(PlanningProblem problem, Schedule schedule, List<Telescope> telescopes, List<Site> sites,
                              Map<String, Request> requestByVisit, Map<String, VisitStats> statsByVisit,
                              long candidateCount, long placementCount) {

    public Telescope telescope(int index) {
        return telescopes.get(index);
    }

    public int telescopeIndex(String telescopeId) {
        for (int i = 0; i < telescopes.size(); i++) {
            if (telescopes.get(i).id().equals(telescopeId)) {
                return i;
            }
        }
        throw new IllegalArgumentException("unknown telescope '" + telescopeId + "'");
    }
}
