package org.skyrota.web.compute;

import java.time.Clock;
import java.time.LocalDate;
import java.time.ZoneId;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;

import org.skyrota.web.compute.SkyComputations.Conditions;
import org.skyrota.web.compute.SkyComputations.Darkness;
import org.skyrota.web.compute.SkyComputations.Observer;
import org.skyrota.web.compute.SkyComputations.Target;
import org.skyrota.plugin.MovingTarget;
import org.skyrota.web.plugin.TargetKinds;
import org.skyrota.web.request.ObservingRequest;
import org.skyrota.web.request.RequestService;
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
    private final RequestService requests;
    private final SiteService sites;
    private final TargetKinds targetKinds;
    private final Clock clock;

    StoredSkyController(SkyComputations sky, RequestService requests, SiteService sites, TargetKinds targetKinds,
                        Clock clock) {
        this.clock = clock;
        this.targetKinds = targetKinds;
        this.sky = sky;
        this.requests = requests;
        this.sites = sites;
    }

    record SiteWindows(long siteId, String siteName, List<WindowResponse> windows) {}

    record NextNight(long siteId, String night, String start) {}

    record Observability(long requestId, String from, String to, List<SiteWindows> sites, NextNight nextObservableNight) {}

    /** Windows per site between {@code from} and {@code to} (default: the request's own nights, else 14 from today). */
    @GetMapping("/api/requests/{id}/observability")
    Observability observability(@PathVariable long id, @RequestParam(required = false) LocalDate from,
                                @RequestParam(required = false) LocalDate to) {
        ObservingRequest r = requests.readable(id);
        LocalDate first = from != null ? from : r.getEarliestNight() != null ? r.getEarliestNight() : LocalDate.now(clock);
        LocalDate last = to != null ? to : r.getLatestNight() != null && !r.getLatestNight().isBefore(first)
                ? r.getLatestNight() : first.plusDays(13);
        if (last.isBefore(first)) {
            throw new InvalidParametersException(List.of(new FieldProblem("to", "must not be before from")));
        }
        if (ChronoUnit.DAYS.between(first, last) + 1 > MAX_NIGHTS) {
            throw new InvalidParametersException(List.of(new FieldProblem("to", "at most " + MAX_NIGHTS + " nights")));
        }
        Conditions conditions = new Conditions(r.getMinAltitudeDeg(), Darkness.valueOf(r.getDarkness().name()),
                r.getMinMoonSeparationDeg(), r.getMaxMoonIllumination(), r.getMaxAirmass());
        // A moving target's place is resolved once, with the plugins of this server.
        MovingTarget moving = TargetKinds.isFixed(r.getTargetKind()) ? null
                : targetKinds.resolve(r.getTargetKind(), r.getTargetParameters());
        List<SiteWindows> bySite = new ArrayList<>();
        NextNight next = null;
        SkyComputations.Window best = null;
        for (Site s : sites.all()) {
            List<SkyComputations.Window> windows = moving != null ? sky.movingWindows(observer(s), moving, conditions, first, last)
                    : sky.windows(observer(s), new Target(r.getRaDeg(), r.getDecDeg()), conditions, first, last);
            bySite.add(new SiteWindows(s.getId(), s.getName(), windows.stream().map(WindowResponse::of).toList()));
            SkyComputations.Window earliest = windows.stream().min(Comparator.comparing(SkyComputations.Window::start)).orElse(null);
            if (earliest != null && (best == null || earliest.start().isBefore(best.start()))) {
                best = earliest;
                next = new NextNight(s.getId(), earliest.night().toString(), UtcSeconds.format(earliest.start()));
            }
        }
        return new Observability(id, first.toString(), last.toString(), bySite, next);
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
