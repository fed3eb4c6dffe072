package org.skyrota.web.support;

import static org.springframework.security.test.web.servlet.request.SecurityMockMvcRequestPostProcessors.csrf;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.get;

import org.springframework.boot.test.context.TestConfiguration;
import org.springframework.boot.webmvc.test.autoconfigure.MockMvcBuilderCustomizer;
import org.springframework.context.annotation.Bean;

/**
 * For API tests that act as a signed-in browser user (@WithMockUser): every request carries a
 * valid CSRF token, as the dashboard's requests will. The CSRF rule itself is tested in the
 * security tests, which do not use this.
 */
@TestConfiguration
public class CsrfOnEveryRequest {

    @Bean
    MockMvcBuilderCustomizer csrfOnEveryRequest() {
        return builder -> builder.defaultRequest(get("/").with(csrf()));
    }
}
