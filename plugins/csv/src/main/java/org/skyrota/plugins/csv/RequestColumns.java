package org.skyrota.plugins.csv;

import java.util.List;
import java.util.Set;

/**
 * The columns of a request file. The header row names them; their order is free, and every one but
 * {@link #REQUIRED} may be left out. Right ascension and declination are ICRS, in decimal degrees or
 * sexagesimal ({@code "12:29:06.7"}, {@code "+02:03:08"}).
 */
public final class RequestColumns {

    public static final String TITLE = "title";
    public static final String TARGET = "target";
    /** {@code fixed} (the default) or a plugin's target kind such as {@code planet}. */
    public static final String TARGET_KIND = "target_kind";
    /** {@code key=value} pairs split by semicolons, for a target kind: {@code "body=jupiter"}. */
    public static final String TARGET_PARAMETERS = "target_parameters";
    public static final String RA = "ra";
    public static final String DEC = "dec";
    /** Exposures as {@code filter:seconds x count} split by semicolons: {@code "V:60x3;R:60x3"}. */
    public static final String FILTER_PLAN = "filter_plan";
    public static final String MIN_ALTITUDE = "min_altitude";
    /** Highest Kasten–Young airmass, 1 to 10; empty for none. */
    public static final String MAX_AIRMASS = "max_airmass";
    public static final String DARKNESS = "darkness";
    public static final String MAX_MOON_ILLUMINATION = "max_moon_illumination";
    public static final String MIN_MOON_SEPARATION = "min_moon_separation";
    public static final String EARLIEST_NIGHT = "earliest_night";
    public static final String LATEST_NIGHT = "latest_night";
    public static final String REPEATS = "repeats";
    public static final String INTERVAL_DAYS = "interval_days";
    /** 1 (lowest) to 5 (highest), as the planner and {@code RequestRecord} count. */
    public static final String PRIORITY = "priority";
    public static final String PROGRAM = "program";
    public static final String OWNER = "owner";
    public static final String NOTES = "notes";

    /** Every column, in the order the writer uses. */
    public static final List<String> ALL = List.of(TITLE, TARGET, TARGET_KIND, TARGET_PARAMETERS, RA, DEC, FILTER_PLAN,
            MIN_ALTITUDE, MAX_AIRMASS, DARKNESS, MAX_MOON_ILLUMINATION, MIN_MOON_SEPARATION, EARLIEST_NIGHT, LATEST_NIGHT, REPEATS,
            INTERVAL_DAYS, PRIORITY, PROGRAM, OWNER, NOTES);

    public static final Set<String> REQUIRED = Set.of(TITLE, TARGET, FILTER_PLAN, PRIORITY, PROGRAM);

    private RequestColumns() {
    }
}
