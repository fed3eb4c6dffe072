package org.skyrota.web.support;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.List;

/**
 * An invented test network, made through the API: one site at 45° N with one telescope and a camera, one program
 * with a grant, and accepted requests for January 2027 evenings. Targets' coordinates are approximate values
 * recalled from memory (catalogue numbers), good enough to be up in a January evening at 45° N; one target far south
 * of the site's sky never rises there (the celestial pole's altitude equals the latitude: common practice, no source).
 */
public final class PlanningNetwork {

    public static final String FIRST_NIGHT = "2027-01-10";
    public static final String LAST_NIGHT = "2027-01-11";

    public long siteId;
    public long telescopeId;
    public long programId;
    public final List<Long> requestIds = new ArrayList<>();
    public long neverRisesId;
    public long studentRequestId;

    /** Makes the network as {@code coordinator}; the requests belong to {@code student} and {@code other}. */
    public static PlanningNetwork create(ApiClient api, String coordinator, String student, String other, String tag) {
        PlanningNetwork n = new PlanningNetwork();
        n.siteId = created(api.post("/api/sites", coordinator, "{\"name\":\"Test hill " + tag + "\",\"latitudeDeg\":45,"
                + "\"longitudeDeg\":7,\"elevationM\":500,\"timeZone\":\"Europe/Rome\",\"darkSkyZenithVMag\":21.5}"));
        n.telescopeId = created(api.post("/api/telescopes", coordinator, "{\"siteId\":" + n.siteId + ",\"name\":\"T40 "
                + tag + "\",\"apertureMm\":400,\"minAltitudeDeg\":15,\"slewRateDegPerS\":4,\"settleSeconds\":10,\"active\":true}"));
        created(api.post("/api/instruments", coordinator, "{\"telescopeId\":" + n.telescopeId + ",\"name\":\"CCD " + tag
                + "\",\"readoutSeconds\":5,\"filterChangeSeconds\":10,\"certifiedSolarFilter\":false,\"filters\":[\"B\",\"V\",\"R\"]}"));
        n.programId = created(api.post("/api/programs", coordinator, "{\"code\":\"P" + tag + "\",\"title\":\"Test program\","
                + "\"principalInvestigator\":\"Dr. Test\",\"active\":true,\"grants\":[{\"telescopeId\":" + n.telescopeId
                + ",\"hours\":40,\"firstNight\":\"2027-01-01\",\"lastNight\":\"2027-01-31\"}]}"));
        // name, RA deg, Dec deg (approximate)
        Object[][] targets = {
                {"NGC 1952", 83.6, 22.0}, {"M45", 56.9, 24.1}, {"NGC 2168", 92.2, 24.3}, {"NGC 2244", 98.0, 4.9},
                {"NGC 1912", 82.2, 35.8}, {"NGC 2632", 130.1, 19.7}};
        for (int i = 0; i < targets.length; i++) {
            String owner = i % 2 == 0 ? ApiClientUser.name(student) : ApiClientUser.name(other);
            long id = accepted(api, coordinator, n.programId, owner, (String) targets[i][0], (double) targets[i][1],
                    (double) targets[i][2], i == 0 ? 2 : 1);
            n.requestIds.add(id);
            if (i == 0) {
                n.studentRequestId = id;
            }
        }
        n.neverRisesId = accepted(api, coordinator, n.programId, ApiClientUser.name(student), "NGC 2070", 84.7, -69.1, 1);
        n.requestIds.add(n.neverRisesId);
        return n;
    }

    private static long accepted(ApiClient api, String coordinator, long programId, String owner, String target,
                                 double ra, double dec, int repeats) {
        long id = created(api.post("/api/requests", coordinator, "{\"programId\":" + programId + ",\"owner\":\"" + owner
                + "\",\"targetName\":\"" + target + "\",\"ra\":" + ra + ",\"dec\":" + dec
                + ",\"exposures\":[{\"filter\":\"V\",\"seconds\":60,\"count\":5}],\"minAltitudeDeg\":30,"
                + "\"earliestNight\":\"" + FIRST_NIGHT + "\",\"latestNight\":\"" + LAST_NIGHT + "\",\"repeats\":" + repeats
                + (repeats > 1 ? ",\"repeatIntervalHours\":24,\"repeatToleranceHours\":4" : "") + ",\"priority\":2}"));
        ApiClient.Answer s = api.post("/api/requests/" + id + "/submit?version=0", coordinator, null);
        assertThat(s.status()).as(s.body()).isEqualTo(200);
        ApiClient.Answer a = api.post("/api/requests/" + id + "/accept?version=" + s.id("$.version"), coordinator, null);
        assertThat(a.status()).as(a.body()).isEqualTo(200);
        return id;
    }

    private static long created(ApiClient.Answer a) {
        assertThat(a.status()).as(a.body()).isEqualTo(201);
        return a.id("$.id");
    }

    /** Reads the user name back out of a Basic credential. */
    static final class ApiClientUser {
        static String name(String basic) {
            String decoded = new String(java.util.Base64.getDecoder().decode(basic.substring(6)), java.nio.charset.StandardCharsets.UTF_8);
            return decoded.substring(0, decoded.indexOf(':'));
        }
    }
}
