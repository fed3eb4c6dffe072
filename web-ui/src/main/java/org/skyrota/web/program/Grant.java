package org.skyrota.web.program;

import java.time.LocalDate;

import jakarta.persistence.Column;
import jakarta.persistence.Embeddable;

/**
 * Hours granted to a program for the nights from {@code firstNight} to {@code lastNight}: on one telescope, at one
 * site (any of its telescopes), or anywhere in the network when neither is named. A visit pays from the most specific
 * grant of its program that covers its telescope and night ({@link org.skyrota.planning.model.Grant#payer}).
 */
@Embeddable
public class Grant {

    @Column(name = "telescope_id")
    private Long telescopeId;

    @Column(name = "site_id")
    private Long siteId;

    @Column(nullable = false)
    private double hours;

    @Column(name = "first_night", nullable = false)
    private LocalDate firstNight;

    @Column(name = "last_night", nullable = false)
    private LocalDate lastNight;

    protected Grant() {}

    /** A grant on one telescope. */
    public Grant(long telescopeId, double hours, LocalDate firstNight, LocalDate lastNight) {
        this(Long.valueOf(telescopeId), null, hours, firstNight, lastNight);
    }

    /** A grant on one telescope, at one site, or (both null) anywhere. */
    public Grant(Long telescopeId, Long siteId, double hours, LocalDate firstNight, LocalDate lastNight) {
        this.telescopeId = telescopeId;
        this.siteId = telescopeId == null ? siteId : null;
        this.hours = hours;
        this.firstNight = firstNight;
        this.lastNight = lastNight;
    }

    /** The one telescope it pays for, or null. */
    public Long getTelescopeId() {
        return telescopeId;
    }

    /** The one site it pays for, or null (also when it names a telescope). */
    public Long getSiteId() {
        return siteId;
    }

    public double getHours() {
        return hours;
    }

    public LocalDate getFirstNight() {
        return firstNight;
    }

    public LocalDate getLastNight() {
        return lastNight;
    }
}
