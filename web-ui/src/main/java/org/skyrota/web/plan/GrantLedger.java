package org.skyrota.web.plan;

import java.time.LocalDate;
import java.time.ZoneId;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;

import org.skyrota.planning.model.Grant;
import org.skyrota.web.equipment.Telescope;
import org.skyrota.web.program.Program;
import org.skyrota.web.report.ObservationReport;
import org.skyrota.web.site.Site;

/**
 * The grants as a ledger: what each stored grant holds, and what is drawn on it, as the planner draws on it (the most
 * specific grant of the program that covers a visit's telescope and night pays: {@link Grant#payer}). Granted less
 * observed, published (ahead, or awaiting its report) and the draft's change is what remains; a run sees the grant
 * less what lies outside it (observed, awaiting a report, and the draft's visits it does not re-plan).
 *
 * <p>A plain value built for one moment from stored rows; it reads nothing itself.
 */
public final class GrantLedger {

    /** What a visit's time is, for the ledger. */
    public enum Kind { OBSERVED, AWAITING, PUBLISHED, DRAFT }

    /** Time drawn by one visit. */
    public record Use(long programId, long telescopeId, LocalDate night, double hours, Kind kind) {}

    /** One grant's account, hours. {@code draft} is the draft's change to the published plan (may be negative). */
    public record Account(long programId, int grantNo, String label, Long telescopeId, Long siteId,
                          LocalDate firstNight, LocalDate lastNight, double granted, double observed, double published,
                          double draft, double remaining) {
        public boolean over() {
            return remaining < -0.005;
        }
    }

    private final Map<Long, Program> programs = new LinkedHashMap<>();
    private final Map<Long, Telescope> telescopes = new HashMap<>();
    private final List<Grant> grants = new ArrayList<>();
    private final Map<String, StoredGrant> stored = new HashMap<>();

    private record StoredGrant(long programId, int grantNo, org.skyrota.web.program.Grant grant) {}

    public GrantLedger(List<Program> programs, List<Telescope> telescopes) {
        telescopes.forEach(t -> this.telescopes.put(t.getId(), t));
        for (Program p : programs) {
            this.programs.put(p.getId(), p);
            List<org.skyrota.web.program.Grant> list = p.getGrants();
            for (int i = 0; i < list.size(); i++) {
                org.skyrota.web.program.Grant g = list.get(i);
                String id = p.getId() + "/" + (i + 1);
                grants.add(new Grant(id, String.valueOf(p.getId()), g.getTelescopeId() == null ? null
                        : String.valueOf(g.getTelescopeId()), g.getSiteId() == null ? null : String.valueOf(g.getSiteId()),
                        g.getFirstNight(), g.getLastNight(), g.getHours(), label(g)));
                stored.put(id, new StoredGrant(p.getId(), i + 1, g));
            }
        }
    }

    /** The grant a visit of {@code programId} on {@code telescopeId} in {@code night} pays from. */
    public Optional<Grant> payer(long programId, long telescopeId, LocalDate night) {
        Telescope t = telescopes.get(telescopeId);
        if (t == null) {
            return Optional.empty();
        }
        return Grant.payer(grants, String.valueOf(programId), PlanningMapper.telescope(t), night);
    }

    /**
     * The grants a run may still spend: each stored grant less what {@code outside} draws on it (observed, awaiting
     * a report, kept in place outside the run), never below zero; only grants whose nights overlap the run's.
     */
    public List<Grant> remainingFor(LocalDate first, LocalDate last, List<Use> outside) {
        Map<String, Double> drawn = drawn(outside);
        List<Grant> out = new ArrayList<>();
        for (Grant g : grants) {
            boolean overlaps = (g.firstNight() == null || !g.firstNight().isAfter(last))
                    && (g.lastNight() == null || !g.lastNight().isBefore(first));
            if (overlaps) {
                double left = Math.max(0, g.hours() - drawn.getOrDefault(g.id(), 0.0));
                out.add(new Grant(g.id(), g.programId(), g.telescopeId(), g.siteId(), g.firstNight(), g.lastNight(),
                        left, g.label() + ", " + hours(left) + " left"));
            }
        }
        return out;
    }

    /** The accounts of every grant of {@code programId} (all programs when null), and the time no grant pays for. */
    public List<Account> accounts(Long programId, List<Use> uses) {
        Map<String, double[]> byGrant = new HashMap<>();
        Map<Long, double[]> unpaid = new LinkedHashMap<>();
        for (Use u : uses) {
            Optional<Grant> g = payer(u.programId(), u.telescopeId(), u.night());
            double[] row = g.isPresent() ? byGrant.computeIfAbsent(g.get().id(), k -> new double[4])
                    : unpaid.computeIfAbsent(u.programId(), k -> new double[4]);
            row[u.kind().ordinal()] += u.hours();
        }
        List<Account> out = new ArrayList<>();
        for (Grant g : grants) {
            StoredGrant s = stored.get(g.id());
            if (programId != null && s.programId() != programId) {
                continue;
            }
            out.add(account(s.programId(), s.grantNo(), g.label(), s.grant().getTelescopeId(), s.grant().getSiteId(),
                    g.firstNight(), g.lastNight(), g.hours(), byGrant.getOrDefault(g.id(), new double[4])));
        }
        unpaid.forEach((program, row) -> {
            if (programId == null || program.equals(programId)) {
                out.add(account(program, 0, "time no grant of the program pays for", null, null, null, null, 0, row));
            }
        });
        return out;
    }

    private static Account account(long programId, int grantNo, String label, Long telescopeId, Long siteId,
                                   LocalDate first, LocalDate last, double granted, double[] row) {
        double observed = row[Kind.OBSERVED.ordinal()];
        double published = row[Kind.AWAITING.ordinal()] + row[Kind.PUBLISHED.ordinal()];
        double draft = row[Kind.DRAFT.ordinal()] - row[Kind.PUBLISHED.ordinal()];
        return new Account(programId, grantNo, label, telescopeId, siteId, first, last, round(granted), round(observed),
                round(published), round(draft), round(granted - observed - published - draft));
    }

    private Map<String, Double> drawn(List<Use> uses) {
        Map<String, Double> drawn = new HashMap<>();
        for (Use u : uses) {
            payer(u.programId(), u.telescopeId(), u.night()).ifPresent(g -> drawn.merge(g.id(), u.hours(), Double::sum));
        }
        return drawn;
    }

    /**
     * The time the term has drawn so far and what is planned: observed repeats, published visits awaiting a report or
     * under way, the published visits ahead and the draft's visits ahead.
     *
     * @param programOf the program of each request
     * @param zones     each telescope's night zone, to find the night of an observation no published visit holds
     */
    public static List<Use> uses(TermState term, Map<Long, Long> programOf, Map<Long, ZoneId> zones) {
        List<Use> out = new ArrayList<>();
        out.addAll(history(term, programOf, zones));
        term.published().ifPresent(p -> p.getVisits().stream().filter(v -> v.isPlaced() && !term.hasStarted(v))
                .forEach(v -> add(out, programOf, v, Kind.PUBLISHED)));
        term.draftVisits().stream().filter(v -> v.isPlaced() && !term.hasStarted(v))
                .forEach(v -> add(out, programOf, v, Kind.DRAFT));
        return out;
    }

    /** The time drawn by what has already happened or is under way: observed repeats and those awaiting a report. */
    public static List<Use> history(TermState term, Map<Long, Long> programOf, Map<Long, ZoneId> zones) {
        List<Use> out = new ArrayList<>();
        for (Map.Entry<VisitKey, ObservationReport> e : term.observed().entrySet()) {
            Long program = programOf.get(e.getKey().requestId());
            ObservationReport r = e.getValue();
            if (program == null) {
                continue;
            }
            LocalDate night = term.historyOf(e.getKey()).map(PlanVisit::getNight).orElseGet(() -> {
                ZoneId zone = zones.get(r.getTelescopeId());
                return zone == null ? null : PlanningMapper.nightOf(r.getObservedAt(), zone);
            });
            if (night != null) {
                out.add(new Use(program, r.getTelescopeId(), night, r.getObservedSeconds() / 3600.0, Kind.OBSERVED));
            }
        }
        for (PlanVisit v : term.history()) {
            TermState.Standing s = term.standing(v);
            if (s == TermState.Standing.UNDER_WAY || s == TermState.Standing.AWAITING_REPORT) {
                add(out, programOf, v, Kind.AWAITING);
            }
        }
        return out;
    }

    static void add(List<Use> out, Map<Long, Long> programOf, PlanVisit v, Kind kind) {
        Long program = programOf.get(v.getRequestId());
        if (program != null) {
            out.add(new Use(program, v.getTelescopeId(), v.getNight(), hoursOf(v), kind));
        }
    }

    static double hoursOf(PlanVisit v) {
        return (v.getEnd().getEpochSecond() - v.getStart().getEpochSecond()) / 3600.0;
    }

    private String label(org.skyrota.web.program.Grant g) {
        String where;
        if (g.getTelescopeId() != null) {
            Telescope t = telescopes.get(g.getTelescopeId());
            where = "on " + (t == null ? "telescope " + g.getTelescopeId() : t.getName());
        } else if (g.getSiteId() != null) {
            Site s = telescopes.values().stream().map(Telescope::getSite).filter(x -> x.getId().equals(g.getSiteId()))
                    .findFirst().orElse(null);
            where = "at " + (s == null ? "site " + g.getSiteId() : s.getName());
        } else {
            where = "anywhere";
        }
        return hours(g.getHours()) + " " + where + ", " + g.getFirstNight() + " to " + g.getLastNight();
    }

    static String hours(double h) {
        return String.format(Locale.ROOT, "%.1f h", h);
    }

    private static double round(double hours) {
        return Math.round(hours * 100) / 100.0;
    }
}
