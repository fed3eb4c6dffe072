package org.skyrota.web.report;

import java.time.Clock;
import java.time.Duration;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.List;
import java.util.Locale;
import java.util.Optional;

import org.skyrota.web.equipment.Telescope;
import org.skyrota.web.equipment.TelescopeRepository;
import org.skyrota.web.plan.PlanRevision;
import org.skyrota.web.plan.PlanRevisionRepository;
import org.skyrota.web.plan.PlanVisit;
import org.skyrota.web.plan.VisitKey;
import org.skyrota.web.site.Site;
import org.skyrota.web.site.SiteMapper;
import org.skyrota.web.system.AuditLog;
import org.skyrota.web.system.ConflictException;
import org.skyrota.web.system.FieldProblem;
import org.skyrota.web.system.InvalidParametersException;
import org.skyrota.web.system.NotFoundException;
import org.springframework.security.access.AccessDeniedException;
import org.springframework.security.core.context.SecurityContextHolder;
import org.springframework.stereotype.Service;
import org.springframework.transaction.annotation.Transactional;

/**
 * Observation reports from a telescope's control computer, about visits of the published plan on that telescope.
 * A done visit counts as observed time and is not planned again; a failed one stays open, so the next run plans it
 * again (its request is back in the queue).
 */
@Service
@Transactional
public class ReportService {

    private final ObservationReportRepository reports;
    private final PlanRevisionRepository revisions;
    private final TelescopeRepository telescopes;
    private final AuditLog audit;
    private final Clock clock;

    ReportService(ObservationReportRepository reports, PlanRevisionRepository revisions, TelescopeRepository telescopes,
                  AuditLog audit, Clock clock) {
        this.reports = reports;
        this.revisions = revisions;
        this.telescopes = telescopes;
        this.audit = audit;
        this.clock = clock;
    }

    public record ReportView(long id, String visitId, long requestId, long telescopeId, String outcome, String reason,
                             Instant observedAt, double observedHours, boolean requeued) {
        static ReportView of(ObservationReport r) {
            return new ReportView(r.getId(), new VisitKey(r.getRequestId(), r.getRepeatNo()).toString(), r.getRequestId(),
                    r.getTelescopeId(), r.getOutcome().name().toLowerCase(Locale.ROOT), r.getReason(), r.getObservedAt(),
                    Math.round(r.getObservedSeconds() / 36.0) / 100.0, r.getOutcome() == Outcome.FAILED);
        }
    }

    public ReportView report(String visitId, String outcome, String reason, Instant observedAt) {
        if (visitId == null || visitId.isBlank()) {
            throw new InvalidParametersException(List.of(new FieldProblem("visitId", "must be given")));
        }
        Outcome how;
        try {
            how = Outcome.valueOf(outcome == null ? "" : outcome.trim().toUpperCase(Locale.ROOT));
        } catch (IllegalArgumentException e) {
            throw new InvalidParametersException(List.of(new FieldProblem("outcome", "must be done, partial or failed")));
        }
        if (reason != null && reason.length() > 1000) {
            throw new InvalidParametersException(List.of(new FieldProblem("reason", "at most 1000 characters")));
        }
        VisitKey key = VisitKey.parse(visitId);
        TokenPrincipal token = (TokenPrincipal) SecurityContextHolder.getContext().getAuthentication().getPrincipal();
        PlanRevision published = revisions.findFirstByStateOrderByIdDesc(PlanRevision.State.PUBLISHED)
                .orElseThrow(() -> new NotFoundException("published visit", visitId));
        PlanVisit visit = published.getVisits().stream().filter(v -> v.isPlaced() && v.key().equals(key)).findFirst()
                .orElseThrow(() -> new NotFoundException("published visit", visitId));
        if (visit.getTelescopeId() != token.telescopeId()) {
            throw new AccessDeniedException("visit " + visitId + " is planned on another telescope");
        }
        if (!visit.getStart().isBefore(clock.instant())) {
            // A report is about what happened: a visit ahead of now has not, and its repeat stays planned as it is.
            throw new ConflictException("Visit " + visitId + " starts at " + visit.getStart()
                    + ", which is still ahead; report on it once it has started");
        }
        if (observedAt != null) {
            requirePlausible(observedAt, visit);
        }
        // observedAt is when the visit started; a report that leaves it out is taken to say the visit ran as
        // published, and the spacing of the open repeats is measured from that start, not from when it was sent.
        long seconds = how == Outcome.DONE ? Duration.between(visit.getStart(), visit.getEnd()).toSeconds() : 0;
        ObservationReport saved = reports.saveAndFlush(new ObservationReport(key.requestId(), key.repeatNo(),
                token.telescopeId(), how, reason, observedAt == null ? visit.getStart() : observedAt, seconds,
                token.tokenId()));
        ReportView view = ReportView.of(saved);
        audit.record("create", "observation-report", saved.getId(), null, view);
        return view;
    }

    /**
     * A visit is observed neither later than now (the server's clock) nor before its night began (local noon of the
     * visit's night at its telescope's site): such a time is a typing or clock error, and the spacing of the open
     * repeats would be measured from it.
     */
    private void requirePlausible(Instant observedAt, PlanVisit visit) {
        Instant now = clock.instant();
        if (observedAt.isAfter(now)) {
            throw new InvalidParametersException(List.of(new FieldProblem("observedAt",
                    "must not be in the future: the server's clock reads " + now.truncatedTo(ChronoUnit.SECONDS)
                            + ", was " + observedAt)));
        }
        Optional<Site> site = telescopes.findById(visit.getTelescopeId()).map(Telescope::getSite);
        if (site.isPresent() && visit.getNight() != null) {
            Instant nightStart = SiteMapper.nightStart(site.get(), visit.getNight());
            if (observedAt.isBefore(nightStart)) {
                throw new InvalidParametersException(List.of(new FieldProblem("observedAt",
                        "must not be before the visit's night began (local noon of " + visit.getNight() + " at its site, "
                                + nightStart + "), was " + observedAt)));
            }
        }
    }
}
