package org.skyrota.plugins.csv;

import java.io.IOException;
import java.io.OutputStream;
import java.io.OutputStreamWriter;
import java.nio.charset.StandardCharsets;
import java.util.List;
import org.apache.commons.csv.CSVPrinter;
import org.skyrota.plugin.PlanExporter;
import org.skyrota.plugin.PlanRecord;
import org.skyrota.plugin.PlannedVisitRecord;
import org.skyrota.plugin.PluginDescriptor;

/**
 * Writes a plan as CSV (RFC 4180, UTF-8, CRLF), one row per visit in the order of the plan, times
 * in UTC ISO-8601, angles in decimal degrees (empty for a moving target).
 */
public final class CsvPlanExporter implements PlanExporter {

    /** The columns, in order. */
    public static final List<String> COLUMNS = List.of("visit_id", "request_id", "title", "target", "ra", "dec", "site",
            "telescope", "night", "start", "end", "owner", "program", "exposure_plan");

    @Override
    public PluginDescriptor descriptor() {
        return CsvPlugin.DESCRIPTOR;
    }

    @Override
    public String description() {
        return "Exports a plan as CSV, one row per visit, times in UTC.";
    }

    @Override
    public String mediaType() {
        return CsvPlugin.MEDIA_TYPE;
    }

    @Override
    public String fileExtension() {
        return "csv";
    }

    @Override
    public void write(PlanRecord plan, OutputStream out) throws IOException {
        CSVPrinter printer = new CSVPrinter(new OutputStreamWriter(out, StandardCharsets.UTF_8), CsvRequestWriter.FORMAT);
        printer.printRecord(COLUMNS);
        for (PlannedVisitRecord v : plan.visits()) {
            printer.printRecord(v.visitId(), v.requestId(), v.title(), v.targetName(), CsvRequestWriter.number(v.raDeg()),
                    CsvRequestWriter.number(v.decDeg()), v.site(), v.telescope(), v.night(), v.start(), v.end(),
                    v.owner(), v.program(), v.exposurePlan());
        }
        printer.flush();
    }
}
