package org.skyrota.web.system;

import io.swagger.v3.oas.models.OpenAPI;
import io.swagger.v3.oas.models.info.Info;
import io.swagger.v3.oas.models.info.License;

import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;

/** The title page of the OpenAPI description served at /v3/api-docs (browsable at /swagger-ui.html). */
@Configuration
class OpenApiConfig {

    @Bean
    OpenAPI skyrotaOpenApi() {
        return new OpenAPI().info(new Info()
                .title("Skyrota API")
                .description("Sites, equipment, programs and observing requests; almanac and visibility computations. "
                        + "Angles in degrees (longitude east-positive, right ascension 0-360), instants in UTC, "
                        + "errors as RFC 9457 problem documents.")
                .version("0.1.0")
                .license(new License().name("Apache-2.0")));
    }
}
