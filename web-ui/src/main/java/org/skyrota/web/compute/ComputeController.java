package org.skyrota.web.compute;

import java.time.LocalDate;
import java.time.temporal.ChronoUnit;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import org.skyrota.planning.model.DarknessLimit;
import org.skyrota.planning.model.ObservingLimits;
import org.skyrota.planning.sky.EngineSkyModel;
import org.skyrota.planning.sky.SkyWindow;
import org.skyrota.planning.sky.TelescopeWindows;
import org.skyrota.plugin.MovingTarget;
import org.skyrota.web.compute.SkyComputations.Conditions;
import org.skyrota.web.compute.SkyComputations.Darkness;
import org.skyrota.web.compute.SkyComputations.Observer;
import org.skyrota.web.compute.SkyComputations.Target;
import org.skyrota.web.plan.StoredSky;
import org.skyrota.web.plugin.TargetKinds;
import org.skyrota.web.system.FieldProblem;
import org.skyrota.web.system.InvalidParametersException;
import org.skyrota.web.system.QueryParameters;
import org.skyrota.web.system.SupportedDates;
import org.springframework.beans.factory.ObjectProvider;
import org.springframework.http.MediaType;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.bind.annotation.RestController;

/**
 * The compute endpoints: almanac and visibility windows for a site given by its coordinates.
 * They read no stored data, so they need no login. Visibility at a stored site ({@code siteId})
 * reads the site and its telescopes, so that call needs a sign-in (SecurityConfig).
 */
@RestController
class ComputeController {

    /** Nights a single visibility request may span: one year, leap years included. */
    static final int MAX_NIGHTS = 366;
    /** Dates the server accepts, here as in every body and query parameter ({@link SupportedDates}). */
    static final LocalDate EARLIEST_DATE = SupportedDates.FIRST;
    static final LocalDate LATEST_DATE = SupportedDates.LAST;
    static final double DEFAULT_MIN_ALTITUDE_DEG = 30;
    /** The sky engine's range for a minimum altitude (ObservingConstraints): below -1° refraction is unreliable. */
    static final double LOWEST_MIN_ALTITUDE_DEG = -1;
    static final double HIGHEST_MIN_ALTITUDE_DEG = 89;
    static final Darkness DEFAULT_DARKNESS = Darkness.ASTRONOMICAL;
    /** An airmass limit's range, as a request's: 1 is the zenith; 10 (about 5.2° up, Kasten–Young) is our choice. */
    static final double LOWEST_MAX_AIRMASS = 1;
    static final double HIGHEST_MAX_AIRMASS = 10;

    /** Query parameters with this prefix are a moving target's parameters: {@code targetParameters.body=jupiter}. */
    static final String PARAMETER_PREFIX = TargetKinds.PARAMETERS_FIELD + ".";

    /** The query parameter naming a stored site. */
    static final String SITE_ID = "siteId";

    private final SkyComputations sky;
    private final ObjectProvider<TargetKinds> targetKinds;
    private final StoredSky storedSky;

    ComputeController(SkyComputations sky, ObjectProvider<TargetKinds> targetKinds, StoredSky storedSky) {
        this.sky = sky;
        this.targetKinds = targetKinds;
        this.storedSky = storedSky;
    }

    @GetMapping(path = "/api/almanac", produces = MediaType.APPLICATION_JSON_VALUE)
    AlmanacResponse almanac(
            @RequestParam(required = false) String lat,
            @RequestParam(required = false) String lon,
            @RequestParam(required = false) String elevation,
            @RequestParam(required = false) String date,
            @RequestParam(required = false) String tz) {
        QueryParameters params = new QueryParameters();
        Observer observer = observer(params, lat, lon, elevation, tz);
        LocalDate night = params.requiredDate("date", date, EARLIEST_DATE, LATEST_DATE);
        params.throwIfInvalid();
        return AlmanacResponse.of(sky.almanac(observer, night));
    }

    @GetMapping(path = "/api/visibility", produces = MediaType.APPLICATION_JSON_VALUE)
    VisibilityResponse visibility(
            @RequestParam(required = false) String ra,
            @RequestParam(required = false) String dec,
            @RequestParam(required = false) String lat,
            @RequestParam(required = false) String lon,
            @RequestParam(required = false) String elevation,
            @RequestParam(required = false) String from,
            @RequestParam(required = false) String to,
            @RequestParam(required = false) String minAltitude,
            @RequestParam(required = false) String darkness,
            @RequestParam(required = false) String minMoonSeparation,
            @RequestParam(required = false) String maxMoonIllumination,
            @RequestParam(required = false) String maxAirmass,
            @RequestParam(required = false) String tz,
            @RequestParam(required = false) String targetKind,
            @RequestParam(name = SITE_ID, required = false) String siteId,
            @RequestParam Map<String, String> query) {
        QueryParameters params = new QueryParameters();
        boolean fixed = TargetKinds.isFixed(targetKind);
        double raDeg = fixed ? params.requiredNumber("ra", ra, 0, 360) : 0;
        double decDeg = fixed ? params.requiredNumber("dec", dec, -90, 90) : 0;
        Map<String, String> coordinates = new LinkedHashMap<>();
        coordinates.put("lat", lat);
        coordinates.put("lon", lon);
        coordinates.put("elevation", elevation);
        coordinates.put("tz", tz);
        StoredSky.Network stored = siteId == null ? null : storedSite(params, siteId, coordinates);
        Observer observer = siteId == null ? observer(params, lat, lon, elevation, tz) : null;
        LocalDate first = params.requiredDate("from", from, EARLIEST_DATE, LATEST_DATE);
        LocalDate last = params.requiredDate("to", to, EARLIEST_DATE, LATEST_DATE);
        Conditions conditions = new Conditions(
                params.optionalNumber("minAltitude", minAltitude, LOWEST_MIN_ALTITUDE_DEG, HIGHEST_MIN_ALTITUDE_DEG,
                        DEFAULT_MIN_ALTITUDE_DEG),
                params.optionalChoice("darkness", darkness, Darkness.class, DEFAULT_DARKNESS),
                params.optionalNumber("minMoonSeparation", minMoonSeparation, 0, 180),
                params.optionalNumber("maxMoonIllumination", maxMoonIllumination, 0, 1),
                params.optionalNumber("maxAirmass", maxAirmass, LOWEST_MAX_AIRMASS, HIGHEST_MAX_AIRMASS));
        if (first != null && last != null) {
            if (last.isBefore(first)) {
                params.reject("to", "must not be before from (" + first + "), was " + last);
            } else if (ChronoUnit.DAYS.between(first, last) + 1 > MAX_NIGHTS) {
                params.reject("to", "may be at most " + MAX_NIGHTS + " nights after from (" + first + "), was " + last);
            }
        }
        params.throwIfInvalid();
        if (stored != null) {
            Target target = new Target(raDeg % 360, decDeg);
            return atStoredSite(stored, fixed ? null : moving(targetKind, query), target, conditions, first, last);
        }
        if (!fixed) {
            return VisibilityResponse.of(sky.movingWindows(observer, moving(targetKind, query), conditions, first, last));
        }
        return VisibilityResponse.of(sky.windows(observer, new Target(raDeg % 360, decDeg), conditions, first, last));
    }

    /**
     * The stored site a visibility query names, with its active telescopes; null (and the problems noted) when
     * {@code siteId} is not a stored site's id or coordinates are given as well.
     */
    private StoredSky.Network storedSite(QueryParameters params, String siteId, Map<String, String> coordinates) {
        coordinates.forEach((name, value) -> {
            if (value != null && !value.isBlank()) {
                params.reject(name, "must not be given with " + SITE_ID + ": the stored site's own is used, was '"
                        + value + "'");
            }
        });
        long id;
        try {
            id = Long.parseLong(siteId.trim());
        } catch (NumberFormatException e) {
            params.reject(SITE_ID, "must be the id of a stored site, a whole number, was '" + siteId + "'");
            return null;
        }
        StoredSky.Network network = storedSky.site(id);
        if (network == null) {
            params.reject(SITE_ID, "names no stored site: " + id);
        }
        return network;
    }

    /**
     * The windows at a stored site, by the planner's sky model and the rule its candidates follow
     * ({@link TelescopeWindows}): under the site's horizon profile, with the minimum altitude raised to the lowest
     * pointing limit of the site's active telescopes where that is higher.
     *
     * @param moving the moving target's position, or null for the fixed {@code target}
     */
    private static VisibilityResponse atStoredSite(StoredSky.Network stored, MovingTarget moving, Target target,
                                                   Conditions conditions, LocalDate first, LocalDate last) {
        org.skyrota.planning.model.Site site = stored.sites().get(0);
        double lowest = stored.lowestPointingLimitDeg(site);
        double minAltitude = Double.isNaN(lowest) ? conditions.minAltitudeDeg()
                : Math.max(conditions.minAltitudeDeg(), lowest);
        // No Sun-separation limit: the same conditions as a query by coordinates.
        ObservingLimits limits = new ObservingLimits(minAltitude, Double.POSITIVE_INFINITY,
                DarknessLimit.valueOf(conditions.darkness().name()),
                conditions.minMoonSeparationDeg() == null ? 0 : conditions.minMoonSeparationDeg(),
                conditions.maxMoonIllumination() == null ? 1 : conditions.maxMoonIllumination(), 0);
        org.skyrota.planning.model.Target planned = moving != null
                ? org.skyrota.planning.model.Target.moving(moving.label(), moving)
                : org.skyrota.planning.model.Target.fixed("the target", target.raDeg(), target.decDeg());
        List<SkyWindow> windows = TelescopeWindows.windows(new EngineSkyModel(), site, planned, limits, first, last);
        return new VisibilityResponse(windows.stream().map(WindowResponse::of).toList());
    }

    /** The position of a plugin's target kind, from the {@code targetParameters.*} query parameters. */
    private MovingTarget moving(String kind, Map<String, String> query) {
        Map<String, String> parameters = new LinkedHashMap<>();
        query.forEach((name, value) -> {
            if (name.startsWith(PARAMETER_PREFIX) && name.length() > PARAMETER_PREFIX.length()) {
                parameters.put(name.substring(PARAMETER_PREFIX.length()), value);
            }
        });
        TargetKinds kinds = targetKinds.getIfAvailable();
        if (kinds == null) {
            throw new InvalidParametersException(List.of(new FieldProblem(TargetKinds.KIND_FIELD,
                    "this server has no target-kind plugins; only fixed targets: " + kind)));
        }
        return kinds.resolve(kind, parameters);
    }

    private static Observer observer(QueryParameters params, String lat, String lon, String elevation, String tz) {
        return new Observer(
                params.requiredNumber("lat", lat, -90, 90),
                params.requiredNumber("lon", lon, -180, 180),
                params.optionalNumber("elevation", elevation, -500, 9000, 0),
                params.optionalZone("tz", tz));
    }

    record VisibilityResponse(List<WindowResponse> windows) {
        static VisibilityResponse of(List<SkyComputations.Window> windows) {
            return new VisibilityResponse(windows.stream().map(WindowResponse::of).toList());
        }
    }
}
