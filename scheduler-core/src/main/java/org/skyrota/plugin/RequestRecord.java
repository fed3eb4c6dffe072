package org.skyrota.plugin;

import java.time.LocalDate;
import java.util.List;
import java.util.Map;

/**
 * An observing request as importers produce it and exporters read it. Values are as a user typed
 * them into a form: the server validates them as it validates the form, naming the field.
 *
 * @param title            a short title; not blank
 * @param targetName       the target's name or catalogue number; not blank
 * @param targetKind       {@code "fixed"} for an ICRS position, or a {@link TargetKind#kind()}
 * @param raDeg            ICRS right ascension in degrees for fixed targets, else null
 * @param decDeg           ICRS declination in degrees for fixed targets, else null
 * @param targetParameters parameters for a {@link TargetKind}; empty for fixed targets
 * @param exposures        the exposure plan; not empty
 * @param minAltitudeDeg   lowest apparent altitude, degrees; null for the default
 * @param darkness         {@code "astronomical"}, {@code "nautical"} or {@code "civil"}; null for the default
 * @param maxMoonIllumination highest Moon illuminated fraction while the Moon is up, 0 to 1; null for none
 * @param minMoonSeparationDeg smallest angle from the Moon, degrees; null for none
 * @param maxAirmass       highest Kasten–Young airmass, at least 1; null for none
 * @param earliestNight    first night the request may be observed; null for no limit
 * @param latestNight      last night; null for no limit
 * @param repeats          how many visits, at least 1
 * @param intervalDays     nights between repeats; 0 when {@code repeats} is 1
 * @param priority         1 (low) to 5 (high)
 * @param program          the program's name or code; not blank
 * @param owner            the user name of the requester; null when the importing user owns it
 * @param notes            free text, may be empty
 * @param sourceId         what names this record at its source, the same each time the source sends it again (a
 *                         VOEvent packet's IVORN), so that the server can recognise a record it already stored; null
 *                         when the source names none
 */
public record RequestRecord(
        String title,
        String targetName,
        String targetKind,
        Double raDeg,
        Double decDeg,
        Map<String, String> targetParameters,
        List<ExposureRecord> exposures,
        Double minAltitudeDeg,
        String darkness,
        Double maxMoonIllumination,
        Double minMoonSeparationDeg,
        Double maxAirmass,
        LocalDate earliestNight,
        LocalDate latestNight,
        int repeats,
        int intervalDays,
        int priority,
        String program,
        String owner,
        String notes,
        String sourceId) {

    public RequestRecord {
        targetParameters = targetParameters == null ? Map.of() : Map.copyOf(targetParameters);
        exposures = exposures == null ? List.of() : List.copyOf(exposures);
        notes = notes == null ? "" : notes;
        sourceId = sourceId == null || sourceId.isBlank() ? null : sourceId.strip();
    }

    /** A record whose source names it by nothing that stays the same when sent again (a row of a file). */
    public RequestRecord(String title, String targetName, String targetKind, Double raDeg, Double decDeg,
            Map<String, String> targetParameters, List<ExposureRecord> exposures, Double minAltitudeDeg, String darkness,
            Double maxMoonIllumination, Double minMoonSeparationDeg, Double maxAirmass, LocalDate earliestNight,
            LocalDate latestNight, int repeats, int intervalDays, int priority, String program, String owner,
            String notes) {
        this(title, targetName, targetKind, raDeg, decDeg, targetParameters, exposures, minAltitudeDeg, darkness,
                maxMoonIllumination, minMoonSeparationDeg, maxAirmass, earliestNight, latestNight, repeats, intervalDays,
                priority, program, owner, notes, null);
    }

    /** A request without an airmass limit, named at its source by {@code sourceId}. */
    public RequestRecord(String title, String targetName, String targetKind, Double raDeg, Double decDeg,
            Map<String, String> targetParameters, List<ExposureRecord> exposures, Double minAltitudeDeg, String darkness,
            Double maxMoonIllumination, Double minMoonSeparationDeg, LocalDate earliestNight, LocalDate latestNight,
            int repeats, int intervalDays, int priority, String program, String owner, String notes, String sourceId) {
        this(title, targetName, targetKind, raDeg, decDeg, targetParameters, exposures, minAltitudeDeg, darkness,
                maxMoonIllumination, minMoonSeparationDeg, null, earliestNight, latestNight, repeats, intervalDays,
                priority, program, owner, notes, sourceId);
    }

    /**
     * A request without an airmass limit or a source id: the members as they were before those, so that importers
     * built against them keep working unchanged.
     */
    public RequestRecord(String title, String targetName, String targetKind, Double raDeg, Double decDeg,
                         Map<String, String> targetParameters, List<ExposureRecord> exposures, Double minAltitudeDeg,
                         String darkness, Double maxMoonIllumination, Double minMoonSeparationDeg, LocalDate earliestNight,
                         LocalDate latestNight, int repeats, int intervalDays, int priority, String program, String owner,
                         String notes) {
        this(title, targetName, targetKind, raDeg, decDeg, targetParameters, exposures, minAltitudeDeg, darkness,
                maxMoonIllumination, minMoonSeparationDeg, null, earliestNight, latestNight, repeats, intervalDays, priority,
                program, owner, notes, null);
    }
}
