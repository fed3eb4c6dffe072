package org.skyrota.web.site;

import java.util.List;

import org.skyrota.web.system.AuditLog;
import org.skyrota.web.system.ConflictException;
import org.skyrota.web.system.InvalidParametersException;
import org.skyrota.web.system.FieldProblem;
import org.skyrota.web.system.NotFoundException;
import org.skyrota.web.system.PageView;
import org.springframework.data.domain.Page;
import org.springframework.data.domain.Pageable;
import org.springframework.stereotype.Service;
import org.springframework.transaction.annotation.Transactional;

/** Reads and changes sites, one transaction per call. */
@Service
@Transactional
public class SiteService {

    static final String KIND = "site";

    private final SiteRepository sites;
    private final AuditLog audit;

    SiteService(SiteRepository sites, AuditLog audit) {
        this.sites = sites;
        this.audit = audit;
    }

    @Transactional(readOnly = true)
    public PageView<SiteView> list(String nameContains, Pageable pageable) {
        Page<Site> page = nameContains == null || nameContains.isBlank()
                ? sites.findAll(pageable)
                : sites.findByNameContainingIgnoreCase(nameContains.trim(), pageable);
        return PageView.of(page, SiteView::of);
    }

    @Transactional(readOnly = true)
    public SiteView get(long id) {
        return SiteView.of(find(id));
    }

    /** Every stored site, by name. */
    @Transactional(readOnly = true)
    public java.util.List<Site> all() {
        return sites.findAll(org.springframework.data.domain.Sort.by("name"));
    }

    /** The stored site, for other features' services inside their own transaction. */
    @Transactional(readOnly = true)
    public Site find(long id) {
        return sites.findById(id).orElseThrow(() -> new NotFoundException(KIND, id));
    }

    public SiteView create(SiteForm form) {
        if (sites.existsByNameIgnoreCase(form.name().trim())) {
            throw new ConflictException("A site named '" + form.name().trim() + "' exists already");
        }
        Site site = new Site(form.name().trim(), form.latitudeDeg(), form.longitudeDeg(), form.elevationM());
        apply(form, site);
        SiteView created = SiteView.of(sites.saveAndFlush(site));
        audit.record("create", KIND, created.id(), null, created);
        return created;
    }

    public SiteView update(long id, SiteForm form) {
        Site site = find(id);
        requireVersionGiven(form.version());
        SiteView before = SiteView.of(site);
        site.requireVersion(KIND, form.version());
        if (!site.getName().equalsIgnoreCase(form.name().trim()) && sites.existsByNameIgnoreCase(form.name().trim())) {
            throw new ConflictException("A site named '" + form.name().trim() + "' exists already");
        }
        site.setName(form.name().trim());
        site.setLocation(form.latitudeDeg(), form.longitudeDeg(), form.elevationM());
        apply(form, site);
        // Flush now so that the new version is known to the caller's response.
        SiteView after = SiteView.of(sites.saveAndFlush(site));
        audit.record("update", KIND, id, before, after);
        return after;
    }

    public void delete(long id, Long version) {
        Site site = find(id);
        if (version != null) {
            site.requireVersion(KIND, version);
        }
        audit.record("delete", KIND, id, SiteView.of(site), null);
        sites.delete(site);
        sites.flush();
    }

    private static void apply(SiteForm form, Site site) {
        if (form.horizon() != null) {
            java.util.Set<Double> seen = new java.util.HashSet<>();
            for (int i = 0; i < form.horizon().size(); i++) {
                if (!seen.add(form.horizon().get(i).azimuthDeg())) {
                    throw new InvalidParametersException(List.of(new FieldProblem("horizon[" + i + "].azimuthDeg",
                            "repeats an azimuth given earlier: " + form.horizon().get(i).azimuthDeg())));
                }
            }
        }
        site.setTimeZone(form.timeZone() == null || form.timeZone().isBlank() ? null : form.timeZone().trim());
        site.setDarkSkyZenithVMag(form.darkSkyZenithVMag());
        site.setHorizon(form.horizon() == null ? List.of()
                : form.horizon().stream().map(p -> new HorizonPoint(p.azimuthDeg(), p.altitudeDeg())).toList());
    }

    static void requireVersionGiven(Long version) {
        if (version == null) {
            throw new InvalidParametersException(List.of(new FieldProblem("version",
                    "is required when editing: send the version you read")));
        }
    }
}
