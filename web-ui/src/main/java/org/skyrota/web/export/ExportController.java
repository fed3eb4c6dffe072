package org.skyrota.web.export;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.time.LocalDate;

import org.skyrota.plugin.PlanExporter;
import org.skyrota.plugin.PlanRecord;
import org.skyrota.plugin.PluginRegistry;
import org.skyrota.web.account.CurrentUser;
import org.skyrota.web.system.ConflictException;
import org.springframework.http.HttpHeaders;
import org.springframework.http.MediaType;
import org.springframework.http.ResponseEntity;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.bind.annotation.RestController;

/** The published plan as files, written by the exporter plugins (CSV, iCalendar) found in the plugin registry. */
@RestController
class ExportController {

    static final String CSV = "text/csv";
    static final String ICALENDAR = "text/calendar";

    private final PlanRecords records;
    private final PluginRegistry plugins;

    ExportController(PlanRecords records, PluginRegistry plugins) {
        this.records = records;
        this.plugins = plugins;
    }

    @GetMapping("/api/plans/published.csv")
    ResponseEntity<byte[]> csv(@RequestParam(required = false) Long siteId, @RequestParam(required = false) LocalDate night) {
        return export(CSV, records.published(siteId, night, null), "plan");
    }

    @GetMapping("/api/plans/published.ics")
    ResponseEntity<byte[]> ics(@RequestParam(required = false) Long siteId) {
        return export(ICALENDAR, records.published(siteId, null, null), "plan");
    }

    /** The signed-in person's own published visits (a feed reader signs in with {@code ?token=}). */
    @GetMapping("/api/calendar/mine.ics")
    ResponseEntity<byte[]> mine() {
        return export(ICALENDAR, records.published(null, null, CurrentUser.get().username()), "my-visits");
    }

    private ResponseEntity<byte[]> export(String mediaType, PlanRecord plan, String name) {
        PlanExporter exporter = plugins.planExporter(mediaType).orElseThrow(() -> new ConflictException(
                "No exporter plugin for " + mediaType + " is loaded on this server"));
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        try {
            exporter.write(plan, out);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return ResponseEntity.ok()
                .contentType(MediaType.parseMediaType(exporter.mediaType() + ";charset=UTF-8"))
                .header(HttpHeaders.CONTENT_DISPOSITION, "inline; filename=\"" + name + "." + exporter.fileExtension() + "\"")
                .body(out.toByteArray());
    }
}
