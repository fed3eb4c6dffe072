package org.skyrota.plugins.voevent;

import java.io.IOException;
import java.io.InputStream;
import java.util.List;
import java.util.Objects;
import org.skyrota.plugin.ImportProblem;
import org.skyrota.plugin.ImportResult;
import org.skyrota.plugin.PluginApi;
import org.skyrota.plugin.PluginDescriptor;
import org.skyrota.plugin.PluginException;
import org.skyrota.plugin.RequestImporter;

/**
 * A VOEvent 2.0 packet as a request import: one packet gives one time-critical request in the
 * target-of-opportunity program, or a refusal with the reason. Re-planning the affected nights is
 * the server's part, once the request is stored.
 *
 * <p>Loaded by {@link java.util.ServiceLoader} it reads its settings from system properties:
 * {@code skyrota.voevent.program} (default "Target of opportunity") and
 * {@code skyrota.voevent.allow-test} ({@code true} to accept {@code role="test"} packets).
 */
public final class VoEventImporter implements RequestImporter {

    public static final String MEDIA_TYPE = "application/x-voevent+xml";
    static final PluginDescriptor DESCRIPTOR = new PluginDescriptor("voevent", "VOEvent alerts", "1.0", PluginApi.VERSION);

    private final AlertSettings settings;

    public VoEventImporter() {
        this(AlertSettings.defaults()
                .withProgram(System.getProperty("skyrota.voevent.program", AlertSettings.DEFAULT_PROGRAM))
                .withTestPackets(Boolean.getBoolean("skyrota.voevent.allow-test")));
    }

    public VoEventImporter(AlertSettings settings) {
        this.settings = Objects.requireNonNull(settings, "settings");
    }

    @Override
    public PluginDescriptor descriptor() {
        return DESCRIPTOR;
    }

    @Override
    public String description() {
        return "Turns a VOEvent 2.0 alert into a time-critical request of the program \"" + settings.program() + "\".";
    }

    @Override
    public String mediaType() {
        return MEDIA_TYPE;
    }

    @Override
    public ImportResult read(InputStream in) throws IOException {
        try {
            VoEventAlert alert = new VoEventParser(settings.allowTestPackets()).parse(in);
            return ImportResult.of(List.of(AlertRequests.toRequest(alert, settings)));
        } catch (PluginException e) {
            int line = 1;
            if (e.field() != null && e.field().startsWith("line ")) {
                try {
                    line = Math.max(1, Integer.parseInt(e.field().substring(5)));
                } catch (NumberFormatException ignored) {
                    // keep line 1
                }
            }
            return ImportResult.refused(List.of(new ImportProblem(line, e.field(), e.getMessage())));
        }
    }
}
