package org.skyrota.web.plan;

import static org.assertj.core.api.Assertions.assertThat;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.get;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.post;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.content;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.jsonPath;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.status;

import com.jayway.jsonpath.JsonPath;

import java.util.ArrayList;
import java.util.List;

import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.Test;
import org.skyrota.planning.model.MountKind;
import org.skyrota.web.equipment.TelescopeRepository;
import org.skyrota.web.site.SiteRepository;
import org.skyrota.web.support.CsrfOnEveryRequest;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.webmvc.test.autoconfigure.AutoConfigureMockMvc;
import org.springframework.context.annotation.Import;
import org.springframework.http.MediaType;
import org.springframework.security.test.context.support.WithMockUser;
import org.springframework.test.web.servlet.MockMvc;
import org.springframework.test.web.servlet.ResultActions;
import org.springframework.transaction.PlatformTransactionManager;
import org.springframework.transaction.support.TransactionTemplate;

/**
 * A telescope's mount is stored, shown, checked naming the field, and reaches the planner through the planning
 * mapper; a telescope sent without mount fields keeps the old behaviour (equatorial, no flip, no limits).
 */
@SpringBootTest
@AutoConfigureMockMvc
@Import(CsrfOnEveryRequest.class)
@WithMockUser(username = "coordinator", roles = "COORDINATOR")
class TelescopeMountApiTest {

    @Autowired MockMvc mvc;
    @Autowired TelescopeRepository telescopes;
    @Autowired SiteRepository sites;
    @Autowired PlatformTransactionManager transactions;

    private final List<Long> createdTelescopes = new ArrayList<>();
    private Long siteId;

    @AfterEach
    void remove() {
        createdTelescopes.forEach(telescopes::deleteById);
        if (siteId != null) {
            sites.deleteById(siteId);
        }
    }

    @Test
    void aGermanEquatorialMountWithLimitsIsStoredShownAndMapped() throws Exception {
        long telescope = telescope("""
                ,"mountKind":"EQUATORIAL","needsMeridianFlip":true,"eastHourAngleLimitDeg":-95,"westHourAngleLimitDeg":30""")
                .andExpect(status().isCreated()).andReturn().getResponse().getContentAsString().transform(this::id);
        mvc.perform(get("/api/telescopes/" + telescope))
                .andExpect(jsonPath("$.mountKind").value("EQUATORIAL"))
                .andExpect(jsonPath("$.needsMeridianFlip").value(true))
                .andExpect(jsonPath("$.eastHourAngleLimitDeg").value(-95.0))
                .andExpect(jsonPath("$.westHourAngleLimitDeg").value(30.0));
        org.skyrota.planning.model.Telescope mapped = mapped(telescope);
        assertThat(mapped.mount()).isEqualTo(MountKind.EQUATORIAL);
        assertThat(mapped.needsMeridianFlip()).isTrue();
        assertThat(mapped.eastHourAngleLimitDeg()).isEqualTo(-95);
        assertThat(mapped.westHourAngleLimitDeg()).isEqualTo(30);
    }

    @Test
    void aTelescopeSentWithoutMountFieldsIsAnEquatorialMountWithoutLimits() throws Exception {
        long telescope = telescope("").andExpect(status().isCreated())
                .andExpect(jsonPath("$.mountKind").value("EQUATORIAL"))
                .andExpect(jsonPath("$.needsMeridianFlip").value(false))
                .andReturn().getResponse().getContentAsString().transform(this::id);
        org.skyrota.planning.model.Telescope mapped = mapped(telescope);
        assertThat(mapped.hourAngleMatters()).isFalse();
        assertThat(mapped.eastHourAngleLimitDeg()).isEqualTo(-180);
        assertThat(mapped.westHourAngleLimitDeg()).isEqualTo(180);
    }

    @Test
    void anAltAzimuthMountIsMappedAsOne() throws Exception {
        long telescope = telescope(",\"mountKind\":\"ALT_AZIMUTH\"").andExpect(status().isCreated())
                .andReturn().getResponse().getContentAsString().transform(this::id);
        assertThat(mapped(telescope).mount()).isEqualTo(MountKind.ALT_AZIMUTH);
    }

    @Test
    void aFlipOnAnAltAzimuthMountAndALimitOutOfRangeAreRefusedNamingTheField() throws Exception {
        refused(telescope(",\"mountKind\":\"ALT_AZIMUTH\",\"needsMeridianFlip\":true"), "needsMeridianFlip");
        refused(telescope(",\"mountKind\":\"ALT_AZIMUTH\",\"westHourAngleLimitDeg\":60"), "westHourAngleLimitDeg");
        refused(telescope(",\"westHourAngleLimitDeg\":200"), "westHourAngleLimitDeg");
        refused(telescope(",\"eastHourAngleLimitDeg\":10"), "eastHourAngleLimitDeg");
        assertThat(createdTelescopes).isEmpty();
    }

    private ResultActions telescope(String mountFields) throws Exception {
        if (siteId == null) {
            siteId = id(mvc.perform(post("/api/sites").contentType(MediaType.APPLICATION_JSON).content("""
                    {"name":"Mount Test Station","latitudeDeg":35.2,"longitudeDeg":-111.6,"elevationM":2100}"""))
                    .andExpect(status().isCreated()).andReturn().getResponse().getContentAsString());
        }
        String name = "M" + System.nanoTime();
        ResultActions result = mvc.perform(post("/api/telescopes").contentType(MediaType.APPLICATION_JSON).content("""
                {"siteId":%d,"name":"%s","apertureMm":300,"minAltitudeDeg":15,"slewRateDegPerS":4,"settleSeconds":10%s}"""
                .formatted(siteId, name, mountFields)));
        String body = result.andReturn().getResponse().getContentAsString();
        if (result.andReturn().getResponse().getStatus() == 201) {
            createdTelescopes.add(id(body));
        }
        return result;
    }

    private org.skyrota.planning.model.Telescope mapped(long id) {
        return new TransactionTemplate(transactions).execute(s -> PlanningMapper.telescope(telescopes.findById(id).orElseThrow()));
    }

    private static void refused(ResultActions result, String field) throws Exception {
        result.andExpect(status().isBadRequest())
                .andExpect(content().contentType(MediaType.APPLICATION_PROBLEM_JSON))
                .andExpect(jsonPath("$.errors[0].field").value(field));
    }

    private long id(String json) {
        return ((Number) JsonPath.read(json, "$.id")).longValue();
    }
}
