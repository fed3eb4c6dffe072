package org.skyrota.web.request;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.List;
import java.util.Map;

import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.skyrota.web.account.Account;
import org.skyrota.web.account.AccountRepository;
import org.skyrota.web.account.Role;
import org.skyrota.web.support.ApiClient;
import org.skyrota.web.support.ApiClient.Answer;
import org.skyrota.web.support.PlanningNetwork;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.security.crypto.password.PasswordEncoder;
import org.springframework.test.context.DynamicPropertyRegistry;
import org.springframework.test.context.DynamicPropertySource;
import org.springframework.test.context.TestPropertySource;

/**
 * The server's use of the bundled importer, alert and conditions plugins: a CSV file of requests stored whole or not
 * at all; a VOEvent 2.0 packet becoming an accepted, time-critical request and a re-plan of its nights; a conditions
 * file closing a night before the planner runs. Targets and coordinates are invented or approximate demo values.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = "skyrota.test.context=imports-alerts-conditions")
class ImportsAlertsAndConditionsTest {

    static final String COORD = ApiClient.basic("impcoord", "password1");
    static final String STUDENT = ApiClient.basic("impstudent", "password1");
    static final String OTHER = ApiClient.basic("impother", "password1");
    static final String CLOSED_NIGHT = "2027-01-11";

    static Path conditionsFile;

    @DynamicPropertySource
    static void conditions(DynamicPropertyRegistry registry) throws IOException {
        conditionsFile = Files.createTempFile("skyrota-conditions", ".csv");
        Files.writeString(conditionsFile, "site,telescope,night,closed,cloud_fraction,reason\n"
                + "Test hill I,," + CLOSED_NIGHT + ",yes,,dome maintenance\n"
                + "Nowhere ridge,,2027-01-10,yes,,storm\n"
                + "Test hill I,,2027-01-12,no,0.3,thin cloud\n", StandardCharsets.UTF_8);
        registry.add("skyrota.conditions.file", conditionsFile::toString);
    }

    @AfterAll
    static void forgetTheConditionsFile() throws IOException {
        // The bundled feed reads a system property; later test contexts in this JVM must not inherit it.
        System.clearProperty("skyrota.conditions.file");
        Files.deleteIfExists(conditionsFile);
    }

    @LocalServerPort int port;
    @Autowired AccountRepository accounts;
    @Autowired PasswordEncoder encoder;

    ApiClient api;
    static PlanningNetwork network;
    static long tooProgramId;

    @BeforeEach
    void setUp() {
        api = new ApiClient(port);
        if (accounts.findByUsername("impcoord").isEmpty()) {
            accounts.save(new Account("impcoord", encoder.encode("password1"), Role.COORDINATOR));
            accounts.save(new Account("impstudent", encoder.encode("password1"), Role.REQUESTER));
            accounts.save(new Account("impother", encoder.encode("password1"), Role.REQUESTER));
            network = PlanningNetwork.create(api, COORD, STUDENT, OTHER, "I");
            Answer too = api.post("/api/programs", COORD, "{\"code\":\"TOO\",\"title\":\"Target of opportunity\","
                    + "\"principalInvestigator\":\"Dr. Alert\",\"active\":true,\"grants\":[{\"telescopeId\":" + network.telescopeId
                    + ",\"hours\":10,\"firstNight\":\"2027-01-01\",\"lastNight\":\"2027-01-31\"}]}");
            assertThat(too.status()).as(too.body()).isEqualTo(201);
            tooProgramId = too.id("$.id");
        }
    }

    long storedRequests() {
        return ((Number) api.get("/api/requests?size=1", COORD).json("$.totalItems")).longValue();
    }

    @Test
    void aCsvFileOfRequestsIsStoredWholeAsDraftsOfTheImporter() {
        long before = storedRequests();
        String csv = "title,target,ra,dec,filter_plan,priority,program,earliest_night,latest_night\n"
                + "Planetary nebula,NGC 2392,07:29:10.8,+20:54:42,V:60x3,3,PI,2027-01-10,2027-01-11\n"
                + "Cone cluster,NGC 2264,100.24,9.9,B:30x2;V:30x2,2,Test program,,\n";
        Answer ok = api.send("POST", "/api/requests/import", STUDENT, csv, "text/csv; charset=UTF-8");
        assertThat(ok.status()).as(ok.body()).isEqualTo(201);
        assertThat((Integer) ok.json("$.imported")).isEqualTo(2);
        assertThat(ok.<List<String>>json("$.requests[*].owner")).containsExactly("impstudent", "impstudent");
        assertThat(ok.<List<String>>json("$.requests[*].state")).containsExactly("draft", "draft");
        assertThat(ok.<List<String>>json("$.requests[*].targetName")).containsExactly("NGC 2392", "NGC 2264");
        // 07h29m10.8s = 112.295°: sexagesimal hours to degrees (x15), common practice.
        assertThat(((Number) ok.json("$.requests[0].raDeg")).doubleValue()).isCloseTo(112.295, org.assertj.core.data.Offset.offset(1e-9));
        assertThat(storedRequests()).isEqualTo(before + 2);
    }

    /**
     * Seen before: a coordinator's import could name an owner with no account. The server's checks hold an imported
     * record as they hold a form: owners, nights within 1900..2200, and the airmass limit stored.
     */
    @Test
    void importedRecordsAreHeldToTheFormsRulesAndKeepTheirAirmassLimit() {
        long before = storedRequests();
        String bad = "title,target,ra,dec,filter_plan,priority,program,owner,earliest_night,max_airmass\n"
                + "Fine,NGC 2392,112.3,20.9,V:60x3,3,PI,impstudent,2027-01-10,1.3\n"
                + "Nobody's,NGC 2264,100.2,9.9,V:60x3,3,PI,nobody-at-all,2027-01-10,\n"
                + "Too early,NGC 2264,100.2,9.9,V:60x3,3,PI,impstudent,1800-01-01,\n";
        Answer refused = api.send("POST", "/api/requests/import", COORD, bad, "text/csv");
        assertThat(refused.status()).as(refused.body()).isEqualTo(400);
        assertThat(refused.<List<String>>json("$.errors[*].field")).containsExactly("record 2: owner", "record 3: earliestNight");
        assertThat(storedRequests()).isEqualTo(before);
        String good = bad.substring(0, bad.indexOf("Nobody's"));
        Answer ok = api.send("POST", "/api/requests/import", COORD, good, "text/csv");
        assertThat(ok.status()).as(ok.body()).isEqualTo(201);
        assertThat(((Number) ok.json("$.requests[0].maxAirmass")).doubleValue()).isEqualTo(1.3);
        assertThat((String) ok.json("$.requests[0].owner")).isEqualTo("impstudent");
    }

    @Test
    void aFileWithAnyBadRowStoresNothingAndNamesEveryProblem() {
        long before = storedRequests();
        String badCell = "title,target,ra,dec,filter_plan,priority,program\n"
                + "Fine,NGC 2392,112.3,20.9,V:60x3,3,PI\n"
                + "Bad,NGC 2264,100.2,9.9,V:60x3,nine,PI\n";
        Answer refused = api.send("POST", "/api/requests/import", STUDENT, badCell, "text/csv");
        assertThat(refused.status()).as(refused.body()).isEqualTo(400);
        assertThat(refused.contentType()).startsWith("application/problem+json");
        assertThat((String) refused.json("$.parameter")).startsWith("line 3");
        // Rows the importer reads but the server refuses (a program that is not stored, a requester naming another
        // owner) also store nothing, and each is named by its record number.
        String badForServer = "title,target,ra,dec,filter_plan,priority,program,owner\n"
                + "Fine,NGC 2392,112.3,20.9,V:60x3,3,PI,\n"
                + "Unknown program,NGC 2264,100.2,9.9,V:60x3,3,NOPE,\n"
                + "Someone else's,NGC 2264,100.2,9.9,V:60x3,3,PI,impother\n";
        Answer second = api.send("POST", "/api/requests/import", STUDENT, badForServer, "text/csv");
        assertThat(second.status()).as(second.body()).isEqualTo(400);
        assertThat(second.<List<String>>json("$.errors[*].field")).containsExactly("record 2: program", "record 3: owner");
        assertThat(storedRequests()).isEqualTo(before);

        Answer unsupported = api.send("POST", "/api/requests/import", STUDENT, "{}", "application/json");
        assertThat(unsupported.status()).isEqualTo(415);
        assertThat(unsupported.contentType()).startsWith("application/problem+json");
        assertThat(storedRequests()).isEqualTo(before);
    }

    @Test
    void anAlertBecomesAnAcceptedTimeCriticalRequestAndItsNightsAreReplannedWithTheConditionsFeedsClosures() {
        // An invented VOEvent 2.0 packet (IVOA Recommendation, 2011): event on the evening of 2027-01-10, UTC, at an
        // approximate position that is up on January evenings at 45° N; importance 0.9.
        String packet = """
                <?xml version="1.0" encoding="UTF-8"?>
                <voe:VOEvent xmlns:voe="http://www.ivoa.net/xml/VOEvent/v2.0" version="2.0" role="observation"
                             ivorn="ivo://skyrota.test/alerts#server-1">
                  <Who><AuthorIVORN>ivo://skyrota.test/alerts</AuthorIVORN><Date>2027-01-10T20:05:00</Date></Who>
                  <WhereWhen><ObsDataLocation><ObservatoryLocation id="GEOLUN"/><ObservationLocation>
                    <AstroCoordSystem id="UTC-FK5-GEO"/>
                    <AstroCoords coord_system_id="UTC-FK5-GEO">
                      <Time unit="s"><TimeInstant><ISOTime>2027-01-10T20:00:00</ISOTime></TimeInstant></Time>
                      <Position2D unit="deg"><Name1>RA</Name1><Name2>Dec</Name2>
                        <Value2><C1>84.0</C1><C2>21.5</C2></Value2><Error2Radius>0.01</Error2Radius></Position2D>
                    </AstroCoords>
                  </ObservationLocation></ObsDataLocation></WhereWhen>
                  <Why importance="0.9"><Inference probability="0.8"><Name>SKY-T 27b</Name></Inference></Why>
                </voe:VOEvent>
                """;
        assertThat(api.send("POST", "/api/alerts", STUDENT, packet, "application/xml").status()).isEqualTo(403);
        long before = storedRequests();
        Answer malformed = api.send("POST", "/api/alerts", COORD, packet.replace("<C2>21.5</C2>", "<C2>north</C2>"), "application/xml");
        assertThat(malformed.status()).as(malformed.body()).isEqualTo(400);
        assertThat(malformed.contentType()).startsWith("application/problem+json");
        assertThat((String) malformed.json("$.detail")).isNotBlank();
        assertThat(storedRequests()).isEqualTo(before);

        Answer alert = api.send("POST", "/api/alerts", COORD, packet, "application/xml");
        assertThat(alert.status()).as(alert.body()).isEqualTo(201);
        assertThat((String) alert.json("$.request.state")).isEqualTo("accepted");
        assertThat(((Number) alert.json("$.request.programId")).longValue()).isEqualTo(tooProgramId);
        // Importance 0.9 lies in the top fifth: the highest priority (the plugin's five equal steps).
        assertThat((Integer) alert.json("$.request.priority")).isEqualTo(5);
        assertThat((String) alert.json("$.request.earliestNight")).isEqualTo("2027-01-10");
        long alertRequest = ((Number) alert.json("$.request.id")).longValue();
        assertThat(alert.<Object>json("$.run")).as(alert.body()).isNotNull();

        Answer run = api.awaitRunEnd(((Number) alert.json("$.run.id")).longValue(), COORD, Duration.ofSeconds(240));
        assertThat((String) run.json("$.state")).as(run.body()).isEqualTo("finished");
        assertThat((String) run.json("$.message")).contains("telescope nights closed by conditions feeds: 1")
                .contains("names no stored site Nowhere ridge");

        Answer draft = api.get("/api/plans/draft", COORD);
        List<Map<String, Object>> closed = draft.json("$.closedNights[?(@.telescopeId == " + network.telescopeId
                + " && @.night == '" + CLOSED_NIGHT + "')]");
        assertThat(closed).hasSize(1);
        assertThat(closed.get(0).get("state")).isEqualTo("closed");
        assertThat((String) closed.get(0).get("reason")).contains("dome maintenance");
        List<String> nightsOnTheClosedTelescope = draft.json("$.visits[?(@.telescopeId == " + network.telescopeId + ")].night");
        assertThat(nightsOnTheClosedTelescope).isNotEmpty().doesNotContain(CLOSED_NIGHT);
        // The alert, at the highest priority, is placed.
        assertThat(draft.<List<Object>>json("$.visits[?(@.requestId == " + alertRequest + ")]")).isNotEmpty();
    }
}
