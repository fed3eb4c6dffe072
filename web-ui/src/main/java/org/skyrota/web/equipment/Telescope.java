package org.skyrota.web.equipment;

import jakarta.persistence.Column;
import jakarta.persistence.Entity;
import jakarta.persistence.EnumType;
import jakarta.persistence.Enumerated;
import jakarta.persistence.FetchType;
import jakarta.persistence.JoinColumn;
import jakarta.persistence.ManyToOne;
import jakarta.persistence.Table;

import org.skyrota.web.site.Site;
import org.skyrota.web.system.StoredEntity;

/** A telescope at a site, with the limits and overheads that shape its visits. */
@Entity
@Table(name = "telescope")
public class Telescope extends StoredEntity {

    @ManyToOne(fetch = FetchType.LAZY, optional = false)
    @JoinColumn(name = "site_id", nullable = false)
    private Site site;

    @Column(nullable = false, length = 100)
    private String name;

    @Column(name = "aperture_mm", nullable = false)
    private double apertureMm;

    /** The mount's or the dome's lowest usable altitude. */
    @Column(name = "min_altitude_deg", nullable = false)
    private double minAltitudeDeg;

    @Column(name = "slew_rate_deg_per_s", nullable = false)
    private double slewRateDegPerS;

    @Column(name = "settle_seconds", nullable = false)
    private double settleSeconds;

    @Column(nullable = false)
    private boolean active;

    @Enumerated(EnumType.STRING)
    @Column(name = "mount_kind", nullable = false, length = 20)
    private MountKind mountKind = MountKind.EQUATORIAL;

    /** A German equatorial mount swings to the other side of its pier when the target crosses the meridian. */
    @Column(name = "needs_meridian_flip", nullable = false)
    private boolean needsMeridianFlip;

    /** The most eastern (negative) hour angle the mount reaches, degrees; -180 for no limit. */
    @Column(name = "east_hour_angle_limit_deg", nullable = false)
    private double eastHourAngleLimitDeg = -180;

    /** The most western (positive) hour angle the mount reaches, degrees; 180 for no limit. */
    @Column(name = "west_hour_angle_limit_deg", nullable = false)
    private double westHourAngleLimitDeg = 180;

    protected Telescope() {}

    public Telescope(Site site, String name) {
        this.site = site;
        this.name = name;
        this.active = true;
    }

    public Site getSite() {
        return site;
    }

    public void setSite(Site site) {
        this.site = site;
    }

    public String getName() {
        return name;
    }

    public void setName(String name) {
        this.name = name;
    }

    public double getApertureMm() {
        return apertureMm;
    }

    public double getMinAltitudeDeg() {
        return minAltitudeDeg;
    }

    public double getSlewRateDegPerS() {
        return slewRateDegPerS;
    }

    public double getSettleSeconds() {
        return settleSeconds;
    }

    public void setOptics(double apertureMm, double minAltitudeDeg, double slewRateDegPerS, double settleSeconds) {
        this.apertureMm = apertureMm;
        this.minAltitudeDeg = minAltitudeDeg;
        this.slewRateDegPerS = slewRateDegPerS;
        this.settleSeconds = settleSeconds;
    }

    public MountKind getMountKind() {
        return mountKind;
    }

    public boolean needsMeridianFlip() {
        return needsMeridianFlip;
    }

    public double getEastHourAngleLimitDeg() {
        return eastHourAngleLimitDeg;
    }

    public double getWestHourAngleLimitDeg() {
        return westHourAngleLimitDeg;
    }

    public void setMount(MountKind kind, boolean needsMeridianFlip, double eastHourAngleLimitDeg,
                         double westHourAngleLimitDeg) {
        this.mountKind = kind;
        this.needsMeridianFlip = needsMeridianFlip;
        this.eastHourAngleLimitDeg = eastHourAngleLimitDeg;
        this.westHourAngleLimitDeg = westHourAngleLimitDeg;
    }

    public boolean isActive() {
        return active;
    }

    public void setActive(boolean active) {
        this.active = active;
    }
}
