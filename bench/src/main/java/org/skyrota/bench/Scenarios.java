package org.skyrota.bench;

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

/** Invented, seeded benchmark scenarios. Sites, people and programs are made up. */
final class Scenarios {
    static final LocalDate SMALL_FIRST_NIGHT = LocalDate.of(2027, 3, 8);

    private Scenarios() {
    }

    /** Two telescopes at one invented site, three nights, 60 visits (some requests repeat), seeded. */
    static PlanningProblem small(long seed) {
        Random random = new Random(seed);
        Site site = Site.of("ridge", "Ridge Field Station (invented)", 34.0, -107.0, 2100, "America/Denver", 21.5);
        List<Telescope> telescopes = List.of(
                new Telescope("ridge-40", "ridge", 0.40, MountKind.EQUATORIAL, 4.0, 10, 15, 90),
                new Telescope("ridge-60", "ridge", 0.60, MountKind.ALT_AZIMUTH, 2.0, 15, 20, 88));
        List<Instrument> instruments = List.of(
                new Instrument("ridge-40-cam", "ridge-40", Set.of("B", "V", "R", "I"), 8, 10, false),
                new Instrument("ridge-60-cam", "ridge-60", Set.of("V", "R", "Halpha"), 12, 15, false));
        List<Program> programs = List.of(
                new Program("astro101", "Introductory astronomy lab (invented)", 30, 1),
                new Program("club", "Variable-star club (invented)", 30, 1));
        String[] filters = {"V", "R", "B", "Halpha"};
        List<Request> requests = new ArrayList<>();
        int visits = 0;
        int n = 0;
        while (visits < 60) {
            int repeats = random.nextInt(5) == 0 ? 2 : 1;
            repeats = Math.min(repeats, 60 - visits);
            String filter = filters[random.nextInt(filters.length)];
            int count = 4 + random.nextInt(12);
            double seconds = 60 * (1 + random.nextInt(10));
            // Right ascensions of 180-360° are up in the dark on these March nights of the synthetic sky: all compete.
            Target target = Target.fixed("invented field " + n, 180 + random.nextDouble() * 180, -10 + random.nextDouble() * 70);
            LocalDate earliest = SMALL_FIRST_NIGHT.plusDays(repeats == 2 ? 0 : random.nextInt(2));
            LocalDate latest = repeats == 2 ? SMALL_FIRST_NIGHT.plusDays(2) : earliest.plusDays(random.nextInt(3 - (int) (earliest.toEpochDay() - SMALL_FIRST_NIGHT.toEpochDay())));
            requests.add(new Request("q" + n, random.nextBoolean() ? "astro101" : "club", "member" + random.nextInt(20),
                    target, List.of(new ExposureStep(filter, seconds, count)), ObservingLimits.dark(30),
                    earliest, latest, repeats, Duration.ofHours(repeats == 2 ? 24 : 0), Duration.ofHours(repeats == 2 ? 2 : 0),
                    1 + random.nextInt(5)));
            visits += repeats;
            n++;
        }
        return new PlanningProblem(List.of(site), telescopes, instruments, programs, requests, List.of(), List.of(),
                List.of(), SMALL_FIRST_NIGHT, SMALL_FIRST_NIGHT.plusDays(2), 5, 5);
    }
}
