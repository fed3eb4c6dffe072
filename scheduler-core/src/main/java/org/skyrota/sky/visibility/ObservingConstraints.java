package org.skyrota.sky.visibility;

import java.time.Instant;
import java.util.Objects;
import java.util.Optional;
import java.util.OptionalDouble;

/**
 * What a request needs from the sky. Build with {@link #of(double, Darkness)} and the
 * {@code with…} methods; every factory and wither validates and names the bad value.
 *
 * @param minAltitudeDeg lowest apparent (refracted) altitude of the target, −1 to 89°; the
 *     site's horizon profile may raise it by azimuth
 * @param maxAirmass highest Kasten–Young airmass, ≥ 1, if limited
 * @param darkness how far below the horizon the Sun must be
 * @param minMoonSeparationDeg smallest angle between the target and the Moon's topocentric
 *     centre, 0 to 180°, if limited; applies while the Moon is above the horizon (upper limb,
 *     standard refraction), like the illumination limit: a Moon below the horizon lights
 *     nothing
 * @param maxMoonIllumination largest illuminated fraction of the Moon, 0 to 1, if limited;
 *     applies only while the Moon is above the horizon
 * @param maxSkyBrightness the brightest sky allowed, V mag/arcsec² (the sky must be fainter,
 *     i.e. numerically at least this), if limited
 * @param minSunSeparationDeg smallest angle between the target and the Sun, 0 to 180°, if
 *     limited
 * @param earliest no window starts before this instant, if given
 * @param latest no window ends after this instant, if given
 */
public record ObservingConstraints(
        double minAltitudeDeg,
        OptionalDouble maxAirmass,
        Darkness darkness,
        OptionalDouble minMoonSeparationDeg,
        OptionalDouble maxMoonIllumination,
        OptionalDouble maxSkyBrightness,
        OptionalDouble minSunSeparationDeg,
        Optional<Instant> earliest,
        Optional<Instant> latest) {

    public ObservingConstraints {
        if (!(minAltitudeDeg >= -1 && minAltitudeDeg <= 89)) {
            throw new IllegalArgumentException("minAltitudeDeg must be in [-1, 89]: " + minAltitudeDeg);
        }
        Objects.requireNonNull(maxAirmass, "maxAirmass must not be null (use OptionalDouble.empty())");
        Objects.requireNonNull(darkness, "darkness must not be null (use Darkness.ANY)");
        Objects.requireNonNull(minMoonSeparationDeg, "minMoonSeparationDeg must not be null");
        Objects.requireNonNull(maxMoonIllumination, "maxMoonIllumination must not be null");
        Objects.requireNonNull(maxSkyBrightness, "maxSkyBrightness must not be null");
        Objects.requireNonNull(minSunSeparationDeg, "minSunSeparationDeg must not be null");
        Objects.requireNonNull(earliest, "earliest must not be null (use Optional.empty())");
        Objects.requireNonNull(latest, "latest must not be null (use Optional.empty())");
        if (maxAirmass.isPresent() && !(maxAirmass.getAsDouble() >= 1 && maxAirmass.getAsDouble() <= 40)) {
            throw new IllegalArgumentException("maxAirmass must be in [1, 40]: " + maxAirmass.getAsDouble());
        }
        requireRange("minMoonSeparationDeg", minMoonSeparationDeg, 0, 180);
        requireRange("maxMoonIllumination", maxMoonIllumination, 0, 1);
        requireRange("maxSkyBrightness", maxSkyBrightness, 10, 25);
        requireRange("minSunSeparationDeg", minSunSeparationDeg, 0, 180);
        if (earliest.isPresent() && latest.isPresent() && !latest.get().isAfter(earliest.get())) {
            throw new IllegalArgumentException("latest must be after earliest: earliest " + earliest.get()
                    + ", latest " + latest.get());
        }
    }

    /** A minimum altitude and a darkness, nothing else limited. */
    public static ObservingConstraints of(double minAltitudeDeg, Darkness darkness) {
        return new ObservingConstraints(minAltitudeDeg, OptionalDouble.empty(), darkness, OptionalDouble.empty(),
                OptionalDouble.empty(), OptionalDouble.empty(), OptionalDouble.empty(), Optional.empty(),
                Optional.empty());
    }

    public ObservingConstraints withMinAltitudeDeg(double value) {
        return new ObservingConstraints(value, maxAirmass, darkness, minMoonSeparationDeg, maxMoonIllumination,
                maxSkyBrightness, minSunSeparationDeg, earliest, latest);
    }

    public ObservingConstraints withMaxAirmass(double value) {
        return new ObservingConstraints(minAltitudeDeg, OptionalDouble.of(value), darkness, minMoonSeparationDeg,
                maxMoonIllumination, maxSkyBrightness, minSunSeparationDeg, earliest, latest);
    }

    public ObservingConstraints withDarkness(Darkness value) {
        return new ObservingConstraints(minAltitudeDeg, maxAirmass, value, minMoonSeparationDeg, maxMoonIllumination,
                maxSkyBrightness, minSunSeparationDeg, earliest, latest);
    }

    public ObservingConstraints withMinMoonSeparationDeg(double value) {
        return new ObservingConstraints(minAltitudeDeg, maxAirmass, darkness, OptionalDouble.of(value),
                maxMoonIllumination, maxSkyBrightness, minSunSeparationDeg, earliest, latest);
    }

    public ObservingConstraints withMaxMoonIllumination(double value) {
        return new ObservingConstraints(minAltitudeDeg, maxAirmass, darkness, minMoonSeparationDeg,
                OptionalDouble.of(value), maxSkyBrightness, minSunSeparationDeg, earliest, latest);
    }

    public ObservingConstraints withMaxSkyBrightness(double vMagPerArcsec2) {
        return new ObservingConstraints(minAltitudeDeg, maxAirmass, darkness, minMoonSeparationDeg,
                maxMoonIllumination, OptionalDouble.of(vMagPerArcsec2), minSunSeparationDeg, earliest, latest);
    }

    public ObservingConstraints withMinSunSeparationDeg(double value) {
        return new ObservingConstraints(minAltitudeDeg, maxAirmass, darkness, minMoonSeparationDeg,
                maxMoonIllumination, maxSkyBrightness, OptionalDouble.of(value), earliest, latest);
    }

    /** Limits every window to {@code [earliest, latest]}; either may be null for no limit. */
    public ObservingConstraints withTimeWindow(Instant earliestOrNull, Instant latestOrNull) {
        return new ObservingConstraints(minAltitudeDeg, maxAirmass, darkness, minMoonSeparationDeg,
                maxMoonIllumination, maxSkyBrightness, minSunSeparationDeg, Optional.ofNullable(earliestOrNull),
                Optional.ofNullable(latestOrNull));
    }

    /**
     * The lowest apparent altitude that satisfies both the minimum altitude and the airmass
     * limit (Kasten–Young airmass falls as the altitude rises, so the limit is an altitude).
     */
    public double effectiveMinAltitudeDeg() {
        if (maxAirmass.isEmpty()) {
            return minAltitudeDeg;
        }
        return Math.max(minAltitudeDeg, AirmassLimit.altitudeForAirmassDeg(maxAirmass.getAsDouble()));
    }

    private static void requireRange(String name, OptionalDouble value, double min, double max) {
        if (value.isPresent() && !(value.getAsDouble() >= min && value.getAsDouble() <= max)) {
            throw new IllegalArgumentException(name + " must be in [" + min + ", " + max + "]: " + value.getAsDouble());
        }
    }
}
