package org.skyrota.planning.model;

import java.time.LocalDate;

/**
 * A night on which a telescope, or a whole site, is off: weather, maintenance, an event.
 *
 * @param siteId       the site
 * @param telescopeId  one telescope at the site, or null for the whole site
 * @param night        the site-local date of the evening
 * @param reason       in plain words
 */
public record Closure(String siteId, String telescopeId, LocalDate night, String reason) {
    public Closure {
        Checks.notBlank("siteId of closure", siteId);
        Checks.notNull("night of closure", night);
        reason = reason == null ? "closed" : reason;
    }

    public static Closure site(String siteId, LocalDate night, String reason) {
        return new Closure(siteId, null, night, reason);
    }

    public static Closure telescope(String siteId, String telescopeId, LocalDate night, String reason) {
        return new Closure(siteId, telescopeId, night, reason);
    }

    public boolean covers(Telescope telescope, LocalDate date) {
        return night.equals(date) && siteId.equals(telescope.siteId())
                && (telescopeId == null || telescopeId.equals(telescope.id()));
    }
}
