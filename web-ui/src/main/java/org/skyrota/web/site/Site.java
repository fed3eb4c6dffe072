package org.skyrota.web.site;

import java.util.ArrayList;
import java.util.List;

import jakarta.persistence.CollectionTable;
import jakarta.persistence.Column;
import jakarta.persistence.ElementCollection;
import jakarta.persistence.Entity;
import jakarta.persistence.JoinColumn;
import jakarta.persistence.OrderColumn;
import jakarta.persistence.Table;

import org.hibernate.annotations.BatchSize;
import org.skyrota.web.system.StoredEntity;

/** An observatory site: where it is, its clock, its horizon and how dark its sky is. */
@Entity
@Table(name = "site")
public class Site extends StoredEntity {

    @Column(nullable = false, length = 100)
    private String name;

    @Column(name = "latitude_deg", nullable = false)
    private double latitudeDeg;

    @Column(name = "longitude_deg", nullable = false)
    private double longitudeDeg;

    @Column(name = "elevation_m", nullable = false)
    private double elevationM;

    /** IANA zone, or null for local mean solar time. */
    @Column(name = "time_zone", length = 64)
    private String timeZone;

    /** Zenith sky brightness on a moonless night, V mag per square arcsecond; null when unknown. */
    @Column(name = "dark_sky_zenith_vmag")
    private Double darkSkyZenithVMag;

    @ElementCollection
    @BatchSize(size = 64)
    @CollectionTable(name = "site_horizon_point", joinColumns = @JoinColumn(name = "site_id"))
    @OrderColumn(name = "seq")
    private List<HorizonPoint> horizon = new ArrayList<>();

    protected Site() {}

    public Site(String name, double latitudeDeg, double longitudeDeg, double elevationM) {
        this.name = name;
        this.latitudeDeg = latitudeDeg;
        this.longitudeDeg = longitudeDeg;
        this.elevationM = elevationM;
    }

    public String getName() {
        return name;
    }

    public void setName(String name) {
        this.name = name;
    }

    public double getLatitudeDeg() {
        return latitudeDeg;
    }

    public double getLongitudeDeg() {
        return longitudeDeg;
    }

    public double getElevationM() {
        return elevationM;
    }

    public void setLocation(double latitudeDeg, double longitudeDeg, double elevationM) {
        this.latitudeDeg = latitudeDeg;
        this.longitudeDeg = longitudeDeg;
        this.elevationM = elevationM;
    }

    public String getTimeZone() {
        return timeZone;
    }

    public void setTimeZone(String timeZone) {
        this.timeZone = timeZone;
    }

    public Double getDarkSkyZenithVMag() {
        return darkSkyZenithVMag;
    }

    public void setDarkSkyZenithVMag(Double darkSkyZenithVMag) {
        this.darkSkyZenithVMag = darkSkyZenithVMag;
    }

    public List<HorizonPoint> getHorizon() {
        return List.copyOf(horizon);
    }

    public void setHorizon(List<HorizonPoint> points) {
        horizon.clear();
        horizon.addAll(points);
    }
}
