package org.skyrota.web.plan;

import org.skyrota.constraints.SkyrotaConstraints;
import org.skyrota.planning.sky.EngineSkyModel;
import org.skyrota.planning.solver.Planner;
import org.springframework.stereotype.Component;

/**
 * Planners for the server: the real sky engine behind each, the constraints module's score rules. Every run and every
 * scoring gets a planner of its own, because the sky model caches sites by id and Sun and Moon positions by minute:
 * a long-lived one would keep a site's old coordinates after an edit and grow without end.
 */
@Component
public class PlannerConfig {

    public Planner fresh() {
        return new Planner(new EngineSkyModel(), SkyrotaConstraints.class);
    }
}
