package org.skyrota.planning.model;

import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.util.List;

/**
 * An accepted observing request. It becomes {@code repeats} visits, each one execution of the exposure plan.
 *
 * @param id           stable identifier
 * @param programId    the program whose time it spends
 * @param owner        the student or member who asked for it
 * @param target       what to point at
 * @param exposures    the exposure plan, in order
 * @param limits       the conditions every visit needs
 * @param earliestNight first night (site-local date of the evening) a visit may use
 * @param latestNight  last night a visit may use
 * @param repeats      number of visits, at least 1
 * @param interval     spacing between successive visits, also from the repeats already observed (zero when there
 *                     is a single visit and nothing observed)
 * @param tolerance    how much closer than the interval a repeat may still be
 * @param priority     1 (low) to 5 (high)
 * @param observedStarts when the repeats already observed were taken: {@code repeats} counts only the open ones,
 *                       and those keep the spacing from these as from each other
 */
public record Request(String id, String programId, String owner, Target target, List<ExposureStep> exposures,
                      ObservingLimits limits, LocalDate earliestNight, LocalDate latestNight, int repeats,
                      Duration interval, Duration tolerance, int priority, List<Instant> observedStarts) {

    /** A request none of whose repeats has been observed yet. */
    public Request(String id, String programId, String owner, Target target, List<ExposureStep> exposures,
                   ObservingLimits limits, LocalDate earliestNight, LocalDate latestNight, int repeats,
                   Duration interval, Duration tolerance, int priority) {
        this(id, programId, owner, target, exposures, limits, earliestNight, latestNight, repeats, interval, tolerance,
                priority, List.of());
    }

    public Request {
        Checks.notBlank("request id", id);
        Checks.notBlank("programId of request " + id, programId);
        Checks.notNull("target of request " + id, target);
        exposures = List.copyOf(Checks.notNull("exposures of request " + id, exposures));
        if (exposures.isEmpty()) {
            throw new IllegalArgumentException("exposures of request " + id + " must not be empty");
        }
        Checks.notNull("limits of request " + id, limits);
        Checks.notNull("earliestNight of request " + id, earliestNight);
        Checks.notNull("latestNight of request " + id, latestNight);
        if (latestNight.isBefore(earliestNight)) {
            throw new IllegalArgumentException("latestNight " + latestNight + " of request " + id
                    + " is before earliestNight " + earliestNight);
        }
        if (repeats < 1) {
            throw new IllegalArgumentException("repeats of request " + id + " must be at least 1, got " + repeats);
        }
        interval = interval == null ? Duration.ZERO : interval;
        tolerance = tolerance == null ? Duration.ZERO : tolerance;
        if (interval.isNegative() || tolerance.isNegative()) {
            throw new IllegalArgumentException("interval and tolerance of request " + id + " must not be negative, got "
                    + interval + " and " + tolerance);
        }
        if (priority < 1 || priority > 5) {
            throw new IllegalArgumentException("priority of request " + id + " must be 1..5, got " + priority);
        }
        observedStarts = observedStarts == null ? List.of() : observedStarts;
        if (observedStarts.stream().anyMatch(java.util.Objects::isNull)) {
            throw new IllegalArgumentException("observedStarts of request " + id + " must not hold an empty time");
        }
        observedStarts = List.copyOf(observedStarts);
    }

    /** Least start-to-start spacing between two repeats: the interval minus its tolerance, never negative. */
    public Duration minimumSpacing() {
        Duration spacing = interval.minus(tolerance);
        return spacing.isNegative() ? Duration.ZERO : spacing;
    }

    /** Shutter-open time of one visit, seconds. */
    public double exposureSeconds() {
        return exposures.stream().mapToDouble(e -> e.seconds() * e.count()).sum();
    }

    public int exposureCount() {
        return exposures.stream().mapToInt(ExposureStep::count).sum();
    }

    /** Filter changes in one visit: one before the first step and one at every change of filter. */
    public int filterChanges() {
        int changes = 1;
        for (int i = 1; i < exposures.size(); i++) {
            if (!exposures.get(i).filter().equals(exposures.get(i - 1).filter())) {
                changes++;
            }
        }
        return changes;
    }

    public List<String> filters() {
        return exposures.stream().map(ExposureStep::filter).distinct().toList();
    }

    public String visitId(int repeatIndex) {
        return repeats == 1 ? id : id + "#" + (repeatIndex + 1);
    }
}
