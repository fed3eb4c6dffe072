package org.skyrota.web.system;

import java.time.Clock;
import java.time.Duration;
import java.time.Instant;
import java.time.ZoneId;
import java.time.ZoneOffset;
import java.time.format.DateTimeParseException;
import java.time.temporal.ChronoUnit;
import java.util.List;

import org.springframework.beans.factory.annotation.Value;
import org.springframework.stereotype.Component;

/**
 * The server's one clock: every "now" the server uses (what is past, what a run may place, when a change was made)
 * is read here. It runs at the pace of the system clock, from the instant {@code skyrota.clock} names when one is
 * given (a demo or a test set in another season), else from the system time. Time moves one way: with
 * {@code skyrota.clock.settable=true} (tests, demos, the term benchmark) it can be moved forward, never back.
 */
@Component
public class ServerClock extends Clock {

    /** The clock that entity time stamps read: set when the server's clock is made, the system clock before that. */
    private static volatile Clock current = Clock.systemUTC();

    private final boolean settable;
    /** What is added to the system time; only ever grows. */
    private volatile Duration offset;

    ServerClock(@Value("${skyrota.clock:}") String start, @Value("${skyrota.clock.settable:false}") boolean settable) {
        this.settable = settable;
        this.offset = start == null || start.isBlank() ? Duration.ZERO : Duration.between(Instant.now(), parse(start));
        current = this;
    }

    /** A clock that starts at {@code start} and can be moved forward (for tests that need no server). */
    public static ServerClock startingAt(Instant start) {
        return new ServerClock(start.toString(), true);
    }

    /** The server's clock, for code that cannot be handed it (entity callbacks). */
    public static Instant currentInstant() {
        return current.instant();
    }

    private static Instant parse(String text) {
        try {
            return Instant.parse(text.trim());
        } catch (DateTimeParseException e) {
            throw new IllegalArgumentException("skyrota.clock must be an instant in UTC such as 2027-03-01T18:00:00Z, not '"
                    + text + "'");
        }
    }

    @Override
    public ZoneId getZone() {
        return ZoneOffset.UTC;
    }

    @Override
    public Clock withZone(ZoneId zone) {
        throw new UnsupportedOperationException("the server's clock is in UTC; convert instants to a zone where needed");
    }

    @Override
    public Instant instant() {
        return Instant.now().plus(offset);
    }

    public boolean isSettable() {
        return settable;
    }

    /**
     * Moves the clock to {@code to}, from where it runs on.
     *
     * @throws InvalidParametersException naming {@code now} when {@code to} is before the clock's time
     * @throws ConflictException when the clock was not started settable
     */
    public synchronized Instant set(Instant to) {
        if (!settable) {
            throw new ConflictException("This server's clock cannot be set; start it with --skyrota.clock.settable=true");
        }
        Instant now = instant();
        if (to.isBefore(now.truncatedTo(ChronoUnit.SECONDS))) {
            throw new InvalidParametersException(List.of(new FieldProblem("now",
                    "time moves one way: the server's clock reads " + now.truncatedTo(ChronoUnit.SECONDS)
                            + ", so it cannot be set back to " + to)));
        }
        offset = offset.plus(Duration.between(now, to).isNegative() ? Duration.ZERO : Duration.between(now, to));
        return instant();
    }

    /** Moves the clock forward by {@code by}. */
    public Instant advance(Duration by) {
        return set(instant().plus(by));
    }
}
