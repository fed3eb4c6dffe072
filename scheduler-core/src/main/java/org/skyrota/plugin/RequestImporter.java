package org.skyrota.plugin;

import java.io.IOException;
import java.io.InputStream;

/** Reads observing requests from a file format. */
public interface RequestImporter extends SkyrotaPlugin {

    /** The media type this importer reads, for example {@code "text/csv"}; not null. */
    String mediaType();

    /**
     * Reads the whole file. Every bad row is reported, by line number; none is skipped silently.
     *
     * @param in the file's bytes; the importer does not close it
     * @throws IOException only when the stream itself fails
     */
    ImportResult read(InputStream in) throws IOException;
}
