package org.skyrota.plugins.csv;

import java.io.IOException;
import java.io.OutputStream;
import java.io.OutputStreamWriter;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVPrinter;
import org.skyrota.plugin.RequestRecord;

/**
 * Writes requests in the format {@link CsvRequestImporter} reads, with every column of
 * {@link RequestColumns#ALL}; angles in decimal degrees so that nothing is lost in the round trip.
 */
public final class CsvRequestWriter {

    static final CSVFormat FORMAT = CSVFormat.RFC4180.builder().setRecordSeparator("\r\n").get();

    /** Writes a header row and one row per request; the stream is flushed, not closed. */
    public void write(List<RequestRecord> requests, OutputStream out) throws IOException {
        Writer writer = new OutputStreamWriter(out, StandardCharsets.UTF_8);
        CSVPrinter printer = new CSVPrinter(writer, FORMAT);
        printer.printRecord(RequestColumns.ALL);
        for (RequestRecord r : requests) {
            List<String> row = new ArrayList<>(RequestColumns.ALL.size());
            row.add(r.title());
            row.add(r.targetName());
            row.add(r.targetKind() == null ? "" : r.targetKind());
            row.add(parameters(r.targetParameters()));
            row.add(number(r.raDeg()));
            row.add(number(r.decDeg()));
            row.add(FilterPlan.format(r.exposures()));
            row.add(number(r.minAltitudeDeg()));
            row.add(number(r.maxAirmass()));
            row.add(text(r.darkness()));
            row.add(number(r.maxMoonIllumination()));
            row.add(number(r.minMoonSeparationDeg()));
            row.add(r.earliestNight() == null ? "" : r.earliestNight().toString());
            row.add(r.latestNight() == null ? "" : r.latestNight().toString());
            row.add(Integer.toString(r.repeats()));
            row.add(Integer.toString(r.intervalDays()));
            row.add(Integer.toString(r.priority()));
            row.add(r.program());
            row.add(text(r.owner()));
            row.add(r.notes());
            printer.printRecord(row);
        }
        printer.flush();
    }

    private static String parameters(Map<String, String> parameters) {
        StringBuilder text = new StringBuilder();
        for (Map.Entry<String, String> p : new TreeMap<>(parameters).entrySet()) {
            if (p.getKey().contains("=") || p.getKey().contains(";") || p.getValue().contains(";")) {
                throw new IllegalArgumentException("a target parameter in CSV cannot hold ';' (or '=' in its key): " + p);
            }
            if (text.length() > 0) {
                text.append(';');
            }
            text.append(p.getKey()).append('=').append(p.getValue());
        }
        return text.toString();
    }

    /** Shortest text that reads back to the same double. */
    static String number(Double x) {
        return x == null ? "" : Double.toString(x);
    }

    private static String text(String s) {
        return s == null ? "" : s;
    }
}
