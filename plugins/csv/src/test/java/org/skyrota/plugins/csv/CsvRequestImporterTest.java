package org.skyrota.plugins.csv;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.tuple;
import static org.assertj.core.api.Assertions.within;

import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.time.LocalDate;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.skyrota.plugin.ExposureRecord;
import org.skyrota.plugin.ImportProblem;
import org.skyrota.plugin.ImportResult;
import org.skyrota.plugin.RequestRecord;

/**
 * The request importer against RFC 4180 (quoted cells with commas, doubled quotes and line breaks)
 * and against its own rules: every bad cell is reported by its physical line and column, and a
 * file with any problem imports nothing. Targets and coordinates are approximate demo values.
 */
class CsvRequestImporterTest {

    private final CsvRequestImporter importer = new CsvRequestImporter();

    private ImportResult read(String csv) throws IOException {
        return importer.read(new ByteArrayInputStream(csv.getBytes(StandardCharsets.UTF_8)));
    }

    @Test
    void readsEveryColumnInAnyOrderWithSexagesimalOrDecimalAngles() throws IOException {
        String csv = "\uFEFFprogram,title,target,ra,dec,filter_plan,priority,min_altitude,darkness,max_moon_illumination,"
                + "min_moon_separation,earliest_night,latest_night,repeats,interval_days,owner,notes\r\n"
                + "Clusters,M 13 colour,M 13,16:41:41.6,+36:27:37,V:60x3;R:60x3,4,35,astronomical,0.5,30,2027-05-01,"
                + "2027-06-30,3,7,student,\"one line, with a comma and \"\"quotes\"\"\"\r\n"
                + "\r\n"
                + "Equator,Field near the equator,HD 1,187.5,-00:30:00,B:120,2,,,,,,,,,,\"two\nlines\"\r\n"
                + "Equator,Another,HD 2,12h30m00s,-0.25,Ha:300x2,1,,civil,,,,,,,,\n";

        ImportResult result = read(csv);

        assertThat(result.problems()).isEmpty();
        assertThat(result.requests()).hasSize(3);
        RequestRecord first = result.requests().get(0);
        // 16h41m41.6s = 250.42333... degrees; +36°27'37" = 36.46027... degrees (1 h = 15 degrees, common practice)
        assertThat(first.raDeg()).isCloseTo((16 + 41 / 60.0 + 41.6 / 3600) * 15, within(1e-9));
        assertThat(first.decDeg()).isCloseTo(36 + 27 / 60.0 + 37 / 3600.0, within(1e-9));
        assertThat(first.targetKind()).isEqualTo("fixed");
        assertThat(first.exposures()).containsExactly(new ExposureRecord("V", 60, 3), new ExposureRecord("R", 60, 3));
        assertThat(first.minAltitudeDeg()).isEqualTo(35.0);
        assertThat(first.darkness()).isEqualTo("astronomical");
        assertThat(first.maxMoonIllumination()).isEqualTo(0.5);
        assertThat(first.minMoonSeparationDeg()).isEqualTo(30.0);
        assertThat(first.earliestNight()).isEqualTo(LocalDate.of(2027, 5, 1));
        assertThat(first.latestNight()).isEqualTo(LocalDate.of(2027, 6, 30));
        assertThat(first.repeats()).isEqualTo(3);
        assertThat(first.intervalDays()).isEqualTo(7);
        assertThat(first.priority()).isEqualTo(4);
        assertThat(first.owner()).isEqualTo("student");
        assertThat(first.notes()).isEqualTo("one line, with a comma and \"quotes\"");

        RequestRecord second = result.requests().get(1);
        assertThat(second.raDeg()).isEqualTo(187.5);
        assertThat(second.decDeg()).isEqualTo(-0.5); // the sign on zero degrees
        assertThat(second.repeats()).isEqualTo(1);
        assertThat(second.intervalDays()).isZero();
        assertThat(second.darkness()).isNull();
        assertThat(second.owner()).isNull();
        assertThat(second.notes()).isEqualTo("two\nlines");
        assertThat(result.requests().get(2).raDeg()).isCloseTo(187.5, within(1e-9));
    }

    @Test
    void everyBadCellIsReportedByLineAndColumnAndNothingIsImported() throws IOException {
        String csv = "title,target,ra,dec,filter_plan,priority,program,notes,repeats,interval_days,earliest_night,latest_night,darkness\n"
                + "Good one,HD 1,10,20,V:60,3,P,\"a note\nover two lines\",,,,,\n"            // lines 2-3: good
                + "Bad RA,HD 2,25:00:00,20,V:60,3,P,,,,,,\n"                                   // line 4
                + "Bad dec and priority,HD 3,10,+91:00:00,V:60,9,P,,,,,,\n"                     // line 5
                + ",HD 4,10,20,V:sixty,3,,,,,,,\n"                                             // line 6
                + "Bad dates,HD 5,10,20,V:60,3,P,,2,0,2027-13-01,2027-01-01,dusk\n"             // line 7
                + "Good two,HD 6,11,21,R:30x2,1,P,,,,,,\n"                                     // line 8: good
                + "No position,HD 7,,,R:30x2,1,P,,,,,,\n"                                      // line 9
                + "Short row,HD 8\n";                                                          // line 10

        ImportResult result = read(csv);

        assertThat(result.isAccepted()).isFalse();
        assertThat(result.requests()).isEmpty();
        assertThat(result.problems()).extracting(ImportProblem::line, ImportProblem::field).containsExactly(
                tuple(4, "ra"),
                tuple(5, "dec"),
                tuple(5, "priority"),
                tuple(6, "title"),
                tuple(6, "filter_plan"),
                tuple(6, "program"),
                tuple(7, "interval_days"),
                tuple(7, "earliest_night"),
                tuple(7, "darkness"),
                tuple(9, "ra"),
                tuple(9, "dec"),
                tuple(10, null));
        assertThat(result.problems().get(0).message()).contains("below 24").contains("25:00:00");
        assertThat(result.problems().get(2).message()).contains("from 1 to 5");
        assertThat(result.problems().get(4).message()).contains("V:sixty");
        assertThat(result.problems().get(11).message()).contains("2 cells").contains("13 columns");
    }

    @Test
    void theHeaderRowIsChecked() throws IOException {
        ImportResult result = read("title,target,ra,dec,colour,filter_plan,program,ra\nA,B,1,2,red,V:1,P,3\n");

        assertThat(result.problems()).extracting(ImportProblem::line, ImportProblem::field).containsExactly(
                tuple(1, "colour"), tuple(1, "ra"), tuple(1, "priority"));
        assertThat(result.problems().get(0).message()).contains("unknown column");
        assertThat(result.problems().get(1).message()).contains("twice");
        assertThat(result.problems().get(2).message()).contains("lacks the required column priority");
    }

    @Test
    void emptyFilesAndBrokenQuotingAreRefused() throws IOException {
        assertThat(read("").problems()).singleElement().satisfies(p -> assertThat(p.message()).contains("empty"));
        assertThat(read("title,target,ra,dec,filter_plan,priority,program\n").problems())
                .singleElement().satisfies(p -> assertThat(p.message()).contains("no requests"));

        ImportResult broken = read("title,target,ra,dec,filter_plan,priority,program\n"
                + "A,HD 1,1,2,V:1,3,P\n"
                + "\"B\"x,HD 2,1,2,V:1,3,P\n");
        assertThat(broken.requests()).isEmpty();
        assertThat(broken.problems()).singleElement().satisfies(p -> {
            assertThat(p.line()).isEqualTo(3);
            assertThat(p.message()).contains("cannot be read");
        });

        ImportResult notUtf8 = importer.read(new ByteArrayInputStream(new byte[] {'t', 'i', (byte) 0xC3, (byte) 0x28}));
        assertThat(notUtf8.problems()).singleElement().satisfies(p -> assertThat(p.message()).contains("UTF-8"));
    }

    @Test
    void targetsOfAPluginKindCarryParametersAndNoPosition() throws IOException {
        ImportResult result = read("title,target,target_kind,target_parameters,ra,dec,filter_plan,priority,program\n"
                + "Planet,Jupiter,planet,body=jupiter,,,V:1x10,3,P\n"
                + "Bad,Jupiter,planet,body=jupiter,10,,V:1x10,3,P\n"
                + "Bad params,X,fixed,body=jupiter,10,20,V:1x10,3,P\n");

        assertThat(result.problems()).extracting(ImportProblem::line, ImportProblem::field)
                .containsExactly(tuple(3, "ra"), tuple(4, "target_parameters"));

        ImportResult good = read("title,target,target_kind,target_parameters,ra,dec,filter_plan,priority,program\n"
                + "Planet,Jupiter,planet,body=jupiter; extra = 1,,,V:1x10,3,P\n");
        assertThat(good.requests()).singleElement().satisfies(r -> {
            assertThat(r.targetKind()).isEqualTo("planet");
            assertThat(r.targetParameters()).isEqualTo(Map.of("body", "jupiter", "extra", "1"));
            assertThat(r.raDeg()).isNull();
        });
    }

    @Test
    void anAirmassLimitIsReadFromOneToTenAndOtherwiseRefusedNamingItsColumn() throws IOException {
        String header = "title,target,ra,dec,filter_plan,priority,program,max_airmass\n";
        ImportResult ok = read(header + "Limited,HD 1,10,20,V:60,3,P,1.2\nEdges,HD 2,10,20,V:60,3,P,1\nOpen,HD 3,10,20,V:60,3,P,\n");
        assertThat(ok.problems()).isEmpty();
        assertThat(ok.requests()).extracting(RequestRecord::maxAirmass).containsExactly(1.2, 1.0, null);
        for (String bad : List.of("0.9", "10.5", "thin")) {
            ImportResult refused = read(header + "Bad,HD 1,10,20,V:60,3,P," + bad + "\n");
            assertThat(refused.requests()).isEmpty();
            assertThat(refused.problems()).extracting(ImportProblem::line, ImportProblem::field)
                    .containsExactly(tuple(2, "max_airmass"));
        }
    }

    @Test
    void exportThenImportGivesTheSameRecords() throws IOException {
        List<RequestRecord> requests = List.of(
                new RequestRecord("M 13 colour", "M 13", "fixed", 250.42333333333335, 36.460277777777776, Map.of(),
                        List.of(new ExposureRecord("V", 60, 3), new ExposureRecord("R", 12.5, 1)), 35.0, "nautical", 0.25, 40.0,
                        1.35, LocalDate.of(2027, 5, 1), LocalDate.of(2027, 6, 1), 4, 3, 5, "Clusters", "student2",
                        "notes, with \"quotes\"\nand a second line"),
                new RequestRecord("Jupiter", "Jupiter", "planet", null, null, Map.of("body", "jupiter"),
                        List.of(new ExposureRecord("Ha", 1, 100)), null, null, null, null, null, null, 1, 0, 1, "Planets", null, ""),
                new RequestRecord("Near the pole", "HD 5848", "fixed", 0.0, -89.999, Map.of(),
                        List.of(new ExposureRecord("L", 0.001, 1)), 0.0, "civil", 1.0, 180.0, null, null, 1, 0, 3, "P", null, ""));
        java.io.ByteArrayOutputStream out = new java.io.ByteArrayOutputStream();
        new CsvRequestWriter().write(requests, out);

        ImportResult back = importer.read(new ByteArrayInputStream(out.toByteArray()));

        assertThat(back.problems()).isEmpty();
        assertThat(back.requests()).isEqualTo(requests);
    }
}
