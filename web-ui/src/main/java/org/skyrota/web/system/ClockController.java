package org.skyrota.web.system;

import java.time.Instant;
import java.util.List;

import com.fasterxml.jackson.annotation.JsonIgnoreProperties;

import org.springframework.transaction.PlatformTransactionManager;
import org.springframework.transaction.support.TransactionTemplate;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PutMapping;
import org.springframework.web.bind.annotation.RequestBody;
import org.springframework.web.bind.annotation.RestController;

/**
 * The server's time: read by anyone signed in (the dashboard draws its now-line from it), moved forward by an admin
 * only on a server started with {@code --skyrota.clock.settable=true} (demos and the term benchmark walk days so).
 */
@RestController
class ClockController {

    private final ServerClock clock;
    private final AuditLog audit;
    private final TransactionTemplate tx;
    private final org.springframework.context.ApplicationEventPublisher events;

    ClockController(ServerClock clock, AuditLog audit, PlatformTransactionManager transactions,
                    org.springframework.context.ApplicationEventPublisher events) {
        this.events = events;
        this.clock = clock;
        this.audit = audit;
        this.tx = new TransactionTemplate(transactions);
    }

    record ClockView(Instant now, boolean settable) {}

    /** {@code settable}, read-only, is ignored: what a GET answers can be sent back. */
    @JsonIgnoreProperties({"settable"})
    record ClockForm(Instant now) {}

    @GetMapping("/api/clock")
    ClockView read() {
        return new ClockView(clock.instant(), clock.isSettable());
    }

    @PutMapping("/api/clock")
    ClockView set(@RequestBody ClockForm form) {
        if (form == null || form.now() == null) {
            throw new InvalidParametersException(List.of(new FieldProblem("now", "must be given, an instant in UTC")));
        }
        Instant before = clock.instant();
        Instant now = clock.set(form.now());
        tx.executeWithoutResult(status -> audit.record("set", "clock", 0, new ClockView(before, true), new ClockView(now, true)));
        // What the new time has ended (requests whose nights are over) is settled before the answer goes out.
        events.publishEvent(new ClockMoved(before, now));
        return new ClockView(clock.instant(), true);
    }
}
