package org.skyrota.web.plugin;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import org.skyrota.plugin.PluginRegistry;
import org.skyrota.plugin.SkyrotaPlugin;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.RestController;

/** The plugins this server loaded, and the ones it left out with the reason. */
@RestController
class PluginController {

    private final PluginRegistry registry;

    PluginController(PluginRegistry registry) {
        this.registry = registry;
    }

    record PluginView(String id, String name, String version, int apiVersion, List<String> kinds, String description) {}

    record ProblemView(String source, String plugin, String problem) {}

    /** A target kind a request may name, with its parameters and a line of help on each. */
    record TargetKindView(String kind, String plugin, String description, Map<String, String> parameters) {}

    record PluginsView(List<PluginView> plugins, List<ProblemView> problems, List<TargetKindView> targetKinds) {}

    @GetMapping("/api/plugins")
    PluginsView plugins() {
        Map<String, PluginView> byId = new LinkedHashMap<>();
        for (Class<? extends SkyrotaPlugin> service : PluginRegistry.CORE_SERVICES) {
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
        List<ProblemView> problems = registry.problems().stream()
                .map(r -> new ProblemView(r.source(), r.pluginId(), r.problem())).toList();
        List<TargetKindView> kinds = registry.targetKinds().stream()
                .map(k -> new TargetKindView(k.kind(), k.descriptor().id(), k.description(),
                        new java.util.TreeMap<>(k.parameterHelp())))
                .toList();
        return new PluginsView(List.copyOf(byId.values()), problems, kinds);
    }

    /** "PlanExporter" becomes "plan-exporter". */
    static String kind(Class<?> service) {
        return service.getSimpleName().replaceAll("([a-z])([A-Z])", "$1-$2").toLowerCase();
    }
}
