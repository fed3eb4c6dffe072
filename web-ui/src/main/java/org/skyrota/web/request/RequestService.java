package org.skyrota.web.request;

import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;

import org.skyrota.web.account.AccountRepository;
import org.skyrota.web.account.CurrentUser;
import org.skyrota.web.plugin.TargetKinds;
import org.skyrota.web.program.Program;
import org.skyrota.web.program.ProgramRepository;
import org.skyrota.web.system.AuditLog;
import org.skyrota.web.system.ConflictException;
import org.skyrota.web.system.FieldProblem;
import org.skyrota.web.system.InvalidParametersException;
import org.skyrota.web.system.NotFoundException;
import org.skyrota.web.system.PageView;
import org.skyrota.web.system.SupportedDates;
import org.springframework.context.ApplicationEventPublisher;
import org.springframework.data.domain.Pageable;
import org.springframework.stereotype.Service;
import org.springframework.transaction.annotation.Transactional;

/** Reads, edits and moves observing requests through their states, one transaction per call. */
@Service
@Transactional
public class RequestService {

    static final String KIND = "request";
    static final double DEFAULT_MIN_ALTITUDE_DEG = 30;

    private final ObservingRequestRepository requests;
    private final ProgramRepository programs;
    private final AuditLog audit;
    private final TargetKinds targetKinds;
    private final RequestListing listing;
    private final ApplicationEventPublisher events;
    private final AccountRepository accounts;

    RequestService(ObservingRequestRepository requests, ProgramRepository programs, AuditLog audit,
                   TargetKinds targetKinds, RequestListing listing, AccountRepository accounts,
                   ApplicationEventPublisher events) {
        this.events = events;
        this.accounts = accounts;
        this.listing = listing;
        this.audit = audit;
        this.targetKinds = targetKinds;
        this.requests = requests;
        this.programs = programs;
    }

    /** What a listing may be narrowed to; null members do not narrow. */
    record Filter(RequestState state, String owner, Long programId, String target, Integer priority) {}

    @Transactional(readOnly = true)
    public PageView<RequestView> list(Filter asked, Pageable pageable) {
        if (asked.priority() != null && (asked.priority() < 1 || asked.priority() > 5)) {
            throw new InvalidParametersException(List.of(new FieldProblem("priority", "must be 1 to 5: " + asked.priority())));
        }
        CurrentUser user = CurrentUser.get();
        // A requester sees their own requests only, whatever they filter by.
        Filter filter = user.reviewer() ? asked
                : new Filter(asked.state(), user.username(), asked.programId(), asked.target(), asked.priority());
        return listing.page(filter, pageable);
    }

    /** The stored request, when the signed-in user may see it (else 404, as for {@link #get}). */
    @Transactional(readOnly = true)
    public ObservingRequest readable(long id) {
        return find(id);
    }

    @Transactional(readOnly = true)
    public RequestView get(long id) {
        return RequestView.of(find(id));
    }

    public RequestView create(RequestForm form) {
        return create(form, null);
    }

    /** Creates the request made from the VOEvent packet {@code alertIvorn} (null: not from an alert). */
    RequestView create(RequestForm form, String alertIvorn) {
        CurrentUser user = CurrentUser.get();
        String owner = form.owner() == null || form.owner().isBlank() ? user.username() : form.owner().trim();
        if (!user.reviewer() && !owner.equals(user.username())) {
            throw new InvalidParametersException(List.of(new FieldProblem("owner", "a requester can only create their own requests")));
        }
        // Whoever asks exists; anyone else named as the owner must have an account, or the request would belong to
        // nobody who could ever see it.
        if (!owner.equals(user.username()) && !accounts.existsByUsername(owner)) {
            throw new InvalidParametersException(List.of(new FieldProblem("owner", "names no account: " + owner)));
        }
        ObservingRequest r = new ObservingRequest(referencedProgram(form.programId()), owner);
        apply(form, r);
        r.setAlertIvorn(alertIvorn);
        RequestView created = RequestView.of(requests.saveAndFlush(r));
        audit.record("create", KIND, created.id(), null, created);
        return created;
    }

    public RequestView update(long id, RequestForm form) {
        ObservingRequest r = find(id);
        requireVersion(r, form.version());
        RequestView before = RequestView.of(r);
        if (r.getState() != RequestState.DRAFT) {
            throw new ConflictException("Only a draft can be edited; this request is " + r.getState().name().toLowerCase());
        }
        if (form.owner() != null && !form.owner().isBlank() && !r.getOwner().equals(form.owner().trim())) {
            throw new InvalidParametersException(List.of(new FieldProblem("owner", "cannot be changed by an edit")));
        }
        r.setProgram(referencedProgram(form.programId()));
        apply(form, r);
        RequestView after = RequestView.of(requests.saveAndFlush(r));
        audit.record("update", KIND, id, before, after);
        return after;
    }

    /** Moves the request to {@code target}; {@code reason} is required for a rejection. */
    public RequestView move(long id, Long version, RequestState target, String reason) {
        ObservingRequest r = find(id);
        requireVersion(r, version);
        if (target == RequestState.REJECTED && (reason == null || reason.isBlank())) {
            throw new InvalidParametersException(List.of(new FieldProblem("reason", "is required when rejecting a request")));
        }
        if (reason != null && reason.length() > 500) {
            throw new InvalidParametersException(List.of(new FieldProblem("reason", "may be at most 500 characters")));
        }
        if (target == RequestState.COMPLETED || target == RequestState.EXPIRED) {
            throw new ConflictException("Only the server completes or expires a request, when its repeats are observed"
                    + " or its nights have passed");
        }
        RequestView before = RequestView.of(r);
        RequestState from = r.getState();
        r.moveTo(target, reason == null ? null : reason.trim());
        RequestView after = RequestView.of(requests.saveAndFlush(r));
        audit.record("state:" + target.name().toLowerCase(), KIND, id, before, after);
        events.publishEvent(new RequestStateChanged(id, from, target));
        return after;
    }

    public void delete(long id, Long version) {
        ObservingRequest r = find(id);
        if (version != null) {
            r.requireVersion(KIND, version);
        }
        if (r.getState() != RequestState.DRAFT && r.getState() != RequestState.WITHDRAWN) {
            throw new ConflictException("Only a draft or a withdrawn request can be deleted; withdraw it first");
        }
        audit.record("delete", KIND, id, RequestView.of(r), null);
        requests.delete(r);
        requests.flush();
    }

    /** The request, if the signed-in user may see it; another requester's request does not exist for them. */
    private ObservingRequest find(long id) {
        CurrentUser user = CurrentUser.get();
        return requests.findById(id)
                .filter(r -> user.reviewer() || r.getOwner().equals(user.username()))
                .orElseThrow(() -> new NotFoundException(KIND, id));
    }

    private Program referencedProgram(long programId) {
        return programs.findById(programId).orElseThrow(() ->
                new InvalidParametersException(List.of(new FieldProblem("programId", "names no stored program: " + programId))));
    }

    private static void requireVersion(ObservingRequest r, Long version) {
        if (version == null) {
            throw new InvalidParametersException(List.of(new FieldProblem("version", "is required when editing: send the version you read")));
        }
        r.requireVersion(KIND, version);
    }

    /**
     * The rules between repeats, interval and tolerance (each field's own range is checked on the form). Without an
     * interval, the planner would be free to put every repeat into the same night, which is rarely what a repeat is
     * for; so more than one repeat needs one. A conflict between two fields names both, so that each field shows it.
     */
    static List<FieldProblem> repeatSpacingProblems(int repeats, Double intervalHours, Double toleranceHours) {
        List<FieldProblem> problems = new ArrayList<>();
        if (repeats > 1 && intervalHours == null) {
            problems.add(new FieldProblem("repeatIntervalHours",
                    "is required when repeats is more than 1: the least time between the starts of two visits, hours"));
        }
        if (toleranceHours != null && intervalHours == null) {
            problems.add(new FieldProblem("repeatToleranceHours", "needs repeatIntervalHours, which it loosens"));
        }
        if (toleranceHours != null && intervalHours != null && toleranceHours >= intervalHours) {
            problems.add(new FieldProblem("repeatToleranceHours",
                    "must be less than repeatIntervalHours (" + intervalHours + "): " + toleranceHours));
            problems.add(new FieldProblem("repeatIntervalHours",
                    "must be more than repeatToleranceHours (" + toleranceHours + "): " + intervalHours));
        }
        return problems;
    }

    private void apply(RequestForm form, ObservingRequest r) {
        List<FieldProblem> problems = new ArrayList<>();
        double raDeg = 0;
        double decDeg = 0;
        String kind = TargetKinds.normalise(form.targetKind());
        Map<String, String> parameters = form.targetParameters() == null ? Map.of()
                : form.targetParameters();
        if (TargetKinds.isFixed(kind)) {
            raDeg = coordinate(true, form.ra(), form.raDeg(), problems);
            decDeg = coordinate(false, form.dec(), form.decDeg(), problems);
            if (!parameters.isEmpty()) {
                problems.add(new FieldProblem(TargetKinds.PARAMETERS_FIELD, "a fixed target takes ra and dec, no parameters"));
            }
        } else {
            // Resolving is the check: the kind must be known and accept these parameters. A moving target's
            // position is resolved again when planned; ra and dec are not stored for it.
            try {
                targetKinds.resolve(kind, parameters);
            } catch (InvalidParametersException e) {
                problems.addAll(e.problems());
            }
        }
        // JSON bodies are held to these dates as they are read; imported records are checked here.
        SupportedDates.check("earliestNight", form.earliestNight(), problems);
        SupportedDates.check("latestNight", form.latestNight(), problems);
        SupportedDates.checkOrder("earliestNight", form.earliestNight(), "latestNight", form.latestNight(), problems);
        int repeats = form.repeats() == null ? 1 : form.repeats();
        problems.addAll(repeatSpacingProblems(repeats, form.repeatIntervalHours(), form.repeatToleranceHours()));
        if (!problems.isEmpty()) {
            throw new InvalidParametersException(problems);
        }
        r.setTarget(form.targetName().trim(), raDeg, decDeg);
        r.setTargetKind(kind, TargetKinds.isFixed(kind) ? Map.of() : parameters);
        r.setConditions(form.minAltitudeDeg() == null ? DEFAULT_MIN_ALTITUDE_DEG : form.minAltitudeDeg(),
                form.darkness() == null ? DarknessLimit.ASTRONOMICAL : form.darkness(),
                form.minMoonSeparationDeg(), form.maxMoonIllumination());
        r.setMaxAirmass(form.maxAirmass());
        r.setSchedule(form.earliestNight(), form.latestNight(), repeats, form.priority());
        r.setRepeatSpacing(form.repeatIntervalHours(), form.repeatIntervalHours() == null ? null
                : form.repeatToleranceHours() == null ? 0.0 : form.repeatToleranceHours());
        r.setExposures(form.exposures().stream().map(e -> new Exposure(e.filter().trim(), e.seconds(), e.count())).toList());
    }

    /**
     * Right ascension or declination in degrees, from {@code ra}/{@code dec} (decimal degrees or sexagesimal text) or
     * from {@code raDeg}/{@code decDeg} (decimal degrees, as a request read back carries them); when both are given,
     * they must agree to within a thousandth of an arcsecond.
     */
    private static double coordinate(boolean rightAscension, String text, Double degrees, List<FieldProblem> problems) {
        String field = rightAscension ? "ra" : "dec";
        String degreesField = rightAscension ? "raDeg" : "decDeg";
        if ((text == null || text.isBlank()) && degrees == null) {
            problems.add(new FieldProblem(field, "must not be blank (a fixed target needs ra and dec)"));
            return 0;
        }
        Double fromText = text == null || text.isBlank() ? null : parsed(field, rightAscension, text, problems);
        Double fromDegrees = degrees == null ? null
                : parsed(degreesField, rightAscension, new BigDecimal(Double.toString(degrees)).toPlainString(), problems);
        if (fromText != null && fromDegrees != null && Math.abs(fromText - fromDegrees) > 1e-3 / 3600) {
            problems.add(new FieldProblem(degreesField, "disagrees with " + field + " (" + text + "): send one of them"));
        }
        return fromText != null ? fromText : fromDegrees != null ? fromDegrees : 0;
    }

    private static Double parsed(String field, boolean rightAscension, String text, List<FieldProblem> problems) {
        try {
            return rightAscension ? Sexagesimal.rightAscensionDeg(text) : Sexagesimal.declinationDeg(text);
        } catch (IllegalArgumentException e) {
            problems.add(new FieldProblem(field, e.getMessage()));
            return null;
        }
    }
}
