package org.skyrota.plugins.icalendar;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.time.Clock;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneOffset;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Collectors;
import net.fortuna.ical4j.data.CalendarBuilder;
import net.fortuna.ical4j.model.Calendar;
import net.fortuna.ical4j.model.Property;
import net.fortuna.ical4j.model.component.VEvent;
import org.junit.jupiter.api.Test;
import org.skyrota.plugin.PlanRecord;
import org.skyrota.plugin.PlannedVisitRecord;
import org.skyrota.plugin.PluginRegistry;

/**
 * The calendar against the rules of RFC 5545 (content lines 3.1, TEXT 3.3.11, DATE-TIME form #2
 * 3.3.5, required properties 3.6 and 3.6.1) and read back by an independent parser, ical4j, in
 * test scope. The plan is invented demo data.
 */
class ICalendarPlanExporterTest {

    private static final String AWKWARD_TITLE =
            "Comet C/2027 test; back\\slash, commas, and a very long title that needs folding — “typographic” ñ 日本 ☄";

    private static PlanRecord plan(long revision, Instant publishedAt) {
        return new PlanRecord("Published plan, 2027-03-01 to 2027-03-07", revision, publishedAt, List.of(
                new PlannedVisitRecord(11, 5, AWKWARD_TITLE, "HD 1", 10.68458, -0.5, "Ridge Site", "T40",
                        LocalDate.of(2027, 3, 1), Instant.parse("2027-03-02T02:00:00.750Z"), Instant.parse("2027-03-02T02:20:00Z"),
                        "student", "Clusters", "V 3x60s, R 3x60s"),
                new PlannedVisitRecord(12, 6, "Second\nline", "Jupiter", null, null, "Lake Site", "T25",
                        LocalDate.of(2027, 3, 1), Instant.parse("2027-03-02T03:00:00Z"), Instant.parse("2027-03-02T03:05:00Z"),
                        "student2", "Planets", "R 100x1s")));
    }

    private static byte[] export(PlanRecord plan) throws IOException {
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        new ICalendarPlanExporter(Clock.fixed(Instant.parse("2027-02-28T10:00:00Z"), ZoneOffset.UTC)).write(plan, out);
        return out.toByteArray();
    }

    /** Physical lines, split on CRLF, each checked to be whole UTF-8 (a fold must not split a character). */
    private static List<String> physicalLines(byte[] bytes) throws IOException {
        List<String> lines = new ArrayList<>();
        int start = 0;
        for (int i = 0; i < bytes.length; i++) {
            if (bytes[i] == '\r') {
                assertThat(i + 1 < bytes.length && bytes[i + 1] == '\n').as("CR at %d is followed by LF", i).isTrue();
                byte[] line = java.util.Arrays.copyOfRange(bytes, start, i);
                assertThat(line.length).as("octets in line %d", lines.size() + 1).isLessThanOrEqualTo(75);
                lines.add(StandardCharsets.UTF_8.newDecoder().onMalformedInput(CodingErrorAction.REPORT)
                        .decode(ByteBuffer.wrap(line)).toString());
                start = i + 2;
                i++;
            } else {
                assertThat(bytes[i]).as("bare LF at %d", i).isNotEqualTo((byte) '\n');
            }
        }
        assertThat(start).as("the object ends with CRLF").isEqualTo(bytes.length);
        return lines;
    }

    /** RFC 5545 3.1: unfolding removes every CRLF followed by one space or tab. */
    private static List<String> unfold(List<String> physical) {
        List<String> logical = new ArrayList<>();
        for (String line : physical) {
            if (line.startsWith(" ") || line.startsWith("\t")) {
                logical.set(logical.size() - 1, logical.get(logical.size() - 1) + line.substring(1));
            } else {
                logical.add(line);
            }
        }
        return logical;
    }

    @Test
    void contentLinesAreCrlfAndFoldedAt75OctetsWithoutSplittingACharacter() throws IOException {
        List<String> physical = physicalLines(export(plan(3, Instant.parse("2027-02-28T12:00:00Z"))));

        assertThat(physical).anyMatch(l -> l.startsWith(" ")); // the long summary was folded
        List<String> logical = unfold(physical);
        assertThat(logical).first().isEqualTo("BEGIN:VCALENDAR");
        assertThat(logical).last().isEqualTo("END:VCALENDAR");
    }

    @Test
    void textIsEscapedAndTimesAreUtc() throws IOException {
        List<String> logical = unfold(physicalLines(export(plan(3, Instant.parse("2027-02-28T12:00:00Z")))));

        assertThat(logical).contains("SUMMARY:Comet C/2027 test\\; back\\\\slash\\, commas\\, and a very long title that needs"
                + " folding — “typographic” ñ 日本 ☄ (HD 1)");
        assertThat(logical).contains("SUMMARY:Second\\nline (Jupiter)");
        assertThat(logical).contains("LOCATION:Ridge Site\\, T40");
        // DATE-TIME form #2 (UTC), whole seconds
        assertThat(logical).contains("DTSTART:20270302T020000Z", "DTEND:20270302T022000Z", "DTSTAMP:20270228T120000Z");
        assertThat(logical).filteredOn(l -> l.startsWith("DESCRIPTION:")).first().asString()
                .contains("ICRS RA 00:42:44.3\\, Dec -00:30:00").contains("\\n").doesNotContain("\n");
    }

    @Test
    void requiredPropertiesAreThereAndUidsAreStableAcrossRevisions() throws IOException {
        List<String> rev3 = unfold(physicalLines(export(plan(3, Instant.parse("2027-02-28T12:00:00Z")))));
        List<String> rev4 = unfold(physicalLines(export(plan(4, null))));

        assertThat(rev3).contains("VERSION:2.0").anyMatch(l -> l.startsWith("PRODID:"));
        for (String name : List.of("UID:", "DTSTAMP:", "DTSTART:", "DTEND:", "SUMMARY:")) {
            assertThat(rev3.stream().filter(l -> l.startsWith(name)).count()).as(name).isEqualTo(2);
        }
        List<String> uids3 = rev3.stream().filter(l -> l.startsWith("UID:")).collect(Collectors.toList());
        List<String> uids4 = rev4.stream().filter(l -> l.startsWith("UID:")).collect(Collectors.toList());
        assertThat(uids3).containsExactly("UID:visit-11@skyrota", "UID:visit-12@skyrota").isEqualTo(uids4);
        assertThat(rev3).contains("SEQUENCE:3", "STATUS:CONFIRMED");
        // a draft is stamped with the clock and marked tentative
        assertThat(rev4).contains("SEQUENCE:4", "STATUS:TENTATIVE", "DTSTAMP:20270228T100000Z");
    }

    @Test
    void anIndependentParserReadsItBack() throws Exception {
        byte[] ics = export(plan(3, Instant.parse("2027-02-28T12:00:00Z")));

        Calendar calendar = new CalendarBuilder().build(new ByteArrayInputStream(ics));

        assertThat(calendar.validate().hasErrors()).as(calendar.validate().toString()).isFalse();
        List<VEvent> events = calendar.getComponents("VEVENT");
        assertThat(events).hasSize(2);
        VEvent first = events.get(0);
        assertThat(first.<Property>getProperty("SUMMARY").orElseThrow().getValue()).isEqualTo(AWKWARD_TITLE + " (HD 1)");
        assertThat(first.<Property>getProperty("UID").orElseThrow().getValue()).isEqualTo("visit-11@skyrota");
        assertThat(Instant.from(first.getStartDate().orElseThrow().getDate())).isEqualTo(Instant.parse("2027-03-02T02:00:00Z"));
        assertThat(Instant.from(first.getEndDate().orElseThrow().getDate())).isEqualTo(Instant.parse("2027-03-02T02:20:00Z"));
        assertThat(events.get(1).<Property>getProperty("SUMMARY").orElseThrow().getValue()).isEqualTo("Second\nline (Jupiter)");
    }

    @Test
    void foundThroughItsServicesFile() {
        PluginRegistry registry = PluginRegistry.load(getClass().getClassLoader());
        assertThat(registry.problems()).isEmpty();
        assertThat(registry.planExporter("text/calendar")).get().isInstanceOf(ICalendarPlanExporter.class);
    }
}
