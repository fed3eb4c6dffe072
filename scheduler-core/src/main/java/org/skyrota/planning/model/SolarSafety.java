package org.skyrota.planning.model;

/** The caution shown wherever a solar request is made, planned or explained. */
public final class SolarSafety {
    public static final String CAUTION = "Solar observing: only with the certified full-aperture solar filter fitted"
            + " over the front of the optics (and the finder capped); never look through or point unfiltered optics"
            + " at or near the Sun: it blinds in an instant and destroys cameras.";

    private SolarSafety() {
    }
}
