package org.skyrota.planning.sky;

import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;

import org.skyrota.planning.model.Instrument;
import org.skyrota.planning.model.ObservingLimits;
import org.skyrota.planning.model.Request;
import org.skyrota.planning.model.Site;
import org.skyrota.planning.model.Target;
import org.skyrota.planning.model.Telescope;

/**
 * When a telescope could take a request: the one rule that the planner's candidates and every preview of a request's
 * windows share, so that what a requester is shown is what the planner will consider.
 *
 * <ul>
 *   <li>Only a telescope with an instrument that carries every filter of the request's exposure plan can take it, and
 *       a solar target only one with a certified solar filter (caution: sunlight through optics blinds and burns).</li>
 *   <li>Its windows are the sky model's for the request's limits with the minimum altitude raised to the telescope's
 *       pointing limit where that is higher, under the site's horizon profile ({@link Site#horizon()}, which the sky
 *       model applies).</li>
 * </ul>
 * Closed nights, the Sun-separation check per candidate and the visit's length are the planner's business, not part
 * of the windows.
 */
public final class TelescopeWindows {

    private TelescopeWindows() {}

    /**
     * The first of {@code instruments} on the telescope that carries every filter of the request's plan and, for a
     * solar target, a certified solar filter; empty when there is none.
     */
    public static Optional<Instrument> instrumentFor(Request request, Telescope telescope, List<Instrument> instruments) {
        for (Instrument i : instruments) {
            if (i.telescopeId().equals(telescope.id()) && i.filters().containsAll(request.filters())
                    && (!request.target().solar() || i.certifiedSolarFilter())) {
                return Optional.of(i);
            }
        }
        return Optional.empty();
    }

    /** Why the telescope cannot take the request, in plain words; empty when it can. */
    public static Optional<String> whyNot(Request request, Telescope telescope, List<Instrument> instruments) {
        if (instrumentFor(request, telescope, instruments).isPresent()) {
            return Optional.empty();
        }
        List<Instrument> own = instruments.stream().filter(i -> i.telescopeId().equals(telescope.id())).toList();
        if (own.isEmpty()) {
            return Optional.of("no instrument");
        }
        boolean filters = own.stream().anyMatch(i -> i.filters().containsAll(request.filters()));
        if (filters && request.target().solar()) {
            return Optional.of("no instrument with a certified solar filter, which a solar target needs");
        }
        return Optional.of("no instrument carries every filter of the plan (" + String.join(", ", request.filters())
                + (request.target().solar() ? ") with a certified solar filter" : ")"));
    }

    /** The request's limits on this telescope: the minimum altitude is the higher of the request's and the telescope's. */
    public static ObservingLimits limitsOn(ObservingLimits requested, Telescope telescope) {
        double minAlt = Math.max(requested.minAltitudeDeg(), telescope.minAltitudeDeg());
        return new ObservingLimits(minAlt, requested.maxAirmass(), requested.darkness(),
                requested.minMoonSeparationDeg(), requested.maxMoonIllumination(), requested.minSunSeparationDeg());
    }

    /**
     * The request's windows on the telescope in one night, under the site's horizon profile. Does not ask whether
     * the telescope can take the request ({@link #instrumentFor}).
     */
    public static List<SkyWindow> windows(SkyModel sky, Site site, Telescope telescope, Request request,
                                          LocalDate night) {
        return sky.windows(site, request.target(), limitsOn(request.limits(), telescope), night);
    }

    /**
     * The request's windows on the telescope from night {@code from} to night {@code to}, in time order. Does not ask
     * whether the telescope can take the request ({@link #instrumentFor}).
     */
    public static List<SkyWindow> windows(SkyModel sky, Site site, Telescope telescope, Request request,
                                          LocalDate from, LocalDate to) {
        return windows(sky, site, request.target(), limitsOn(request.limits(), telescope), from, to);
    }

    /**
     * A target's windows at a site under the given limits and the site's horizon profile, from night {@code from} to
     * night {@code to}, in time order: asked in one batch where the sky model has a batch path (fixed and moving
     * targets), the Sun night by night.
     */
    public static List<SkyWindow> windows(SkyModel sky, Site site, Target target, ObservingLimits limits,
                                          LocalDate from, LocalDate to) {
        if (target.solar() && !target.isMoving()) {
            List<SkyWindow> out = new ArrayList<>();
            for (LocalDate night = from; !night.isAfter(to); night = night.plusDays(1)) {
                out.addAll(sky.windows(site, target, limits, night));
            }
            return out;
        }
        return sky.windows(List.of(site), List.of(target), limits, from, to).get(0).get(0);
    }

    /**
     * The request at one site from night {@code from} to night {@code to}: each of the site's telescopes among
     * {@code telescopes}, in their order, with its windows or the reason it cannot take the request, and the union of
     * the windows of those that can, night by night.
     */
    public static AtSite atSite(SkyModel sky, Site site, List<Telescope> telescopes, List<Instrument> instruments,
                                Request request, LocalDate from, LocalDate to) {
        Map<Telescope, Optional<String>> why = new LinkedHashMap<>();
        List<OnTelescope> onTelescopes = new ArrayList<>();
        // Telescopes with the same pointing limit share their windows: the rule depends on nothing else of theirs.
        Map<Double, List<SkyWindow>> byMinAltitude = new LinkedHashMap<>();
        for (Telescope t : telescopes) {
            if (!t.siteId().equals(site.id())) {
                continue;
            }
            Optional<String> whyNot = whyNot(request, t, instruments);
            why.put(t, whyNot);
            List<SkyWindow> windows = whyNot.isPresent() ? List.of()
                    : byMinAltitude.computeIfAbsent(limitsOn(request.limits(), t).minAltitudeDeg(),
                            k -> windows(sky, site, t, request, from, to));
            onTelescopes.add(new OnTelescope(t, whyNot.orElse(null), windows));
        }
        List<SkyWindow> all = onTelescopes.stream().flatMap(o -> o.windows().stream()).toList();
        return new AtSite(site, List.copyOf(onTelescopes), union(all));
    }

    /**
     * The union of windows, night by night: overlapping or touching windows of one night become one, with the highest
     * of their altitudes; in time order.
     */
    public static List<SkyWindow> union(List<SkyWindow> windows) {
        List<SkyWindow> sorted = new ArrayList<>(windows);
        sorted.sort(Comparator.comparing(SkyWindow::night).thenComparing(SkyWindow::start));
        List<SkyWindow> out = new ArrayList<>();
        SkyWindow current = null;
        for (SkyWindow w : sorted) {
            if (current != null && current.night().equals(w.night()) && !w.start().isAfter(current.end())) {
                current = new SkyWindow(current.night(), current.start(),
                        w.end().isAfter(current.end()) ? w.end() : current.end(),
                        Math.max(current.maxAltitudeDeg(), w.maxAltitudeDeg()));
            } else {
                if (current != null) {
                    out.add(current);
                }
                current = w;
            }
        }
        if (current != null) {
            out.add(current);
        }
        return out;
    }

    /**
     * One telescope's answer for a request.
     *
     * @param whyNot  why it cannot take the request, or null when it can
     * @param windows its windows, empty when it cannot take the request
     */
    public record OnTelescope(Telescope telescope, String whyNot, List<SkyWindow> windows) {
        public OnTelescope {
            Objects.requireNonNull(telescope, "telescope");
            windows = List.copyOf(windows);
        }

        public boolean canTake() {
            return whyNot == null;
        }
    }

    /**
     * A request at one site.
     *
     * @param telescopes the site's telescopes, each with its windows or why it cannot take the request
     * @param windows    the union, night by night, of the windows of the telescopes that can take it
     */
    public record AtSite(Site site, List<OnTelescope> telescopes, List<SkyWindow> windows) {}
}
