package org.skyrota.plugin;

import java.io.IOException;
import java.io.OutputStream;

/** Writes a plan in a file format. */
public interface PlanExporter extends SkyrotaPlugin {

    /** The media type written, for example {@code "text/calendar"}; not null. */
    String mediaType();

    /** The file name extension without the dot, for example {@code "ics"}; not null. */
    String fileExtension();

    /** Writes the plan; the exporter does not close the stream. */
    void write(PlanRecord plan, OutputStream out) throws IOException;
}
