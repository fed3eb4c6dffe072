package org.skyrota.sky.time;

import java.time.Instant;

/**
 * TAI − UTC from the table of leap seconds published by the IERS (Bulletin C).
 *
 * <p>The table starts on 1972-01-01 (10 s) and its last step is 2017-01-01 (37 s). After
 * that the difference is held at 37 s: no further leap second had been announced up to
 * {@link #TABLE_VALID_UNTIL}. When the IERS announces a new one, add a row here and move
 * {@code TABLE_VALID_UNTIL}.
 */
public final class LeapSeconds {

    /** First instant of the leap-second era (UTC as it is defined today). */
    public static final Instant TABLE_START = Instant.parse("1972-01-01T00:00:00Z");

    /**
     * End of the period for which the table is taken to hold. IERS Bulletin C is published every
     * six months and announces the next possible leap second; none has been inserted since
     * 2017-01-01. The latest bulletin known when this was written (No. 70, July 2025, from memory)
     * excluded one at the end of 2025; 2027-01-01 assumes that the following bulletins announced
     * none for mid-2026 and the end of 2026 either. Check the latest Bulletin C and move this date,
     * or add a row, when a new one appears. Beyond it {@link TimeScales} models UT1 with ΔT rather than assuming
     * UT1 = UTC.
     */
    public static final Instant TABLE_VALID_UNTIL = Instant.parse("2027-01-01T00:00:00Z");

    /** Epoch seconds at which each step takes effect (00:00 UTC on that date). */
    private static final long[] STEP_EPOCH_SECONDS = {
        epoch("1972-01-01"), epoch("1972-07-01"), epoch("1973-01-01"), epoch("1974-01-01"),
        epoch("1975-01-01"), epoch("1976-01-01"), epoch("1977-01-01"), epoch("1978-01-01"),
        epoch("1979-01-01"), epoch("1980-01-01"), epoch("1981-07-01"), epoch("1982-07-01"),
        epoch("1983-07-01"), epoch("1985-07-01"), epoch("1988-01-01"), epoch("1990-01-01"),
        epoch("1991-01-01"), epoch("1992-07-01"), epoch("1993-07-01"), epoch("1994-07-01"),
        epoch("1996-01-01"), epoch("1997-07-01"), epoch("1999-01-01"), epoch("2006-01-01"),
        epoch("2009-01-01"), epoch("2012-07-01"), epoch("2015-07-01"), epoch("2017-01-01"),
    };

    /** TAI − UTC in seconds from the matching step onwards. */
    private static final int[] TAI_MINUS_UTC = {
        10, 11, 12, 13, 14, 15, 16, 17, 18, 19, 20, 21, 22, 23,
        24, 25, 26, 27, 28, 29, 30, 31, 32, 33, 34, 35, 36, 37,
    };

    private LeapSeconds() {
    }

    private static long epoch(String isoDate) {
        return Instant.parse(isoDate + "T00:00:00Z").getEpochSecond();
    }

    /**
     * TAI − UTC in whole seconds at the given instant.
     *
     * <p>Before 1972 UTC had no whole-second offset (it used rubber seconds and steps); this
     * method then answers the first value, 10 s, but {@link TimeScales} does not use the table
     * there: it models that era with ΔT.
     *
     * @param t the instant, not null
     * @return TAI − UTC in seconds, 10 to 37
     */
    public static int taiMinusUtcSeconds(Instant t) {
        long s = t.getEpochSecond();
        int lo = 0;
        int hi = STEP_EPOCH_SECONDS.length - 1;
        if (s < STEP_EPOCH_SECONDS[0]) {
            return TAI_MINUS_UTC[0];
        }
        while (lo < hi) {
            int mid = (lo + hi + 1) >>> 1;
            if (STEP_EPOCH_SECONDS[mid] <= s) {
                lo = mid;
            } else {
                hi = mid - 1;
            }
        }
        return TAI_MINUS_UTC[lo];
    }

    /**
     * Whether the instant lies in the span where UTC is tied to TAI by this table and
     * |UT1 − UTC| < 0.9 s is guaranteed: from {@link #TABLE_START} (inclusive) to
     * {@link #TABLE_VALID_UNTIL} (exclusive).
     */
    public static boolean withinTable(Instant t) {
        return !t.isBefore(TABLE_START) && t.isBefore(TABLE_VALID_UNTIL);
    }
}
