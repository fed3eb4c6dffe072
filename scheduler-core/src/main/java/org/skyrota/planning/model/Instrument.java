package org.skyrota.planning.model;

import java.util.Set;

/**
 * A camera or spectrograph on a telescope.
 *
 * @param id                      stable identifier
 * @param telescopeId             the telescope carrying it
 * @param filters                 filter names in its wheel (for example "R", "V", "Halpha")
 * @param readoutSeconds          readout time per exposure
 * @param filterChangeSeconds     time to change filter
 * @param certifiedSolarFilter    true only when a certified full-aperture solar filter is fitted; solar
 *                                targets go nowhere else (sunlight through optics blinds and burns)
 */
public record Instrument(String id, String telescopeId, Set<String> filters, double readoutSeconds,
                         double filterChangeSeconds, boolean certifiedSolarFilter) {
    public Instrument {
        Checks.notBlank("instrument id", id);
        Checks.notBlank("telescopeId of instrument " + id, telescopeId);
        filters = Set.copyOf(Checks.notNull("filters of instrument " + id, filters));
        Checks.notNegative("readoutSeconds of instrument " + id, readoutSeconds);
        Checks.notNegative("filterChangeSeconds of instrument " + id, filterChangeSeconds);
    }
}
