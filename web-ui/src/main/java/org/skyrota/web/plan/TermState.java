package org.skyrota.web.plan;

import java.time.Instant;
import java.util.ArrayList;
import java.util.Collection;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;

import org.skyrota.web.report.ObservationReport;
import org.skyrota.web.report.Outcome;
import org.skyrota.web.report.StandingReports;

/**
 * The plan at one moment. Time moves one way: a published visit that has started is history, and history never
 * changes (it stays in every later draft and published revision as it was published); the telescope's reports say
 * how it went. Everything ahead of now is a promise (published) or a proposal (draft).
 *
 * <p>A visit's id (request and repeat number) is unique within a revision: a repeat that failed or was missed stays
 * in history under its number, and the repeat planned in its place takes a new one.
 */
public final class TermState {

    /** How a placed visit stands at {@link #now()}. */
    public enum Standing {
        /** Ahead of now. */
        PLANNED("planned"),
        /** Started, not yet ended. */
        UNDER_WAY("under way"),
        /** Ended, no report yet, still within the time a report may come. */
        AWAITING_REPORT("awaiting report"),
        /** Its telescope reported it done. */
        OBSERVED("observed"),
        /** Its telescope reported it failed: the repeat is planned again. */
        FAILED("failed"),
        /** No report came in time: the repeat is planned again. */
        MISSED("missed");

        private final String words;

        Standing(String words) {
            this.words = words;
        }

        /** As the API writes it. */
        public String words() {
            return words;
        }

        /** Whether the repeat is spent (done, or may still be): it is not planned again. */
        public boolean takesTheRepeat() {
            return this == UNDER_WAY || this == AWAITING_REPORT || this == OBSERVED;
        }
    }

    private final Instant now;
    private final TermSettings settings;
    private final PlanRevision published;
    private final PlanRevision draft;
    private final Map<VisitKey, ObservationReport> deciding;
    private final Map<VisitKey, ObservationReport> observed;
    private final List<PlanVisit> history = new ArrayList<>();
    private final Map<VisitKey, PlanVisit> historyByKey = new HashMap<>();

    private TermState(Instant now, TermSettings settings, PlanRevision published, PlanRevision draft,
                      Collection<ObservationReport> reports) {
        this.now = now;
        this.settings = settings;
        this.published = published;
        this.draft = draft;
        this.deciding = StandingReports.deciding(List.copyOf(reports));
        this.observed = StandingReports.done(List.copyOf(reports));
        if (published != null) {
            for (PlanVisit v : published.getVisits()) {
                if (v.isPlaced() && v.getStart().isBefore(now)) {
                    history.add(v);
                    historyByKey.put(v.key(), v);
                }
            }
        }
    }

    public static TermState of(Instant now, TermSettings settings, Optional<PlanRevision> published,
                               Optional<PlanRevision> draft, Collection<ObservationReport> reports) {
        return new TermState(now, settings, published.orElse(null), draft.orElse(null), reports);
    }

    public Instant now() {
        return now;
    }

    public TermSettings settings() {
        return settings;
    }

    /** The earliest start a run or an override may give a visit: now plus the lead time. */
    public Instant notBefore() {
        return now.plus(settings.leadTime());
    }

    public Optional<PlanRevision> published() {
        return Optional.ofNullable(published);
    }

    public Optional<PlanRevision> draft() {
        return Optional.ofNullable(draft);
    }

    /** Whether a placed visit has started: it is then history, or would be if it were published. */
    public boolean hasStarted(PlanVisit v) {
        return v.isPlaced() && v.getStart().isBefore(now);
    }

    /** The published visits that have started, as they were published. */
    public List<PlanVisit> history() {
        return List.copyOf(history);
    }

    /** The history entry of a visit, if it has one. */
    public Optional<PlanVisit> historyOf(VisitKey key) {
        return Optional.ofNullable(historyByKey.get(key));
    }

    /** How a placed visit of a revision stands now. */
    public Standing standing(PlanVisit v) {
        if (!hasStarted(v)) {
            return Standing.PLANNED;
        }
        ObservationReport report = deciding.get(v.key());
        if (report != null) {
            return report.getOutcome() == Outcome.DONE ? Standing.OBSERVED : Standing.FAILED;
        }
        if (now.isBefore(v.getEnd())) {
            return Standing.UNDER_WAY;
        }
        return v.getEnd().plus(settings.missedAfter()).isBefore(now) ? Standing.MISSED : Standing.AWAITING_REPORT;
    }

    /** Per visit, the report that decides it (the latest done or failed one). */
    public Map<VisitKey, ObservationReport> deciding() {
        return deciding;
    }

    /** The repeats whose deciding report is done, with that report. */
    public Map<VisitKey, ObservationReport> observed() {
        return observed;
    }

    /**
     * The visit ids of a request already spent: observed, or in history (whatever its standing, a failed or missed
     * repeat keeps its number there).
     */
    public Set<Integer> usedRepeatNumbers(long requestId) {
        Set<Integer> used = new HashSet<>();
        observed.keySet().stream().filter(k -> k.requestId() == requestId).forEach(k -> used.add(k.repeatNo()));
        history.stream().filter(v -> v.getRequestId() == requestId).forEach(v -> used.add(v.getRepeatNo()));
        return used;
    }

    /**
     * The draft as it stands now: the published plan's history, then the draft's visits still ahead and its
     * left-out ones, leaving out any whose id is history (a draft change that came too late to be published) and
     * any placement of the draft that has started without being published (it never happened).
     */
    public List<PlanVisit> draftVisits() {
        List<PlanVisit> out = new ArrayList<>(history);
        if (draft != null) {
            for (PlanVisit v : draft.getVisits()) {
                if (v.isCancelled() || historyByKey.containsKey(v.key()) || hasStarted(v)) {
                    continue;
                }
                out.add(v);
            }
        }
        return out;
    }

    /** The draft's night marks (none without a draft). */
    public List<PlanNight> draftNights() {
        return draft == null ? List.of() : draft.getNights();
    }
}
