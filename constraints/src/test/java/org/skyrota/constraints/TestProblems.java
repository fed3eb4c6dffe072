package org.skyrota.constraints;

import java.time.Duration;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import java.util.Set;

import org.skyrota.planning.model.ExposureStep;
import org.skyrota.planning.model.Instrument;
import org.skyrota.planning.model.MountKind;
import org.skyrota.planning.model.ObservingLimits;
import org.skyrota.planning.model.PlanningProblem;
import org.skyrota.planning.model.Program;
import org.skyrota.planning.model.Request;
import org.skyrota.planning.model.Site;
import org.skyrota.planning.model.Target;
import org.skyrota.planning.model.Telescope;
import org.skyrota.planning.sky.SyntheticSky;

/**
 * Small invented problems on the synthetic sky (every night dark 20:00 to 05:00 local, targets up ±3 h around
 * culmination; in March 2027 a right ascension of 240–300° culminates around local midnight there).
 */
final class TestProblems {
    static final LocalDate FIRST = LocalDate.of(2027, 3, 8);
    static final SyntheticSky SKY = new SyntheticSky(Duration.ofHours(3));
    static final Site SITE = Site.of("hill", "Hill Station (invented)", 40.0, -105.0, 1600, "America/Denver", 21.5);
    static final List<Telescope> TELESCOPES = List.of(
            new Telescope("hill-a", "hill", 0.4, MountKind.EQUATORIAL, 5, 0, 10, 90),
            new Telescope("hill-b", "hill", 0.5, MountKind.EQUATORIAL, 5, 0, 10, 90));
    static final List<Instrument> INSTRUMENTS = List.of(
            new Instrument("hill-a-cam", "hill-a", Set.of("V", "R"), 0, 0, false),
            new Instrument("hill-b-cam", "hill-b", Set.of("V", "R"), 0, 0, false));

    private TestProblems() {
    }

    static Request request(String id, String program, double raDeg, int minutes, int priority, LocalDate from,
                           LocalDate to) {
        // 60/5 = 12 s of slew on these telescopes rounds each visit up by one 5-minute grid step.
        return new Request(id, program, "member", Target.fixed("invented field " + id, raDeg, 20),
                List.of(new ExposureStep("R", 60, minutes)), ObservingLimits.dark(30), from, to, 1, null, null, priority);
    }

    /** Seeded: {@code visits} single-visit requests on {@code telescopes} telescopes over {@code nights} nights. */
    static PlanningProblem random(long seed, int telescopes, int nights, int visits) {
        Random random = new Random(seed);
        List<Request> requests = new ArrayList<>();
        for (int i = 0; i < visits; i++) {
            LocalDate from = FIRST.plusDays(random.nextInt(nights));
            requests.add(request("q" + i, random.nextBoolean() ? "lab" : "club", 240 + random.nextDouble() * 60,
                    15 + 5 * random.nextInt(16), 1 + random.nextInt(5), from, FIRST.plusDays(nights - 1)));
        }
        return problem(TELESCOPES.subList(0, telescopes), requests, nights, 200);
    }

    static PlanningProblem problem(List<Telescope> telescopes, List<Request> requests, int nights, double grantHours) {
        return new PlanningProblem(List.of(SITE), telescopes, INSTRUMENTS.stream()
                .filter(i -> telescopes.stream().anyMatch(t -> t.id().equals(i.telescopeId()))).toList(),
                List.of(new Program("lab", "Lab section (invented)", grantHours, 1),
                        new Program("club", "Club project (invented)", grantHours, 1)),
                requests, List.of(), List.of(), List.of(), FIRST, FIRST.plusDays(nights - 1), 5, 5);
    }
}
