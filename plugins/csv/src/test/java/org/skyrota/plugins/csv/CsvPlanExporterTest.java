package org.skyrota.plugins.csv;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.StringReader;
import java.nio.charset.StandardCharsets;
import java.time.Instant;
import java.time.LocalDate;
import java.util.List;
import java.util.ServiceLoader;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVRecord;
import org.junit.jupiter.api.Test;
import org.skyrota.plugin.PlanExporter;
import org.skyrota.plugin.PlanRecord;
import org.skyrota.plugin.PlannedVisitRecord;
import org.skyrota.plugin.PluginRegistry;
import org.skyrota.plugin.RequestImporter;

/** The plan exporter's output read back with Commons CSV as RFC 4180 says it must read. Invented demo plan. */
class CsvPlanExporterTest {

    private static PlanRecord plan() {
        return new PlanRecord("Published plan, 2027-03-01", 7, Instant.parse("2027-03-01T12:00:00Z"), List.of(
                new PlannedVisitRecord(11, 5, "M 13 colour, take 1", "M 13", 250.4233, 36.4603, "Ridge Site", "T40",
                        LocalDate.of(2027, 3, 1), Instant.parse("2027-03-02T02:00:00Z"), Instant.parse("2027-03-02T02:20:00Z"),
                        "student", "Clusters", "V 3x60s, R 3x60s"),
                new PlannedVisitRecord(12, 6, "Jupiter \"belts\"", "Jupiter", null, null, "Ridge Site", "T40",
                        LocalDate.of(2027, 3, 1), Instant.parse("2027-03-02T03:00:00Z"), Instant.parse("2027-03-02T03:05:00Z"),
                        "student2", "Planets", "R 100x1s")));
    }

    @Test
    void oneRowPerVisitWithCrlfAndQuotedCells() throws IOException {
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        new CsvPlanExporter().write(plan(), out);
        String text = out.toString(StandardCharsets.UTF_8);

        assertThat(text).startsWith("visit_id,request_id,title,target,ra,dec,site,telescope,night,start,end,owner,program,exposure_plan\r\n");
        assertThat(text.replace("\r\n", "")).doesNotContain("\n");
        List<CSVRecord> rows = CSVFormat.RFC4180.builder().setHeader().setSkipHeaderRecord(true).get()
                .parse(new StringReader(text)).getRecords();
        assertThat(rows).hasSize(2);
        assertThat(rows.get(0).get("title")).isEqualTo("M 13 colour, take 1");
        assertThat(rows.get(0).get("ra")).isEqualTo("250.4233");
        assertThat(rows.get(0).get("start")).isEqualTo("2027-03-02T02:00:00Z");
        assertThat(rows.get(0).get("night")).isEqualTo("2027-03-01");
        assertThat(rows.get(1).get("title")).isEqualTo("Jupiter \"belts\"");
        assertThat(rows.get(1).get("ra")).isEmpty();
        assertThat(rows.get(1).get("exposure_plan")).isEqualTo("R 100x1s");
    }

    @Test
    void theJarDeclaresItsServices() {
        PluginRegistry registry = PluginRegistry.load(getClass().getClassLoader());
        assertThat(registry.problems()).isEmpty();
        assertThat(registry.requestImporter("text/csv")).get().isInstanceOf(CsvRequestImporter.class);
        assertThat(registry.planExporter("text/csv")).get().isInstanceOf(CsvPlanExporter.class);
        assertThat(ServiceLoader.load(RequestImporter.class).stream()).hasSize(1);
        assertThat(ServiceLoader.load(PlanExporter.class).stream()).hasSize(1);
    }
}
