package org.skyrota.plugins.conditions;

import java.io.IOException;
import java.io.StringReader;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.Iterator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.skyrota.plugin.ConditionsFeed;
import org.skyrota.plugin.ImportProblem;
import org.skyrota.plugin.PluginApi;
import org.skyrota.plugin.PluginDescriptor;
import org.skyrota.plugin.SiteCondition;

/**
 * Expected conditions read from a CSV file (UTF-8, RFC 4180) with a header row naming the columns
 * {@code site,night,closed,cloud_fraction,reason} and, optionally, {@code telescope}:
 *
 * <pre>
 * site,telescope,night,closed,cloud_fraction,reason
 * Ridge Site,,2027-03-02,yes,,dome maintenance
 * Lake Site,T25,2027-03-03,no,0.8,forecast mostly cloudy
 * </pre>
 *
 * {@code night} is the local date of the evening; {@code closed} is yes/no (or true/false, 1/0);
 * {@code cloud_fraction} is 0 (clear) to 1 (overcast) or empty when unknown. The file is read
 * afresh on every call, so an edited file takes effect at the next planning run; a file with any
 * bad line yields nothing and a {@link ConditionsFileException} listing every bad line.
 *
 * <p>Loaded by {@link java.util.ServiceLoader}, the feed reads the file named by the system
 * property {@value #PATH_PROPERTY}, which must exist when it is read (a missing one is an error the
 * server reports with the run). Without it, the feed reads the file named by
 * {@value #DEFAULT_PATH_PROPERTY} whenever that file exists (the server's default place,
 * {@code <data-dir>/conditions.csv}): a file created or changed while the server runs takes effect
 * at the next run, and no file means no conditions. With neither property set it knows no
 * conditions.
 */
public final class ConditionsFileFeed implements ConditionsFeed {

    public static final String PATH_PROPERTY = "skyrota.conditions.file";
    /** The file read when it exists, if {@value #PATH_PROPERTY} is unset; set by the server to its default place. */
    public static final String DEFAULT_PATH_PROPERTY = "skyrota.conditions.default-file";
    static final PluginDescriptor DESCRIPTOR =
            new PluginDescriptor("conditions-file", "Conditions from a file", "1.0", PluginApi.VERSION);

    private static final List<String> REQUIRED = List.of("site", "night", "closed", "cloud_fraction", "reason");
    private static final Set<String> KNOWN = Set.of("site", "telescope", "night", "closed", "cloud_fraction", "reason");
    private static final CSVFormat FORMAT = CSVFormat.RFC4180.builder()
            .setIgnoreEmptyLines(true).setIgnoreSurroundingSpaces(true).setCommentMarker('#').get();

    private final Path file;
    /** Whether a missing file means no conditions rather than an error. */
    private final boolean optional;

    /**
     * Reads the file named by the system property {@value #PATH_PROPERTY} if set, else the one named by
     * {@value #DEFAULT_PATH_PROPERTY} whenever it exists.
     */
    public ConditionsFileFeed() {
        String configured = System.getProperty(PATH_PROPERTY);
        String fallback = System.getProperty(DEFAULT_PATH_PROPERTY);
        if (configured != null && !configured.isBlank()) {
            this.file = Path.of(configured);
            this.optional = false;
        } else if (fallback != null && !fallback.isBlank()) {
            this.file = Path.of(fallback);
            this.optional = true;
        } else {
            this.file = null;
            this.optional = false;
        }
    }

    /** Reads {@code file}, which must exist whenever conditions are asked for. */
    public ConditionsFileFeed(Path file) {
        this(file, false);
    }

    /**
     * Reads {@code file} afresh at every call.
     *
     * @param optional true when a missing file means no conditions (it may be created later), false when it is an
     *                 error
     */
    public ConditionsFileFeed(Path file, boolean optional) {
        this.file = file;
        this.optional = optional;
    }

    @Override
    public PluginDescriptor descriptor() {
        return DESCRIPTOR;
    }

    @Override
    public String description() {
        if (file == null) {
            return "Closes nights listed in a conditions file; no file is configured (system property " + PATH_PROPERTY + ").";
        }
        return "Closes nights and records cloud cover listed in " + file
                + (optional ? ", read at every planning run whenever the file exists." : ".");
    }

    /** The file read, if one is configured. */
    public Optional<Path> file() {
        return Optional.ofNullable(file);
    }

    @Override
    public List<SiteCondition> conditions(LocalDate from, LocalDate to) throws IOException, ConditionsFileException {
        if (file == null || optional && !Files.exists(file)) {
            return List.of();
        }
        List<SiteCondition> all = readAll();
        List<SiteCondition> inRange = new ArrayList<>();
        for (SiteCondition c : all) {
            if (!c.night().isBefore(from) && !c.night().isAfter(to)) {
                inRange.add(c);
            }
        }
        return inRange;
    }

    private List<SiteCondition> readAll() throws IOException, ConditionsFileException {
        String text = Files.readString(file, StandardCharsets.UTF_8);
        if (text.startsWith("\uFEFF")) {
            text = text.substring(1);
        }
        int[] lineStarts = lineStarts(text);
        List<ImportProblem> problems = new ArrayList<>();
        List<SiteCondition> conditions = new ArrayList<>();
        Map<String, Integer> seen = new HashMap<>();
        try (CSVParser parser = CSVParser.parse(new StringReader(text), FORMAT)) {
            Iterator<CSVRecord> records = parser.iterator();
            if (!records.hasNext()) {
                throw new ConditionsFileException(file.toString(), List.of(new ImportProblem(1, null,
                        "the file is empty; the first row must name the columns " + String.join(",", REQUIRED) + " (and optionally telescope)")));
            }
            CSVRecord headerRow = records.next();
            int headerLine = lineAt(lineStarts, headerRow.getCharacterPosition());
            Map<String, Integer> header = new LinkedHashMap<>();
            for (int i = 0; i < headerRow.size(); i++) {
                String name = headerRow.get(i).strip().toLowerCase(Locale.ROOT);
                if (!KNOWN.contains(name)) {
                    problems.add(new ImportProblem(headerLine, name, "unknown column \"" + headerRow.get(i) + "\""));
                } else if (header.putIfAbsent(name, i) != null) {
                    problems.add(new ImportProblem(headerLine, name, "the column appears twice"));
                }
            }
            for (String required : REQUIRED) {
                if (!header.containsKey(required)) {
                    problems.add(new ImportProblem(headerLine, required, "the header row lacks the column " + required));
                }
            }
            if (!problems.isEmpty()) {
                throw new ConditionsFileException(file.toString(), problems);
            }
            long linesRead = parser.getCurrentLineNumber();
            while (true) {
                CSVRecord r;
                try {
                    if (!records.hasNext()) {
                        break;
                    }
                    r = records.next();
                } catch (UncheckedIOException | IllegalStateException e) {
                    problems.add(new ImportProblem((int) linesRead + 1, null, "the CSV cannot be read from this line on: "
                            + (e.getCause() != null ? e.getCause().getMessage() : e.getMessage())));
                    break;
                }
                int line = lineAt(lineStarts, r.getCharacterPosition());
                SiteCondition c = row(r, header, line, problems);
                if (c != null) {
                    String key = c.site() + "\u0000" + (c.telescope() == null ? "" : c.telescope()) + "\u0000" + c.night();
                    Integer earlier = seen.putIfAbsent(key, line);
                    if (earlier != null) {
                        problems.add(new ImportProblem(line, null, "line " + earlier + " already gives the conditions of "
                                + c.site() + (c.telescope() == null ? "" : " " + c.telescope()) + " for the night of " + c.night()));
                    } else {
                        conditions.add(c);
                    }
                }
                linesRead = parser.getCurrentLineNumber();
            }
        }
        if (!problems.isEmpty()) {
            throw new ConditionsFileException(file.toString(), problems);
        }
        return conditions;
    }

    private static SiteCondition row(CSVRecord r, Map<String, Integer> header, int line, List<ImportProblem> problems) {
        if (r.size() != header.size()) {
            problems.add(new ImportProblem(line, null, "the row has " + r.size() + " cells but the header names " + header.size() + " columns"));
            return null;
        }
        int before = problems.size();
        String site = cell(r, header, "site");
        if (site.isEmpty()) {
            problems.add(new ImportProblem(line, "site", "site must not be empty"));
        }
        String telescope = cell(r, header, "telescope");
        LocalDate night = null;
        String nightText = cell(r, header, "night");
        try {
            night = LocalDate.parse(nightText);
        } catch (DateTimeParseException e) {
            problems.add(new ImportProblem(line, "night", "night must be a date as YYYY-MM-DD: \"" + nightText + "\""));
        }
        Boolean closed = switch (cell(r, header, "closed").toLowerCase(Locale.ROOT)) {
            case "yes", "true", "1", "y" -> true;
            case "no", "false", "0", "n" -> false;
            default -> null;
        };
        if (closed == null) {
            problems.add(new ImportProblem(line, "closed", "closed must be yes or no: \"" + cell(r, header, "closed") + "\""));
        }
        Double cloud = null;
        String cloudText = cell(r, header, "cloud_fraction");
        if (!cloudText.isEmpty()) {
            try {
                cloud = Double.parseDouble(cloudText);
            } catch (NumberFormatException e) {
                cloud = Double.NaN;
            }
            if (!(cloud >= 0 && cloud <= 1)) {
                problems.add(new ImportProblem(line, "cloud_fraction",
                        "cloud_fraction must be a number from 0 (clear) to 1 (overcast), or empty: \"" + cloudText + "\""));
            }
        }
        if (problems.size() > before) {
            return null;
        }
        return new SiteCondition(site, telescope.isEmpty() ? null : telescope, night, closed, cloud, cell(r, header, "reason"));
    }

    private static String cell(CSVRecord r, Map<String, Integer> header, String column) {
        Integer i = header.get(column);
        return i == null ? "" : r.get(i).strip();
    }

    private static int[] lineStarts(String text) {
        List<Integer> starts = new ArrayList<>();
        starts.add(0);
        for (int i = 0; i < text.length(); i++) {
            if (text.charAt(i) == '\n') {
                starts.add(i + 1);
            }
        }
        return starts.stream().mapToInt(Integer::intValue).toArray();
    }

    private static int lineAt(int[] starts, long offset) {
        int i = java.util.Arrays.binarySearch(starts, (int) offset);
        return (i >= 0 ? i : -i - 2) + 1;
    }
}
