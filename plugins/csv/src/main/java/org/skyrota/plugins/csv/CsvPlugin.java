package org.skyrota.plugins.csv;

import org.skyrota.plugin.PluginApi;
import org.skyrota.plugin.PluginDescriptor;

/** The descriptor shared by the CSV importer and exporters. */
final class CsvPlugin {

    static final PluginDescriptor DESCRIPTOR = new PluginDescriptor("csv", "CSV requests and plans", "1.0", PluginApi.VERSION);
    static final String MEDIA_TYPE = "text/csv";

    private CsvPlugin() {
    }
}
