package org.skyrota.plugin;

/** The version of the plugin interfaces. A plugin built for another version is skipped when loaded. */
public final class PluginApi {

    /** Raised whenever an interface in this package changes incompatibly. */
    public static final int VERSION = 1;

    private PluginApi() {
    }
}
