package org.skyrota.web.system;

import static org.assertj.core.api.Assertions.assertThat;
import static org.hamcrest.Matchers.hasKey;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.get;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.jsonPath;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.status;

import com.jayway.jsonpath.JsonPath;

import org.junit.jupiter.api.Test;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.webmvc.test.autoconfigure.AutoConfigureMockMvc;
import org.springframework.test.web.servlet.MockMvc;

/** The server describes its own API in OpenAPI 3, every resource included. */
@SpringBootTest
@AutoConfigureMockMvc
class OpenApiTest {

    @Autowired
    MockMvc mvc;

    @Test
    void describesEveryEndpoint() throws Exception {
        mvc.perform(get("/v3/api-docs"))
                .andExpect(status().isOk())
                .andExpect(jsonPath("$.openapi").value(org.hamcrest.Matchers.startsWith("3.")))
                .andExpect(jsonPath("$.paths", hasKey("/api/almanac")))
                .andExpect(jsonPath("$.paths", hasKey("/api/visibility")))
                .andExpect(jsonPath("$.paths", hasKey("/api/sites/{id}")))
                .andExpect(jsonPath("$.paths", hasKey("/api/telescopes")))
                .andExpect(jsonPath("$.paths", hasKey("/api/instruments")))
                .andExpect(jsonPath("$.paths", hasKey("/api/programs")))
                .andExpect(jsonPath("$.paths", hasKey("/api/requests/{id}/submit")));
        String document = mvc.perform(get("/v3/api-docs")).andReturn().getResponse().getContentAsString();
        assertThat(JsonPath.<java.util.Map<String, Object>>read(document, "$.paths"))
                .containsKeys("/api/requests/import", "/api/alerts", "/api/plugins", "/api/planner/runs");
        mvc.perform(get("/swagger-ui/index.html")).andExpect(status().isOk());
    }
}
