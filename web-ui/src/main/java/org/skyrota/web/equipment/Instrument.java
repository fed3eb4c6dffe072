package org.skyrota.web.equipment;

import java.util.ArrayList;
import java.util.List;

import jakarta.persistence.CollectionTable;
import jakarta.persistence.Column;
import jakarta.persistence.ElementCollection;
import jakarta.persistence.Entity;
import jakarta.persistence.FetchType;
import jakarta.persistence.JoinColumn;
import jakarta.persistence.ManyToOne;
import jakarta.persistence.OrderColumn;
import jakarta.persistence.Table;

import org.hibernate.annotations.BatchSize;
import org.skyrota.web.system.StoredEntity;

/** A camera or spectrograph on a telescope, with its filters in wheel order. */
@Entity
@Table(name = "instrument")
public class Instrument extends StoredEntity {

    @ManyToOne(fetch = FetchType.LAZY, optional = false)
    @JoinColumn(name = "telescope_id", nullable = false)
    private Telescope telescope;

    @Column(nullable = false, length = 100)
    private String name;

    @Column(name = "readout_seconds", nullable = false)
    private double readoutSeconds;

    @Column(name = "filter_change_seconds", nullable = false)
    private double filterChangeSeconds;

    /** Only instruments with a certified solar filter may take solar targets. */
    @Column(name = "certified_solar_filter", nullable = false)
    private boolean certifiedSolarFilter;

    @ElementCollection
    @BatchSize(size = 64)
    @CollectionTable(name = "instrument_filter", joinColumns = @JoinColumn(name = "instrument_id"))
    @OrderColumn(name = "seq")
    @Column(name = "name", nullable = false, length = 40)
    private List<String> filters = new ArrayList<>();

    protected Instrument() {}

    public Instrument(Telescope telescope, String name) {
        this.telescope = telescope;
        this.name = name;
    }

    public Telescope getTelescope() {
        return telescope;
    }

    public void setTelescope(Telescope telescope) {
        this.telescope = telescope;
    }

    public String getName() {
        return name;
    }

    public void setName(String name) {
        this.name = name;
    }

    public double getReadoutSeconds() {
        return readoutSeconds;
    }

    public double getFilterChangeSeconds() {
        return filterChangeSeconds;
    }

    public void setOverheads(double readoutSeconds, double filterChangeSeconds) {
        this.readoutSeconds = readoutSeconds;
        this.filterChangeSeconds = filterChangeSeconds;
    }

    public boolean hasCertifiedSolarFilter() {
        return certifiedSolarFilter;
    }

    public void setCertifiedSolarFilter(boolean certifiedSolarFilter) {
        this.certifiedSolarFilter = certifiedSolarFilter;
    }

    public List<String> getFilters() {
        return List.copyOf(filters);
    }

    public void setFilters(List<String> names) {
        filters.clear();
        filters.addAll(names);
    }
}
