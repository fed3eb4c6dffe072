package org.skyrota.web.plan;

import java.util.ArrayList;
import java.util.List;

import org.skyrota.constraints.ScoreRules;
import org.skyrota.planning.domain.RuleNames;
import org.skyrota.planning.sky.EngineSkyModel;
import org.skyrota.planning.solver.Planner;
import org.springframework.stereotype.Component;

/**
 * Planners for the server: the real sky engine behind each, the constraints module's score rules and those of the
 * loaded score-rule plugins. Every run and every scoring gets a planner of its own, because the sky model caches
 * sites by id and Sun and Moon positions by minute: a long-lived one would keep a site's old coordinates after an
 * edit and grow without end.
 */
@Component
public class PlannerConfig {

    private final ScoreRules scoreRules;

    public PlannerConfig(ScoreRules scoreRules) {
        this.scoreRules = scoreRules;
    }

    public Planner fresh() {
        return scoreRules.planner(new EngineSkyModel());
    }

    /** Every rule a run may weight: the built-in ones, then the plugins'. */
    public List<String> ruleNames() {
        List<String> names = new ArrayList<>(RuleNames.ALL);
        names.addAll(scoreRules.defaultWeights().keySet());
        return names;
    }
}
