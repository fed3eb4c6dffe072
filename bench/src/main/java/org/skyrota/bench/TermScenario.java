package org.skyrota.bench;

import java.time.Duration;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import java.util.Set;

import org.skyrota.planning.model.DarknessLimit;
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

/**
 * The invented term: three sites on three continents and both hemispheres (one at 63° N, where late-April to
 * May nights lose astronomical darkness), six telescopes, thirty nights, about 2,500 visits with repeats, Moon
 * limits and four programs. Targets are real objects by catalogue number with approximate demo coordinates
 * (J2000, from memory, rounded); sites, people and programs are made up.
 */
final class TermScenario {
    static final LocalDate FIRST_NIGHT = LocalDate.of(2027, 4, 20);
    static final int NIGHTS = 30;

    /** Catalogue number, RA deg, Dec deg: approximate demo values from memory. */
    private static final Object[][] TARGETS = {
            {"M 3", 205.5, 28.4}, {"M 5", 229.6, 2.1}, {"M 13", 250.4, 36.5}, {"M 92", 259.3, 43.1},
            {"M 10", 254.3, -4.1}, {"M 12", 251.8, -1.9}, {"M 4", 245.9, -26.5}, {"M 80", 244.3, -23.0},
            {"M 62", 255.3, -30.1}, {"M 6", 265.1, -32.2}, {"M 7", 268.5, -34.8}, {"M 8", 270.9, -24.4},
            {"M 20", 270.6, -23.0}, {"M 16", 274.7, -13.8}, {"M 11", 282.8, -6.3}, {"M 57", 283.4, 33.0},
            {"M 22", 279.1, -23.9}, {"M 27", 300.0, 22.7}, {"M 51", 202.5, 47.2}, {"M 101", 210.8, 54.3},
            {"M 81", 148.9, 69.1}, {"M 97", 168.7, 55.0}, {"M 106", 184.7, 47.3}, {"M 63", 199.0, 42.0},
            {"M 94", 192.7, 41.1}, {"M 53", 198.2, 18.2}, {"M 64", 194.2, 21.7}, {"M 87", 187.7, 12.4},
            {"M 65", 169.7, 13.1}, {"M 66", 170.1, 13.0}, {"M 44", 130.1, 19.7}, {"M 67", 132.8, 11.8},
            {"M 104", 190.0, -11.6}, {"M 68", 189.9, -26.7}, {"M 83", 204.3, -29.9}, {"NGC 5128", 201.4, -43.0},
            {"NGC 5139", 201.7, -47.5}, {"NGC 3372", 161.3, -59.9}, {"NGC 4755", 193.4, -60.4},
            {"NGC 3532", 166.4, -58.7}, {"NGC 6744", 287.4, -63.9}, {"NGC 6543", 269.6, 66.6},
            {"NGC 6397", 265.2, -53.7}, {"NGC 6752", 287.7, -60.0}, {"NGC 2070", 84.7, -69.1},
            {"NGC 104", 6.0, -72.1}, {"NGC 7000", 314.7, 44.3}, {"M 15", 322.5, 12.2}, {"M 2", 323.4, -0.8},
            {"NGC 3242", 156.2, -18.6}, {"NGC 4565", 189.1, 26.0}, {"NGC 4631", 190.5, 32.5},
            {"NGC 2392", 112.3, 20.9}, {"M 35", 92.3, 24.3}, {"NGC 6826", 296.2, 50.5}, {"NGC 6960", 311.4, 30.7},
    };

    private TermScenario() {
    }

    static PlanningProblem build(long seed) {
        Random random = new Random(seed);
        List<Site> sites = List.of(
                Site.of("nordvik", "Nordvik Fjord Observatory (invented)", 63.4, 10.4, 120, "Europe/Oslo", 21.4),
                Site.of("karoo", "Karoo Plateau Station (invented)", -32.4, 20.8, 1750, "Africa/Johannesburg", 21.9),
                Site.of("mesa", "Red Mesa College Observatory (invented)", 31.9, -111.6, 2000, "America/Phoenix", 21.7));
        List<Telescope> telescopes = List.of(
                new Telescope("nordvik-35", "nordvik", 0.35, MountKind.EQUATORIAL, 5, 10, 10, 90),
                new Telescope("nordvik-50", "nordvik", 0.50, MountKind.ALT_AZIMUTH, 3, 15, 15, 88),
                new Telescope("karoo-40", "karoo", 0.40, MountKind.EQUATORIAL, 4, 10, 10, 90),
                new Telescope("karoo-100", "karoo", 1.00, MountKind.ALT_AZIMUTH, 2, 20, 20, 87),
                new Telescope("mesa-30", "mesa", 0.30, MountKind.EQUATORIAL, 6, 8, 10, 90),
                new Telescope("mesa-60", "mesa", 0.60, MountKind.EQUATORIAL, 3, 12, 15, 90));
        List<Instrument> instruments = List.of(
                new Instrument("nordvik-35-cam", "nordvik-35", Set.of("B", "V", "R", "I"), 6, 8, false),
                new Instrument("nordvik-50-cam", "nordvik-50", Set.of("g", "r", "i", "Halpha", "OIII"), 10, 12, false),
                new Instrument("karoo-40-cam", "karoo-40", Set.of("B", "V", "R", "I", "Halpha"), 8, 10, false),
                new Instrument("karoo-100-cam", "karoo-100", Set.of("g", "r", "i", "z", "V", "R"), 15, 20, false),
                new Instrument("mesa-30-solar", "mesa-30", Set.of("Halpha", "V"), 2, 5, true),
                new Instrument("mesa-60-cam", "mesa-60", Set.of("B", "V", "R", "I", "OIII", "Halpha"), 10, 10, false));
        List<Program> programs = List.of(
                new Program("astro101", "Introductory astronomy labs (invented)", 320, 1),
                new Program("spectro-lab", "Upper-level photometry lab (invented)", 260, 1),
                new Program("variables", "Variable-star club (invented)", 360, 1),
                new Program("outreach", "Public outreach nights (invented)", 160, 1));
        String[][] filterSets = {{"V"}, {"R"}, {"B", "V"}, {"V", "R"}, {"r"}, {"g", "r"}, {"Halpha"}, {"OIII", "Halpha"},
                {"B", "V", "R"}, {"i"}};
        double[] minAltitudes = {25, 30, 30, 30, 40};
        DarknessLimit[] darkness = {DarknessLimit.ASTRONOMICAL, DarknessLimit.ASTRONOMICAL, DarknessLimit.NAUTICAL,
                DarknessLimit.NAUTICAL, DarknessLimit.CIVIL};
        List<Request> requests = new ArrayList<>();
        int visits = 0;
        int n = 0;
        LocalDate last = FIRST_NIGHT.plusDays(NIGHTS - 1);
        // A few solar visits for the certified solar instrument (caution: certified full-aperture solar filter only).
        for (int i = 0; i < 10; i++) {
            LocalDate earliest = FIRST_NIGHT.plusDays(random.nextInt(20));
            requests.add(new Request("sun" + i, "outreach", "student-" + random.nextInt(200), Target.sun(),
                    List.of(new ExposureStep("Halpha", 5, 20)),
                    new ObservingLimits(25, Double.POSITIVE_INFINITY, DarknessLimit.ANY, 0, 1, 0),
                    earliest, earliest.plusDays(7), 2, Duration.ofDays(1), Duration.ofHours(6), 2 + random.nextInt(3)));
            visits += 2;
            n++;
        }
        String[] programIds = {"astro101", "spectro-lab", "variables", "outreach"};
        while (visits < 2500) {
            Object[] t = TARGETS[random.nextInt(TARGETS.length)];
            Target target = Target.fixed((String) t[0], (Double) t[1], (Double) t[2]);
            String[] filters = filterSets[random.nextInt(filterSets.length)];
            List<ExposureStep> plan = new ArrayList<>();
            for (String f : filters) {
                plan.add(new ExposureStep(f, 60 + 30 * random.nextInt(11), 2 + random.nextInt(8)));
            }
            ObservingLimits limits = new ObservingLimits(minAltitudes[random.nextInt(minAltitudes.length)],
                    Double.POSITIVE_INFINITY, darkness[random.nextInt(darkness.length)], 0, 1,
                    ObservingLimits.DEFAULT_MIN_SUN_SEPARATION_DEG);
            if (random.nextInt(10) < 3) {
                limits = limits.withMoon(30, 0.6);
            }
            int repeats = random.nextInt(100) < 35 ? 2 + random.nextInt(3) : 1;
            repeats = Math.min(repeats, 2500 - visits);
            int intervalDays = 1 + random.nextInt(3);
            LocalDate earliest = FIRST_NIGHT.plusDays(random.nextInt(NIGHTS - 2));
            int span = Math.max((repeats - 1) * intervalDays + 1, 2 + random.nextInt(13));
            LocalDate latest = earliest.plusDays(span);
            if (latest.isAfter(last)) {
                latest = last;
            }
            requests.add(new Request("q" + n, programIds[random.nextInt(programIds.length)],
                    "student-" + random.nextInt(200), target, plan, limits, earliest, latest, repeats,
                    Duration.ofDays(repeats > 1 ? intervalDays : 0), Duration.ofHours(repeats > 1 ? 6 : 0),
                    1 + random.nextInt(5)));
            visits += repeats;
            n++;
        }
        return new PlanningProblem(sites, telescopes, instruments, programs, requests, List.of(), List.of(), List.of(),
                FIRST_NIGHT, last, 5, 10);
    }
}
