package org.skyrota.web.plugin;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

import org.skyrota.constraints.ScoreRule;
import org.skyrota.constraints.ScoreRules;

import org.skyrota.plugin.PluginJars;
import org.skyrota.plugin.PluginLoadReport;
import org.skyrota.plugin.PluginRegistry;
import org.skyrota.plugin.SkyrotaPlugin;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.beans.factory.annotation.Value;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;
import org.springframework.core.env.Environment;

/**
 * The plugins of this server: those on the class path (the bundled ones) and the jars in {@code <data-dir>/plugins}.
 * A broken jar or plugin never stops the start: it is left out, logged, and listed by {@code GET /api/plugins}.
 */
@Configuration
class PluginsConfig {

    private static final Logger log = LoggerFactory.getLogger(PluginsConfig.class);

    /** The core plugin interfaces and the constraints module's score rules. */
    static final List<Class<? extends SkyrotaPlugin>> SERVICES;

    static {
        List<Class<? extends SkyrotaPlugin>> services = new ArrayList<>(PluginRegistry.CORE_SERVICES);
        services.add(ScoreRule.class);
        SERVICES = List.copyOf(services);
    }

    @Bean(destroyMethod = "close")
    PluginJars pluginJars(@Value("${skyrota.data-dir}") String dataDir) {
        return PluginJars.open(Path.of(dataDir, "plugins"), PluginsConfig.class.getClassLoader());
    }

    /**
     * The bundled plugins read their settings from system properties when the service loader makes them; these are
     * the server's settings of the same names (command line, environment, application properties), copied over
     * first. Without {@code skyrota.conditions.file} the conditions file is {@code <data-dir>/conditions.csv}, read at
     * every planner run whenever it exists, so that one written or changed while the server runs takes effect at the
     * next run (the feed is made once, at the start, when the file may not exist yet).
     */
    static final List<String> PLUGIN_SETTINGS = List.of("skyrota.conditions.file", "skyrota.voevent.program",
            "skyrota.voevent.allow-test");
    /** The conditions file named outright: it must exist whenever a run reads it. */
    static final String CONDITIONS_FILE = "skyrota.conditions.file";
    /** The conditions-file plugin's default place, read whenever the file exists (its DEFAULT_PATH_PROPERTY). */
    static final String CONDITIONS_DEFAULT_FILE = "skyrota.conditions.default-file";

    @Bean
    PluginRegistry pluginRegistry(PluginJars jars, Environment environment) {
        for (String name : PLUGIN_SETTINGS) {
            String value = environment.getProperty(name);
            if (value != null && !value.isBlank()) {
                System.setProperty(name, value);
            }
        }
        String configured = environment.getProperty(CONDITIONS_FILE);
        if (configured == null || configured.isBlank()) {
            Path conditions = Path.of(environment.getProperty("skyrota.data-dir", "./skyrota-data"), "conditions.csv");
            System.setProperty(CONDITIONS_DEFAULT_FILE, conditions.toAbsolutePath().toString());
        }
        PluginRegistry registry;
        try {
            registry = PluginRegistry.load(jars.classLoader(), jars.problems(), SERVICES);
        } catch (RuntimeException | LinkageError e) {
            // The registry promises not to throw for a plugin; should it still, the server starts without plugins.
            registry = PluginRegistry.of(List.of());
            log.error("Plugins could not be loaded at all; the server runs without them", e);
        }
        for (PluginLoadReport problem : registry.problems()) {
            log.warn("Plugin left out: {}", problem);
        }
        registry.loaded().forEach(p -> log.info("Plugin {} {} ({}) from {}", p.descriptor().id(), p.descriptor().version(),
                p.service(), p.source()));
        return registry;
    }

    /** The score rules of the loaded plugins, checked; a rule that fails a check is left out and logged. */
    @Bean
    ScoreRules scoreRules(PluginRegistry registry) {
        ScoreRules rules = ScoreRules.from(registry);
        for (String problem : rules.problems()) {
            log.warn("Score rule left out: {}", problem);
        }
        return rules;
    }
}
