package org.skyrota.sky.visibility;

import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.function.Function;
import org.skyrota.plugin.MovingTarget;
import org.skyrota.sky.events.SkyAtSite;
import org.skyrota.sky.site.Night;
import org.skyrota.sky.site.SiteLocation;

/**
 * Visibility windows by the plain definition: every constraint is evaluated from exact
 * positions once a minute through each night, and each change between two samples is refined
 * by bisection to under a second. Slow but obviously right; {@link BatchVisibility} is the fast
 * path and is tested against this one.
 *
 * <p>Windows shorter than {@link VisibilityWindow#MIN_DURATION} are dropped (a minute's
 * sampling cannot see them reliably, and no visit fits in them).
 *
 * <p>It is also the path for a {@link MovingTarget} (a planet, the Moon, a comet): the same
 * sampling and refinement, with the target's place asked for at every instant and corrected for
 * the site's parallax. A moving target's place changes too little within a minute for the
 * sampling to miss a window longer than {@link VisibilityWindow#MIN_DURATION}.
 */
public final class VisibilityCalculator {

    /** Sampling step of the per-instant path, seconds. */
    public static final double STEP_SECONDS = 60;
    private static final double REFINE_SECONDS = 0.25;

    private VisibilityCalculator() {
    }

    /** The windows of every night from {@code from} to {@code to} inclusive, in time order. */
    public static List<VisibilityWindow> windows(SiteLocation site, FixedTarget target,
            ObservingConstraints constraints, LocalDate from, LocalDate to) {
        Objects.requireNonNull(target, "target");
        return run(site, constraints, from, to, c -> new Probe() {
            @Override
            public boolean holds(double t) {
                return c.holds(target, t);
            }

            @Override
            public double altitudeDeg(double t) {
                return c.altitudeDeg(target, t);
            }
        });
    }

    /** The windows of one night. */
    public static List<VisibilityWindow> windows(SiteLocation site, FixedTarget target,
            ObservingConstraints constraints, LocalDate night) {
        return windows(site, target, constraints, night, night);
    }

    /**
     * The windows of a moving target on every night from {@code from} to {@code to} inclusive,
     * in time order, under the same constraints as a fixed target's; the altitude is topocentric
     * (the target's distance gives its parallax). Whether the target is solar is the caller's
     * concern: this only finds where the constraints hold.
     */
    public static List<VisibilityWindow> windows(SiteLocation site, MovingTarget target,
            ObservingConstraints constraints, LocalDate from, LocalDate to) {
        Objects.requireNonNull(target, "target");
        return run(site, constraints, from, to, c -> new Probe() {
            @Override
            public boolean holds(double t) {
                return c.holds(target, t);
            }

            @Override
            public double altitudeDeg(double t) {
                return c.altitudeDeg(target, t);
            }
        });
    }

    /** One thing to sample: whether every constraint holds at an instant, and the target's altitude. */
    private interface Probe {
        boolean holds(double t);

        double altitudeDeg(double t);
    }

    private static List<VisibilityWindow> run(SiteLocation site, ObservingConstraints constraints, LocalDate from,
            LocalDate to, Function<InstantConditions, Probe> probe) {
        Objects.requireNonNull(site, "site");
        Objects.requireNonNull(constraints, "constraints");
        Objects.requireNonNull(from, "from");
        Objects.requireNonNull(to, "to");
        if (to.isBefore(from)) {
            throw new IllegalArgumentException("to must not be before from: from " + from + ", to " + to);
        }
        InstantConditions conditions = new InstantConditions(site, constraints);
        Probe p = probe.apply(conditions);
        List<VisibilityWindow> out = new ArrayList<>();
        for (LocalDate d = from; !d.isAfter(to); d = d.plusDays(1)) {
            night(conditions, p, Night.of(site, d), out);
        }
        return out;
    }

    private static void night(InstantConditions c, Probe target, Night night, List<VisibilityWindow> out) {
        double t0 = SkyAtSite.toEpochSecond(night.start());
        double t1 = SkyAtSite.toEpochSecond(night.end());
        int n = (int) Math.ceil((t1 - t0) / STEP_SECONDS);
        boolean inside = false;
        double start = 0;
        double maxAlt = -90;
        double prevT = t0;
        for (int i = 0; i <= n; i++) {
            double t = Math.min(t1, t0 + i * STEP_SECONDS);
            boolean ok = target.holds(t);
            double alt = c.lastAltitudeDeg();
            if (ok && !inside) {
                start = i == 0 ? t : refine(target, prevT, t, true);
                maxAlt = Math.max(alt, target.altitudeDeg(start));
                inside = true;
            } else if (ok) {
                maxAlt = Math.max(maxAlt, alt);
            } else if (inside) {
                double end = refine(target, prevT, t, false);
                maxAlt = Math.max(maxAlt, target.altitudeDeg(end));
                emit(night, start, end, maxAlt, out);
                inside = false;
            }
            prevT = t;
        }
        if (inside) {
            emit(night, start, t1, maxAlt, out);
        }
    }

    /**
     * The instant in (a, b] where the conditions change, to within REFINE_SECONDS, taken on the
     * side where they hold (the window's first or last instant).
     */
    private static double refine(Probe target, double a, double b, boolean opening) {
        boolean atA = target.holds(a);
        while (b - a > REFINE_SECONDS) {
            double m = 0.5 * (a + b);
            if (target.holds(m) == atA) {
                a = m;
            } else {
                b = m;
            }
        }
        return opening ? b : a;
    }

    private static void emit(Night night, double start, double end, double maxAlt, List<VisibilityWindow> out) {
        if (end - start < VisibilityWindow.MIN_DURATION.getSeconds()) {
            return;
        }
        out.add(new VisibilityWindow(night.date(), SkyAtSite.toInstant(start), SkyAtSite.toInstant(end),
                Math.max(-90, Math.min(90, maxAlt))));
    }
}
