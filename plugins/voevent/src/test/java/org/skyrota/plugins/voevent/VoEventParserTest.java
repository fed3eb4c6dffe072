package org.skyrota.plugins.voevent;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.time.LocalDate;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.skyrota.plugin.ExposureRecord;
import org.skyrota.plugin.ImportResult;
import org.skyrota.plugin.PluginException;
import org.skyrota.plugin.PluginRegistry;
import org.skyrota.plugin.RequestRecord;

/**
 * Packets written by hand to the VOEvent 2.0 schema (IVOA Recommendation "Sky Event Reporting
 * Metadata Version 2.0", 2011: root VOEvent in the v2.0 namespace with ivorn, role and version;
 * Who/Date; WhereWhen/ObsDataLocation/ObservationLocation/AstroCoords with coord_system_id,
 * Time/TimeInstant/ISOTime and Position2D/Value2/C1,C2 with Error2Radius; Why/@importance).
 * The ivorns and events are invented.
 */
class VoEventParserTest {

    private static String packet() throws IOException {
        try (InputStream in = VoEventParserTest.class.getResourceAsStream("/observation.xml")) {
            return new String(in.readAllBytes(), StandardCharsets.UTF_8);
        }
    }

    private static VoEventAlert parse(String xml, boolean allowTest) throws PluginException {
        return new VoEventParser(allowTest).parse(xml.getBytes(StandardCharsets.UTF_8));
    }

    @Test
    void readsPositionTimeErrorAndImportance() throws Exception {
        VoEventAlert alert = parse(packet(), false);

        assertThat(alert.ivorn()).isEqualTo("ivo://skyrota.test/alerts#1");
        assertThat(alert.role()).isEqualTo("observation");
        assertThat(alert.authoredAt()).isEqualTo(Instant.parse("2027-03-01T02:10:00Z"));
        assertThat(alert.eventTime()).isEqualTo(Instant.parse("2027-03-01T01:58:30.25Z"));
        assertThat(alert.raDeg()).isEqualTo(187.2779);
        assertThat(alert.decDeg()).isEqualTo(2.0524);
        assertThat(alert.errorRadiusDeg()).isEqualTo(0.0125);
        assertThat(alert.coordSystem()).isEqualTo("UTC-FK5-GEO");
        assertThat(alert.importance()).isEqualTo(0.85);
        assertThat(alert.name()).isEqualTo("SKY-T 27a");
    }

    @Test
    void becomesATimeCriticalRequestOfTheTargetOfOpportunityProgram() throws Exception {
        RequestRecord request = AlertRequests.toRequest(parse(packet(), false), AlertSettings.defaults());

        assertThat(request.program()).isEqualTo("Target of opportunity");
        assertThat(request.targetKind()).isEqualTo("fixed");
        assertThat(request.raDeg()).isEqualTo(187.2779);
        assertThat(request.decDeg()).isEqualTo(2.0524);
        assertThat(request.priority()).isEqualTo(5); // importance 0.85 lies in [0.8, 1]
        // 01:58 UTC on March 1 is still the night of February 28 in Greenwich mean solar time
        assertThat(request.earliestNight()).isEqualTo(LocalDate.of(2027, 2, 28));
        assertThat(request.latestNight()).isEqualTo(LocalDate.of(2027, 3, 2));
        assertThat(request.repeats()).isEqualTo(1);
        assertThat(request.exposures()).containsExactly(new ExposureRecord("R", 60, 5));
        assertThat(request.notes()).contains("ivo://skyrota.test/alerts#1").contains("error radius 0.0125 deg");
    }

    @ParameterizedTest
    @CsvSource({"0.0, 1", "0.19, 1", "0.2, 2", "0.5, 3", "0.79, 4", "0.8, 5", "1.0, 5"})
    void priorityFollowsImportanceInFiveSteps(String importance, int priority) throws Exception {
        String xml = packet().replace("importance=\"0.85\"", "importance=\"" + importance + "\"");
        assertThat(AlertRequests.toRequest(parse(xml, false), AlertSettings.defaults()).priority()).isEqualTo(priority);
    }

    @Test
    void theProgramIsConfigurableAndTheIcrsFrameAndZonedTimesAreAccepted() throws Exception {
        String xml = packet().replace("UTC-FK5-GEO", "UTC-ICRS-GEO").replace("2027-03-01T01:58:30.25", "2027-03-01T13:00:00Z")
                .replace("<Why importance=\"0.85\">", "<Why>");
        VoEventAlert alert = parse(xml, false);
        RequestRecord request = AlertRequests.toRequest(alert, AlertSettings.defaults().withProgram("Rapid response"));

        assertThat(alert.coordSystem()).isEqualTo("UTC-ICRS-GEO");
        assertThat(request.program()).isEqualTo("Rapid response");
        assertThat(request.priority()).isEqualTo(3); // no importance: the default
        assertThat(request.earliestNight()).isEqualTo(LocalDate.of(2027, 3, 1));
    }

    @Test
    void testPacketsOnlyWhenAllowed() throws Exception {
        String xml = packet().replace("role=\"observation\"", "role=\"test\"");
        assertThatThrownBy(() -> parse(xml, false)).isInstanceOf(PluginException.class)
                .hasMessageContaining("test packets are not accepted")
                .extracting(e -> ((PluginException) e).field()).isEqualTo("role");
        assertThat(parse(xml, true).role()).isEqualTo("test");
    }

    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', value = {
        "not XML|NOT-XML|not well-formed XML",
        "wrong root|ROOT|not <VOEvent>",
        "wrong namespace|NS|not in the VOEvent 2.0 namespace",
        "missing position|NO-POSITION|no sky position",
        "right ascension out of range|<C1>187.2779</C1> => <C1>400</C1>|from 0 to 360",
        "declination out of range|<C2>2.0524</C2> => <C2>-91.5</C2>|from -90 to +90",
        "declination not a number|<C2>2.0524</C2> => <C2>north</C2>|finite number",
        "NaN position|<C1>187.2779</C1> => <C1>NaN</C1>|finite number",
        "missing time|NO-TIME|lacks AstroCoords/Time",
        "bad time|2027-03-01T01:58:30.25 => yesterday|ISO 8601",
        "galactic frame|UTC-FK5-GEO => UTC-GAL-GEO|only ICRS or FK5",
        "utility role|role=\"observation\" => role=\"utility\"|utility packet",
        "unknown role|role=\"observation\" => role=\"rumour\"|role must be",
        "bad ivorn|ivorn=\"ivo://skyrota.test/alerts#1\" => ivorn=\"http://example\"|ivo://",
        "importance out of range|importance=\"0.85\" => importance=\"1.5\"|from 0 to 1",
        "radians|unit=\"deg\" => unit=\"rad\"|in degrees",
        "other version|version=\"2.0\" => version=\"1.1\"|version 2.0",
    })
    void malformedPacketsAreRejectedWithAReason(String label, String change, String reason) throws Exception {
        String good = packet();
        String xml = switch (change) {
            case "NOT-XML" -> "this is not a packet";
            case "ROOT" -> "<?xml version=\"1.0\"?><VOEventList xmlns=\"" + VoEventParser.NAMESPACE + "\"/>";
            case "NS" -> good.replace("http://www.ivoa.net/xml/VOEvent/v2.0\"\n", "http://example.test/other\"\n");
            case "NO-POSITION" -> good.replaceAll("(?s)<Position2D.*</Position2D>", "");
            case "NO-TIME" -> good.replaceAll("(?s)<Time unit.*</Time>", "");
            default -> {
                String[] fromTo = change.split(" => ", 2);
                assertThat(good).as("the test's packet holds %s", fromTo[0]).contains(fromTo[0]);
                yield good.replace(fromTo[0], fromTo[1]);
            }
        };
        assertThatThrownBy(() -> parse(xml, false)).as(label).isInstanceOf(PluginException.class).hasMessageContaining(reason);
    }

    /**
     * Event times are read only from 1900-01-01 to 2200-12-31 (UTC), the years the server plans in; a time outside
     * them is refused naming the element. Year 1 once became an accepted request whose nights came back from storage
     * out of order.
     */
    @ParameterizedTest(name = "{0}")
    @CsvSource({"0001-01-01T00:00:00", "0000-06-01T00:00:00", "-1000-01-01T00:00:00", "1899-12-31T23:59:59.999",
        "2201-01-01T00:00:00", "+10000-01-01T00:00:00", "1900-01-01T01:00:00+02:00"})
    void eventTimesOutsideTheYearsPlannedAreRefusedNamingIsoTime(String time) throws Exception {
        String xml = packet().replace("2027-03-01T01:58:30.25", time);
        assertThatThrownBy(() -> parse(xml, false)).isInstanceOf(PluginException.class)
                .hasMessageContaining("1900-01-01").hasMessageContaining("2200-12-31")
                .extracting(e -> ((PluginException) e).field()).isEqualTo("ISOTime");

        ImportResult refused = new VoEventImporter(AlertSettings.defaults())
                .read(new ByteArrayInputStream(xml.getBytes(StandardCharsets.UTF_8)));
        assertThat(refused.requests()).isEmpty();
        assertThat(refused.problems()).singleElement().satisfies(p -> assertThat(p.field()).isEqualTo("ISOTime"));
    }

    @ParameterizedTest
    @CsvSource({"1900-01-01T00:00:00, 1900-01-01T00:00:00Z", "2200-12-31T23:59:59.999, 2200-12-31T23:59:59.999Z",
        "1900-01-01T01:00:00+01:00, 1900-01-01T00:00:00Z"})
    void theFirstAndLastMomentsOfThoseYearsAreRead(String time, String instant) throws Exception {
        assertThat(parse(packet().replace("2027-03-01T01:58:30.25", time), false).eventTime()).isEqualTo(Instant.parse(instant));
    }

    @Test
    void theRequestCarriesThePacketsIvornAsItsSourceIdentifier() throws Exception {
        ImportResult read = new VoEventImporter(AlertSettings.defaults())
                .read(new ByteArrayInputStream(packet().getBytes(StandardCharsets.UTF_8)));
        assertThat(read.requests()).singleElement().satisfies(r -> assertThat(r.sourceId()).isEqualTo("ivo://skyrota.test/alerts#1"));
        String spaced = packet().replace("ivorn=\"ivo://skyrota.test/alerts#1\"", "ivorn=\"  ivo://skyrota.test/alerts#1 \"");
        assertThat(AlertRequests.toRequest(parse(spaced, false), AlertSettings.defaults()).sourceId())
                .isEqualTo("ivo://skyrota.test/alerts#1");
    }

    @Test
    void externalEntitiesAreNeverRead(@TempDir Path dir) throws Exception {
        Path secret = Files.writeString(dir.resolve("secret.txt"), "do-not-read-me");
        String xml = "<?xml version=\"1.0\"?>\n<!DOCTYPE voe:VOEvent [ <!ENTITY leak SYSTEM \"" + secret.toUri() + "\"> ]>\n"
                + packet().substring(packet().indexOf("<voe:VOEvent")).replace("<Name>SKY-T 27a</Name>", "<Name>&leak;</Name>");

        assertThatThrownBy(() -> parse(xml, false)).isInstanceOf(PluginException.class)
                .hasMessageContaining("DOCTYPE")
                .hasMessageNotContaining("do-not-read-me");
    }

    @Test
    void asARequestImporterABadPacketImportsNothingAndSaysWhy() throws Exception {
        VoEventImporter importer = new VoEventImporter(AlertSettings.defaults());
        ImportResult good = importer.read(new ByteArrayInputStream(packet().getBytes(StandardCharsets.UTF_8)));
        assertThat(good.requests()).hasSize(1);

        ImportResult bad = importer.read(new ByteArrayInputStream("<?xml version=\"1.0\"?>\n<a>\n<b></a>".getBytes(StandardCharsets.UTF_8)));
        assertThat(bad.requests()).isEmpty();
        assertThat(bad.problems()).singleElement().satisfies(p -> {
            assertThat(p.line()).isEqualTo(3);
            assertThat(p.message()).contains("not well-formed");
        });
    }

    @Test
    void foundThroughItsServicesFile() {
        PluginRegistry registry = PluginRegistry.load(getClass().getClassLoader());
        assertThat(registry.problems()).isEmpty();
        assertThat(registry.requestImporter("application/x-voevent+xml")).get().isInstanceOf(VoEventImporter.class);
        assertThat(registry.requestImporters()).extracting(i -> i.descriptor().id()).isEqualTo(List.of("voevent"));
    }
}
