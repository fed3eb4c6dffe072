package org.skyrota.plugin;

import java.util.Objects;
import java.util.regex.Pattern;

/**
 * What a plugin says about itself.
 *
 * @param id         a stable identifier, lower case letters, digits, dots and dashes ({@code "solar-system"}); not null
 * @param name       a human-readable name; not blank
 * @param version    the plugin's own version; not blank
 * @param apiVersion the {@link PluginApi#VERSION} the plugin was built for
 */
public record PluginDescriptor(String id, String name, String version, int apiVersion) {

    private static final Pattern ID = Pattern.compile("[a-z0-9][a-z0-9.\\-]{0,63}");

    public PluginDescriptor {
        Objects.requireNonNull(id, "id");
        if (!ID.matcher(id).matches()) {
            throw new IllegalArgumentException("plugin id must be lower case letters, digits, dots or dashes (1-64 chars): " + id);
        }
        if (name == null || name.isBlank()) {
            throw new IllegalArgumentException("plugin name must not be blank (id " + id + ")");
        }
        if (version == null || version.isBlank()) {
            throw new IllegalArgumentException("plugin version must not be blank (id " + id + ")");
        }
    }

    /** Whether this plugin was built for the plugin interfaces of this Skyrota. */
    public boolean isCompatible() {
        return apiVersion == PluginApi.VERSION;
    }
}
