package org.skyrota.web.request;

import java.io.IOException;
import java.io.InputStream;
import java.util.List;

import org.skyrota.plugin.ImportResult;
import org.skyrota.plugin.RequestImporter;
import org.skyrota.plugin.RequestRecord;
import org.skyrota.web.run.RunForm;
import org.skyrota.web.run.RunService;
import org.skyrota.web.run.RunView;
import org.skyrota.web.system.ConflictException;
import org.skyrota.web.system.FieldProblem;
import org.skyrota.web.system.InvalidParametersException;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.beans.factory.annotation.Value;
import org.springframework.stereotype.Service;
import org.springframework.transaction.PlatformTransactionManager;
import org.springframework.transaction.support.TransactionTemplate;

/**
 * Alerts about transients, as IVOA VOEvent 2.0 packets: each becomes a time-critical request, accepted at once, in the
 * target-of-opportunity program, and a planner run re-plans the nights it is open.
 */
@Service
public class Alerts {

    /** The media type of the bundled VOEvent importer. */
    public static final String VOEVENT = "application/x-voevent+xml";

    private static final Logger log = LoggerFactory.getLogger(Alerts.class);

    private final RequestImports imports;
    private final RequestService requests;
    private final RunService runs;
    private final TransactionTemplate tx;
    private final int replanSeconds;

    Alerts(RequestImports imports, RequestService requests, RunService runs, PlatformTransactionManager transactions,
           @Value("${skyrota.alerts.replan-seconds:30}") int replanSeconds) {
        this.imports = imports;
        this.requests = requests;
        this.runs = runs;
        this.tx = new TransactionTemplate(transactions);
        this.replanSeconds = replanSeconds;
    }

    /**
     * @param run        the re-planning run, or null when none could start
     * @param runProblem why no run started (another run covers those nights), or null
     */
    public record Outcome(RequestView request, RunView run, String runProblem) {}

    public Outcome receive(InputStream packet) throws IOException {
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
        RequestView accepted = tx.execute(status -> {
            RequestView created = requests.create(imports.form(record, ""));
            RequestView submitted = requests.move(created.id(), created.version(), RequestState.SUBMITTED, null);
            return requests.move(submitted.id(), submitted.version(), RequestState.ACCEPTED, null);
        });
        try {
            RunView run = runs.start(new RunForm(accepted.earliestNight(), accepted.latestNight(), null, replanSeconds, null));
            return new Outcome(accepted, run, null);
        } catch (ConflictException e) {
            // The request is stored and accepted; the run that is going on, or the next one, will plan it.
            log.info("Alert request {} stored; no re-plan started: {}", accepted.id(), e.getMessage());
            return new Outcome(accepted, null, e.getMessage());
        }
    }
}
