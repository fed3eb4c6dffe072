package org.skyrota.web.compute;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.time.LocalTime;
import java.time.ZoneId;
import java.time.ZoneOffset;
import java.time.ZonedDateTime;
import java.util.List;
import java.util.Map;

import com.jayway.jsonpath.JsonPath;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.shredzone.commons.suncalc.MoonIllumination;
import org.shredzone.commons.suncalc.MoonTimes;
import org.shredzone.commons.suncalc.SunTimes;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;

/**
 * The compute endpoints over real HTTP with the real sky engine, checked against an independent
 * implementation: commons-suncalc 3.11 (Maven Central, test scope). Its rise, set and twilight
 * times are searched the same way as the night (from local noon, for 24 hours), with no dip of
 * the horizon (elevation 0), so the two must agree to the stated tolerances.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
class ComputeEndpointsSkyTest {

    /** Sun events: both sides are accurate to seconds; 30 s leaves room for suncalc's simpler Sun theory. */
    private static final Duration SUN_TOLERANCE = Duration.ofSeconds(30);
    /** Moon events: suncalc's Moon is a short series (its documentation says minute accuracy); two minutes. */
    private static final Duration MOON_TOLERANCE = Duration.ofMinutes(2);
    /** Illuminated fraction at the night's middle; suncalc's phase is a short series too. */
    private static final double ILLUMINATION_TOLERANCE = 0.005;

    private final HttpClient http = HttpClient.newHttpClient();

    @LocalServerPort
    int port;

    @ParameterizedTest(name = "almanac at {0},{1} tz={2} on {3}")
    @CsvSource({
            "37.2, -3.6, Europe/Madrid, 2027-03-15",
            "37.2, -3.6, Europe/Madrid, 2027-10-31",  // the night of the change back from summer time
            "-33.9, 18.4, Africa/Johannesburg, 2027-06-01",
            "-45.0, 170.5, Pacific/Auckland, 2027-12-20",
            "19.8, -155.5, , 2027-10-05",              // no zone: local mean solar time
            "51.5, 0.0, Europe/London, 2028-01-10",
    })
    void almanacAgreesWithSuncalc(double lat, double lon, String tz, LocalDate date) throws Exception {
        String query = "lat=" + lat + "&lon=" + lon + "&elevation=0&date=" + date + (tz == null ? "" : "&tz=" + tz);
        HttpResponse<String> response = get("/api/almanac?" + query);
        assertThat(response.statusCode()).isEqualTo(200);
        assertThat(response.headers().firstValue("Content-Type")).hasValueSatisfying(v -> assertThat(v).startsWith("application/json"));
        String body = response.body();
        assertThat(JsonPath.<String>read(body, "$.date")).isEqualTo(date.toString());

        ZoneId zone = tz == null ? ZoneOffset.ofTotalSeconds((int) Math.round(lon * 240)) : ZoneId.of(tz);
        ZonedDateTime noon = ZonedDateTime.of(date, LocalTime.NOON, zone);
        Map<SunTimes.Twilight, String[]> keys = Map.of(
                SunTimes.Twilight.VISUAL, new String[] {"sunset", "sunrise"},
                SunTimes.Twilight.CIVIL, new String[] {"civilDusk", "civilDawn"},
                SunTimes.Twilight.NAUTICAL, new String[] {"nauticalDusk", "nauticalDawn"},
                SunTimes.Twilight.ASTRONOMICAL, new String[] {"astronomicalDusk", "astronomicalDawn"});
        for (var entry : keys.entrySet()) {
            SunTimes sun = SunTimes.compute().on(noon).timezone(zone).at(lat, lon).twilight(entry.getKey())
                    .limit(Duration.ofDays(1)).execute();
            assertEvent(body, entry.getValue()[0], sun.getSet(), SUN_TOLERANCE);
            assertEvent(body, entry.getValue()[1], sun.getRise(), SUN_TOLERANCE);
        }
        MoonTimes moon = MoonTimes.compute().on(noon).timezone(zone).at(lat, lon).limit(Duration.ofDays(1)).execute();
        assertEvent(body, "moonrise", moon.getRise(), MOON_TOLERANCE);
        assertEvent(body, "moonset", moon.getSet(), MOON_TOLERANCE);

        Instant middle = noon.toInstant().plus(Duration.between(noon, noon.plusDays(1)).dividedBy(2));
        double fraction = MoonIllumination.compute().on(middle).execute().getFraction();
        assertThat(JsonPath.<Double>read(body, "$.moonIllumination")).isCloseTo(fraction, org.assertj.core.data.Offset.offset(ILLUMINATION_TOLERANCE));
    }

    @Test
    void midnightSunHasNoSunsetNoDuskAndNoDawn() throws Exception {
        // A site at 78.2°N at the June solstice: north of the Arctic circle the Sun does not set
        // (common practice, no source); suncalc agrees that the Sun stays up all day.
        String body = get("/api/almanac?lat=78.2&lon=15.6&date=2027-06-21&tz=Europe/Oslo").body();
        for (String key : List.of("sunset", "civilDusk", "nauticalDusk", "astronomicalDusk",
                "astronomicalDawn", "nauticalDawn", "civilDawn", "sunrise")) {
            assertThat(JsonPath.<Object>read(body, "$." + key)).as(key).isNull();
        }
        assertThat(body).contains("\"sunset\":null");
        SunTimes sun = SunTimes.compute().on(ZonedDateTime.of(LocalDate.of(2027, 6, 21), LocalTime.NOON, ZoneId.of("Europe/Oslo")))
                .at(78.2, 15.6).limit(Duration.ofDays(1)).execute();
        assertThat(sun.isAlwaysUp()).isTrue();
    }

    @Test
    void aTargetThatNeverSinksBelowTheLimitIsVisibleFromAstronomicalDuskToDawn() throws Exception {
        // At latitude 45°N a target at declination +85° circles between altitudes 40° and 50°
        // (lower culmination at φ − (90° − δ), upper at 90° − (φ − δ): common practice, no source),
        // so with minAltitude 30 only the darkness limit bounds its windows: each night's one
        // window runs from astronomical dusk to astronomical dawn, which suncalc gives independently.
        String body = get("/api/visibility?ra=40&dec=85&lat=45&lon=7&tz=Europe/Rome"
                + "&from=2027-11-01&to=2027-11-03&minAltitude=30&darkness=astronomical").body();
        List<Map<String, Object>> windows = JsonPath.read(body, "$.windows");
        assertThat(windows).hasSize(3);
        for (int i = 0; i < 3; i++) {
            LocalDate night = LocalDate.of(2027, 11, 1).plusDays(i);
            Map<String, Object> w = windows.get(i);
            assertThat(w).containsOnlyKeys("night", "start", "end", "maxAltitude");
            assertThat(w.get("night")).isEqualTo(night.toString());
            SunTimes dark = SunTimes.compute().on(ZonedDateTime.of(night, LocalTime.NOON, ZoneId.of("Europe/Rome")))
                    .at(45, 7).twilight(SunTimes.Twilight.ASTRONOMICAL).limit(Duration.ofDays(1)).execute();
            assertThat(Duration.between(dark.getSet().toInstant(), Instant.parse((String) w.get("start"))).abs()).isLessThan(SUN_TOLERANCE);
            assertThat(Duration.between(dark.getRise().toInstant(), Instant.parse((String) w.get("end"))).abs()).isLessThan(SUN_TOLERANCE);
            // Refraction at 40-50° adds about 1′ (Bennett, Meeus ch. 16), hence the 0.05° margin.
            assertThat(((Number) w.get("maxAltitude")).doubleValue()).isBetween(40.0, 50.05);
        }
    }

    @Test
    void noAstronomicalDarknessMeansNoWindowButCivilDarknessGivesOne() throws Exception {
        // At 60°N in late June the Sun stays above −18° all night (suncalc: no astronomical
        // twilight that night) but does sink below −6° for a while.
        ZonedDateTime noon = ZonedDateTime.of(LocalDate.of(2027, 6, 21), LocalTime.NOON, ZoneId.of("Europe/Helsinki"));
        SunTimes astro = SunTimes.compute().on(noon).at(60.2, 24.9).twilight(SunTimes.Twilight.ASTRONOMICAL).limit(Duration.ofDays(1)).execute();
        SunTimes civil = SunTimes.compute().on(noon).at(60.2, 24.9).twilight(SunTimes.Twilight.NAUTICAL).limit(Duration.ofDays(1)).execute();
        assertThat(astro.getSet()).isNull();
        String site = "ra=40&dec=85&lat=60.2&lon=24.9&tz=Europe/Helsinki&from=2027-06-21&to=2027-06-21&minAltitude=20";
        assertThat(JsonPath.<List<Object>>read(get("/api/visibility?" + site + "&darkness=astronomical").body(), "$.windows")).isEmpty();
        String nautical = get("/api/visibility?" + site + "&darkness=nautical").body();
        if (civil.getSet() == null) {
            assertThat(JsonPath.<List<Object>>read(nautical, "$.windows")).isEmpty();
        } else {
            assertThat(Instant.parse(JsonPath.read(nautical, "$.windows[0].start"))).isCloseTo(civil.getSet().toInstant(), org.assertj.core.api.Assertions.within(SUN_TOLERANCE));
        }
    }

    @Test
    void badParameterOverHttpIsAProblemDocumentNamingIt() throws Exception {
        HttpResponse<String> response = get("/api/visibility?ra=12&dec=95&lat=45&lon=7&from=2027-11-01&to=2027-11-03");
        assertThat(response.statusCode()).isEqualTo(400);
        assertThat(response.headers().firstValue("Content-Type")).hasValue("application/problem+json");
        assertThat(JsonPath.<String>read(response.body(), "$.parameter")).isEqualTo("dec");
        assertThat(response.body()).doesNotContain("Exception");
    }

    @Test
    void healthIsUpAndOnlyHealthAndInfoAreExposed() throws Exception {
        HttpResponse<String> health = get("/actuator/health");
        assertThat(health.statusCode()).isEqualTo(200);
        assertThat(JsonPath.<String>read(health.body(), "$.status")).isEqualTo("UP");
        assertThat(get("/actuator/info").statusCode()).isEqualTo(200);
        // Not exposed: without an account the path is refused, with one it does not exist.
        assertThat(get("/actuator/env").statusCode()).isIn(401, 404);
        assertThat(get("/actuator/beans").statusCode()).isIn(401, 404);
    }

    private void assertEvent(String body, String key, ZonedDateTime expected, Duration tolerance) {
        String actual = JsonPath.read(body, "$." + key);
        if (expected == null) {
            assertThat(actual).as(key + " (suncalc: none in the night)").isNull();
        } else {
            assertThat(actual).as(key).isNotNull().endsWith("Z");
            Duration difference = Duration.between(expected.toInstant(), Instant.parse(actual)).abs();
            assertThat(difference).as(key + " " + actual + " vs suncalc " + expected.toInstant()).isLessThanOrEqualTo(tolerance);
        }
    }

    private HttpResponse<String> get(String pathAndQuery) throws IOException, InterruptedException {
        return http.send(HttpRequest.newBuilder(URI.create("http://127.0.0.1:" + port + pathAndQuery)).GET().build(),
                HttpResponse.BodyHandlers.ofString());
    }
}
