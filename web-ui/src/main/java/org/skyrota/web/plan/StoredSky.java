package org.skyrota.web.plan;

import java.time.LocalDate;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.stream.Collectors;

import org.skyrota.planning.model.Instrument;
import org.skyrota.planning.model.Request;
import org.skyrota.planning.model.Site;
import org.skyrota.planning.model.Target;
import org.skyrota.planning.model.Telescope;
import org.skyrota.web.equipment.InstrumentRepository;
import org.skyrota.web.equipment.TelescopeRepository;
import org.skyrota.web.plugin.TargetKinds;
import org.skyrota.web.request.ObservingRequest;
import org.skyrota.web.request.RequestService;
import org.skyrota.web.site.SiteRepository;
import org.springframework.stereotype.Component;
import org.springframework.transaction.annotation.Transactional;

/**
 * The stored network and requests as the planner sees them, for the previews of the sky: sites with their horizon
 * profiles, the active telescopes with their pointing limits, their instruments, and a stored request as the planner's
 * {@link Request}, each converted by {@link PlanningMapper} exactly as a planner run converts it. The previews then ask
 * {@link org.skyrota.planning.sky.TelescopeWindows}, the rule the planner's candidates follow.
 */
@Component
public class StoredSky {

    /** The widest range of nights a stored request may name; the windows never depend on the request's own range. */
    private static final LocalDate NO_EARLIER = LocalDate.of(1, 1, 1);
    private static final LocalDate NO_LATER = LocalDate.of(9999, 12, 31);

    private final SiteRepository sites;
    private final TelescopeRepository telescopes;
    private final InstrumentRepository instruments;
    private final RequestService requests;
    private final TargetKinds targetKinds;

    StoredSky(SiteRepository sites, TelescopeRepository telescopes, InstrumentRepository instruments,
              RequestService requests, TargetKinds targetKinds) {
        this.sites = sites;
        this.telescopes = telescopes;
        this.instruments = instruments;
        this.requests = requests;
        this.targetKinds = targetKinds;
    }

    /**
     * Sites, telescopes and instruments as the planner gets them.
     *
     * @param sites          by name
     * @param telescopes     the active ones, by name within their site
     * @param telescopeNames stored names by the planner's telescope id
     */
    public record Network(List<Site> sites, List<Telescope> telescopes, Map<String, String> telescopeNames,
                          List<Instrument> instruments) {

        /** The lowest pointing limit of the site's active telescopes, or NaN when it has none. */
        public double lowestPointingLimitDeg(Site site) {
            return telescopes.stream().filter(t -> t.siteId().equals(site.id()))
                    .mapToDouble(Telescope::minAltitudeDeg).min().orElse(Double.NaN);
        }
    }

    /** A stored request as the planner gets it, with the nights it names (either may be null). */
    public record StoredRequest(long id, Request request, LocalDate earliestNight, LocalDate latestNight) {}

    /** Every stored site with its active telescopes and their instruments. */
    @Transactional(readOnly = true)
    public Network network() {
        return network(sites.findAll());
    }

    /** One stored site with its active telescopes and their instruments; null when no site has that id. */
    @Transactional(readOnly = true)
    public Network site(long siteId) {
        return sites.findById(siteId).map(s -> network(List.of(s))).orElse(null);
    }

    /**
     * The stored request as the planner's {@link Request}, when the signed-in user may see it (else 404). A target of
     * a plugin's kind is resolved with this server's plugins; one that no longer resolves is a 400 naming
     * {@code targetKind} or the parameter.
     */
    @Transactional(readOnly = true)
    public StoredRequest request(long id) {
        ObservingRequest r = requests.readable(id);
        if (!TargetKinds.isFixed(r.getTargetKind())) {
            // Throws the problem (400 naming the kind or the parameter) that the planner would only log.
            targetKinds.resolve(r.getTargetKind(), r.getTargetParameters());
        }
        Target target = PlanningMapper.target(r, targetKinds);
        Request request = PlanningMapper.request(r, target, 1, NO_EARLIER, NO_LATER);
        return new StoredRequest(r.getId(), request, r.getEarliestNight(), r.getLatestNight());
    }

    private Network network(List<org.skyrota.web.site.Site> stored) {
        List<org.skyrota.web.site.Site> byName = stored.stream()
                .sorted(Comparator.comparing(org.skyrota.web.site.Site::getName)
                        .thenComparing(org.skyrota.web.site.Site::getId))
                .toList();
        Set<Long> siteIds = byName.stream().map(org.skyrota.web.site.Site::getId).collect(Collectors.toSet());
        // Only active telescopes at these sites, as a planner run reads them.
        List<org.skyrota.web.equipment.Telescope> active = telescopes.findAll().stream()
                .filter(t -> t.isActive() && siteIds.contains(t.getSite().getId()))
                .sorted(Comparator.comparing(org.skyrota.web.equipment.Telescope::getName)
                        .thenComparing(org.skyrota.web.equipment.Telescope::getId))
                .toList();
        Set<Long> telescopeIds = active.stream().map(org.skyrota.web.equipment.Telescope::getId).collect(Collectors.toSet());
        Map<String, String> names = new LinkedHashMap<>();
        active.forEach(t -> names.put(String.valueOf(t.getId()), t.getName()));
        return new Network(byName.stream().map(PlanningMapper::site).toList(),
                active.stream().map(PlanningMapper::telescope).toList(), Map.copyOf(names),
                instruments.findAll().stream().filter(i -> telescopeIds.contains(i.getTelescope().getId()))
                        .sorted(Comparator.comparing(org.skyrota.web.equipment.Instrument::getId))
                        .map(PlanningMapper::instrument).toList());
    }
}
