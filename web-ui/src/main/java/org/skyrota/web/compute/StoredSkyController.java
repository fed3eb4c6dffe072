package org.skyrota.web.compute;

import java.time.Clock;
import java.time.LocalDate;
import java.time.ZoneId;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;

import com.fasterxml.jackson.annotation.JsonPropertyOrder;

import org.skyrota.planning.sky.EngineSkyModel;
import org.skyrota.planning.sky.SkyWindow;
import org.skyrota.planning.sky.TelescopeWindows;
import org.skyrota.web.compute.SkyComputations.Observer;
import org.skyrota.web.plan.StoredSky;
import org.skyrota.web.site.Site;
import org.skyrota.web.site.SiteService;
import org.skyrota.web.system.FieldProblem;
import org.skyrota.web.system.InvalidParametersException;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.bind.annotation.RestController;

/** The sky for stored things: a request's windows at every site, and a stored site's almanac. */
@RestController
class StoredSkyController {

    static final int MAX_NIGHTS = 62;

    private final SkyComputations sky;
    private final StoredSky storedSky;
    private final SiteService sites;
    private final Clock clock;

    StoredSkyController(SkyComputations sky, StoredSky storedSky, SiteService sites, Clock clock) {
        this.clock = clock;
        this.sky = sky;
        this.storedSky = storedSky;
        this.sites = sites;
    }

    /**
     * One telescope of a site for a request: its windows, or why it cannot take the request.
     *
     * @param canTake whether the telescope has an instrument with every filter of the plan (and a certified solar
     *                filter for a solar target)
     * @param reason  why it cannot take the request, or null
     */
    @JsonPropertyOrder({"telescopeId", "telescopeName", "canTake", "reason", "windows"})
    record TelescopeWindowsView(long telescopeId, String telescopeName, boolean canTake, String reason,
                                List<WindowResponse> windows) {}

    /** A site: the union, night by night, of the windows of its telescopes that can take the request, and each one's. */
    @JsonPropertyOrder({"siteId", "siteName", "windows", "telescopes"})
    record SiteWindows(long siteId, String siteName, List<WindowResponse> windows, List<TelescopeWindowsView> telescopes) {}

    record NextNight(long siteId, String night, String start) {}

    record Observability(long requestId, String from, String to, List<SiteWindows> sites, NextNight nextObservableNight) {}

    /**
     * Windows per site between {@code from} and {@code to} (default: the request's own nights, else 14 from today), by
     * the rule the planner's candidates follow ({@link TelescopeWindows}): only the site's active telescopes that could
     * take the request, each under the site's horizon profile with the higher of the request's and its own minimum
     * altitude.
     */
    @GetMapping("/api/requests/{id}/observability")
    Observability observability(@PathVariable long id, @RequestParam(required = false) LocalDate from,
                                @RequestParam(required = false) LocalDate to) {
        StoredSky.StoredRequest r = storedSky.request(id);
        LocalDate first = from != null ? from : r.earliestNight() != null ? r.earliestNight() : LocalDate.now(clock);
        LocalDate last = to != null ? to : r.latestNight() != null && !r.latestNight().isBefore(first)
                ? r.latestNight() : first.plusDays(13);
        if (last.isBefore(first)) {
            throw new InvalidParametersException(List.of(new FieldProblem("to", "must not be before from")));
        }
        if (ChronoUnit.DAYS.between(first, last) + 1 > MAX_NIGHTS) {
            throw new InvalidParametersException(List.of(new FieldProblem("to", "at most " + MAX_NIGHTS + " nights")));
        }
        StoredSky.Network network = storedSky.network();
        // A sky model of its own per call: it caches sites by id and the Sun and Moon by minute.
        EngineSkyModel model = new EngineSkyModel();
        List<SiteWindows> bySite = new ArrayList<>();
        NextNight next = null;
        SkyWindow best = null;
        for (org.skyrota.planning.model.Site site : network.sites()) {
            TelescopeWindows.AtSite at = TelescopeWindows.atSite(model, site, network.telescopes(),
                    network.instruments(), r.request(), first, last);
            List<TelescopeWindowsView> telescopes = at.telescopes().stream()
                    .map(o -> new TelescopeWindowsView(Long.parseLong(o.telescope().id()),
                            network.telescopeNames().get(o.telescope().id()), o.canTake(), o.whyNot(),
                            o.windows().stream().map(WindowResponse::of).toList()))
                    .toList();
            long siteId = Long.parseLong(site.id());
            bySite.add(new SiteWindows(siteId, site.name(), at.windows().stream().map(WindowResponse::of).toList(),
                    telescopes));
            SkyWindow earliest = at.windows().stream().min(Comparator.comparing(SkyWindow::start)).orElse(null);
            if (earliest != null && (best == null || earliest.start().isBefore(best.start()))) {
                best = earliest;
                next = new NextNight(siteId, earliest.night().toString(), UtcSeconds.format(earliest.start()));
            }
        }
        return new Observability(r.id(), first.toString(), last.toString(), bySite, next);
    }

    @GetMapping("/api/sites/{id}/almanac")
    AlmanacResponse almanac(@PathVariable long id, @RequestParam(required = false) LocalDate date) {
        Site s = sites.find(id);
        return AlmanacResponse.of(sky.almanac(observer(s), date == null ? LocalDate.now(clock) : date));
    }

    private static Observer observer(Site s) {
        return new Observer(s.getLatitudeDeg(), s.getLongitudeDeg(), s.getElevationM(),
                s.getTimeZone() == null ? null : ZoneId.of(s.getTimeZone()));
    }
}
