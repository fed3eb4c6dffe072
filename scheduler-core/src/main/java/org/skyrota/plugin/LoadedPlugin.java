package org.skyrota.plugin;

import java.util.Objects;

/**
 * A plugin provider that loaded, as the plugin list shows it.
 *
 * @param service    the plugin interface it provides, for example {@code "TargetKind"}; not null
 * @param descriptor what the plugin says about itself; not null
 * @param provider   the provider's class name; not null
 * @param source     the jar it came from, or {@code "class path"}; not null
 */
public record LoadedPlugin(String service, PluginDescriptor descriptor, String provider, String source) {

    public LoadedPlugin {
        Objects.requireNonNull(service, "service");
        Objects.requireNonNull(descriptor, "descriptor");
        Objects.requireNonNull(provider, "provider");
        Objects.requireNonNull(source, "source");
    }
}
