package org.skyrota.plugin;

/** What every kind of plugin has in common. */
public interface SkyrotaPlugin {

    /** The plugin's id, name, version and the interface version it was built for; not null. */
    PluginDescriptor descriptor();

    /** One sentence a coordinator reads in the plugin list. */
    default String description() {
        return descriptor().name();
    }
}
