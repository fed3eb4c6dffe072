package org.skyrota.web.compute;

import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneId;
import java.util.List;
import java.util.Objects;
import java.util.Optional;

import org.skyrota.plugin.MovingTarget;

/**
 * The sky computations the compute endpoints need, in the server's own terms.
 *
 * <p>The controllers and their parameter checks depend only on this port; one adapter
 * ({@link EngineSkyComputations}) translates it to the sky engine of {@code scheduler-core}.
 * Angles are degrees, elevations metres, instants UTC.
 */
public interface SkyComputations {

    /** The events of the night that starts at local noon of {@code night}. */
    NightEvents almanac(Observer observer, LocalDate night);

    /** The visibility windows of one fixed target for every night from {@code from} to {@code to} inclusive. */
    List<Window> windows(Observer observer, Target target, Conditions conditions, LocalDate from, LocalDate to);

    /**
     * The visibility windows of a moving target (a target-kind plugin's position: a planet, the Moon, a comet), its
     * altitude topocentric, for every night from {@code from} to {@code to} inclusive.
     */
    List<Window> movingWindows(Observer observer, MovingTarget target, Conditions conditions, LocalDate from, LocalDate to);

    /**
     * Where the observer stands.
     *
     * @param zone the IANA time zone, or null for local mean solar time
     */
    record Observer(double latitudeDeg, double longitudeDeg, double elevationM, ZoneId zone) {}

    /** An ICRS (J2000) mean position. */
    record Target(double raDeg, double decDeg) {}

    /** How dark the sky must be: the Sun's centre below this geometric altitude. */
    enum Darkness {
        CIVIL(-6), NAUTICAL(-12), ASTRONOMICAL(-18);

        private final double sunAltitudeDeg;

        Darkness(double sunAltitudeDeg) {
            this.sunAltitudeDeg = sunAltitudeDeg;
        }

        public double sunAltitudeDeg() {
            return sunAltitudeDeg;
        }
    }

    /**
     * What must hold for the target to count as observable.
     *
     * @param minMoonSeparationDeg null when there is no such limit
     * @param maxMoonIllumination null when there is no such limit (applies only while the Moon is up)
     * @param maxAirmass the highest Kasten–Young airmass, null when there is no such limit
     */
    record Conditions(double minAltitudeDeg, Darkness darkness, Double minMoonSeparationDeg, Double maxMoonIllumination,
                      Double maxAirmass) {
        public Conditions {
            Objects.requireNonNull(darkness, "darkness");
        }

        /** Without an airmass limit. */
        public Conditions(double minAltitudeDeg, Darkness darkness, Double minMoonSeparationDeg, Double maxMoonIllumination) {
            this(minAltitudeDeg, darkness, minMoonSeparationDeg, maxMoonIllumination, null);
        }
    }

    /** The first of each event inside the night; empty when it does not happen that night. */
    record NightEvents(
            LocalDate night,
            Optional<Instant> sunset,
            Optional<Instant> civilDusk,
            Optional<Instant> nauticalDusk,
            Optional<Instant> astronomicalDusk,
            Optional<Instant> astronomicalDawn,
            Optional<Instant> nauticalDawn,
            Optional<Instant> civilDawn,
            Optional<Instant> sunrise,
            Optional<Instant> moonrise,
            Optional<Instant> moonset,
            double moonIllumination) {}

    /** A maximal interval of one night in which every condition holds. */
    record Window(LocalDate night, Instant start, Instant end, double maxAltitudeDeg) {}
}
