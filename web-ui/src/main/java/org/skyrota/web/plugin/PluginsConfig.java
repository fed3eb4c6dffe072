package org.skyrota.web.plugin;

import java.nio.file.Files;
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
     * first. The conditions file defaults to {@code <data-dir>/conditions.csv} when that file exists.
     */
    static final List<String> PLUGIN_SETTINGS = List.of("skyrota.conditions.file", "skyrota.voevent.program",
            "skyrota.voevent.allow-test");

    @Bean
    PluginRegistry pluginRegistry(PluginJars jars, Environment environment) {
        for (String name : PLUGIN_SETTINGS) {
            String value = environment.getProperty(name);
            if (value != null && !value.isBlank()) {
                System.setProperty(name, value);
            }
        }
        Path conditions = Path.of(environment.getProperty("skyrota.data-dir", "./skyrota-data"), "conditions.csv");
        if (environment.getProperty("skyrota.conditions.file") == null && Files.isRegularFile(conditions)) {
            System.setProperty("skyrota.conditions.file", conditions.toString());
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
