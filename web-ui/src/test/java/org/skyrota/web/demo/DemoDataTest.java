package org.skyrota.web.demo;

import static org.assertj.core.api.Assertions.assertThat;
import static org.springframework.security.test.web.servlet.request.SecurityMockMvcRequestPostProcessors.httpBasic;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.get;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.jsonPath;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.status;

import java.time.ZoneId;
import java.util.EnumSet;
import java.util.List;
import java.util.Set;
import java.util.stream.Collectors;

import org.junit.jupiter.api.Test;
import org.skyrota.web.account.AccountRepository;
import org.skyrota.web.equipment.TelescopeRepository;
import org.skyrota.web.program.ProgramRepository;
import org.skyrota.web.request.ObservingRequest;
import org.skyrota.web.request.ObservingRequestRepository;
import org.skyrota.web.request.RequestState;
import org.skyrota.web.site.Site;
import org.skyrota.web.site.SiteRepository;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.DefaultApplicationArguments;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.webmvc.test.autoconfigure.AutoConfigureMockMvc;
import org.springframework.security.crypto.password.PasswordEncoder;
import org.springframework.test.web.servlet.MockMvc;

/** {@code --demo} on an empty database loads the invented consortium, and only once. */
@SpringBootTest(args = "--demo")
@AutoConfigureMockMvc
class DemoDataTest {

    @Autowired MockMvc mvc;
    @Autowired DemoData demo;
    @Autowired AccountRepository accounts;
    @Autowired SiteRepository sites;
    @Autowired TelescopeRepository telescopes;
    @Autowired ProgramRepository programs;
    @Autowired ObservingRequestRepository requests;
    @Autowired PasswordEncoder encoder;

    @Test
    void loadsTheConsortiumWithItsAccounts() throws Exception {
        for (String name : List.of("admin", "coordinator", "student", "student2")) {
            assertThat(encoder.matches("demo", accounts.findByUsername(name).orElseThrow().getPasswordHash())).as(name).isTrue();
        }
        assertThat(accounts.count()).isEqualTo(4);

        List<Site> all = sites.findAll();
        assertThat(all).hasSize(3);
        assertThat(all).anySatisfy(s -> assertThat(s.getLatitudeDeg()).isGreaterThan(60));   // high northern latitude
        assertThat(all).anySatisfy(s -> assertThat(s.getLatitudeDeg()).isNegative());       // southern hemisphere
        Set<String> continents = all.stream().map(s -> ZoneId.of(s.getTimeZone()).getId().split("/")[0]).collect(Collectors.toSet());
        assertThat(continents).hasSize(3);
        assertThat(telescopes.count()).isEqualTo(5);
        assertThat(programs.count()).as("four programs and the one alerts go to").isEqualTo(5);

        List<ObservingRequest> all150 = requests.findAll();
        assertThat(all150).hasSize(DemoData.REQUEST_COUNT);
        // Every state a person sets; completed and expired come only from the term itself (reports, the clock).
        assertThat(all150.stream().map(ObservingRequest::getState).collect(Collectors.toSet())).isEqualTo(
                EnumSet.complementOf(EnumSet.of(RequestState.COMPLETED, RequestState.EXPIRED)));
        assertThat(all150).filteredOn(r -> r.getState() == RequestState.REJECTED).allSatisfy(r -> assertThat(r.getRejectionReason()).isNotBlank());
        // Every priority from 1 (lowest) to 5 (highest) occurs, and every repeated request carries the spacing the
        // request form asks for (an interval, and a tolerance below it), so a demo draft can be edited as it is.
        assertThat(all150.stream().map(ObservingRequest::getPriority).collect(Collectors.toSet())).containsExactlyInAnyOrder(1, 2, 3, 4, 5);
        assertThat(all150).filteredOn(r -> r.getRepeats() > 1).isNotEmpty().allSatisfy(r -> {
            assertThat(r.getRepeatIntervalHours()).isPositive();
            assertThat(r.getRepeatToleranceHours()).isGreaterThanOrEqualTo(0.0).isLessThan(r.getRepeatIntervalHours());
        });

        mvc.perform(get("/api/about")).andExpect(jsonPath("$.demo").value(true));
        long own = all150.stream().filter(r -> r.getOwner().equals("student")).count();
        mvc.perform(get("/api/requests").with(httpBasic("student", "demo")))
                .andExpect(status().isOk())
                .andExpect(jsonPath("$.totalItems").value((int) own));
    }

    @Test
    void aDatabaseThatHoldsDataIsLeftAlone() throws Exception {
        long before = requests.count();
        demo.run(new DefaultApplicationArguments("--demo"));
        assertThat(requests.count()).isEqualTo(before);
        assertThat(sites.count()).isEqualTo(3);
    }
}
