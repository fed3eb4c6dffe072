package org.skyrota.planning.model;

import java.time.Instant;
import java.time.LocalDate;
import java.util.List;

/**
 * Everything the planner needs for one run.
 *
 * @param sites, telescopes, instruments, programs, requests  the network and its queue
 * @param closures            closed nights
 * @param pins                a coordinator's fixed placements: these visits never move (even when they break a rule;
 *                            the broken rule is then reported)
 * @param published           the plan last published, for stability; may be empty
 * @param firstNight          first night of the horizon
 * @param lastNight           last night of the horizon (inclusive)
 * @param gridMinutes         time grid for visit lengths and starts (default 5)
 * @param candidateStepMinutes spacing of candidate starts, a multiple of gridMinutes (coarser keeps big horizons small)
 * @param notBefore           no visit starts before this instant (now plus a lead time); null for no limit
 * @param grants              what each program may spend, by telescope, site and nights; when empty, each program's
 *                            {@link Program#grantedHours()} is one grant for the whole network and horizon
 * @param occupied            telescope time taken by what the run does not plan (visits under way)
 */
public record PlanningProblem(List<Site> sites, List<Telescope> telescopes, List<Instrument> instruments,
                              List<Program> programs, List<Request> requests, List<Closure> closures,
                              List<Assignment> pins, List<Assignment> published,
                              LocalDate firstNight, LocalDate lastNight, int gridMinutes, int candidateStepMinutes,
                              Instant notBefore, List<Grant> grants, List<Occupied> occupied) {
    public static final int DEFAULT_GRID_MINUTES = 5;

    /** A problem without a "now", with each program's grantedHours as its one grant, and no occupied time. */
    public PlanningProblem(List<Site> sites, List<Telescope> telescopes, List<Instrument> instruments,
                           List<Program> programs, List<Request> requests, List<Closure> closures,
                           List<Assignment> pins, List<Assignment> published,
                           LocalDate firstNight, LocalDate lastNight, int gridMinutes, int candidateStepMinutes) {
        this(sites, telescopes, instruments, programs, requests, closures, pins, published, firstNight, lastNight,
                gridMinutes, candidateStepMinutes, null, List.of(), List.of());
    }

    public PlanningProblem {
        grants = List.copyOf(grants == null ? List.of() : grants);
        occupied = List.copyOf(occupied == null ? List.of() : occupied);
        sites = List.copyOf(sites);
        telescopes = List.copyOf(telescopes);
        instruments = List.copyOf(instruments);
        programs = List.copyOf(programs);
        requests = List.copyOf(requests);
        closures = List.copyOf(closures == null ? List.of() : closures);
        pins = List.copyOf(pins == null ? List.of() : pins);
        published = List.copyOf(published == null ? List.of() : published);
        Checks.notNull("firstNight", firstNight);
        Checks.notNull("lastNight", lastNight);
        if (lastNight.isBefore(firstNight)) {
            throw new IllegalArgumentException("lastNight " + lastNight + " is before firstNight " + firstNight);
        }
        if (gridMinutes < 1 || gridMinutes > 60) {
            throw new IllegalArgumentException("gridMinutes must be 1..60, got " + gridMinutes);
        }
        if (candidateStepMinutes < gridMinutes || candidateStepMinutes % gridMinutes != 0) {
            throw new IllegalArgumentException("candidateStepMinutes must be a multiple of gridMinutes "
                    + gridMinutes + ", got " + candidateStepMinutes);
        }
    }

    public PlanningProblem withClosures(List<Closure> newClosures) {
        return new PlanningProblem(sites, telescopes, instruments, programs, requests, newClosures, pins, published,
                firstNight, lastNight, gridMinutes, candidateStepMinutes, notBefore, grants, occupied);
    }

    public PlanningProblem withPins(List<Assignment> newPins) {
        return new PlanningProblem(sites, telescopes, instruments, programs, requests, closures, newPins, published,
                firstNight, lastNight, gridMinutes, candidateStepMinutes, notBefore, grants, occupied);
    }

    public PlanningProblem withPublished(List<Assignment> newPublished) {
        return new PlanningProblem(sites, telescopes, instruments, programs, requests, closures, pins, newPublished,
                firstNight, lastNight, gridMinutes, candidateStepMinutes, notBefore, grants, occupied);
    }

    /** This problem where no visit starts before {@code instant}, with these grants and this occupied time. */
    public PlanningProblem withTerm(Instant instant, List<Grant> newGrants, List<Occupied> newOccupied) {
        return new PlanningProblem(sites, telescopes, instruments, programs, requests, closures, pins, published,
                firstNight, lastNight, gridMinutes, candidateStepMinutes, instant, newGrants, newOccupied);
    }

    /** The grants in force: {@link #grants()}, or each program's grantedHours as one grant when none are given. */
    public List<Grant> grantsInForce() {
        if (!grants.isEmpty()) {
            return grants;
        }
        return programs.stream().map(p -> Grant.anywhere(p.id(), p.grantedHours())).toList();
    }
}
