package org.skyrota.web.program;

import java.time.LocalDate;

import jakarta.persistence.Column;
import jakarta.persistence.Embeddable;

/** Hours of one telescope granted to a program for the nights from {@code firstNight} to {@code lastNight}. */
@Embeddable
public class Grant {

    @Column(name = "telescope_id", nullable = false)
    private long telescopeId;

    @Column(nullable = false)
    private double hours;

    @Column(name = "first_night", nullable = false)
    private LocalDate firstNight;

    @Column(name = "last_night", nullable = false)
    private LocalDate lastNight;

    protected Grant() {}

    public Grant(long telescopeId, double hours, LocalDate firstNight, LocalDate lastNight) {
        this.telescopeId = telescopeId;
        this.hours = hours;
        this.firstNight = firstNight;
        this.lastNight = lastNight;
    }

    public long getTelescopeId() {
        return telescopeId;
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
