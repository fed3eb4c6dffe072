package org.skyrota.web.equipment;

import java.util.List;

import org.skyrota.web.equipment.EquipmentViews.InstrumentView;
import org.skyrota.web.equipment.EquipmentViews.TelescopeView;
import org.skyrota.web.site.Site;
import org.skyrota.web.site.SiteRepository;
import org.skyrota.web.system.AuditLog;
import org.skyrota.web.system.ConflictException;
import org.skyrota.web.system.FieldProblem;
import org.skyrota.web.system.InvalidParametersException;
import org.skyrota.web.system.NotFoundException;
import org.skyrota.web.system.PageView;
import org.springframework.data.domain.Pageable;
import org.springframework.stereotype.Service;
import org.springframework.transaction.annotation.Transactional;

/** Reads and changes telescopes and their instruments, one transaction per call. */
@Service
@Transactional
public class EquipmentService {

    private final TelescopeRepository telescopes;
    private final InstrumentRepository instruments;
    private final SiteRepository sites;
    private final AuditLog audit;

    EquipmentService(TelescopeRepository telescopes, InstrumentRepository instruments, SiteRepository sites, AuditLog audit) {
        this.audit = audit;
        this.telescopes = telescopes;
        this.instruments = instruments;
        this.sites = sites;
    }

    @Transactional(readOnly = true)
    public PageView<TelescopeView> listTelescopes(Long siteId, Pageable pageable) {
        return PageView.of(siteId == null ? telescopes.findAll(pageable) : telescopes.findBySiteId(siteId, pageable), TelescopeView::of);
    }

    @Transactional(readOnly = true)
    public TelescopeView getTelescope(long id) {
        return TelescopeView.of(telescope(id));
    }

    /** The stored telescope, for other features' services inside their own transaction. */
    @Transactional(readOnly = true)
    public Telescope telescope(long id) {
        return telescopes.findById(id).orElseThrow(() -> new NotFoundException("telescope", id));
    }

    public TelescopeView createTelescope(TelescopeForm form) {
        Site site = referencedSite(form.siteId());
        requireUniqueTelescopeName(site.getId(), form.name().trim(), null);
        Telescope t = new Telescope(site, form.name().trim());
        apply(form, t);
        TelescopeView created = TelescopeView.of(telescopes.saveAndFlush(t));
        audit.record("create", "telescope", created.id(), null, created);
        return created;
    }

    public TelescopeView updateTelescope(long id, TelescopeForm form) {
        Telescope t = telescope(id);
        requireVersionGiven(form.version());
        t.requireVersion("telescope", form.version());
        TelescopeView before = TelescopeView.of(t);
        Site site = referencedSite(form.siteId());
        requireUniqueTelescopeName(site.getId(), form.name().trim(), t);
        t.setSite(site);
        t.setName(form.name().trim());
        apply(form, t);
        TelescopeView after = TelescopeView.of(telescopes.saveAndFlush(t));
        audit.record("update", "telescope", id, before, after);
        return after;
    }

    public void deleteTelescope(long id, Long version) {
        Telescope t = telescope(id);
        if (version != null) {
            t.requireVersion("telescope", version);
        }
        audit.record("delete", "telescope", id, TelescopeView.of(t), null);
        telescopes.delete(t);
        telescopes.flush();
    }

    @Transactional(readOnly = true)
    public PageView<InstrumentView> listInstruments(Long telescopeId, Pageable pageable) {
        return PageView.of(telescopeId == null ? instruments.findAll(pageable) : instruments.findByTelescopeId(telescopeId, pageable),
                InstrumentView::of);
    }

    @Transactional(readOnly = true)
    public InstrumentView getInstrument(long id) {
        return InstrumentView.of(instrument(id));
    }

    public InstrumentView createInstrument(InstrumentForm form) {
        Telescope t = referencedTelescope(form.telescopeId());
        if (instruments.existsByTelescopeIdAndNameIgnoreCase(t.getId(), form.name().trim())) {
            throw new ConflictException("Telescope " + t.getName() + " has an instrument named '" + form.name().trim() + "' already");
        }
        Instrument i = new Instrument(t, form.name().trim());
        apply(form, i);
        InstrumentView created = InstrumentView.of(instruments.saveAndFlush(i));
        audit.record("create", "instrument", created.id(), null, created);
        return created;
    }

    public InstrumentView updateInstrument(long id, InstrumentForm form) {
        Instrument i = instrument(id);
        requireVersionGiven(form.version());
        i.requireVersion("instrument", form.version());
        InstrumentView before = InstrumentView.of(i);
        Telescope t = referencedTelescope(form.telescopeId());
        if (!(i.getTelescope().getId().equals(t.getId()) && i.getName().equalsIgnoreCase(form.name().trim()))
                && instruments.existsByTelescopeIdAndNameIgnoreCase(t.getId(), form.name().trim())) {
            throw new ConflictException("Telescope " + t.getName() + " has an instrument named '" + form.name().trim() + "' already");
        }
        i.setTelescope(t);
        i.setName(form.name().trim());
        apply(form, i);
        InstrumentView after = InstrumentView.of(instruments.saveAndFlush(i));
        audit.record("update", "instrument", id, before, after);
        return after;
    }

    public void deleteInstrument(long id, Long version) {
        Instrument i = instrument(id);
        if (version != null) {
            i.requireVersion("instrument", version);
        }
        audit.record("delete", "instrument", id, InstrumentView.of(i), null);
        instruments.delete(i);
        instruments.flush();
    }

    private Instrument instrument(long id) {
        return instruments.findById(id).orElseThrow(() -> new NotFoundException("instrument", id));
    }

    private Site referencedSite(long siteId) {
        return sites.findById(siteId).orElseThrow(() -> invalid("siteId", "names no stored site: " + siteId));
    }

    private Telescope referencedTelescope(long telescopeId) {
        return telescopes.findById(telescopeId).orElseThrow(() -> invalid("telescopeId", "names no stored telescope: " + telescopeId));
    }

    private void requireUniqueTelescopeName(long siteId, String name, Telescope editing) {
        boolean unchanged = editing != null && editing.getSite().getId() == siteId && editing.getName().equalsIgnoreCase(name);
        if (!unchanged && telescopes.existsBySiteIdAndNameIgnoreCase(siteId, name)) {
            throw new ConflictException("The site has a telescope named '" + name + "' already");
        }
    }

    private static void apply(TelescopeForm form, Telescope t) {
        MountKind kind = form.mountKind() == null ? MountKind.EQUATORIAL : form.mountKind();
        boolean flips = Boolean.TRUE.equals(form.needsMeridianFlip());
        double east = form.eastHourAngleLimitDeg() == null ? -180 : form.eastHourAngleLimitDeg();
        double west = form.westHourAngleLimitDeg() == null ? 180 : form.westHourAngleLimitDeg();
        if (kind == MountKind.ALT_AZIMUTH) {
            List<FieldProblem> problems = new java.util.ArrayList<>();
            if (flips) {
                problems.add(new FieldProblem("needsMeridianFlip", "only an equatorial mount flips at the meridian"));
            }
            if (east != -180) {
                problems.add(new FieldProblem("eastHourAngleLimitDeg", "hour-angle limits apply to equatorial mounts only"));
            }
            if (west != 180) {
                problems.add(new FieldProblem("westHourAngleLimitDeg", "hour-angle limits apply to equatorial mounts only"));
            }
            if (!problems.isEmpty()) {
                throw new InvalidParametersException(problems);
            }
        }
        t.setOptics(form.apertureMm(), form.minAltitudeDeg(), form.slewRateDegPerS(), form.settleSeconds());
        t.setMount(kind, flips, east, west);
        t.setActive(form.active() == null || form.active());
    }

    private static void apply(InstrumentForm form, Instrument i) {
        i.setOverheads(form.readoutSeconds(), form.filterChangeSeconds());
        i.setCertifiedSolarFilter(Boolean.TRUE.equals(form.certifiedSolarFilter()));
        i.setFilters(form.filters() == null ? List.of() : form.filters().stream().map(String::trim).toList());
    }

    static InvalidParametersException invalid(String field, String message) {
        return new InvalidParametersException(List.of(new FieldProblem(field, message)));
    }

    static void requireVersionGiven(Long version) {
        if (version == null) {
            throw invalid("version", "is required when editing: send the version you read");
        }
    }
}
