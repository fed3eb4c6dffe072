package org.skyrota.web.compute;

import static org.assertj.core.api.Assertions.assertThat;
import static org.hamcrest.Matchers.containsString;
import static org.hamcrest.Matchers.hasItem;
import static org.mockito.ArgumentMatchers.any;
import static org.mockito.ArgumentMatchers.eq;
import static org.mockito.Mockito.verify;
import static org.mockito.Mockito.verifyNoInteractions;
import static org.mockito.Mockito.when;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.get;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.content;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.jsonPath;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.status;

import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneId;
import java.util.List;
import java.util.Optional;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.mockito.ArgumentCaptor;
import org.skyrota.web.compute.SkyComputations.Conditions;
import org.skyrota.web.compute.SkyComputations.Darkness;
import org.skyrota.web.compute.SkyComputations.NightEvents;
import org.skyrota.web.compute.SkyComputations.Observer;
import org.skyrota.web.compute.SkyComputations.Target;
import org.skyrota.web.compute.SkyComputations.Window;
import org.skyrota.web.plan.StoredSky;
import org.skyrota.web.system.ProblemAdvice;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.webmvc.test.autoconfigure.AutoConfigureMockMvc;
import org.springframework.boot.webmvc.test.autoconfigure.WebMvcTest;
import org.springframework.context.annotation.Import;
import org.springframework.http.MediaType;
import org.springframework.test.context.bean.override.mockito.MockitoBean;
import org.springframework.test.web.servlet.MockMvc;

/**
 * The compute endpoints' parameter handling and JSON shape, with the sky engine replaced by a
 * mock: what reaches the engine, what the client sees, and a problem document naming the
 * parameter for every kind of bad input. The sky results themselves are checked in
 * {@link ComputeEndpointsSkyTest} against an independent library.
 */
@WebMvcTest(ComputeController.class)
@AutoConfigureMockMvc(addFilters = false)
@Import(ProblemAdvice.class)
class ComputeControllerParametersTest {

    private static final String SITE = "lat=37.2&lon=-3.6&elevation=680&tz=Europe/Madrid";
    private static final String TARGET = "ra=83.8&dec=-5.4";

    @Autowired
    MockMvc mvc;

    @MockitoBean
    SkyComputations sky;

    /** Stored sites are read only for {@code siteId}; see {@link OneSkyTest} for the real answers. */
    @MockitoBean
    StoredSky storedSky;

    @Test
    void almanacPassesTheSiteAndNightAndWritesEveryKeyInContractOrder() throws Exception {
        LocalDate night = LocalDate.of(2027, 6, 1);
        when(sky.almanac(any(), any())).thenReturn(new NightEvents(night,
                Optional.of(Instant.parse("2027-06-01T19:31:12.600Z")), Optional.of(Instant.parse("2027-06-01T20:02:00Z")),
                Optional.empty(), Optional.empty(), Optional.empty(), Optional.empty(),
                Optional.of(Instant.parse("2027-06-02T04:01:00Z")), Optional.of(Instant.parse("2027-06-02T04:32:00Z")),
                Optional.empty(), Optional.of(Instant.parse("2027-06-01T22:10:09.499Z")), 0.431249));

        String body = mvc.perform(get("/api/almanac?" + SITE + "&date=2027-06-01"))
                .andExpect(status().isOk())
                .andExpect(content().contentTypeCompatibleWith(MediaType.APPLICATION_JSON))
                .andReturn().getResponse().getContentAsString();

        verify(sky).almanac(new Observer(37.2, -3.6, 680, ZoneId.of("Europe/Madrid")), night);
        // Key order, nulls kept, instants rounded to whole seconds with Z, illumination to 4 decimals.
        assertThat(body).isEqualTo("{\"date\":\"2027-06-01\",\"sunset\":\"2027-06-01T19:31:13Z\","
                + "\"civilDusk\":\"2027-06-01T20:02:00Z\",\"nauticalDusk\":null,\"astronomicalDusk\":null,"
                + "\"astronomicalDawn\":null,\"nauticalDawn\":null,\"civilDawn\":\"2027-06-02T04:01:00Z\","
                + "\"sunrise\":\"2027-06-02T04:32:00Z\",\"moonrise\":null,\"moonset\":\"2027-06-01T22:10:09Z\","
                + "\"moonIllumination\":0.4312}");
    }

    @Test
    void almanacWithoutElevationOrZoneUsesSeaLevelAndLocalMeanSolarTime() throws Exception {
        when(sky.almanac(any(), any())).thenReturn(emptyNight(LocalDate.of(2027, 6, 1)));
        mvc.perform(get("/api/almanac?lat=-33.9&lon=18.4&date=2027-06-01")).andExpect(status().isOk());
        verify(sky).almanac(new Observer(-33.9, 18.4, 0, null), LocalDate.of(2027, 6, 1));
    }

    @Test
    void almanacTakesTheEndsOfTheDateRangeAndAnEtcRegionForAFixedOffset() throws Exception {
        when(sky.almanac(any(), any())).thenAnswer(call -> emptyNight(call.getArgument(1)));
        mvc.perform(get("/api/almanac?lat=24.5&lon=54.4&date=1900-01-01&tz=Etc/GMT-4")).andExpect(status().isOk());
        mvc.perform(get("/api/almanac?lat=24.5&lon=54.4&date=2200-12-31&tz=Asia/Dubai")).andExpect(status().isOk());
        // Etc/GMT-4 is four hours east of Greenwich: the IANA database's own sign convention.
        verify(sky).almanac(new Observer(24.5, 54.4, 0, ZoneId.of("Etc/GMT-4")), LocalDate.of(1900, 1, 1));
        verify(sky).almanac(new Observer(24.5, 54.4, 0, ZoneId.of("Asia/Dubai")), LocalDate.of(2200, 12, 31));
    }

    @Test
    void visibilityAppliesTheDocumentedDefaults() throws Exception {
        when(sky.windows(any(), any(), any(), any(), any())).thenReturn(List.of());
        mvc.perform(get("/api/visibility?" + TARGET + "&lat=37.2&lon=-3.6&from=2027-01-10&to=2027-01-12"))
                .andExpect(status().isOk())
                .andExpect(content().json("{\"windows\":[]}"));
        verify(sky).windows(new Observer(37.2, -3.6, 0, null), new Target(83.8, -5.4),
                new Conditions(30, Darkness.ASTRONOMICAL, null, null),
                LocalDate.of(2027, 1, 10), LocalDate.of(2027, 1, 12));
    }

    @Test
    void visibilityPassesEveryConditionAndWritesWindowsInOrder() throws Exception {
        when(sky.windows(any(), any(), any(), any(), any())).thenReturn(List.of(
                new Window(LocalDate.of(2027, 1, 10), Instant.parse("2027-01-10T19:00:00Z"), Instant.parse("2027-01-11T01:30:00Z"), 52.4449),
                new Window(LocalDate.of(2027, 1, 11), Instant.parse("2027-01-11T18:56:00Z"), Instant.parse("2027-01-12T01:26:00Z"), 52.45)));
        ArgumentCaptor<Conditions> conditions = ArgumentCaptor.forClass(Conditions.class);

        String body = mvc.perform(get("/api/visibility?" + TARGET + "&" + SITE
                        + "&from=2027-01-10&to=2027-01-11&minAltitude=25.5&darkness=nautical"
                        + "&minMoonSeparation=40&maxMoonIllumination=0.5&maxAirmass=1.8"))
                .andExpect(status().isOk())
                .andReturn().getResponse().getContentAsString();

        verify(sky).windows(eq(new Observer(37.2, -3.6, 680, ZoneId.of("Europe/Madrid"))), eq(new Target(83.8, -5.4)),
                conditions.capture(), eq(LocalDate.of(2027, 1, 10)), eq(LocalDate.of(2027, 1, 11)));
        assertThat(conditions.getValue()).isEqualTo(new Conditions(25.5, Darkness.NAUTICAL, 40.0, 0.5, 1.8));
        assertThat(body).isEqualTo("{\"windows\":["
                + "{\"night\":\"2027-01-10\",\"start\":\"2027-01-10T19:00:00Z\",\"end\":\"2027-01-11T01:30:00Z\",\"maxAltitude\":52.44},"
                + "{\"night\":\"2027-01-11\",\"start\":\"2027-01-11T18:56:00Z\",\"end\":\"2027-01-12T01:26:00Z\",\"maxAltitude\":52.45}]}");
    }

    @Test
    void visibilityAcceptsExactlyAYearOfNightsAndTheRangeEnds() throws Exception {
        when(sky.windows(any(), any(), any(), any(), any())).thenReturn(List.of());
        // 2028 is a leap year: 2028-01-01 .. 2028-12-31 is 366 nights.
        mvc.perform(get("/api/visibility?ra=360&dec=90&lat=-90&lon=180&elevation=-500&from=2028-01-01&to=2028-12-31"
                        + "&minAltitude=-1&minMoonSeparation=180&maxMoonIllumination=0&maxAirmass=10&darkness=CIVIL"))
                .andExpect(status().isOk());
        verify(sky).windows(new Observer(-90, 180, -500, null), new Target(0, 90),
                new Conditions(-1, Darkness.CIVIL, 180.0, 0.0, 10.0), LocalDate.of(2028, 1, 1), LocalDate.of(2028, 12, 31));
    }

    @ParameterizedTest(name = "almanac with {0}={1}: {2}")
    @CsvSource(delimiter = '|', textBlock = """
            lat       | 90.0001      | must be between -90 and 90
            lat       | -91          | must be between -90 and 90
            lat       | NaN          | must be a decimal number
            lat       | north        | must be a decimal number
            lon       | 180.5        | must be between -180 and 180
            lon       | Infinity     | must be a decimal number
            lon       | -Infinity    | must be a decimal number
            lon       | 0x1p3        | must be a decimal number
            elevation | 9001         | must be between -500 and 9000
            elevation | -501         | must be between -500 and 9000
            elevation | 12m          | must be a decimal number
            date      | 2027-13-01   | must be a date as YYYY-MM-DD
            date      | 2027-02-29   | must be a date as YYYY-MM-DD
            date      | 01/06/2027   | must be a date as YYYY-MM-DD
            date      | 1500-01-01   | must be between 1900-01-01 and 2200-12-31
            date      | 1899-12-31   | must be between 1900-01-01 and 2200-12-31
            date      | 2201-01-01   | must be between 1900-01-01 and 2200-12-31
            date      | +10000-01-01 | must be between 1900-01-01 and 2200-12-31
            tz        | Mars/Olympus | must be an IANA time-zone region
            tz        | Europe/Nowhere | must be an IANA time-zone region
            tz        | GMT+5        | must be an IANA time-zone region
            tz        | UTC+02:00    | must be an IANA time-zone region
            tz        | +05:00       | must be an IANA time-zone region
            tz        | Z            | must be an IANA time-zone region
            tz        | europe/madrid | must be an IANA time-zone region
            """)
    void almanacRejectsABadValueNamingTheParameter(String name, String value, String message) throws Exception {
        String query = replace("lat=37.2&lon=-3.6&elevation=680&date=2027-06-01&tz=Europe/Madrid", name, value);
        expectProblem("/api/almanac?" + query, name, message);
    }

    @ParameterizedTest(name = "almanac without {0}")
    @CsvSource({"lat", "lon", "date"})
    void almanacRequiresItsParameters(String name) throws Exception {
        String query = replace("lat=37.2&lon=-3.6&date=2027-06-01", name, null);
        expectProblem("/api/almanac?" + query, name, "is required");
        // An empty value counts as missing.
        expectProblem("/api/almanac?" + query + "&" + name + "=", name, "is required");
    }

    @ParameterizedTest(name = "visibility with {0}={1}: {2}")
    @CsvSource(delimiter = '|', textBlock = """
            ra                  | 360.01     | must be between 0 and 360
            ra                  | -0.1       | must be between 0 and 360
            ra                  | 5h35m      | must be a decimal number
            dec                 | 90.5       | must be between -90 and 90
            dec                 | NaN        | must be a decimal number
            lat                 | 100        | must be between -90 and 90
            lon                 | -181       | must be between -180 and 180
            elevation           | 9500       | must be between -500 and 9000
            from                | 2027-1-10  | must be a date as YYYY-MM-DD
            to                  | tomorrow   | must be a date as YYYY-MM-DD
            minAltitude         | -1.5       | must be between -1 and 89
            minAltitude         | 89.5       | must be between -1 and 89
            minAltitude         | Infinity   | must be a decimal number
            darkness            | dark       | must be one of civil, nautical, astronomical
            minMoonSeparation   | 181        | must be between 0 and 180
            minMoonSeparation   | -1         | must be between 0 and 180
            maxMoonIllumination | 1.01       | must be between 0 and 1
            maxMoonIllumination | -0.01      | must be between 0 and 1
            maxMoonIllumination | half       | must be a decimal number
            tz                  | Nowhere    | must be an IANA time-zone region
            tz                  | GMT-3      | must be an IANA time-zone region
            from                | 1899-12-31 | must be between 1900-01-01 and 2200-12-31
            to                  | 0000-01-01 | must be between 1900-01-01 and 2200-12-31
            maxAirmass          | 0.99       | must be between 1 and 10
            maxAirmass          | 10.5       | must be between 1 and 10
            maxAirmass          | NaN        | must be a decimal number
            """)
    void visibilityRejectsABadValueNamingTheParameter(String name, String value, String message) throws Exception {
        String query = replace(TARGET + "&" + SITE + "&from=2027-01-10&to=2027-01-12&minAltitude=30&darkness=astronomical"
                + "&minMoonSeparation=30&maxMoonIllumination=0.9", name, value);
        expectProblem("/api/visibility?" + query, name, message);
    }

    @ParameterizedTest(name = "visibility without {0}")
    @CsvSource({"ra", "dec", "lat", "lon", "from", "to"})
    void visibilityRequiresItsParameters(String name) throws Exception {
        String query = replace(TARGET + "&lat=37.2&lon=-3.6&from=2027-01-10&to=2027-01-12", name, null);
        expectProblem("/api/visibility?" + query, name, "is required");
    }

    @Test
    void visibilityRejectsAnEndBeforeTheStart() throws Exception {
        expectProblem("/api/visibility?" + TARGET + "&" + SITE + "&from=2027-01-10&to=2027-01-09", "to", "must not be before from");
    }

    @Test
    void visibilityRejectsMoreThanAYearOfNights() throws Exception {
        // 2027-01-01 .. 2028-01-01 is 366 nights and allowed; one more is not.
        expectProblem("/api/visibility?" + TARGET + "&" + SITE + "&from=2027-01-01&to=2028-01-02", "to", "may be at most 366 nights");
        when(sky.windows(any(), any(), any(), any(), any())).thenReturn(List.of());
        mvc.perform(get("/api/visibility?" + TARGET + "&" + SITE + "&from=2027-01-01&to=2028-01-01")).andExpect(status().isOk());
    }

    @Test
    void aStoredSiteIsNamedByItsIdAloneAndMustExist() throws Exception {
        String range = "&from=2027-01-10&to=2027-01-12";
        expectProblem("/api/visibility?" + TARGET + range + "&siteId=hill", "siteId", "must be the id of a stored site");
        expectProblem("/api/visibility?" + TARGET + range + "&siteId=12", "siteId", "names no stored site: 12");
        expectProblem("/api/visibility?" + TARGET + range + "&siteId=12&lat=37.2", "lat", "must not be given with siteId");
        expectProblem("/api/visibility?" + TARGET + range + "&siteId=12&tz=Europe/Madrid", "tz", "must not be given with siteId");
        verify(storedSky, org.mockito.Mockito.times(3)).site(12);
    }

    @Test
    void everyBadParameterIsListedAtOnce() throws Exception {
        mvc.perform(get("/api/visibility?ra=400&dec=x&lat=37&lon=-3&from=2027-01-10&to=2027-01-12&darkness=bright"))
                .andExpect(status().isBadRequest())
                .andExpect(jsonPath("$.parameter").value("ra"))
                .andExpect(jsonPath("$.errors.length()").value(3))
                .andExpect(jsonPath("$.errors[*].field").value(hasItem("dec")))
                .andExpect(jsonPath("$.errors[*].field").value(hasItem("darkness")));
        verifyNoInteractions(sky);
    }

    private void expectProblem(String uri, String parameter, String message) throws Exception {
        mvc.perform(get(uri))
                .andExpect(status().isBadRequest())
                .andExpect(content().contentType(MediaType.APPLICATION_PROBLEM_JSON))
                .andExpect(jsonPath("$.type").value("urn:skyrota:problem:invalid-parameters"))
                .andExpect(jsonPath("$.title").value("Invalid request parameters"))
                .andExpect(jsonPath("$.status").value(400))
                .andExpect(jsonPath("$.detail").value(containsString(parameter + " " + message)))
                .andExpect(jsonPath("$.parameter").value(parameter))
                .andExpect(jsonPath("$.errors[0].field").value(parameter))
                .andExpect(jsonPath("$.errors[0].message").value(containsString(message)));
        verifyNoInteractions(sky);
    }

    /** The query with {@code name} set to {@code value}, or removed when value is null. */
    private static String replace(String query, String name, String value) {
        StringBuilder out = new StringBuilder();
        boolean seen = false;
        for (String pair : query.split("&")) {
            String key = pair.substring(0, pair.indexOf('='));
            if (key.equals(name)) {
                seen = true;
                if (value == null) {
                    continue;
                }
                pair = name + "=" + value;
            }
            out.append(out.length() == 0 ? "" : "&").append(pair);
        }
        if (!seen && value != null) {
            out.append('&').append(name).append('=').append(value);
        }
        return out.toString();
    }

    private static NightEvents emptyNight(LocalDate night) {
        return new NightEvents(night, Optional.empty(), Optional.empty(), Optional.empty(), Optional.empty(), Optional.empty(),
                Optional.empty(), Optional.empty(), Optional.empty(), Optional.empty(), Optional.empty(), 0);
    }
}
