package org.skyrota.web.request;

import java.io.IOException;
import java.io.InputStream;
import java.time.Clock;
import java.time.Duration;
import java.time.LocalDate;
import java.time.ZoneOffset;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.Optional;

import org.skyrota.plugin.ImportResult;
import org.skyrota.plugin.RequestImporter;
import org.skyrota.plugin.RequestRecord;
import org.skyrota.web.run.PlannerRun;
import org.skyrota.web.run.PlannerRunRepository;
import org.skyrota.web.run.RunForm;
import org.skyrota.web.run.RunService;
import org.skyrota.web.run.RunState;
import org.skyrota.web.run.RunView;
import org.skyrota.web.system.AuditLog;
import org.skyrota.web.system.ConflictException;
import org.skyrota.web.system.FieldProblem;
import org.skyrota.web.system.InvalidParametersException;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.beans.factory.annotation.Value;
import org.springframework.dao.ConcurrencyFailureException;
import org.springframework.dao.DataIntegrityViolationException;
import org.springframework.stereotype.Service;
import org.springframework.transaction.PlatformTransactionManager;
import org.springframework.transaction.support.TransactionTemplate;

/**
 * Alerts about transients, as IVOA VOEvent 2.0 packets: each becomes a time-critical request, accepted at once, in the
 * target-of-opportunity program, and a planner run re-plans the nights it is open.
 *
 * <p>A packet is known by its IVORN, which the request keeps (unique). A packet whose IVORN a request already has,
 * sent again by a broker that reconnects or relayed by a second broker, answers that request and changes nothing; two
 * such packets arriving together still make one request, since the unique index lets only one of them store it.
 */
@Service
public class Alerts {

    /** The media type of the bundled VOEvent importer. */
    public static final String VOEVENT = "application/x-voevent+xml";
    /** The server setting that names the program alerts go to (read by the VOEvent plugin). */
    static final String PROGRAM_SETTING = "skyrota.voevent.program";
    /** The audit action of a packet whose IVORN a stored request already has. */
    static final String REPEATED = "alert:repeated";

    /** How often a packet that lost the race for its IVORN looks for the request that won it. */
    private static final int ATTEMPTS = 3;
    private static final String STORED = " The request is stored and accepted;";

    private static final Logger log = LoggerFactory.getLogger(Alerts.class);

    private final RequestImports imports;
    private final RequestService requests;
    private final ObservingRequestRepository stored;
    private final RunService runs;
    private final PlannerRunRepository runRecords;
    private final AuditLog audit;
    private final Clock clock;
    private final TransactionTemplate tx;
    private final int replanSeconds;

    Alerts(RequestImports imports, RequestService requests, ObservingRequestRepository stored, RunService runs,
           PlannerRunRepository runRecords, AuditLog audit, Clock clock, PlatformTransactionManager transactions,
           @Value("${skyrota.alerts.replan-seconds:30}") int replanSeconds) {
        this.imports = imports;
        this.requests = requests;
        this.stored = stored;
        this.runs = runs;
        this.runRecords = runRecords;
        this.audit = audit;
        this.clock = clock;
        this.tx = new TransactionTemplate(transactions);
        this.replanSeconds = replanSeconds;
    }

    /**
     * @param run        the re-planning run this packet started, or for a packet received before the run over the
     *                   request's nights under way now; null when there is none
     * @param runProblem in plain words, why this packet started no run, or null when it started one
     */
    public record Outcome(RequestView request, RunView run, String runProblem) {}

    /** @param created true when this packet made the request, false when an earlier packet with its IVORN had */
    public record Received(Outcome outcome, boolean created) {}

    /**
     * Reads the packet, stores its request and starts a re-plan; or answers the request an earlier packet with the
     * same IVORN made.
     *
     * @throws InvalidParametersException naming the packet's element at fault; then nothing is stored
     * @throws ConflictException          when this server cannot take alerts as configured (no VOEvent plugin, no
     *                                    program of the name the setting gives); then nothing is stored
     */
    public Received receive(InputStream packet) throws IOException {
        RequestImporter importer = imports.importer(VOEVENT).orElseThrow(() -> new ConflictException(
                "No VOEvent plugin is loaded (it reads " + VOEVENT + "); see GET /api/plugins"));
        ImportResult read = importer.read(packet);
        if (!read.isAccepted()) {
            throw new InvalidParametersException(read.problems().stream()
                    .map(p -> new FieldProblem(p.field() == null ? "packet" : p.field(), p.message())).toList());
        }
        if (read.requests().size() != 1) {
            throw new InvalidParametersException(List.of(new FieldProblem("packet", "must describe exactly one event")));
        }
        RequestRecord record = read.requests().get(0);
        String ivorn = record.sourceId();
        if (ivorn != null && ivorn.length() > ObservingRequest.MAX_IVORN_LENGTH) {
            throw new InvalidParametersException(List.of(new FieldProblem("ivorn",
                    "may be at most " + ObservingRequest.MAX_IVORN_LENGTH + " characters long; this one has " + ivorn.length())));
        }
        for (int attempt = 1; ; attempt++) {
            // Known before anything else is checked: a packet received before is answered as it was stored, even if
            // the server's settings have changed since.
            Optional<Received> known = ivorn == null ? Optional.empty() : repeated(ivorn);
            if (known.isPresent()) {
                return known.get();
            }
            RequestForm form = form(record);
            try {
                RequestView accepted = store(form, ivorn, record);
                return new Received(replan(accepted), true);
            } catch (DataIntegrityViolationException | ConcurrencyFailureException e) {
                // Another packet with this IVORN stored its request first (the unique index refused this one), or is
                // storing it now: look for it again.
                if (ivorn == null || attempt == ATTEMPTS) {
                    throw e;
                }
                log.info("Alert {} was being stored by another packet at the same moment ({}); looking for its request",
                        ivorn, e.getClass().getSimpleName());
            }
        }
    }

    /** The answer to a packet whose IVORN a stored request already has, audited; empty when none has. */
    private Optional<Received> repeated(String ivorn) {
        Optional<RequestView> existing = tx.execute(status -> stored.findByAlertIvorn(ivorn).map(r -> {
            RequestView view = RequestView.of(r);
            audit.record(REPEATED, RequestService.KIND, view.id(), view, view);
            return view;
        }));
        return existing.map(view -> {
            StringBuilder problem = new StringBuilder("This alert (").append(ivorn).append(") was already received: it is request ")
                    .append(view.id()).append(", ").append(view.state().name().toLowerCase(Locale.ROOT))
                    .append(", so no new run was started.");
            RunView now = null;
            if (view.earliestNight() != null && view.latestNight() != null) {
                Optional<PlannerRun> active = activeRunOver(view.earliestNight(), view.latestNight());
                if (active.isPresent()) {
                    now = runs.get(active.get().getId());
                    problem.append(" Run ").append(now.id()).append(" is under way over the nights ").append(now.firstNight())
                            .append(" to ").append(now.lastNight()).append('.');
                }
            }
            log.info("Alert {} received again; it is request {}", ivorn, view.id());
            return new Received(new Outcome(view, now, problem.toString()), false);
        });
    }

    private RequestView store(RequestForm form, String ivorn, RequestRecord record) {
        try {
            return tx.execute(status -> {
                RequestView created = requests.create(form, ivorn);
                RequestView submitted = requests.move(created.id(), created.version(), RequestState.SUBMITTED, null);
                return requests.move(submitted.id(), submitted.version(), RequestState.ACCEPTED, null);
            });
        } catch (InvalidParametersException e) {
            throw refusal(record, e);
        }
    }

    /** The form for the packet's request, checked; a refusal names what the sender can act on. */
    private RequestForm form(RequestRecord record) {
        try {
            return imports.form(record, "");
        } catch (InvalidParametersException e) {
            throw refusal(record, e);
        }
    }

    /**
     * The server's checks of the request, said in terms of the packet: the nights come from its {@code ISOTime}, the
     * target's name from its {@code Name} (or the IVORN), the position from {@code C1} and {@code C2}. Everything else
     * comes from this server's alert settings, so a problem there is the server's (409), not the sender's.
     */
    private RuntimeException refusal(RequestRecord record, InvalidParametersException e) {
        List<FieldProblem> packet = new ArrayList<>();
        List<String> server = new ArrayList<>();
        for (FieldProblem p : e.problems()) {
            switch (p.field()) {
                case "program", "programId" -> {
                    return new ConflictException("Alerts go to the program that the setting " + PROGRAM_SETTING
                            + " names, \"" + record.program() + "\", and no stored program has"
                            + " that code or title. Create a program with that code or title (POST /api/programs), or"
                            + " start the server with --" + PROGRAM_SETTING + "=<the code or title of a stored program>."
                            + " Nothing was stored.");
                }
                case "earliestNight", "latestNight" -> {
                    if (packet.stream().noneMatch(q -> q.field().equals("ISOTime"))) {
                        packet.add(new FieldProblem("ISOTime", nightsProblem(record)));
                    }
                }
                case "targetName" -> packet.add(new FieldProblem("Name",
                        "the target's name (Why/Inference/Name, or else the IVORN's fragment) " + p.message()));
                case "ra" -> packet.add(new FieldProblem("C1", p.message()));
                case "dec" -> packet.add(new FieldProblem("C2", p.message()));
                default -> server.add(p.field() + ": " + p.message());
            }
        }
        if (!packet.isEmpty()) {
            return new InvalidParametersException(packet);
        }
        return new ConflictException("This server's alert settings make a request it refuses (" + String.join("; ", server)
                + "): the settings, not the packet, are at fault. Nothing was stored.");
    }

    private static String nightsProblem(RequestRecord record) {
        if (record.earliestNight() == null || record.latestNight() == null) {
            return "the event time gives nights the server cannot plan";
        }
        String nights = "the event time gives the nights " + record.earliestNight() + " to " + record.latestNight();
        if (record.latestNight().isBefore(record.earliestNight())) {
            return nights + ", which are out of order";
        }
        return nights + ", and the server plans only nights from " + RequestImports.FIRST_NIGHT + " to "
                + RequestImports.LAST_NIGHT;
    }

    /** Starts the run over the request's nights, or says in plain words why none started. */
    private Outcome replan(RequestView accepted) {
        LocalDate first = accepted.earliestNight();
        LocalDate last = accepted.latestNight();
        if (first == null || last == null) {
            return new Outcome(accepted, null, "No re-plan was started: the alert's request names no nights." + STORED
                    + " the next run will plan it.");
        }
        String nights = first + " to " + last;
        // The night at Greenwich that holds this instant (as the plugin dates an event), less one: no site on Earth
        // is more than one night behind it, so a request that ends before it is over everywhere.
        LocalDate earliestOpen = clock.instant().minus(Duration.ofHours(12)).atOffset(ZoneOffset.UTC).toLocalDate().minusDays(1);
        if (last.isBefore(earliestOpen)) {
            return new Outcome(accepted, null, "No re-plan was started: this alert's nights (" + nights + ") are over at every site.");
        }
        try {
            RunView run = runs.start(new RunForm(first, last, null, replanSeconds, null),
                    "alert: request " + accepted.id() + " (" + accepted.targetName() + ")");
            // A run fails, if it does, while it reads the plan and the sky, in its first seconds: the sender is told
            // then. A later failure is in the run's message and in the audit log, under the alert's purpose.
            RunView now = settled(run.id());
            if ("failed".equals(now.state())) {
                return new Outcome(accepted, now, "The re-plan run " + now.id() + " failed: " + now.message() + STORED
                        + " the next run over its nights will plan it.");
            }
            return new Outcome(accepted, now, null);
        } catch (ConflictException e) {
            // The request is stored and accepted; the run that is going on, or the next one, will plan it.
            String why = activeRunOver(first, last)
                    .map(r -> "run " + r.getId() + " is already planning the nights " + r.getFirstNight() + " to "
                            + r.getLastNight() + ", which overlap this alert's nights (" + nights + ").")
                    .orElse(e.getMessage() + (e.getMessage().endsWith(".") ? "" : "."));
            log.info("Alert request {} stored; no re-plan started: {}", accepted.id(), e.getMessage());
            return new Outcome(accepted, null, "No re-plan was started: " + why + STORED
                    + " the next run over its nights will plan it.");
        } catch (InvalidParametersException e) {
            log.info("Alert request {} stored; the planner refused its nights: {}", accepted.id(), e.getMessage());
            return new Outcome(accepted, null, "No re-plan was started: the planner did not take the nights " + nights
                    + " (" + words(e.problems()) + ")." + STORED + " a run over nights the planner takes will plan it.");
        } catch (RuntimeException e) {
            log.error("Alert request {} stored; the re-plan could not be started", accepted.id(), e);
            return new Outcome(accepted, null, "No re-plan was started because of an error on the server (its log says"
                    + " more)." + STORED + " start a run over the nights " + nights + " to plan it.");
        }
    }

    /** The run once it has ended, or as it stands after three seconds, whichever is first. */
    private RunView settled(long runId) {
        long until = System.nanoTime() + 3_000_000_000L;
        RunView run = runs.get(runId);
        while (("queued".equals(run.state()) || "running".equals(run.state())) && System.nanoTime() < until) {
            try {
                Thread.sleep(100);
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                break;
            }
            run = runs.get(runId);
        }
        return run;
    }

    /** The queued or running run, if any, over nights that overlap {@code first} to {@code last}. */
    private Optional<PlannerRun> activeRunOver(LocalDate first, LocalDate last) {
        return runRecords.findByStateIn(List.of(RunState.QUEUED, RunState.RUNNING)).stream()
                .filter(r -> r.overlaps(first, last))
                .min(Comparator.comparing(PlannerRun::getId));
    }

    /** "firstNight: must not be in the past" as "first night: must not be in the past". */
    private static String words(List<FieldProblem> problems) {
        List<String> out = new ArrayList<>();
        for (FieldProblem p : problems) {
            out.add(p.field().replaceAll("([a-z])([A-Z])", "$1 $2").toLowerCase(Locale.ROOT) + ": " + p.message());
        }
        return String.join("; ", out);
    }
}
