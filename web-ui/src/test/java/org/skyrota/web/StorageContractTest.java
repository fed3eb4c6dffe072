package org.skyrota.web;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.List;

import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.Test;
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

    @AfterEach
    void emptyTables() {
        sites.deleteAll();
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
