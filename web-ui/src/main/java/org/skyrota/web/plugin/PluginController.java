package org.skyrota.web.plugin;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import org.optaplanner.core.api.score.buildin.hardmediumsoftlong.HardMediumSoftLongScore;
import org.skyrota.constraints.ScoreRule;
import org.skyrota.constraints.ScoreRules;
import org.skyrota.plugin.PluginRegistry;
import org.skyrota.plugin.SkyrotaPlugin;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.RestController;

/** The plugins this server loaded, the score rules they add with their default weights, and what was left out. */
@RestController
class PluginController {

    private final PluginRegistry registry;
    private final ScoreRules scoreRules;

    PluginController(PluginRegistry registry, ScoreRules scoreRules) {
        this.registry = registry;
        this.scoreRules = scoreRules;
    }

    record PluginView(String id, String name, String version, int apiVersion, List<String> kinds, String description) {}

    record ProblemView(String source, String plugin, String problem) {}

    /** A weight as runs send it in {@code weights}. */
    record WeightView(long hard, long medium, long soft) {
        static WeightView of(HardMediumSoftLongScore w) {
            return new WeightView(w.hardScore(), w.mediumScore(), w.softScore());
        }
    }

    /** A plugin's score rule: {@code rule} is the key of its weight in a run's {@code weights}. */
    record ScoreRuleView(String plugin, String rule, String description, WeightView defaultWeight) {}

    /** A target kind a request may name, with its parameters and a line of help on each. */
    record TargetKindView(String kind, String plugin, String description, Map<String, String> parameters) {}

    record PluginsView(List<PluginView> plugins, List<ScoreRuleView> scoreRules, List<ProblemView> problems,
                       List<TargetKindView> targetKinds) {}

    @GetMapping("/api/plugins")
    PluginsView plugins() {
        Map<String, PluginView> byId = new LinkedHashMap<>();
        for (Class<? extends SkyrotaPlugin> service : PluginsConfig.SERVICES) {
            for (SkyrotaPlugin p : registry.plugins(service)) {
                String kind = kind(service);
                PluginView seen = byId.get(p.descriptor().id());
                List<String> kinds = new ArrayList<>(seen == null ? List.of() : seen.kinds());
                if (!kinds.contains(kind)) {
                    kinds.add(kind);
                }
                byId.put(p.descriptor().id(), new PluginView(p.descriptor().id(), p.descriptor().name(),
                        p.descriptor().version(), p.descriptor().apiVersion(), List.copyOf(kinds),
                        seen == null ? p.description() : seen.description()));
            }
        }
        List<ScoreRuleView> rules = new ArrayList<>();
        for (ScoreRule r : scoreRules.rules()) {
            rules.add(new ScoreRuleView(r.descriptor().id(), r.ruleName(), r.description(),
                    WeightView.of(r.defaultWeight())));
        }
        List<ProblemView> problems = new ArrayList<>(registry.problems().stream()
                .map(r -> new ProblemView(r.source(), r.pluginId(), r.problem())).toList());
        for (String p : scoreRules.problems()) {
            problems.add(new ProblemView("class path or plugins folder", null, p));
        }
        List<TargetKindView> kinds = registry.targetKinds().stream()
                .map(k -> new TargetKindView(k.kind(), k.descriptor().id(), k.description(),
                        new java.util.TreeMap<>(k.parameterHelp())))
                .toList();
        return new PluginsView(List.copyOf(byId.values()), List.copyOf(rules), List.copyOf(problems), kinds);
    }

    /** "PlanExporter" becomes "plan-exporter". */
    static String kind(Class<?> service) {
        return service.getSimpleName().replaceAll("([a-z])([A-Z])", "$1-$2").toLowerCase();
    }
}
