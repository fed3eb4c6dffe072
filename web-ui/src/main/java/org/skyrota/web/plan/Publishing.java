package org.skyrota.web.plan;

import java.time.Clock;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Set;
import java.util.stream.Collectors;

import org.skyrota.web.account.CurrentUser;
import org.skyrota.web.program.ProgramRepository;
import org.skyrota.web.request.ObservingRequestRepository;
import org.skyrota.web.request.RequestState;
import org.skyrota.web.system.AuditLog;
import org.skyrota.web.system.ConflictException;
import org.skyrota.web.system.FieldProblem;
import org.skyrota.web.system.InvalidParametersException;
import org.springframework.stereotype.Service;
import org.springframework.transaction.annotation.Transactional;

/**
 * Publishing the draft: a promise to the telescopes and the students. A draft that breaks a hard rule is refused
 * unless the coordinator forces it with a reason (audited); a draft that changes nothing publishes nothing new. The
 * published revision keeps history exactly as it was published, takes the draft's visits ahead (of requests still
 * accepted), and keeps the visits it gave up as cancelled entries. Each visit's calendar sequence is the revision in
 * which it last changed (new, moved or cancelled), so an unchanged visit keeps its sequence and a changed one gets a
 * higher one, and subscribed calendars update or remove exactly those.
 */
@Service
@Transactional
public class Publishing {

    private final PlanRevisionRepository revisions;
    private final ObservingRequestRepository requests;
    private final ProgramRepository programs;
    private final PlanInputs inputs;
    private final PlanScorer scorer;
    private final AuditLog audit;
    private final Clock clock;

    Publishing(PlanRevisionRepository revisions, ObservingRequestRepository requests, ProgramRepository programs,
               PlanInputs inputs, PlanScorer scorer, AuditLog audit, Clock clock) {
        this.revisions = revisions;
        this.requests = requests;
        this.programs = programs;
        this.inputs = inputs;
        this.scorer = scorer;
        this.audit = audit;
        this.clock = clock;
    }

    /**
     * What publishing did.
     *
     * @param revision  the published revision now in force (unchanged when nothing changed)
     * @param changed   whether a new revision was published
     * @param message   in plain words
     * @param placed    visits ahead newly in the plan; {@code moved} ahead in another place; {@code cancelled} given up
     * @param forced    the coordinator's reason when the draft broke a hard rule and was published all the same
     * @param plan      the published plan as the caller reads it (filled in by the controller)
     */
    public record PublishView(Long revision, boolean changed, String message, int placed, int moved, int cancelled,
                              int unchanged, String forced, PlanViews.PlanView plan) {

        PublishView withPlan(PlanViews.PlanView published) {
            return new PublishView(revision, changed, message, placed, moved, cancelled, unchanged, forced, published);
        }
    }

    /** A broken hard rule as the refusal names it. */
    public record BrokenRule(String rule, List<String> visits, String program, String grant) {}

    public PublishView publish(long revision, boolean force, String reason) {
        TermState term = inputs.term();
        PlanRevision draft = term.draft().orElseThrow(() -> new ConflictException("There is no draft plan to publish"));
        if (draft.getId() != revision) {
            throw new ConflictException("The draft is revision " + draft.getId() + ", not " + revision
                    + "; read the draft again before publishing");
        }
        String why = reason == null || reason.isBlank() ? null : reason.trim();
        if (force && why == null) {
            throw new InvalidParametersException(List.of(new FieldProblem("reason",
                    "is required to publish a draft that breaks a hard rule: say why it is published all the same")));
        }
        if (why != null && why.length() > 500) {
            throw new InvalidParametersException(List.of(new FieldProblem("reason", "at most 500 characters")));
        }
        List<PlanVisit> draftVisits = term.draftVisits();
        Set<Long> accepted = new HashSet<>();
        Map<Long, RequestState> stateOf = new HashMap<>();
        requests.findAll().forEach(r -> {
            stateOf.put(r.getId(), r.getState());
            if (r.getState() == RequestState.ACCEPTED) {
                accepted.add(r.getId());
            }
        });
        PlanRevision old = term.published().orElse(null);
        Map<VisitKey, PlanVisit> previous = new HashMap<>();
        if (old != null) {
            old.getVisits().stream().filter(v -> (v.isPlaced() || v.isCancelled()) && !v.getStart().isBefore(term.now()))
                    .forEach(v -> previous.put(v.key(), v));
        }

        List<PlanVisit> visits = new ArrayList<>();
        term.history().forEach(v -> visits.add(v.copy()));
        int placed = 0;
        int moved = 0;
        int same = 0;
        Set<VisitKey> ahead = new HashSet<>();
        for (PlanVisit v : draftVisits) {
            if (term.hasStarted(v) || !accepted.contains(v.getRequestId())) {
                continue;
            }
            PlanVisit copy = v.copy();
            if (v.isPlaced()) {
                PlanVisit was = previous.get(v.key());
                if (was == null) {
                    copy.setSequence(PlanVisit.UNSTAMPED);
                    placed++;
                } else if (was.isPlaced() && was.samePlaceAs(v)) {
                    copy.setSequence(was.getSequence());
                    same++;
                } else {
                    copy.setSequence(PlanVisit.UNSTAMPED);
                    if (was.isPlaced()) {
                        moved++;
                    } else {
                        placed++;
                    }
                }
                ahead.add(v.key());
            }
            visits.add(copy);
        }
        int cancelled = 0;
        for (PlanVisit was : previous.values()) {
            if (ahead.contains(was.key())) {
                continue;
            }
            if (was.isCancelled()) {
                visits.add(was.copy());
            } else {
                RequestState state = stateOf.get(was.getRequestId());
                visits.add(was.cancelled(state == null ? "its request was deleted"
                        : state != RequestState.ACCEPTED ? "its request is " + state.name().toLowerCase()
                        : "dropped from the plan"));
                cancelled++;
            }
        }

        if (old != null && placed == 0 && moved == 0 && cancelled == 0 && sameNights(old, draft)
                && sameLeftOut(old, visits)) {
            return new PublishView(old.getId(), false, "Nothing changed since revision " + old.getId()
                    + " was published, so nothing new was published", 0, 0, 0, same, null, null);
        }

        // Scored only when something is to be published: the plan ahead must keep every hard rule, or be forced.
        PlanScorer.Scored scored = scorer.score(term, draft.getFirstNight(), draft.getLastNight(), draftVisits,
                draft.getNights());
        List<BrokenRule> broken = scored.broken().stream().map(b -> new BrokenRule(b.rule(), b.visits(),
                b.programId() == null ? null : programCode(b.programId()), b.grant())).toList();
        if (!broken.isEmpty() && !force) {
            String rules = broken.stream().map(BrokenRule::rule).distinct().collect(Collectors.joining(", "));
            throw new ConflictException("The draft breaks hard rules (" + rules + "): mend it, or publish it all the"
                    + " same with force=true and a reason", Map.of("broken", broken));
        }

        Map<String, Object> before = null;
        for (PlanRevision retired : revisions.findByState(PlanRevision.State.PUBLISHED)) {
            before = Drafts.summary(retired);
            retired.setState(PlanRevision.State.RETIRED);
        }
        PlanRevision copy = new PlanRevision(PlanRevision.State.DRAFT, draft.getFirstNight(), draft.getLastNight());
        if (old != null) {
            copy.widenTo(old.getFirstNight(), old.getLastNight());
        }
        copy.getVisits().addAll(visits);
        draft.getNights().forEach(n -> copy.getNights().add(n.copy()));
        copy.setScore(scored.score().toString());
        copy.setRunId(draft.getRunId());
        copy.markPublished(clock.instant(), CurrentUser.get().username());
        revisions.saveAndFlush(copy);
        // A visit's calendar sequence is the published revision in which it last changed: it only ever grows.
        copy.getVisits().stream().filter(v -> v.getSequence() == PlanVisit.UNSTAMPED)
                .forEach(v -> v.setSequence(copy.getId().intValue()));
        revisions.saveAndFlush(copy);
        Map<String, Object> after = Drafts.summary(copy);
        after.put("fromDraft", draft.getId());
        if (force && !broken.isEmpty()) {
            after.put("forced", why);
            after.put("broken", broken);
        }
        audit.record("publish", "plan", copy.getId(), before, after);
        String message = String.format("Revision %d published: %d visit%s new, %d moved, %d cancelled, %d unchanged%s",
                copy.getId(), placed, placed == 1 ? "" : "s", moved, cancelled, same,
                force && !broken.isEmpty() ? "; published despite broken hard rules: " + why : "");
        return new PublishView(copy.getId(), true, message, placed, moved, cancelled, same,
                force && !broken.isEmpty() ? why : null, null);
    }

    private static boolean sameNights(PlanRevision published, PlanRevision draft) {
        Set<List<Object>> a = published.getNights().stream()
                .map(n -> List.<Object>of(n.getTelescopeId(), n.getNight(), n.getState(), Objects.toString(n.getReason())))
                .collect(Collectors.toSet());
        Set<List<Object>> b = draft.getNights().stream()
                .map(n -> List.<Object>of(n.getTelescopeId(), n.getNight(), n.getState(), Objects.toString(n.getReason())))
                .collect(Collectors.toSet());
        return a.equals(b);
    }

    private static boolean sameLeftOut(PlanRevision published, List<PlanVisit> visits) {
        Map<VisitKey, String> a = new LinkedHashMap<>();
        published.getVisits().stream().filter(v -> !v.isPlaced() && !v.isCancelled())
                .forEach(v -> a.put(v.key(), Objects.toString(v.getReason())));
        Map<VisitKey, String> b = new LinkedHashMap<>();
        visits.stream().filter(v -> !v.isPlaced() && !v.isCancelled())
                .forEach(v -> b.put(v.key(), Objects.toString(v.getReason())));
        return a.equals(b);
    }

    private String programCode(long programId) {
        return programs.findById(programId).map(p -> p.getCode()).orElse(String.valueOf(programId));
    }
}
