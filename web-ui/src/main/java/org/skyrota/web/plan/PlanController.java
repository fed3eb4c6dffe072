package org.skyrota.web.plan;

import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;

import org.skyrota.web.plan.PlanViews.CompareView;
import org.skyrota.web.plan.PlanViews.EffectView;
import org.skyrota.web.plan.PlanViews.PlanStatusView;
import org.skyrota.web.plan.PlanViews.PlanView;
import org.skyrota.web.plan.PlanViews.UsageView;
import org.skyrota.web.system.FieldProblem;
import org.skyrota.web.system.InvalidParametersException;
import org.skyrota.web.system.SupportedDates;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.PutMapping;
import org.springframework.web.bind.annotation.RequestBody;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.bind.annotation.RestController;

@RestController
class PlanController {

    private final PlanService service;
    private final Drafts drafts;
    private final Publishing publishing;

    PlanController(PlanService service, Drafts drafts, Publishing publishing) {
        this.service = service;
        this.drafts = drafts;
        this.publishing = publishing;
    }

    @GetMapping("/api/plans/draft")
    PlanView draft(@RequestParam(required = false) LocalDate from, @RequestParam(required = false) LocalDate to,
                   @RequestParam(required = false) Long siteId) {
        return service.draft(from, ordered(from, to), siteId);
    }

    @GetMapping("/api/plans/published")
    PlanView published(@RequestParam(required = false) LocalDate from, @RequestParam(required = false) LocalDate to,
                       @RequestParam(required = false) Long siteId) {
        return service.published(from, ordered(from, to), siteId);
    }

    @GetMapping("/api/plans/compare")
    CompareView compare(@RequestParam(required = false) LocalDate from, @RequestParam(required = false) LocalDate to) {
        return service.compare(from, ordered(from, to));
    }

    /** {@code to}, when it is not before {@code from}; else a 400 naming both (an empty answer would hide the mistake). */
    private static LocalDate ordered(LocalDate from, LocalDate to) {
        List<FieldProblem> problems = new ArrayList<>();
        SupportedDates.checkOrder("from", from, "to", to, problems);
        if (!problems.isEmpty()) {
            throw new InvalidParametersException(problems);
        }
        return to;
    }

    /**
     * Publishes draft {@code revision}; a draft that breaks a hard rule is refused (409 naming the rules and visits)
     * unless {@code force=true} with a {@code reason}.
     */
    @PostMapping("/api/plans/draft/publish")
    Publishing.PublishView publish(@RequestParam long revision, @RequestParam(defaultValue = "false") boolean force,
                                   @RequestParam(required = false) String reason) {
        // Read after the publishing transaction has committed, so the answer holds what every reader now sees.
        return publishing.publish(revision, force, reason).withPlan(service.published(null, null, null));
    }

    record NightForm(Long telescopeId, Long siteId, LocalDate night, String state, String reason) {}

    @PutMapping("/api/plans/draft/nights")
    EffectView nights(@RequestBody NightForm form, @RequestParam(required = false) Long version,
                      @RequestParam(defaultValue = "false") boolean dryRun) {
        return drafts.setNight(form.telescopeId(), form.siteId(), form.night(), form.state(), form.reason(), version, dryRun);
    }

    record PlaceForm(Long telescopeId, Instant start) {}

    @PostMapping("/api/visits/{id}/pin")
    EffectView pin(@PathVariable String id, @RequestBody(required = false) PlaceForm form,
                   @RequestParam(required = false) Long version, @RequestParam(defaultValue = "false") boolean dryRun) {
        return drafts.pin(id, form == null ? null : form.telescopeId(), form == null ? null : form.start(), version, dryRun);
    }

    @PostMapping("/api/visits/{id}/move")
    EffectView move(@PathVariable String id, @RequestBody PlaceForm form,
                    @RequestParam(required = false) Long version, @RequestParam(defaultValue = "false") boolean dryRun) {
        return drafts.move(id, form.telescopeId(), form.start(), version, dryRun);
    }

    @PostMapping("/api/visits/{id}/unpin")
    EffectView unpin(@PathVariable String id, @RequestParam(required = false) Long version,
                     @RequestParam(defaultValue = "false") boolean dryRun) {
        return drafts.unpin(id, version, dryRun);
    }

    @PostMapping("/api/visits/{id}/unplace")
    EffectView unplace(@PathVariable String id, @RequestParam(required = false) Long version,
                       @RequestParam(defaultValue = "false") boolean dryRun) {
        return drafts.unplace(id, version, dryRun);
    }

    @GetMapping("/api/visits/{id}/candidates")
    List<Drafts.CandidateView> candidates(@PathVariable String id) {
        return drafts.candidates(id);
    }

    @GetMapping("/api/programs/usage")
    List<UsageView> usage() {
        return service.usage();
    }

    /** One program's grants as a ledger: granted, observed, published, draft and remaining hours per grant. */
    @GetMapping("/api/programs/{id}/usage")
    UsageView usage(@PathVariable long id) {
        return service.usage(id);
    }

    @GetMapping("/api/requests/{id}/plan-status")
    PlanStatusView planStatus(@PathVariable long id) {
        return service.planStatus(id);
    }
}
