package org.skyrota.web.demo;

import java.time.Clock;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;

import org.skyrota.web.account.Account;
import org.skyrota.web.account.AccountRepository;
import org.skyrota.web.account.Role;
import org.skyrota.web.equipment.Instrument;
import org.skyrota.web.equipment.InstrumentRepository;
import org.skyrota.web.equipment.Telescope;
import org.skyrota.web.equipment.TelescopeRepository;
import org.skyrota.web.program.Grant;
import org.skyrota.web.program.Program;
import org.skyrota.web.program.ProgramRepository;
import org.skyrota.web.request.DarknessLimit;
import org.skyrota.web.request.Exposure;
import org.skyrota.web.request.ObservingRequest;
import org.skyrota.web.request.ObservingRequestRepository;
import org.skyrota.web.request.RequestState;
import org.skyrota.web.site.HorizonPoint;
import org.skyrota.web.site.Site;
import org.skyrota.web.site.SiteRepository;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.beans.factory.annotation.Value;
import org.springframework.boot.ApplicationArguments;
import org.springframework.boot.ApplicationRunner;
import org.springframework.core.annotation.Order;
import org.springframework.security.crypto.password.PasswordEncoder;
import org.springframework.stereotype.Component;
import org.springframework.transaction.annotation.Transactional;

/**
 * With {@code --demo}, fills an empty database with an invented consortium: three sites on
 * three continents in both hemispheres (one at high northern latitude), five telescopes, four
 * programs and the target-of-opportunity program that alerts go to (titled as the setting
 * {@code skyrota.voevent.program} names it), about 150 observing requests in every state, and the accounts admin, coordinator,
 * student and student2, all with the password {@code demo}. A database that holds anything is
 * left alone. Every name here is invented; the targets are real objects by catalogue number with
 * approximate demo coordinates.
 */
@Component
@Order(10)
public class DemoData implements ApplicationRunner {

    public static final String PASSWORD = "demo";
    /** The code of the demo's target-of-opportunity program; its title is what the alert setting names. */
    public static final String TOO_CODE = "TOO-DEMO";
    /** The default of the setting {@code skyrota.voevent.program} (the VOEvent plugin's default program). */
    static final String DEFAULT_ALERT_PROGRAM = "Target of opportunity";
    static final int REQUEST_COUNT = 150;

    private static final Logger log = LoggerFactory.getLogger(DemoData.class);

    /** Catalogue number, RA and Dec in degrees (J2000, approximate demo values). */
    private record DemoTarget(String name, double raDeg, double decDeg) {}

    private static final List<DemoTarget> TARGETS = List.of(
            new DemoTarget("M 1", 83.63, 22.01), new DemoTarget("M 3", 205.55, 28.38),
            new DemoTarget("M 8", 270.90, -24.38), new DemoTarget("M 11", 282.77, -6.27),
            new DemoTarget("M 13", 250.42, 36.46), new DemoTarget("M 16", 274.70, -13.81),
            new DemoTarget("M 17", 275.20, -16.18), new DemoTarget("M 22", 279.10, -23.90),
            new DemoTarget("M 27", 299.90, 22.72), new DemoTarget("M 31", 10.68, 41.27),
            new DemoTarget("M 33", 23.46, 30.66), new DemoTarget("M 42", 83.82, -5.39),
            new DemoTarget("M 44", 130.10, 19.67), new DemoTarget("M 45", 56.75, 24.12),
            new DemoTarget("M 51", 202.47, 47.20), new DemoTarget("M 57", 283.40, 33.03),
            new DemoTarget("M 81", 148.89, 69.07), new DemoTarget("M 82", 148.97, 69.68),
            new DemoTarget("M 101", 210.80, 54.35), new DemoTarget("M 104", 190.00, -11.62),
            new DemoTarget("NGC 104", 6.02, -72.08), new DemoTarget("NGC 253", 11.89, -25.29),
            new DemoTarget("NGC 869", 34.75, 57.13), new DemoTarget("NGC 2070", 84.68, -69.10),
            new DemoTarget("NGC 3372", 161.26, -59.87), new DemoTarget("NGC 4755", 193.40, -60.36),
            new DemoTarget("NGC 5139", 201.70, -47.48), new DemoTarget("NGC 6543", 269.64, 66.63),
            new DemoTarget("NGC 7000", 314.70, 44.30), new DemoTarget("NGC 7293", 337.41, -20.84));

    private static final List<String> REJECTION_REASONS = List.of(
            "The target stays below 20° from every site during the requested nights.",
            "The exposure plan needs more hours than the program has left this semester.",
            "Please split this into shorter visits; a single visit cannot exceed three hours.",
            "The requested filter is not fitted on any telescope that can see the target.");

    private final AccountRepository accounts;
    private final SiteRepository sites;
    private final TelescopeRepository telescopes;
    private final InstrumentRepository instruments;
    private final ProgramRepository programs;
    private final ObservingRequestRepository requests;
    private final PasswordEncoder encoder;
    private final Clock clock;
    private final String alertProgram;

    DemoData(AccountRepository accounts, SiteRepository sites, TelescopeRepository telescopes, InstrumentRepository instruments,
             ProgramRepository programs, ObservingRequestRepository requests, PasswordEncoder encoder,
             Clock clock, @Value("${skyrota.voevent.program:" + DEFAULT_ALERT_PROGRAM + "}") String alertProgram) {
        this.clock = clock;
        this.alertProgram = alertProgram;
        this.accounts = accounts;
        this.sites = sites;
        this.telescopes = telescopes;
        this.instruments = instruments;
        this.programs = programs;
        this.requests = requests;
        this.encoder = encoder;
    }

    @Override
    @Transactional
    public void run(ApplicationArguments args) {
        if (!args.containsOption("demo")) {
            return;
        }
        if (accounts.count() > 0 || sites.count() > 0 || programs.count() > 0 || requests.count() > 0) {
            log.warn("--demo: the database is not empty, so no demo data was loaded (use an empty --skyrota.data-dir)");
            return;
        }
        load(LocalDate.now(clock));
        log.warn("\n\n  DEMO MODE: invented consortium loaded; accounts admin, coordinator, student, student2, password '{}'.\n"
                + "  Do not use this database for real work.\n", PASSWORD);
    }

    void load(LocalDate today) {
        for (var account : List.of(new Account("admin", encoder.encode(PASSWORD), Role.ADMIN),
                new Account("coordinator", encoder.encode(PASSWORD), Role.COORDINATOR),
                new Account("student", encoder.encode(PASSWORD), Role.REQUESTER),
                new Account("student2", encoder.encode(PASSWORD), Role.REQUESTER))) {
            accounts.save(account);
        }

        Site north = site("Kestrel Fell Observatory", 68.35, 18.82, 420, "Europe/Stockholm", 21.7,
                List.of(new HorizonPoint(0, 4), new HorizonPoint(120, 9), new HorizonPoint(240, 6)));
        Site south = site("Sandveld Plateau Station", -32.38, 20.81, 1760, "Africa/Johannesburg", 21.9,
                List.of(new HorizonPoint(90, 3), new HorizonPoint(270, 12)));
        Site desert = site("Juniper Mesa Teaching Site", 32.90, -105.53, 2225, "America/Denver", 21.6, List.of());

        List<Telescope> scopes = List.of(
                telescope(north, "KF-35", 350, 15, 5, 8, List.of("B", "V", "R", "I")),
                telescope(south, "SP-60", 600, 20, 3, 12, List.of("U", "B", "V", "R", "I", "Ha")),
                telescope(south, "SP-40", 400, 15, 4, 10, List.of("B", "V", "R", "Ha", "OIII")),
                telescope(desert, "JM-50", 500, 18, 4, 10, List.of("B", "V", "R", "I", "Ha")),
                telescope(desert, "JM-28", 280, 10, 6, 5, List.of("L", "R", "G", "B")));

        LocalDate semesterStart = today.minusDays(30);
        LocalDate semesterEnd = today.plusDays(150);
        List<Program> progs = List.of(
                program("VAR-DEMO", "Light curves of variable stars for the first-year laboratory", "coordinator",
                        scopes.get(0), 60, scopes.get(2), 80, semesterStart, semesterEnd),
                program("CLU-DEMO", "Colour-magnitude diagrams of star clusters", "coordinator",
                        scopes.get(1), 120, scopes.get(3), 90, semesterStart, semesterEnd),
                program("GAL-DEMO", "Deep images of nearby galaxies for the club's outreach evenings", "coordinator",
                        scopes.get(3), 50, scopes.get(4), 70, semesterStart, semesterEnd),
                program("NEB-DEMO", "Narrow-band images of emission nebulae", "coordinator",
                        scopes.get(1), 40, scopes.get(2), 60, semesterStart, semesterEnd));
        targetOfOpportunity(scopes, semesterStart, semesterEnd);

        Random random = new Random(2027);
        String[] owners = {"student", "student2", "coordinator"};
        for (int i = 0; i < REQUEST_COUNT; i++) {
            DemoTarget t = TARGETS.get(i % TARGETS.size());
            ObservingRequest r = new ObservingRequest(progs.get(i % progs.size()), owners[i % 7 < 3 ? 0 : i % 7 < 6 ? 1 : 2]);
            r.setTarget(t.name(), t.raDeg(), t.decDeg());
            DarknessLimit darkness = i % 5 == 0 ? DarknessLimit.NAUTICAL : DarknessLimit.ASTRONOMICAL;
            r.setConditions(20 + random.nextInt(4) * 5, darkness,
                    i % 3 == 0 ? 30.0 : null, i % 4 == 0 ? 0.5 : null);
            LocalDate earliest = today.plusDays(random.nextInt(60) - 20);
            int repeats = 1 + random.nextInt(3);
            // Priority 1 is the lowest; drawn as before and flipped, so each demo request keeps its importance.
            r.setSchedule(earliest, earliest.plusDays(14 + random.nextInt(60)), repeats, 6 - (1 + random.nextInt(5)));
            if (repeats > 1) {
                // Nightly, two-nightly or every three nights, each a few hours either way (taken from i, so the
                // random draws above stay as they were).
                r.setRepeatSpacing(24.0 * (1 + i % 3), 4.0);
            }
            r.setExposures(exposures(random, i));
            advance(r, i, random);
            requests.save(r);
        }
    }

    /** Spreads the requests over the states: about 20% draft, 33% submitted, 30% accepted, 10% rejected, 7% withdrawn. */
    private static void advance(ObservingRequest r, int i, Random random) {
        int bucket = i % 30;
        if (bucket < 6) {
            return;
        }
        r.moveTo(RequestState.SUBMITTED, null);
        if (bucket < 16) {
            return;
        }
        if (bucket < 25) {
            r.moveTo(RequestState.ACCEPTED, null);
        } else if (bucket < 28) {
            r.moveTo(RequestState.REJECTED, REJECTION_REASONS.get(random.nextInt(REJECTION_REASONS.size())));
        } else {
            r.moveTo(RequestState.WITHDRAWN, null);
        }
    }

    private static List<Exposure> exposures(Random random, int i) {
        List<Exposure> plan = new ArrayList<>();
        String[][] sets = {{"V"}, {"B", "V"}, {"B", "V", "R"}, {"Ha"}, {"R", "Ha"}};
        for (String filter : sets[i % sets.length]) {
            plan.add(new Exposure(filter, 30 + 30 * random.nextInt(10), 3 + random.nextInt(10)));
        }
        return plan;
    }

    private Site site(String name, double lat, double lon, double elevation, String zone, double sky, List<HorizonPoint> horizon) {
        Site s = new Site(name, lat, lon, elevation);
        s.setTimeZone(zone);
        s.setDarkSkyZenithVMag(sky);
        s.setHorizon(horizon);
        return sites.save(s);
    }

    private Telescope telescope(Site site, String name, double apertureMm, double minAltitudeDeg, double slewDegPerS,
                                double settleSeconds, List<String> filters) {
        Telescope t = new Telescope(site, name);
        t.setOptics(apertureMm, minAltitudeDeg, slewDegPerS, settleSeconds);
        t = telescopes.save(t);
        Instrument camera = new Instrument(t, name + " camera");
        camera.setOverheads(6, 4);
        camera.setFilters(filters);
        instruments.save(camera);
        return t;
    }

    /**
     * The program alerts go to: a few hours on a telescope at each site over the whole term, so that an alert
     * anywhere in the sky finds time. Its title is what the setting {@code skyrota.voevent.program} names (by default
     * "Target of opportunity"), so that alerts reach it as the demo stands; a setting that fits no title keeps the
     * default title, and then names no program (alerts answer 409 saying so).
     */
    private void targetOfOpportunity(List<Telescope> scopes, LocalDate from, LocalDate to) {
        String title = alertProgram == null ? "" : alertProgram.strip();
        if (title.isEmpty() || title.length() > 200 || title.equalsIgnoreCase(TOO_CODE)) {
            title = DEFAULT_ALERT_PROGRAM;
        }
        Program p = new Program(TOO_CODE, title, "coordinator");
        p.setGrants(List.of(new Grant(scopes.get(0).getId(), 6, from, to), new Grant(scopes.get(1).getId(), 8, from, to),
                new Grant(scopes.get(3).getId(), 8, from, to)));
        programs.save(p);
    }

    private Program program(String code, String title, String lead, Telescope first, double firstHours, Telescope second,
                            double secondHours, LocalDate from, LocalDate to) {
        Program p = new Program(code, title, lead);
        p.setGrants(List.of(new Grant(first.getId(), firstHours, from, to), new Grant(second.getId(), secondHours, from, to)));
        return programs.save(p);
    }
}
