package org.skyrota.web.plan;

import java.time.Instant;
import java.time.LocalDate;
import java.util.List;

import org.skyrota.web.request.ObservingRequest;
import org.skyrota.web.request.ObservingRequestRepository;
import org.skyrota.web.request.RequestState;
import org.skyrota.web.request.RequestStateChanged;
import org.skyrota.web.site.Site;
import org.skyrota.web.site.SiteRepository;
import org.skyrota.web.system.AuditLog;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.context.ApplicationEventPublisher;
import org.springframework.scheduling.annotation.Scheduled;
import org.springframework.stereotype.Service;
import org.springframework.transaction.annotation.Transactional;

/**
 * Ends accepted requests as the term moves on: completed when every repeat is observed, expired when the last of
 * its nights is over at every site without that (and no visit of it still awaits its report). Runs before every
 * planner run, when the clock is set, and once a minute.
 */
@Service
public class TermKeeper {

    private static final Logger log = LoggerFactory.getLogger(TermKeeper.class);

    private final ObservingRequestRepository requests;
    private final SiteRepository sites;
    private final PlanInputs inputs;
    private final AuditLog audit;
    private final ApplicationEventPublisher events;

    TermKeeper(ObservingRequestRepository requests, SiteRepository sites, PlanInputs inputs, AuditLog audit,
               ApplicationEventPublisher events) {
        this.requests = requests;
        this.sites = sites;
        this.inputs = inputs;
        this.audit = audit;
        this.events = events;
    }

    @Scheduled(fixedDelayString = "${skyrota.term.keeper-interval:PT1M}", initialDelayString = "PT10S")
    @Transactional
    public void everyMinute() {
        try {
            catchUp();
        } catch (RuntimeException e) {
            log.warn("Could not complete or expire requests this time; trying again at the next run", e);
        }
    }

    /** After the clock was moved forward: what the new time has ended is settled at once. */
    @org.springframework.context.event.EventListener
    @Transactional
    public void clockMoved(org.skyrota.web.system.ClockMoved moved) {
        catchUp();
    }

    /** Completes and expires what the reports and the clock say is over; answers how many requests changed. */
    @Transactional
    public synchronized int catchUp() {
        TermState term = inputs.term();
        List<Site> all = sites.findAll();
        int changed = 0;
        for (ObservingRequest r : requests.findAll()) {
            if (r.getState() != RequestState.ACCEPTED) {
                continue;
            }
            long observed = term.observed().keySet().stream().filter(k -> k.requestId() == r.getId()).count();
            RequestState to = null;
            if (observed >= r.getRepeats()) {
                to = RequestState.COMPLETED;
            } else if (over(r.getLatestNight(), all, term.now()) && nothingAwaited(term, r.getId())) {
                to = RequestState.EXPIRED;
            }
            if (to != null) {
                String before = r.getState().name().toLowerCase();
                r.moveTo(to, null);
                requests.save(r);
                audit.record("state:" + to.name().toLowerCase(), "request", r.getId(),
                        java.util.Map.of("state", before), java.util.Map.of("state", to.name().toLowerCase(),
                                "observedRepeats", observed, "repeats", r.getRepeats()));
                events.publishEvent(new RequestStateChanged(r.getId(), RequestState.ACCEPTED, to));
                changed++;
            }
        }
        if (changed > 0) {
            requests.flush();
        }
        return changed;
    }

    /** Whether the night of {@code last} has ended at every site (nights end at local noon of the next day). */
    static boolean over(LocalDate last, List<Site> sites, Instant now) {
        if (last == null || sites.isEmpty()) {
            return false;
        }
        for (Site s : sites) {
            if (!PlanningMapper.nightEnd(s, last).isBefore(now)) {
                return false;
            }
        }
        return true;
    }

    private static boolean nothingAwaited(TermState term, long requestId) {
        return term.history().stream().filter(v -> v.getRequestId() == requestId)
                .noneMatch(v -> term.standing(v) == TermState.Standing.UNDER_WAY
                        || term.standing(v) == TermState.Standing.AWAITING_REPORT);
    }
}
