package org.skyrota.plugin;

import java.time.LocalDate;

/**
 * The expected conditions at a site (or one telescope) for one night.
 *
 * @param site          the site's name as stored in Skyrota; not blank
 * @param telescope     a telescope's name when only that telescope is affected, else null
 * @param night         the night (local date of the evening); not null
 * @param closed        whether the site or telescope is closed that night
 * @param cloudFraction the expected cloud cover from 0 (clear) to 1 (overcast), or null when unknown
 * @param reason        why, in plain words ({@code "forecast overcast"}, {@code "dome maintenance"}); may be empty
 */
public record SiteCondition(String site, String telescope, LocalDate night, boolean closed, Double cloudFraction, String reason) {

    public SiteCondition {
        if (site == null || site.isBlank()) {
            throw new IllegalArgumentException("site must not be blank");
        }
        if (night == null) {
            throw new IllegalArgumentException("night must not be null (site " + site + ")");
        }
        if (cloudFraction != null && !(cloudFraction >= 0 && cloudFraction <= 1)) {
            throw new IllegalArgumentException("cloudFraction must be between 0 and 1: " + cloudFraction);
        }
        reason = reason == null ? "" : reason;
    }
}
