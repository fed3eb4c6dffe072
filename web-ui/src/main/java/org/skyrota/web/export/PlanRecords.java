package org.skyrota.web.export;

import java.time.Clock;
import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.stream.Collectors;

import org.skyrota.plugin.PlanRecord;
import org.skyrota.plugin.PlannedVisitRecord;
import org.skyrota.web.equipment.Telescope;
import org.skyrota.web.equipment.TelescopeRepository;
import org.skyrota.web.plan.PlanRevision;
import org.skyrota.web.plan.PlanRevisionRepository;
import org.skyrota.web.plan.PlanVisit;
import org.skyrota.web.plugin.TargetKinds;
import org.skyrota.web.request.ObservingRequest;
import org.skyrota.web.request.ObservingRequestRepository;
import org.skyrota.web.request.RequestState;
import org.springframework.stereotype.Component;
import org.springframework.transaction.annotation.Transactional;

/**
 * The one place where the published plan becomes the exporters' {@link PlanRecord}. The exporters take a numeric
 * visit id: it is {@code requestId × 1000 + repeat number} (visit {@code 12-2} is 12002), stable across revisions.
 */
@Component
class PlanRecords {

    private final PlanRevisionRepository revisions;
    private final ObservingRequestRepository requests;
    private final TelescopeRepository telescopes;

    private final Clock clock;

    PlanRecords(PlanRevisionRepository revisions, ObservingRequestRepository requests, TelescopeRepository telescopes,
                Clock clock) {
        this.clock = clock;
        this.revisions = revisions;
        this.requests = requests;
        this.telescopes = telescopes;
    }

    /**
     * The published plan's placed visits, limited to a site, a night and an owner when those are given (null: any).
     * Empty (revision 0) while nothing is published. Visits ahead of requests no longer accepted (withdrawn) are not
     * in the plan any more: they come, with the cancelled entries of the revision, as cancelled records whose sequence
     * is higher than any they had.
     */
    @Transactional(readOnly = true)
    PlanRecord published(Long siteId, LocalDate night, String owner) {
        PlanRevision rev = revisions.findFirstByStateOrderByIdDesc(PlanRevision.State.PUBLISHED).orElse(null);
        if (rev == null) {
            return new PlanRecord("Published plan (nothing published yet)", 0, null, List.of());
        }
        Instant now = clock.instant();
        Map<Long, Telescope> scopes = new HashMap<>();
        telescopes.findAll().forEach(t -> scopes.put(t.getId(), t));
        Map<Long, ObservingRequest> byId = new HashMap<>();
        requests.findAllById(rev.getVisits().stream().map(PlanVisit::getRequestId).distinct().toList())
                .forEach(r -> byId.put(r.getId(), r));
        List<PlannedVisitRecord> visits = new ArrayList<>();
        List<PlannedVisitRecord> cancelled = new ArrayList<>();
        for (PlanVisit v : rev.getVisits()) {
            Telescope t = v.getTelescopeId() == null ? null : scopes.get(v.getTelescopeId());
            ObservingRequest r = byId.get(v.getRequestId());
            if (t == null || r == null || (!v.isPlaced() && !v.isCancelled())
                    || (siteId != null && !siteId.equals(t.getSite().getId()))
                    || (night != null && !night.equals(v.getNight())) || (owner != null && !owner.equals(r.getOwner()))) {
                continue;
            }
            boolean ahead = !v.getStart().isBefore(now);
            if (v.isCancelled()) {
                cancelled.add(record(v, r, t, v.getSequence()));
            } else if (ahead && r.getState() != RequestState.ACCEPTED) {
                // Withdrawn since it was published: cancelled now, one sequence after any the revision gave it.
                cancelled.add(record(v, r, t, (int) Math.max(v.getSequence(), rev.getId()) + 1));
            } else {
                visits.add(record(v, r, t, v.getSequence()));
            }
        }
        visits.sort(Comparator.comparing(PlannedVisitRecord::start).thenComparing(PlannedVisitRecord::telescope));
        cancelled.sort(Comparator.comparing(PlannedVisitRecord::start).thenComparing(PlannedVisitRecord::telescope));
        String title = "Published plan, " + rev.getFirstNight() + " to " + rev.getLastNight()
                + (night == null ? "" : ", night of " + night) + (owner == null ? "" : ", visits of " + owner);
        return new PlanRecord(title, rev.getId(), rev.getPublishedAt(), visits, cancelled);
    }

    private static PlannedVisitRecord record(PlanVisit v, ObservingRequest r, Telescope t, int sequence) {
        boolean fixed = TargetKinds.isFixed(r.getTargetKind());
        return new PlannedVisitRecord(v.getRequestId() * 1000 + v.getRepeatNo(), v.getRequestId(),
                r.getTargetName() + " (" + r.getProgram().getCode() + ")", r.getTargetName(),
                // A moving target has no fixed position to export (the record's null).
                fixed ? Double.valueOf(r.getRaDeg()) : null, fixed ? Double.valueOf(r.getDecDeg()) : null,
                t.getSite().getName(), t.getName(), v.getNight(), v.getStart(), v.getEnd(), r.getOwner(),
                r.getProgram().getTitle(), r.getExposures().stream()
                .map(e -> e.getFilterName() + " " + e.getCount() + "x" + trim(e.getSeconds()) + "s")
                .collect(Collectors.joining(", ")), Math.max(0, sequence));
    }

    private static String trim(double seconds) {
        return seconds == Math.rint(seconds) ? String.valueOf((long) seconds) : String.valueOf(seconds);
    }
}
