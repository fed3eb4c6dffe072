package org.skyrota.plugins.csv;

import java.io.IOException;
import java.io.InputStream;
import java.io.StringReader;
import java.io.UncheckedIOException;
import java.time.LocalDate;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashMap;
import java.util.Iterator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.skyrota.plugin.ExposureRecord;
import org.skyrota.plugin.ImportProblem;
import org.skyrota.plugin.ImportResult;
import org.skyrota.plugin.PluginDescriptor;
import org.skyrota.plugin.RequestImporter;
import org.skyrota.plugin.RequestRecord;
import org.skyrota.sky.coords.Sexagesimal;

/**
 * Reads observing requests from CSV (RFC 4180, UTF-8, a header row naming the columns of
 * {@link RequestColumns}). Every bad cell is reported with its line and column, and a file with
 * any problem imports nothing.
 */
public final class CsvRequestImporter implements RequestImporter {

    private static final Set<String> DARKNESS = Set.of("astronomical", "nautical", "civil");
    private static final CSVFormat FORMAT = CSVFormat.RFC4180.builder()
            .setIgnoreEmptyLines(true)
            .setIgnoreSurroundingSpaces(true)
            .get();

    @Override
    public PluginDescriptor descriptor() {
        return CsvPlugin.DESCRIPTOR;
    }

    @Override
    public String description() {
        return "Imports observing requests from a CSV file with a header row; a file with any bad row imports nothing.";
    }

    @Override
    public String mediaType() {
        return CsvPlugin.MEDIA_TYPE;
    }

    @Override
    public ImportResult read(InputStream in) throws IOException {
        CsvText text;
        try {
            text = CsvText.read(in);
        } catch (CsvText.CsvTextException e) {
            return ImportResult.refused(List.of(new ImportProblem(1, null, e.getMessage())));
        }
        List<ImportProblem> problems = new ArrayList<>();
        List<RequestRecord> requests = new ArrayList<>();
        try (CSVParser parser = CSVParser.parse(new StringReader(text.text), FORMAT)) {
            Iterator<CSVRecord> records = parser.iterator();
            if (!records.hasNext()) {
                return ImportResult.refused(List.of(new ImportProblem(1, null,
                        "the file is empty; the first row must name the columns, for example " + String.join(",", RequestColumns.ALL))));
            }
            CSVRecord headerRecord = records.next();
            int headerLine = text.lineAt(headerRecord.getCharacterPosition());
            Map<String, Integer> header = header(headerRecord, headerLine, problems);
            if (!problems.isEmpty()) {
                return ImportResult.refused(problems);
            }
            long linesRead = parser.getCurrentLineNumber();
            while (true) {
                CSVRecord record;
                try {
                    if (!records.hasNext()) {
                        break;
                    }
                    record = records.next();
                } catch (UncheckedIOException | IllegalStateException e) {
                    problems.add(new ImportProblem((int) linesRead + 1, null,
                            "the CSV cannot be read from this line on: " + rootMessage(e)));
                    break;
                }
                int line = text.lineAt(record.getCharacterPosition());
                Row row = new Row(record, header, line, problems);
                RequestRecord request = row.request();
                if (request != null) {
                    requests.add(request);
                }
                linesRead = parser.getCurrentLineNumber();
            }
        } catch (UncheckedIOException | IllegalStateException e) {
            problems.add(new ImportProblem(1, null, "the CSV cannot be read: " + rootMessage(e)));
        }
        if (problems.isEmpty() && requests.isEmpty()) {
            problems.add(new ImportProblem(1, null, "the file has a header row but no requests"));
        }
        return problems.isEmpty() ? ImportResult.of(requests) : ImportResult.refused(problems);
    }

    private static Map<String, Integer> header(CSVRecord record, int line, List<ImportProblem> problems) {
        Map<String, Integer> columns = new LinkedHashMap<>();
        for (int i = 0; i < record.size(); i++) {
            String name = record.get(i).strip().toLowerCase(Locale.ROOT);
            if (name.isEmpty()) {
                problems.add(new ImportProblem(line, null, "column " + (i + 1) + " of the header row has no name"));
            } else if (!RequestColumns.ALL.contains(name)) {
                problems.add(new ImportProblem(line, name, "unknown column \"" + record.get(i).strip()
                        + "\"; the columns are " + String.join(",", RequestColumns.ALL)));
            } else if (columns.putIfAbsent(name, i) != null) {
                problems.add(new ImportProblem(line, name, "the column appears twice in the header row"));
            }
        }
        for (String required : RequestColumns.ALL) {
            if (RequestColumns.REQUIRED.contains(required) && !columns.containsKey(required)) {
                problems.add(new ImportProblem(line, required, "the header row lacks the required column " + required));
            }
        }
        return columns;
    }

    private static String rootMessage(Throwable e) {
        Throwable t = e;
        while (t.getCause() != null && t.getCause() != t) {
            t = t.getCause();
        }
        return t.getMessage() == null ? t.toString() : t.getMessage();
    }

    /** One data row, read cell by cell; each bad cell adds a problem and the row yields no request. */
    private static final class Row {
        private final CSVRecord record;
        private final Map<String, Integer> header;
        private final int line;
        private final List<ImportProblem> problems;
        private final int problemsBefore;

        Row(CSVRecord record, Map<String, Integer> header, int line, List<ImportProblem> problems) {
            this.record = record;
            this.header = header;
            this.line = line;
            this.problems = problems;
            this.problemsBefore = problems.size();
        }

        RequestRecord request() {
            if (record.size() != header.size()) {
                problems.add(new ImportProblem(line, null, "the row has " + record.size() + " cells but the header names "
                        + header.size() + " columns"));
                return null;
            }
            String title = required(RequestColumns.TITLE);
            String target = required(RequestColumns.TARGET);
            String kind = cell(RequestColumns.TARGET_KIND);
            kind = kind.isEmpty() ? "fixed" : kind.toLowerCase(Locale.ROOT);
            Map<String, String> parameters = parameters(cell(RequestColumns.TARGET_PARAMETERS));
            Double ra = angle(RequestColumns.RA, true);
            Double dec = angle(RequestColumns.DEC, false);
            if ("fixed".equals(kind)) {
                if (ra == null && !hasProblem(RequestColumns.RA)) {
                    problem(RequestColumns.RA, "a fixed target needs a right ascension");
                }
                if (dec == null && !hasProblem(RequestColumns.DEC)) {
                    problem(RequestColumns.DEC, "a fixed target needs a declination");
                }
                if (!parameters.isEmpty()) {
                    problem(RequestColumns.TARGET_PARAMETERS, "a fixed target takes no target parameters");
                }
            } else if (ra != null || dec != null) {
                problem(ra != null ? RequestColumns.RA : RequestColumns.DEC,
                        "a target of kind " + kind + " is computed, so ra and dec must be empty");
            }
            List<ExposureRecord> exposures = exposures();
            Double minAltitude = number(RequestColumns.MIN_ALTITUDE, 0, 90, "degrees");
            Double maxAirmass = number(RequestColumns.MAX_AIRMASS, 1, 10, "an airmass");
            String darkness = cell(RequestColumns.DARKNESS).toLowerCase(Locale.ROOT);
            if (!darkness.isEmpty() && !DARKNESS.contains(darkness)) {
                problem(RequestColumns.DARKNESS, "darkness must be astronomical, nautical or civil: \"" + cell(RequestColumns.DARKNESS) + "\"");
            }
            Double maxMoon = number(RequestColumns.MAX_MOON_ILLUMINATION, 0, 1, "a fraction");
            Double minSeparation = number(RequestColumns.MIN_MOON_SEPARATION, 0, 180, "degrees");
            LocalDate earliest = date(RequestColumns.EARLIEST_NIGHT);
            LocalDate latest = date(RequestColumns.LATEST_NIGHT);
            if (earliest != null && latest != null && latest.isBefore(earliest)) {
                problem(RequestColumns.LATEST_NIGHT, "the latest night " + latest + " is before the earliest night " + earliest);
            }
            Integer repeats = integer(RequestColumns.REPEATS, 1, 1000, 1);
            Integer interval = integer(RequestColumns.INTERVAL_DAYS, 0, 3650, 0);
            if (repeats != null && interval != null) {
                if (repeats == 1 && interval != 0) {
                    problem(RequestColumns.INTERVAL_DAYS, "interval_days must be 0 or empty when repeats is 1");
                } else if (repeats > 1 && interval == 0) {
                    problem(RequestColumns.INTERVAL_DAYS, "interval_days must be at least 1 when repeats is more than 1");
                }
            }
            Integer priority = integer(RequestColumns.PRIORITY, 1, 5, null);
            String program = required(RequestColumns.PROGRAM);
            String owner = cell(RequestColumns.OWNER);
            String notes = cell(RequestColumns.NOTES);
            if (problems.size() > problemsBefore) {
                // report a row's problems left to right, as the user reads it
                problems.subList(problemsBefore, problems.size()).sort(Comparator.comparingInt(
                        p -> p.field() == null ? -1 : header.getOrDefault(p.field(), Integer.MAX_VALUE)));
                return null;
            }
            return new RequestRecord(title, target, kind, ra, dec, parameters, exposures, minAltitude,
                    darkness.isEmpty() ? null : darkness, maxMoon, minSeparation, maxAirmass, earliest, latest, repeats, interval,
                    priority, program, owner.isEmpty() ? null : owner, notes);
        }

        private String cell(String column) {
            Integer i = header.get(column);
            return i == null ? "" : record.get(i).strip();
        }

        private void problem(String column, String message) {
            problems.add(new ImportProblem(line, column, message));
        }

        private boolean hasProblem(String column) {
            for (int i = problemsBefore; i < problems.size(); i++) {
                if (column.equals(problems.get(i).field())) {
                    return true;
                }
            }
            return false;
        }

        private String required(String column) {
            String value = cell(column);
            if (value.isEmpty()) {
                problem(column, column + " must not be empty");
            }
            return value;
        }

        private Double angle(String column, boolean rightAscension) {
            String value = cell(column);
            if (value.isEmpty()) {
                return null;
            }
            try {
                return rightAscension ? Sexagesimal.parseRaDeg(value) : Sexagesimal.parseDecDeg(value);
            } catch (IllegalArgumentException e) {
                problem(column, e.getMessage());
                return null;
            }
        }

        private Double number(String column, double min, double max, String unit) {
            String value = cell(column);
            if (value.isEmpty()) {
                return null;
            }
            double x;
            try {
                x = Double.parseDouble(value);
            } catch (NumberFormatException e) {
                problem(column, column + " must be a number (" + unit + "): \"" + value + "\"");
                return null;
            }
            if (!(x >= min && x <= max)) {
                problem(column, column + " must be between " + fmt(min) + " and " + fmt(max) + " (" + unit + "): \"" + value + "\"");
                return null;
            }
            return x;
        }

        private Integer integer(String column, int min, int max, Integer whenEmpty) {
            String value = cell(column);
            if (value.isEmpty()) {
                if (whenEmpty == null) {
                    problem(column, column + " must not be empty");
                }
                return whenEmpty;
            }
            int x;
            try {
                x = Integer.parseInt(value);
            } catch (NumberFormatException e) {
                problem(column, column + " must be a whole number: \"" + value + "\"");
                return null;
            }
            if (x < min || x > max) {
                problem(column, column + " must be from " + min + " to " + max + ": \"" + value + "\"");
                return null;
            }
            return x;
        }

        private LocalDate date(String column) {
            String value = cell(column);
            if (value.isEmpty()) {
                return null;
            }
            try {
                return LocalDate.parse(value);
            } catch (DateTimeParseException e) {
                problem(column, column + " must be a date as YYYY-MM-DD: \"" + value + "\"");
                return null;
            }
        }

        private List<ExposureRecord> exposures() {
            String value = cell(RequestColumns.FILTER_PLAN);
            if (value.isEmpty()) {
                problem(RequestColumns.FILTER_PLAN, "filter_plan must not be empty; for example V:60x3;R:60x3");
                return List.of();
            }
            try {
                return FilterPlan.parse(value);
            } catch (IllegalArgumentException e) {
                problem(RequestColumns.FILTER_PLAN, e.getMessage());
                return List.of();
            }
        }

        private Map<String, String> parameters(String value) {
            Map<String, String> parameters = new HashMap<>();
            if (value.isEmpty()) {
                return parameters;
            }
            for (String pair : value.split(";")) {
                if (pair.isBlank()) {
                    continue;
                }
                int eq = pair.indexOf('=');
                String key = eq < 0 ? "" : pair.substring(0, eq).strip();
                if (key.isEmpty()) {
                    problem(RequestColumns.TARGET_PARAMETERS, "target parameters are key=value pairs split by ';': \"" + pair.strip() + "\"");
                    continue;
                }
                if (parameters.put(key, pair.substring(eq + 1).strip()) != null) {
                    problem(RequestColumns.TARGET_PARAMETERS, "the target parameter " + key + " is given twice");
                }
            }
            return parameters;
        }

        private static String fmt(double x) {
            return x == Math.rint(x) ? Long.toString((long) x) : Double.toString(x);
        }
    }
}
