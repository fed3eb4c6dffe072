package org.skyrota.web;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.List;

import static org.assertj.core.api.Assertions.tuple;

import java.time.LocalDate;

import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.Test;
import org.skyrota.web.equipment.Instrument;
import org.skyrota.web.equipment.InstrumentRepository;
import org.skyrota.web.equipment.Telescope;
import org.skyrota.web.equipment.TelescopeRepository;
import org.skyrota.web.program.Grant;
import org.skyrota.web.program.Program;
import org.skyrota.web.program.ProgramRepository;
import org.skyrota.web.request.DarknessLimit;
import org.skyrota.web.request.Exposure;
import org.skyrota.web.request.ObservingRequest;
import org.skyrota.web.request.ObservingRequestRepository;
import org.skyrota.web.request.RequestState;
import org.skyrota.web.site.HorizonPoint;
import org.skyrota.web.site.Site;
import org.skyrota.web.site.SiteRepository;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.dao.DataIntegrityViolationException;
import org.springframework.data.domain.PageRequest;
import org.springframework.data.domain.Sort;
import org.springframework.orm.ObjectOptimisticLockingFailureException;
import org.springframework.transaction.annotation.Propagation;
import org.springframework.transaction.annotation.Transactional;
import org.springframework.transaction.support.TransactionTemplate;

/**
 * What the repositories must do on every database Skyrota supports: the Flyway schema
 * validates against the entities (Hibernate's ddl-auto=validate runs at start-up), rows round-trip,
 * versions guard against lost updates, paging and sorting work, and the schema's unique rules hold.
 * Each test commits for real (no rolled-back test transaction) so that versions and constraints
 * behave as in production.
 */
@Transactional(propagation = Propagation.NOT_SUPPORTED)
abstract class StorageContractTest {

    @Autowired
    SiteRepository sites;

    @Autowired
    TransactionTemplate transactions;

    @Autowired
    TelescopeRepository telescopes;

    @Autowired
    InstrumentRepository instruments;

    @Autowired
    ProgramRepository programs;

    @Autowired
    ObservingRequestRepository requests;

    @AfterEach
    void emptyTables() {
        requests.deleteAll();
        programs.deleteAll();
        instruments.deleteAll();
        telescopes.deleteAll();
        sites.deleteAll();
    }

    @Test
    void equipmentProgramAndRequestRoundTripWithTheirLists() {
        Site site = sites.save(new Site("Plateau Station", -23.5, -67.8, 2400));
        Telescope telescope = new Telescope(site, "T40");
        telescope.setOptics(400, 15, 4, 10);
        telescope = telescopes.save(telescope);
        Instrument ccd = new Instrument(telescope, "CCD-1");
        ccd.setOverheads(8, 5);
        ccd.setFilters(List.of("B", "V", "R"));
        long instrumentId = instruments.save(ccd).getId();
        Program program = new Program("VAR-27", "Variable stars", "coordinator");
        program.setGrants(List.of(new Grant(telescope.getId(), 40, LocalDate.of(2027, 1, 1), LocalDate.of(2027, 6, 30))));
        program = programs.save(program);
        ObservingRequest request = new ObservingRequest(program, "student");
        request.setTarget("NGC 1976", 83.82, -5.39);
        request.setConditions(30, DarknessLimit.NAUTICAL, 25.0, null);
        request.setSchedule(LocalDate.of(2027, 1, 10), null, 2, 1);
        request.setExposures(List.of(new Exposure("V", 60, 10), new Exposure("R", 45, 5)));
        long requestId = requests.save(request).getId();

        transactions.executeWithoutResult(status -> {
            assertThat(instruments.findById(instrumentId).orElseThrow().getFilters()).containsExactly("B", "V", "R");
            ObservingRequest r = requests.findById(requestId).orElseThrow();
            assertThat(r.getState()).isEqualTo(RequestState.DRAFT);
            assertThat(r.getDarkness()).isEqualTo(DarknessLimit.NAUTICAL);
            assertThat(r.getMinMoonSeparationDeg()).isEqualTo(25.0);
            assertThat(r.getMaxMoonIllumination()).isNull();
            assertThat(r.getLatestNight()).isNull();
            assertThat(r.getExposures()).extracting(Exposure::getFilterName, Exposure::getSeconds, Exposure::getCount)
                    .containsExactly(tuple("V", 60.0, 10), tuple("R", 45.0, 5));
            assertThat(r.getProgram().getGrants()).singleElement()
                    .satisfies(g -> assertThat(g.getLastNight()).isEqualTo(LocalDate.of(2027, 6, 30)));
        });
        assertThat(requests.countByState(RequestState.DRAFT)).isEqualTo(1);
        // A telescope still in use (an instrument on it, a grant naming it) cannot vanish from under them.
        long telescopeId = telescope.getId();
        assertThatThrownBy(() -> telescopes.deleteById(telescopeId)).isInstanceOf(DataIntegrityViolationException.class);
    }

    @Test
    void siteRoundTripsWithItsHorizonInOrder() {
        Site site = new Site("Ridge Station", -31.27, 149.06, 1165);
        site.setTimeZone("Australia/Sydney");
        site.setDarkSkyZenithVMag(21.6);
        site.setHorizon(List.of(new HorizonPoint(0, 5), new HorizonPoint(90, 12.5), new HorizonPoint(180, 3), new HorizonPoint(270, 8)));
        long id = sites.save(site).getId();

        Site read = transactions.execute(status -> {
            Site s = sites.findById(id).orElseThrow();
            s.getHorizon().size(); // load the collection inside the transaction
            return s;
        });
        assertThat(read.getName()).isEqualTo("Ridge Station");
        assertThat(read.getLatitudeDeg()).isEqualTo(-31.27);
        assertThat(read.getLongitudeDeg()).isEqualTo(149.06);
        assertThat(read.getElevationM()).isEqualTo(1165);
        assertThat(read.getTimeZone()).isEqualTo("Australia/Sydney");
        assertThat(read.getDarkSkyZenithVMag()).isEqualTo(21.6);
        assertThat(read.getHorizon()).extracting(HorizonPoint::getAzimuthDeg).containsExactly(0.0, 90.0, 180.0, 270.0);
        assertThat(read.getHorizon()).extracting(HorizonPoint::getAltitudeDeg).containsExactly(5.0, 12.5, 3.0, 8.0);
        assertThat(read.getCreatedAt()).isNotNull();
        assertThat(read.getVersion()).isZero();
    }

    @Test
    void aStaleCopyCannotOverwriteANewerEdit() {
        long id = sites.save(new Site("Valley Station", 40.1, -105.2, 1600)).getId();
        Site first = sites.findById(id).orElseThrow();
        Site second = sites.findById(id).orElseThrow();

        first.setName("Valley Station North");
        sites.save(first);
        assertThat(sites.findById(id).orElseThrow().getVersion()).isEqualTo(1);

        second.setName("Valley Station South");
        assertThatThrownBy(() -> sites.save(second)).isInstanceOf(ObjectOptimisticLockingFailureException.class);
        assertThat(sites.findById(id).orElseThrow().getName()).isEqualTo("Valley Station North");
    }

    @Test
    void namesAreUnique() {
        sites.save(new Site("Coast Station", 10, 10, 0));
        assertThatThrownBy(() -> sites.saveAndFlush(new Site("Coast Station", 11, 11, 0)))
                .isInstanceOf(DataIntegrityViolationException.class);
    }

    @Test
    void sitesPageSortAndFilterByName() {
        for (String name : List.of("Echo Hill", "Alpha Ridge", "Delta Hill", "Bravo Flat", "Charlie Hill")) {
            sites.save(new Site(name, 0, 0, 0));
        }
        var page = sites.findAll(PageRequest.of(0, 2, Sort.by("name")));
        assertThat(page.getTotalElements()).isEqualTo(5);
        assertThat(page.getTotalPages()).isEqualTo(3);
        assertThat(page.getContent()).extracting(Site::getName).containsExactly("Alpha Ridge", "Bravo Flat");

        var hills = sites.findByNameContainingIgnoreCase("HILL", PageRequest.of(0, 10, Sort.by(Sort.Direction.DESC, "name")));
        assertThat(hills.getContent()).extracting(Site::getName).containsExactly("Echo Hill", "Delta Hill", "Charlie Hill");
    }
}
