package org.skyrota.plugins.icalendar;

import java.io.IOException;
import java.io.OutputStream;
import java.time.Clock;
import java.time.Instant;
import java.util.Locale;
import java.util.Objects;
import org.skyrota.plugin.PlanExporter;
import org.skyrota.plugin.PlanRecord;
import org.skyrota.plugin.PlannedVisitRecord;
import org.skyrota.plugin.PluginApi;
import org.skyrota.plugin.PluginDescriptor;
import org.skyrota.sky.coords.Sexagesimal;

/**
 * Writes a plan as an iCalendar object (RFC 5545): one VEVENT per visit, times in UTC. Each visit's
 * UID is {@code visit-<id>@skyrota}, stable across revisions, and its SEQUENCE is the published
 * revision in which the visit last changed (the plan's revision where the plan does not say), so that
 * a calendar that subscribed earlier updates the event in place, and leaves an unchanged one alone. A
 * visit the plan gave up comes once more, with STATUS:CANCELLED and a higher SEQUENCE.
 * DTSTAMP is the plan's publication time, or the time of writing for a draft.
 */
public final class ICalendarPlanExporter implements PlanExporter {

    static final PluginDescriptor DESCRIPTOR =
            new PluginDescriptor("icalendar", "iCalendar plan export", "1.0", PluginApi.VERSION);

    private final Clock clock;

    /** Used by {@link java.util.ServiceLoader}: drafts are stamped with the system clock. */
    public ICalendarPlanExporter() {
        this(Clock.systemUTC());
    }

    public ICalendarPlanExporter(Clock clock) {
        this.clock = Objects.requireNonNull(clock, "clock");
    }

    @Override
    public PluginDescriptor descriptor() {
        return DESCRIPTOR;
    }

    @Override
    public String description() {
        return "Exports a plan as an iCalendar file (RFC 5545), one event per visit.";
    }

    @Override
    public String mediaType() {
        return "text/calendar";
    }

    @Override
    public String fileExtension() {
        return "ics";
    }

    private void event(ContentLines ics, PlanRecord plan, PlannedVisitRecord v, Instant stamp, String status) {
        ics.line("BEGIN", "VEVENT")
                .line("UID", "visit-" + v.visitId() + "@skyrota")
                .utc("DTSTAMP", stamp)
                .utc("DTSTART", v.start())
                .utc("DTEND", v.end())
                .line("SEQUENCE", Long.toString(Math.max(0, v.sequence() >= 0 ? v.sequence() : plan.revision())))
                .text("SUMMARY", v.title() + " (" + v.targetName() + ")")
                .text("LOCATION", v.site() + ", " + v.telescope())
                .text("DESCRIPTION", description(plan, v))
                .line("STATUS", status)
                .line("TRANSP", status.equals("CANCELLED") ? "TRANSPARENT" : "OPAQUE")
                .line("END", "VEVENT");
    }

    @Override
    public void write(PlanRecord plan, OutputStream out) throws IOException {
        Instant stamp = plan.publishedAt() != null ? plan.publishedAt() : clock.instant();
        ContentLines ics = new ContentLines()
                .line("BEGIN", "VCALENDAR")
                .line("VERSION", "2.0")
                .line("PRODID", "-//Skyrota//Observing plan " + DESCRIPTOR.version() + "//EN")
                // No METHOD: this is a calendar file, not an iTIP message (RFC 5546), so no ORGANIZER is owed.
                .line("CALSCALE", "GREGORIAN");
        for (PlannedVisitRecord v : plan.visits()) {
            event(ics, plan, v, stamp, plan.publishedAt() != null ? "CONFIRMED" : "TENTATIVE");
        }
        // A visit the plan gave up keeps its UID and comes with a higher SEQUENCE, so that a subscribed calendar
        // removes it (RFC 5545 section 3.8.1.11, STATUS:CANCELLED).
        for (PlannedVisitRecord v : plan.cancelled()) {
            event(ics, plan, v, stamp, "CANCELLED");
        }
        ics.line("END", "VCALENDAR");
        out.write(ics.bytes());
        out.flush();
    }

    private static String description(PlanRecord plan, PlannedVisitRecord v) {
        StringBuilder d = new StringBuilder();
        d.append("Target: ").append(v.targetName());
        if (v.raDeg() != null && v.decDeg() != null) {
            d.append(String.format(Locale.ROOT, " (ICRS RA %s, Dec %s)",
                    Sexagesimal.formatRa(v.raDeg(), 1), Sexagesimal.formatDec(v.decDeg(), 0)));
        }
        d.append('\n').append("Exposures: ").append(v.exposurePlan());
        d.append('\n').append("Program: ").append(v.program()).append("; requested by ").append(v.owner());
        d.append('\n').append("Night of ").append(v.night()).append("; request ").append(v.requestId())
                .append(", visit ").append(v.visitId());
        d.append('\n').append(plan.title()).append(", revision ").append(plan.revision())
                .append(plan.publishedAt() != null ? " (published)" : " (draft)");
        return d.toString();
    }
}
