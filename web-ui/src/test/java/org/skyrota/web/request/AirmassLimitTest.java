package org.skyrota.web.request;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.time.Duration;
import java.time.Instant;
import java.util.List;
import java.util.Map;

import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.skyrota.sky.coords.ApparentPlace;
import org.skyrota.sky.coords.Horizontal;
import org.skyrota.sky.time.SiderealTime;
import org.skyrota.sky.time.TimeScales;
import org.skyrota.web.account.Account;
import org.skyrota.web.account.AccountRepository;
import org.skyrota.web.account.Role;
import org.skyrota.web.support.ApiClient;
import org.skyrota.web.support.ApiClient.Answer;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.security.crypto.password.PasswordEncoder;
import org.springframework.test.context.TestPropertySource;

/**
 * A request's airmass limit reaches the observability preview, {@code /api/visibility} and the planner. The target
 * (NGC 1952, RA 83.6°, Dec +22.0°, approximate values recalled from memory) culminates at 67° at the test site (45° N,
 * 7° E) near local midnight in January 2027, well inside astronomical darkness, so that its windows under a 30°
 * minimum altitude are cut by the altitude alone, and under airmass 1.2 by the airmass alone.
 *
 * <p>The airmass is checked against Kasten and Young 1989 (Applied Optics 28, 4735), their formula written out here:
 * X = 1 / (sin h + 0.50572 (h + 6.07995°)^−1.6364), h the apparent altitude; X = 1.2 at h ≈ 56.38°. The altitude at a
 * window's edge is computed with sin h = sin φ sin δ + cos φ cos δ cos H (Meeus, Astronomical Algorithms, 2nd ed.,
 * eq. 13.6) from the engine's apparent place and sidereal time (each held to published values in the engine's own
 * tests), without refraction: at 56° refraction is under 0.7′, which changes the airmass by less than 0.0002, well
 * inside the 0.003 allowed here.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
// A context of its own: runs plan every stored site.
@TestPropertySource(properties = "skyrota.test.context=airmass-limit")
class AirmassLimitTest {

    static final String COORD = ApiClient.basic("amcoord", "password1");
    static final double LAT = 45;
    static final double LON = 7;
    static final double RA = 83.6;
    static final double DEC = 22.0;

    @LocalServerPort int port;
    @Autowired AccountRepository accounts;
    @Autowired PasswordEncoder encoder;

    ApiClient api;
    static long programId;
    static long siteId;

    @BeforeEach
    void network() {
        api = new ApiClient(port);
        if (accounts.findByUsername("amcoord").isPresent()) {
            return;
        }
        accounts.save(new Account("amcoord", encoder.encode("password1"), Role.COORDINATOR));
        siteId = created(api.post("/api/sites", COORD, "{\"name\":\"Airmass hill\",\"latitudeDeg\":" + LAT + ",\"longitudeDeg\":"
                + LON + ",\"elevationM\":500,\"timeZone\":\"Europe/Rome\"}"));
        long telescope = created(api.post("/api/telescopes", COORD, "{\"siteId\":" + siteId + ",\"name\":\"AM40\",\"apertureMm\":400,"
                + "\"minAltitudeDeg\":15,\"slewRateDegPerS\":4,\"settleSeconds\":10}"));
        created(api.post("/api/instruments", COORD, "{\"telescopeId\":" + telescope + ",\"name\":\"AMCCD\",\"readoutSeconds\":5,"
                + "\"filterChangeSeconds\":10,\"filters\":[\"V\"]}"));
        programId = created(api.post("/api/programs", COORD, "{\"code\":\"AM\",\"title\":\"Airmass\",\"principalInvestigator\":\"Dr. Test\","
                + "\"grants\":[{\"telescopeId\":" + telescope + ",\"hours\":40,\"firstNight\":\"2027-01-01\",\"lastNight\":\"2027-01-31\"}]}"));
    }

    long request(String name, String maxAirmass) {
        return created(api.post("/api/requests", COORD, "{\"programId\":" + programId + ",\"targetName\":\"" + name + "\",\"ra\":" + RA
                + ",\"dec\":" + DEC + ",\"exposures\":[{\"filter\":\"V\",\"seconds\":60,\"count\":5}],\"minAltitudeDeg\":30,"
                + (maxAirmass == null ? "" : "\"maxAirmass\":" + maxAirmass + ",")
                + "\"earliestNight\":\"2027-01-10\",\"latestNight\":\"2027-01-11\",\"priority\":3}"));
    }

    @Test
    void anAirmassLimitShortensTheWindowsToWhereTheAirmassIsAtMostTheLimit() {
        long free = request("NGC 1952 any airmass", null);
        long limited = request("NGC 1952 airmass 1.2", "1.2");
        List<Map<String, Object>> wide = windows(free);
        List<Map<String, Object>> narrow = windows(limited);
        assertThat(wide).hasSize(2);
        assertThat(narrow).hasSize(2);
        for (int i = 0; i < 2; i++) {
            Instant wideStart = Instant.parse((String) wide.get(i).get("start"));
            Instant wideEnd = Instant.parse((String) wide.get(i).get("end"));
            Instant start = Instant.parse((String) narrow.get(i).get("start"));
            Instant end = Instant.parse((String) narrow.get(i).get("end"));
            assertThat(start).isAfter(wideStart.plus(Duration.ofHours(1)));
            assertThat(end).isBefore(wideEnd.minus(Duration.ofHours(1)));
            // The edges lie where the airmass reaches the limit; without it the windows reach far thicker air.
            assertThat(kastenYoung(altitudeDeg(start))).as("airmass at " + start).isCloseTo(1.2, within(0.003));
            assertThat(kastenYoung(altitudeDeg(end))).as("airmass at " + end).isCloseTo(1.2, within(0.003));
            assertThat(kastenYoung(altitudeDeg(wideStart))).as("airmass at " + wideStart).isGreaterThan(1.5);
            assertThat(kastenYoung(altitudeDeg(wideEnd))).as("airmass at " + wideEnd).isGreaterThan(1.5);
        }
        // The compute endpoint answers the same windows for the same limit.
        Answer visibility = api.get("/api/visibility?ra=" + RA + "&dec=" + DEC + "&lat=" + LAT + "&lon=" + LON
                + "&elevation=500&tz=Europe/Rome&from=2027-01-10&to=2027-01-11&minAltitude=30&maxAirmass=1.2", null);
        assertThat(visibility.status()).as(visibility.body()).isEqualTo(200);
        assertThat(visibility.<List<String>>json("$.windows[*].start"))
                .containsExactlyElementsOf(narrow.stream().map(w -> (String) w.get("start")).toList());
    }

    @Test
    void thePlannerPlacesALimitedVisitOnlyWhereTheAirmassIsAtMostTheLimit() {
        long limited = request("NGC 1952 planned at airmass 1.1", "1.1");
        accept(limited);
        Answer started = api.post("/api/planner/runs", COORD, "{\"firstNight\":\"2027-01-10\",\"lastNight\":\"2027-01-11\","
                + "\"siteIds\":[" + siteId + "],\"seconds\":1}");
        assertThat(started.status()).as(started.body()).isEqualTo(202);
        Answer run = api.awaitRunEnd(started.id("$.id"), COORD, Duration.ofSeconds(180));
        assertThat((String) run.json("$.state")).as(run.body()).isEqualTo("finished");
        Answer draft = api.get("/api/plans/draft", COORD);
        List<Map<String, Object>> visits = draft.json("$.visits[?(@.requestId == " + limited + ")]");
        assertThat(visits).as(draft.body()).hasSize(1);
        Instant start = Instant.parse((String) visits.get(0).get("start"));
        Instant end = Instant.parse((String) visits.get(0).get("end"));
        // Airmass 1.1 is about 65.4° up; the target culminates at 67°, so only about an hour around the meridian fits.
        assertThat(kastenYoung(altitudeDeg(start))).as("airmass at the start " + start).isLessThanOrEqualTo(1.1 + 0.003);
        assertThat(kastenYoung(altitudeDeg(end))).as("airmass at the end " + end).isLessThanOrEqualTo(1.1 + 0.003);
    }

    private List<Map<String, Object>> windows(long requestId) {
        Answer a = api.get("/api/requests/" + requestId + "/observability", COORD);
        assertThat(a.status()).as(a.body()).isEqualTo(200);
        return a.json("$.sites[?(@.siteId == " + siteId + ")].windows[*]");
    }

    private void accept(long id) {
        assertThat(api.post("/api/requests/" + id + "/submit?version=0", COORD, null).status()).isEqualTo(200);
        assertThat(api.post("/api/requests/" + id + "/accept?version=1", COORD, null).status()).isEqualTo(200);
    }

    /** Kasten and Young 1989, Applied Optics 28, 4735: the relative optical airmass at apparent altitude h. */
    static double kastenYoung(double altitudeDeg) {
        return 1 / (Math.sin(Math.toRadians(altitudeDeg)) + 0.50572 * Math.pow(altitudeDeg + 6.07995, -1.6364));
    }

    /** Geometric altitude of the target at the site (Meeus eq. 13.6) from its apparent place of date. */
    static double altitudeDeg(Instant t) {
        double jdTt = TimeScales.jdTt(t);
        double[] place = new double[2];
        ApparentPlace.ofDate(Math.toRadians(RA), Math.toRadians(DEC), 0, 0, jdTt, place);
        double lst = SiderealTime.gastRad(TimeScales.jdUt1(t), jdTt) + Math.toRadians(LON);
        return Math.toDegrees(Horizontal.altitudeRad(lst - place[0], place[1], Math.toRadians(LAT)));
    }

    private static long created(Answer a) {
        assertThat(a.status()).as(a.body()).isEqualTo(201);
        return a.id("$.id");
    }
}
