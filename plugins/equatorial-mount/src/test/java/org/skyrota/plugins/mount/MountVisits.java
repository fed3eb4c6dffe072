package org.skyrota.plugins.mount;

import java.util.List;
import java.util.concurrent.atomic.AtomicInteger;

import org.skyrota.planning.domain.Placement;
import org.skyrota.planning.domain.TelescopeMount;
import org.skyrota.planning.domain.Visit;
import org.skyrota.planning.model.MountKind;
import org.skyrota.sky.coords.HourAngle;

/** Hand-made placed visits with a given hour angle at their start, on telescope 0, 1 or 2, for the verifier tests. */
final class MountVisits {
    private static final AtomicInteger NEXT = new AtomicInteger();

    private MountVisits() {
    }

    /** A placed visit of {@code minutes} on {@code telescope} whose target stands at {@code startHourAngleDeg}. */
    static Visit visit(int telescope, int minutes, double startHourAngleDeg) {
        int id = NEXT.incrementAndGet();
        Placement p = new Placement(id, telescope, 0, 1000, 20_000);
        Visit v = new Visit("v" + id, "r" + id, 0, "P1", 1.0, 1.0, 3, 3, minutes, 0, new int[] {minutes, minutes, minutes},
                new int[] {0, 0, 0}, List.of(p), new int[1], new int[1], new int[1], new byte[1]);
        v.setHourAngles(new float[] {(float) startHourAngleDeg});
        v.setPlacement(p);
        return v;
    }

    /** The hour angle a visit must start at to end exactly at {@code endDeg}. */
    static double startToEndAt(double endDeg, int minutes) {
        return endDeg - minutes * HourAngle.DEG_PER_MINUTE;
    }

    static TelescopeMount germanEquatorial(int telescope) {
        return new TelescopeMount(telescope, MountKind.EQUATORIAL, true, -180, 180);
    }

    static TelescopeMount limited(int telescope, double eastDeg, double westDeg) {
        return new TelescopeMount(telescope, MountKind.EQUATORIAL, false, eastDeg, westDeg);
    }

    static TelescopeMount unlimited(int telescope) {
        return new TelescopeMount(telescope, MountKind.EQUATORIAL, false, -180, 180);
    }
}
