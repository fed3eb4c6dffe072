package org.skyrota.sky.site;

import java.time.ZoneId;
import java.util.Objects;
import org.skyrota.sky.atmosphere.Refraction;

/**
 * Where a telescope stands, with what the sky engine needs to know about its sky.
 *
 * @param latitudeDeg geodetic latitude, −90 to 90, north positive
 * @param longitudeDeg longitude, −180 to 180, east positive
 * @param elevationM height above sea level in metres, −500 to 9000
 * @param zone IANA time zone that defines the site's nights; {@code null} means local mean
 *     solar time (UTC + longitude/15 h)
 * @param horizon minimum altitude by azimuth, not null ({@link HorizonProfile#flat()} for none)
 * @param darkSkyZenithVMag moonless sky brightness at the zenith, V mag/arcsec², 15 to 25
 * @param extinctionMagPerAirmass V-band extinction coefficient, 0 to 2 mag per airmass
 * @param pressureHpa air pressure for refraction, hPa, 0 to 1100
 * @param temperatureC air temperature for refraction, °C, −90 to 60
 */
public record SiteLocation(
        double latitudeDeg,
        double longitudeDeg,
        double elevationM,
        ZoneId zone,
        HorizonProfile horizon,
        double darkSkyZenithVMag,
        double extinctionMagPerAirmass,
        double pressureHpa,
        double temperatureC) {

    /** A typical dark rural site (common practice, no source). */
    public static final double DEFAULT_DARK_SKY_ZENITH_VMAG = 21.5;
    /** A typical V-band extinction at a good site (common practice, no source). */
    public static final double DEFAULT_EXTINCTION_MAG_PER_AIRMASS = 0.2;

    public SiteLocation {
        requireRange("latitudeDeg", latitudeDeg, -90, 90);
        requireRange("longitudeDeg", longitudeDeg, -180, 180);
        requireRange("elevationM", elevationM, -500, 9000);
        Objects.requireNonNull(horizon, "horizon must not be null (use HorizonProfile.flat())");
        requireRange("darkSkyZenithVMag", darkSkyZenithVMag, 15, 25);
        requireRange("extinctionMagPerAirmass", extinctionMagPerAirmass, 0, 2);
        requireRange("pressureHpa", pressureHpa, 0, 1100);
        requireRange("temperatureC", temperatureC, -90, 60);
    }

    /** A site in local mean solar time with a flat horizon and the default sky. */
    public static SiteLocation of(double latitudeDeg, double longitudeDeg, double elevationM) {
        return of(latitudeDeg, longitudeDeg, elevationM, null);
    }

    /**
     * A site with a flat horizon, the default sky and the standard atmosphere for its
     * elevation.
     *
     * @param zone IANA zone, or null for local mean solar time
     * @throws IllegalArgumentException naming the field that is out of range
     */
    public static SiteLocation of(double latitudeDeg, double longitudeDeg, double elevationM, ZoneId zone) {
        requireRange("elevationM", elevationM, -500, 9000);
        return new SiteLocation(latitudeDeg, longitudeDeg, elevationM, zone, HorizonProfile.flat(),
                DEFAULT_DARK_SKY_ZENITH_VMAG, DEFAULT_EXTINCTION_MAG_PER_AIRMASS,
                Refraction.standardPressureHpa(elevationM), Refraction.STANDARD_TEMPERATURE_C);
    }

    /** Every field given; see the record's components for the ranges. */
    public static SiteLocation of(double latitudeDeg, double longitudeDeg, double elevationM, ZoneId zone,
            HorizonProfile horizon, double darkSkyZenithVMag, double extinctionMagPerAirmass,
            double pressureHpa, double temperatureC) {
        return new SiteLocation(latitudeDeg, longitudeDeg, elevationM, zone, horizon, darkSkyZenithVMag,
                extinctionMagPerAirmass, pressureHpa, temperatureC);
    }

    public SiteLocation withHorizon(HorizonProfile newHorizon) {
        return new SiteLocation(latitudeDeg, longitudeDeg, elevationM, zone, newHorizon, darkSkyZenithVMag,
                extinctionMagPerAirmass, pressureHpa, temperatureC);
    }

    public SiteLocation withZone(ZoneId newZone) {
        return new SiteLocation(latitudeDeg, longitudeDeg, elevationM, newZone, horizon, darkSkyZenithVMag,
                extinctionMagPerAirmass, pressureHpa, temperatureC);
    }

    public SiteLocation withSky(double newDarkSkyZenithVMag, double newExtinctionMagPerAirmass) {
        return new SiteLocation(latitudeDeg, longitudeDeg, elevationM, zone, horizon, newDarkSkyZenithVMag,
                newExtinctionMagPerAirmass, pressureHpa, temperatureC);
    }

    public SiteLocation withWeather(double newPressureHpa, double newTemperatureC) {
        return new SiteLocation(latitudeDeg, longitudeDeg, elevationM, zone, horizon, darkSkyZenithVMag,
                extinctionMagPerAirmass, newPressureHpa, newTemperatureC);
    }

    public double latitudeRad() {
        return Math.toRadians(latitudeDeg);
    }

    public double longitudeRad() {
        return Math.toRadians(longitudeDeg);
    }

    private static void requireRange(String name, double value, double min, double max) {
        if (!(value >= min && value <= max)) {
            throw new IllegalArgumentException(name + " must be in [" + min + ", " + max + "]: " + value);
        }
    }
}
