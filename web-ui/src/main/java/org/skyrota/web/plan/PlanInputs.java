package org.skyrota.web.plan;

import java.time.Instant;
import java.time.LocalDate;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;

import org.skyrota.web.equipment.InstrumentRepository;
import org.skyrota.web.equipment.TelescopeRepository;
import org.skyrota.web.plugin.TargetKinds;
import org.skyrota.web.program.ProgramRepository;
import org.skyrota.web.report.ObservationReportRepository;
import org.skyrota.web.report.StandingReports;
import org.skyrota.web.request.ObservingRequest;
import org.skyrota.web.request.ObservingRequestRepository;
import org.skyrota.web.request.RequestState;
import org.skyrota.web.site.Site;
import org.skyrota.web.site.SiteRepository;
import org.springframework.stereotype.Component;
import org.springframework.transaction.annotation.Propagation;
import org.springframework.transaction.annotation.Transactional;

/** Reads what the planner needs from storage and hands it to {@link PlanningMapper}. */
@Component
public class PlanInputs {

    private final SiteRepository sites;
    private final TelescopeRepository telescopes;
    private final InstrumentRepository instruments;
    private final ProgramRepository programs;
    private final ObservingRequestRepository requests;
    private final ObservationReportRepository reports;
    private final PlanRevisionRepository revisions;
    private final TargetKinds targetKinds;

    PlanInputs(SiteRepository sites, TelescopeRepository telescopes, InstrumentRepository instruments,
               ProgramRepository programs, ObservingRequestRepository requests, ObservationReportRepository reports,
               PlanRevisionRepository revisions, TargetKinds targetKinds) {
        this.targetKinds = targetKinds;
        this.sites = sites;
        this.telescopes = telescopes;
        this.instruments = instruments;
        this.programs = programs;
        this.requests = requests;
        this.reports = reports;
        this.revisions = revisions;
    }

    /**
     * The problem for a horizon: the given sites (all when null), every accepted request, the pins and nights given,
     * and the published plan for stability.
     */
    @Transactional(readOnly = true, propagation = Propagation.SUPPORTS)
    public PlanningMapper.Mapped problem(LocalDate first, LocalDate last, Set<Long> siteIds,
                                         List<PlanVisit> pins, List<PlanNight> nights) {
        List<Site> chosen = sites.findAll().stream()
                .filter(s -> siteIds == null || siteIds.isEmpty() || siteIds.contains(s.getId())).toList();
        List<ObservingRequest> accepted = requests.findAll().stream()
                .filter(r -> r.getState() == RequestState.ACCEPTED).toList();
        List<PlanVisit> published = revisions.findFirstByStateOrderByIdDesc(PlanRevision.State.PUBLISHED)
                .map(PlanRevision::getVisits).orElse(List.of());
        return PlanningMapper.map(new PlanningMapper.Input(chosen, telescopes.findAll(), instruments.findAll(),
                programs.findAll(), accepted, observedRepeats(), first, last, pins, nights, published), targetKinds);
    }

    /**
     * Per request, the repeats whose latest done-or-failed report says done, and when they were observed (the time the
     * open repeats keep their spacing from).
     */
    @Transactional(readOnly = true, propagation = Propagation.SUPPORTS)
    public Map<Long, Map<Integer, Instant>> observedRepeats() {
        Map<Long, Map<Integer, Instant>> out = new HashMap<>();
        StandingReports.done(reports.findAll()).values()
                .forEach(r -> out.computeIfAbsent(r.getRequestId(), k -> new HashMap<>())
                        .put(r.getRepeatNo(), r.getObservedAt()));
        return out;
    }
}
