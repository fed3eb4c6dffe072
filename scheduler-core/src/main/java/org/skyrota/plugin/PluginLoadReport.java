package org.skyrota.plugin;

import java.util.Objects;

/**
 * One plugin, jar or provider that was skipped while loading, and why. The server logs these and
 * lists them under {@code /api/plugins}; none of them stops it.
 *
 * @param source   where the problem was found: a jar's path, or {@code "class path"}; not null
 * @param provider the provider's class name, or null when the problem is with the whole jar
 * @param pluginId the plugin's id when it could be read, else null
 * @param problem  what failed, in plain words; not blank
 */
public record PluginLoadReport(String source, String provider, String pluginId, String problem) {

    public PluginLoadReport {
        Objects.requireNonNull(source, "source");
        if (problem == null || problem.isBlank()) {
            throw new IllegalArgumentException("a load report must say what failed (source " + source + ")");
        }
    }

    @Override
    public String toString() {
        return source + (provider == null ? "" : " [" + provider + "]")
                + (pluginId == null ? "" : " (id " + pluginId + ")") + ": " + problem;
    }
}
