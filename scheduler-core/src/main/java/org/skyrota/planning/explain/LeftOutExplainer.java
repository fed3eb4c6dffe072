package org.skyrota.planning.explain;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeSet;

import org.skyrota.planning.candidates.PreparedProblem;
import org.skyrota.planning.candidates.VisitStats;
import org.skyrota.planning.domain.Placement;
import org.skyrota.planning.domain.ProgramGrant;
import org.skyrota.planning.domain.Visit;
import org.skyrota.planning.model.PlanningProblem;
import org.skyrota.planning.model.Request;
import org.skyrota.planning.model.SolarSafety;

/**
 * Says in plain words why each unplaced visit is unplaced, from its windows (kept by candidate generation) and
 * from the placements that compete with its candidates in the final plan.
 */
public final class LeftOutExplainer {

    public Map<String, String> explain(PreparedProblem prepared) {
        List<Visit> visits = prepared.schedule().visits();
        Map<Integer, List<Visit>> byTelescope = new HashMap<>();
        Map<Integer, Long> grantMinutes = new HashMap<>();
        Map<String, List<Visit>> byRequest = new HashMap<>();
        for (Visit v : visits) {
            byRequest.computeIfAbsent(v.requestId(), k -> new ArrayList<>()).add(v);
            if (v.isPlaced()) {
                byTelescope.computeIfAbsent(v.telescopeIndex(), k -> new ArrayList<>()).add(v);
                grantMinutes.merge(v.grantIndex(), (long) v.placedMinutes(), Long::sum);
            }
        }
        byTelescope.values().forEach(l -> l.sort(Comparator.comparingInt(Visit::startMinute)));
        Map<Integer, ProgramGrant> grants = new HashMap<>();
        prepared.schedule().grants().forEach(g -> grants.put(g.index(), g));

        Map<String, String> reasons = new LinkedHashMap<>();
        for (Visit v : visits) {
            if (!v.isPlaced()) {
                String reason = reason(prepared, v, byTelescope, grantMinutes, grants, byRequest);
                if (prepared.requestByVisit().get(v.id()).target().solar()) {
                    reason += ". " + SolarSafety.CAUTION;
                }
                reasons.put(v.id(), reason);
            }
        }
        return reasons;
    }

    private String reason(PreparedProblem prepared, Visit v, Map<Integer, List<Visit>> byTelescope,
                          Map<Integer, Long> grantMinutes, Map<Integer, ProgramGrant> grants,
                          Map<String, List<Visit>> byRequest) {
        Request r = prepared.requestByVisit().get(v.id());
        VisitStats s = prepared.statsByVisit().get(v.id());
        String filters = String.join(", ", s.filters());
        String range = r.earliestNight() + " and " + r.latestNight();
        if (s.problem() != null) {
            return "its request cannot be planned: " + s.problem();
        }
        if (s.eligibleTelescopes() == 0) {
            return r.target().solar()
                    ? "no telescope has an instrument with a certified solar filter and the " + filters + " filter"
                    + " (solar visits go nowhere else: sunlight through optics blinds and burns)"
                    : "no telescope has an instrument with the " + filters + " filter" + plural(s.filters().size());
        }
        if (s.nightsConsidered() == 0) {
            PlanningProblem problem = prepared.problem();
            boolean overlapsHorizon = !r.latestNight().isBefore(problem.firstNight())
                    && !r.earliestNight().isAfter(problem.lastNight());
            return overlapsHorizon
                    ? String.format(Locale.ROOT, "the nights of its range inside the planning horizon leave no room for"
                    + " this many repeats %s apart", hours(r.minimumSpacing().toMinutes()))
                    : "its nights (" + range + ") fall outside the planning horizon";
        }
        if (s.windowNights() == 0) {
            if (s.longestWindowMinutes() > 0) {
                return String.format(Locale.ROOT, "observable at most %s in one stretch between %s, but the visit needs %s",
                        hours(s.longestWindowMinutes()), range, hours(s.neededMinutes()));
            }
            return "never " + r.limits().words() + " at any site with an instrument with the " + filters
                    + " filter" + plural(s.filters().size()) + " between " + range;
        }
        if (v.candidateCount() == 0) {
            if (s.closedWindowNights() >= s.windowNights()) {
                return "observable only on closed nights between " + range;
            }
            if (s.closedWindowNights() + s.ungrantedWindowNights() >= s.windowNights()) {
                return String.format(Locale.ROOT, "observable on %d night%s between %s, but no grant of program %s pays"
                        + " for a telescope that could take it on %s", s.windowNights(), s.windowNights() == 1 ? "" : "s",
                        range, programName(prepared, v), s.closedWindowNights() == 0 ? "those nights" : "the open ones");
            }
            String spacing = r.observedStarts().isEmpty() ? "its repeat spacing"
                    : "its repeat spacing from the repeats already observed or planned on other nights";
            String closed = s.closedWindowNights() == 0 ? ""
                    : String.format(Locale.ROOT, " (%d of them closed)", s.closedWindowNights());
            return String.format(Locale.ROOT, "observable on %d night%s%s between %s, but on the open ones only too close"
                    + " to the Sun or within %s", s.windowNights(), s.windowNights() == 1 ? "" : "s", closed, range,
                    spacing);
        }

        // It had places to go: what holds them?
        TreeSet<String> higher = new TreeSet<>();
        TreeSet<String> other = new TreeSet<>();
        int free = 0;
        for (Placement p : v.getCandidates()) {
            List<Visit> blockers = overlapping(byTelescope.get(p.telescopeIndex()), p.startMinute(),
                    p.startMinute() + v.lengthOn(p.telescopeIndex()));
            if (blockers.isEmpty()) {
                free++;
            }
            for (Visit b : blockers) {
                if (b.priority() > v.priority() || b.isPinned()) {
                    higher.add(b.id());
                } else {
                    other.add(b.id());
                }
            }
        }
        String observable = String.format(Locale.ROOT, "observable %s on %d night%s", hours(s.observableMinutes()),
                s.windowNights(), s.windowNights() == 1 ? "" : "s");
        // Every grant that pays for one of its candidates is full: the program's time there is spent.
        TreeSet<String> full = new TreeSet<>();
        boolean roomInAGrant = false;
        for (Placement p : v.getCandidates()) {
            int g = v.grantOf(p);
            ProgramGrant grant = grants.get(g);
            if (grant == null) {
                roomInAGrant = true;
                break;
            }
            long used = grantMinutes.getOrDefault(g, 0L);
            if (used + v.lengthOn(p.telescopeIndex()) > grant.grantMinutes()) {
                full.add(grant.label() + " (" + hours(used) + " of " + hours(grant.grantMinutes()) + " used)");
            } else {
                roomInAGrant = true;
                break;
            }
        }
        if (!roomInAGrant && !full.isEmpty()) {
            return observable + ", but program " + programName(prepared, v) + " has no grant time left there: "
                    + String.join("; ", full);
        }
        if (free > 0) {
            for (Visit sibling : byRequest.get(v.requestId())) {
                if (sibling != v && sibling.isPlaced()) {
                    return observable + ", but the free slots are closer to another visit of the same request than"
                            + " its repeat interval allows";
                }
            }
            return observable + " with free slots left, but placing it would lower the plan's score"
                    + " (the solver may also have run out of time)";
        }
        if (!higher.isEmpty() && other.isEmpty()) {
            return observable + ", but those slots went to higher-priority or pinned visits (" + sample(higher) + ")";
        }
        if (!higher.isEmpty()) {
            return observable + ", but those slots went to higher-priority visits (" + sample(higher)
                    + ") and to visits of equal or lower priority that fit better (" + sample(other) + ")";
        }
        return observable + ", but those slots went to visits of equal or lower priority that use the time better ("
                + sample(other) + ")";
    }

    private static String programName(PreparedProblem prepared, Visit v) {
        return prepared.problem().programs().stream().filter(p -> p.id().equals(v.programId()))
                .map(org.skyrota.planning.model.Program::name).findFirst().orElse(v.programId());
    }

    private static List<Visit> overlapping(List<Visit> sorted, int start, int end) {
        List<Visit> result = new ArrayList<>();
        if (sorted == null) {
            return result;
        }
        int lo = 0;
        int hi = sorted.size();
        while (lo < hi) {
            // Visits are at most a night long, so begin the scan a day before the candidate.
            int mid = (lo + hi) >>> 1;
            if (sorted.get(mid).startMinute() < start - 24 * 60) {
                lo = mid + 1;
            } else {
                hi = mid;
            }
        }
        for (int i = lo; i < sorted.size() && sorted.get(i).startMinute() < end; i++) {
            Visit b = sorted.get(i);
            if (b.endMinute() > start) {
                result.add(b);
            }
        }
        return result;
    }

    private static String sample(TreeSet<String> ids) {
        List<String> list = new ArrayList<>(ids);
        return list.size() <= 3 ? String.join(", ", list)
                : String.join(", ", list.subList(0, 3)) + " and " + (list.size() - 3) + " more";
    }

    private static String hours(long minutes) {
        return String.format(Locale.ROOT, "%.1f h", minutes / 60.0);
    }

    private static String plural(int n) {
        return n == 1 ? "" : "s";
    }
}
