package org.skyrota.sky.time;

import java.time.Instant;

/**
 * Conversions between {@link Instant} (UTC, as java.time counts it: 86,400 s a day, no leap
 * seconds) and Julian Dates in the time scales the sky engine needs: UTC, TT and UT1.
 *
 * <h2>How UT1 and TT are obtained</h2>
 * <ul>
 *   <li><b>Leap-second era</b>, from 1972-01-01 up to {@link LeapSeconds#TABLE_VALID_UNTIL}:
 *       TT = UTC + 32.184 s + (TAI − UTC) from {@link LeapSeconds}; UT1 = UTC (the IERS keeps
 *       |UT1 − UTC| below 0.9 s, which is 0.004° of Earth rotation, far below what planning
 *       needs). ΔT = TT − UT1 is then TT − UTC.</li>
 *   <li><b>After the table</b>: TT − UTC stays at 32.184 + 37 s (no leap second is known), and
 *       UT1 = TT − ΔT with ΔT from the Espenak–Meeus polynomial plus a constant offset chosen so
 *       that ΔT is continuous at {@code TABLE_VALID_UNTIL} (the polynomial for 2005–2050
 *       overestimates today's ΔT by several seconds; without the offset UT1 would jump at the
 *       join). UT1 − UTC then drifts away from zero, as it would if no more leap seconds were
 *       inserted.</li>
 *   <li><b>Before 1972</b> TT − UTC is not meaningful (UTC had rubber seconds, or did not
 *       exist). UTC is taken to be UT1, and TT = UT1 + ΔT with the Espenak–Meeus polynomial plus
 *       a constant offset that makes ΔT continuous with TT − UTC = 42.184 s on 1972-01-01.</li>
 * </ul>
 */
public final class TimeScales {

    /** Julian Date of the epoch J2000.0 (2000 January 1, 12h TT). */
    public static final double J2000_JD = 2451545.0;

    /** Julian Date of 1970-01-01T00:00:00 UTC, the epoch of {@link Instant}. */
    public static final double UNIX_EPOCH_JD = 2440587.5;

    /** TT − TAI in seconds (by definition). */
    public static final double TT_MINUS_TAI_SECONDS = 32.184;

    private static final double SECONDS_PER_DAY = 86400.0;

    /** Offset added to the polynomial ΔT before 1972 so that it meets TT − UTC on 1972-01-01. */
    private static final double OFFSET_BEFORE_TABLE_SECONDS;

    /** Offset added to the polynomial ΔT after the table so that it meets TT − UTC there. */
    private static final double OFFSET_AFTER_TABLE_SECONDS;

    static {
        Instant start = LeapSeconds.TABLE_START;
        OFFSET_BEFORE_TABLE_SECONDS = TT_MINUS_TAI_SECONDS + LeapSeconds.taiMinusUtcSeconds(start)
                - DeltaT.espenakMeeusSeconds(decimalYear(start));
        Instant end = LeapSeconds.TABLE_VALID_UNTIL;
        OFFSET_AFTER_TABLE_SECONDS = TT_MINUS_TAI_SECONDS + LeapSeconds.taiMinusUtcSeconds(end)
                - DeltaT.espenakMeeusSeconds(decimalYear(end));
    }

    private TimeScales() {
    }

    /**
     * Julian Date of the instant read as UTC (java.time has no leap seconds, so a day of UTC
     * is 86,400 s here; the leap second itself cannot be represented).
     *
     * @param t the instant, not null
     */
    public static double jdUtc(Instant t) {
        // Whole days and the remainder separately, so that the sum loses nothing before
        // the final addition (about 40 microseconds resolution near JD 2.46e6).
        long s = t.getEpochSecond();
        long days = Math.floorDiv(s, 86400L);
        long rem = Math.floorMod(s, 86400L);
        return UNIX_EPOCH_JD + days + (rem + t.getNano() * 1e-9) / SECONDS_PER_DAY;
    }

    /**
     * Inverse of {@link #jdUtc(Instant)}, rounded to the nearest microsecond.
     *
     * @param jdUtc a Julian Date in UTC
     */
    public static Instant instantOfJdUtc(double jdUtc) {
        double d = jdUtc - UNIX_EPOCH_JD;
        double days = Math.floor(d);
        long micros = Math.round((d - days) * SECONDS_PER_DAY * 1e6);
        long seconds = (long) days * 86400L + Math.floorDiv(micros, 1_000_000L);
        long nanos = Math.floorMod(micros, 1_000_000L) * 1000L;
        return Instant.ofEpochSecond(seconds, nanos);
    }

    /**
     * Julian Day of a calendar date (Meeus, Astronomical Algorithms, 2nd ed., ch. 7).
     *
     * @param year astronomical year (0 = 1 BC)
     * @param month 1 to 12
     * @param dayWithFraction day of the month with the fraction of the day (4.81 = 4th,
     *     19:26:24)
     * @param julianCalendar true for a date in the Julian calendar, false for Gregorian
     */
    public static double julianDay(int year, int month, double dayWithFraction, boolean julianCalendar) {
        if (month < 1 || month > 12) {
            throw new IllegalArgumentException("month must be 1..12: " + month);
        }
        int y = year;
        int m = month;
        if (m <= 2) {
            y -= 1;
            m += 12;
        }
        int b = 0;
        if (!julianCalendar) {
            int a = Math.floorDiv(y, 100);
            b = 2 - a + Math.floorDiv(a, 4);
        }
        return Math.floor(365.25 * (y + 4716)) + Math.floor(30.6001 * (m + 1)) + dayWithFraction + b - 1524.5;
    }

    /**
     * Decimal year of the instant in the Gregorian calendar sense used by the ΔT polynomials
     * (2000.0 = 2000 January 1, 0h; the mean Gregorian year of 365.2425 days).
     */
    public static double decimalYear(Instant t) {
        return 2000.0 + (jdUtc(t) - 2451544.5) / 365.2425;
    }

    /**
     * TT − UTC in seconds: 32.184 s + TAI − UTC from {@link LeapSeconds} from 1972 onwards
     * (held at 69.184 s after the last known leap second); before 1972, where UTC is taken
     * to be UT1, the ΔT model (see the class description).
     *
     * @param t the instant, not null
     */
    public static double ttMinusUtcSeconds(Instant t) {
        if (t.isBefore(LeapSeconds.TABLE_START)) {
            return deltaTSeconds(t);
        }
        return TT_MINUS_TAI_SECONDS + LeapSeconds.taiMinusUtcSeconds(t);
    }

    /**
     * ΔT = TT − UT1 in seconds at the instant (see the class description for the three eras).
     *
     * @param t the instant, not null
     */
    public static double deltaTSeconds(Instant t) {
        if (t.isBefore(LeapSeconds.TABLE_START)) {
            return DeltaT.espenakMeeusSeconds(decimalYear(t)) + OFFSET_BEFORE_TABLE_SECONDS;
        }
        if (t.isBefore(LeapSeconds.TABLE_VALID_UNTIL)) {
            return TT_MINUS_TAI_SECONDS + LeapSeconds.taiMinusUtcSeconds(t);
        }
        return DeltaT.espenakMeeusSeconds(decimalYear(t)) + OFFSET_AFTER_TABLE_SECONDS;
    }

    /** Julian Date in Terrestrial Time. */
    public static double jdTt(Instant t) {
        return jdUtc(t) + ttMinusUtcSeconds(t) / SECONDS_PER_DAY;
    }

    /** Julian Date in UT1 (see the class description). */
    public static double jdUt1(Instant t) {
        if (t.isBefore(LeapSeconds.TABLE_VALID_UNTIL)) {
            // In the table's span UT1 = UTC; before 1972 UTC is taken to be UT1.
            return jdUtc(t);
        }
        return jdTt(t) - deltaTSeconds(t) / SECONDS_PER_DAY;
    }

    /** Julian centuries of TT since J2000.0. */
    public static double centuriesTt(double jdTt) {
        return (jdTt - J2000_JD) / 36525.0;
    }
}
