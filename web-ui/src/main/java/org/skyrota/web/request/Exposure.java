package org.skyrota.web.request;

import jakarta.persistence.Column;
import jakarta.persistence.Embeddable;

/** One line of an exposure plan: {@code count} exposures of {@code seconds} each through {@code filterName}. */
@Embeddable
public class Exposure {

    @Column(name = "filter_name", nullable = false, length = 40)
    private String filterName;

    @Column(nullable = false)
    private double seconds;

    @Column(name = "exposure_count", nullable = false)
    private int count;

    protected Exposure() {}

    public Exposure(String filterName, double seconds, int count) {
        this.filterName = filterName;
        this.seconds = seconds;
        this.count = count;
    }

    public String getFilterName() {
        return filterName;
    }

    public double getSeconds() {
        return seconds;
    }

    public int getCount() {
        return count;
    }
}
