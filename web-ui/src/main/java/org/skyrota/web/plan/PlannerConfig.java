package org.skyrota.web.plan;

import org.skyrota.constraints.SkyrotaConstraints;
import org.skyrota.planning.sky.EngineSkyModel;
import org.skyrota.planning.solver.Planner;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;

/** One planner for the server: the real sky engine behind it, the constraints module's score rules. */
@Configuration
class PlannerConfig {

    @Bean
    Planner planner() {
        return new Planner(new EngineSkyModel(), SkyrotaConstraints.class);
    }
}
