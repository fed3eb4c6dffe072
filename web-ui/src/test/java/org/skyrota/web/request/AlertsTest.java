package org.skyrota.web.request;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.TimeUnit;

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
import org.springframework.test.context.TestPropertySource;

/**
 * VOEvent alerts as a term meets them: a packet sent again (by a broker that reconnects, or by two brokers at once)
 * makes one request; a packet with an impossible event time stores nothing; a server without the program the alerts
 * go to says so as its own fault; and the answer says in plain words why no re-plan started. The packets are
 * invented, written to the VOEvent 2.0 schema (IVOA Recommendation "Sky Event Reporting Metadata Version 2.0", 2011);
 * each test uses IVORNs and nights of its own, so that the tests do not depend on their order.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = {"skyrota.test.context=alerts", "skyrota.alerts.replan-seconds=2"})
class AlertsTest {

    static final String COORD = ApiClient.basic("alertcoord", "password1");
    static final String STUDENT = ApiClient.basic("alertstudent", "password1");
    static final String OTHER = ApiClient.basic("alertother", "password1");

    @LocalServerPort int port;
    @Autowired AccountRepository accounts;
    @Autowired PasswordEncoder encoder;
    @Autowired ObservingRequestRepository requests;

    ApiClient api;
    static long tooProgramId;
    static long telescopeId;

    @BeforeEach
    void setUp() {
        api = new ApiClient(port);
        if (accounts.findByUsername("alertcoord").isEmpty()) {
            accounts.save(new Account("alertcoord", encoder.encode("password1"), Role.COORDINATOR));
            accounts.save(new Account("alertstudent", encoder.encode("password1"), Role.REQUESTER));
            accounts.save(new Account("alertother", encoder.encode("password1"), Role.REQUESTER));
            telescopeId = PlanningNetwork.create(api, COORD, STUDENT, OTHER, "A").telescopeId;
            // The program the alerts go to: the setting skyrota.voevent.program names it, by default by this title.
            Answer too = api.post("/api/programs", COORD, "{\"code\":\"TOO-A\",\"title\":\"Target of opportunity\","
                    + "\"principalInvestigator\":\"Dr. Alert\",\"active\":true,\"grants\":[{\"telescopeId\":" + telescopeId
                    + ",\"hours\":10,\"firstNight\":\"2027-01-01\",\"lastNight\":\"2027-01-31\"}]}");
            assertThat(too.status()).as(too.body()).isEqualTo(201);
            tooProgramId = too.id("$.id");
        }
    }

    /** A packet about an event at {@code isoTime} (UTC), at an approximate position up on January evenings at 45° N. */
    static String packet(String ivorn, String isoTime, double ra) {
        return """
                <?xml version="1.0" encoding="UTF-8"?>
                <voe:VOEvent xmlns:voe="http://www.ivoa.net/xml/VOEvent/v2.0" version="2.0" role="observation"
                             ivorn="%s">
                  <Who><AuthorIVORN>ivo://skyrota.test/alerts</AuthorIVORN><Date>2027-01-01T00:00:00</Date></Who>
                  <WhereWhen><ObsDataLocation><ObservatoryLocation id="GEOLUN"/><ObservationLocation>
                    <AstroCoordSystem id="UTC-FK5-GEO"/>
                    <AstroCoords coord_system_id="UTC-FK5-GEO">
                      <Time unit="s"><TimeInstant><ISOTime>%s</ISOTime></TimeInstant></Time>
                      <Position2D unit="deg"><Name1>RA</Name1><Name2>Dec</Name2>
                        <Value2><C1>%s</C1><C2>21.5</C2></Value2><Error2Radius>0.01</Error2Radius></Position2D>
                    </AstroCoords>
                  </ObservationLocation></ObsDataLocation></WhereWhen>
                  <Why importance="0.5"><Inference probability="0.8"><Name>SKY-T %s</Name></Inference></Why>
                </voe:VOEvent>
                """.formatted(ivorn, isoTime, ra, ivorn.substring(ivorn.indexOf('#') + 1));
    }

    Answer alert(String packet) {
        return api.send("POST", "/api/alerts", COORD, packet, "application/xml");
    }

    long storedRequests() {
        return ((Number) api.get("/api/requests?size=1", COORD).json("$.totalItems")).longValue();
    }

    void awaitRun(Answer alert) {
        if (alert.<Object>json("$.run") != null) {
            api.awaitRunEnd(alert.id("$.run.id"), COORD, Duration.ofSeconds(240));
        }
    }

    @Test
    void aPacketSentAgainAnswersTheRequestItMadeAndStartsNoRun() {
        String ivorn = "ivo://skyrota.test/alerts#again-1";
        long before = storedRequests();
        Answer first = alert(packet(ivorn, "2027-01-13T19:00:00", 84.0));
        assertThat(first.status()).as(first.body()).isEqualTo(201);
        long id = first.id("$.request.id");
        assertThat((String) first.json("$.request.alertIvorn")).isEqualTo(ivorn);
        assertThat(first.<Object>json("$.run")).as(first.body()).isNotNull();
        awaitRun(first);

        // The same IVORN is the same packet (VOEvent 2.0: a new packet about an event has an IVORN of its own), so
        // what it says is not read again: the stored request is answered as it is, even if the text differs.
        Answer again = alert(packet(ivorn, "2027-01-13T19:00:00", 85.5));
        assertThat(again.status()).as(again.body()).isEqualTo(200);
        assertThat(again.id("$.request.id")).isEqualTo(id);
        assertThat(((Number) again.json("$.request.raDeg")).doubleValue()).isEqualTo(84.0);
        assertThat((String) again.json("$.request.state")).isEqualTo("accepted");
        assertThat(again.<Object>json("$.run")).as("no new run").isNull();
        assertThat((String) again.json("$.runProblem")).as(again.body())
                .contains("already received").contains("request " + id).contains("no new run");
        assertThat(storedRequests()).isEqualTo(before + 1);

        // The repeat is in the audit log, after the request's creation and acceptance.
        Answer audit = api.get("/api/audit?entityType=request&entityId=" + id, COORD);
        assertThat(audit.status()).as(audit.body()).isEqualTo(200);
        assertThat(audit.<List<String>>json("$.items[*].action"))
                .containsExactly("alert:repeated", "state:accepted", "state:submitted", "create");
        assertThat((String) audit.json("$.items[0].actor")).isEqualTo("alertcoord");

        // The queue lists the alert's request exactly as it reads alone, IVORN included.
        Answer alone = api.get("/api/requests/" + id, COORD);
        Answer listed = api.get("/api/requests?size=500&target=SKY-T%20again-1", COORD);
        assertThat(listed.<List<Object>>json("$.items")).singleElement().isEqualTo(alone.json("$"));
    }

    @Test
    void packetsWithOneIvornArrivingTogetherMakeOneRequest() throws Exception {
        String ivorn = "ivo://skyrota.test/alerts#together-1";
        String packet = packet(ivorn, "2027-01-16T19:00:00", 84.0);
        long before = storedRequests();
        int senders = 6;
        CountDownLatch ready = new CountDownLatch(senders);
        CountDownLatch go = new CountDownLatch(1);
        ExecutorService pool = Executors.newFixedThreadPool(senders);
        List<Future<Answer>> answers = new ArrayList<>();
        try {
            for (int i = 0; i < senders; i++) {
                answers.add(pool.submit(() -> {
                    ready.countDown();
                    go.await();
                    return alert(packet);
                }));
            }
            assertThat(ready.await(30, TimeUnit.SECONDS)).isTrue();
            go.countDown();
            List<Integer> statuses = new ArrayList<>();
            List<Long> ids = new ArrayList<>();
            for (Future<Answer> f : answers) {
                Answer a = f.get(120, TimeUnit.SECONDS);
                statuses.add(a.status());
                assertThat(a.status()).as(a.body()).isIn(200, 201);
                ids.add(a.id("$.request.id"));
                if (a.status() == 201) {
                    awaitRun(a);
                }
            }
            assertThat(statuses).as("one packet makes the request, the others find it").containsOnlyOnce(201);
            assertThat(ids).containsOnly(ids.get(0));
        } finally {
            pool.shutdownNow();
        }
        assertThat(storedRequests()).isEqualTo(before + 1);
        assertThat(requests.findAll()).filteredOn(r -> ivorn.equals(r.getAlertIvorn())).hasSize(1);
    }

    @Test
    void anEventTimeOutsideTheYearsPlannedStoresNothing() {
        long before = storedRequests();
        // Refused by the packet's reader: year 1 (which once came back from storage with its nights out of order).
        Answer year1 = alert(packet("ivo://skyrota.test/alerts#year-1", "0001-01-01T00:00:00", 84.0));
        assertThat(year1.status()).as(year1.body()).isEqualTo(400);
        assertThat(year1.contentType()).startsWith("application/problem+json");
        assertThat((String) year1.json("$.parameter")).isEqualTo("ISOTime");
        // Inside the years the reader takes, but the nights the request would span are not: the morning of
        // 1900-01-01 belongs to the night of 1899-12-31, and an event on the last evening of 2200 opens nights into
        // 2201. The element named is still the one the sender wrote.
        for (String time : List.of("1900-01-01T06:00:00", "2200-12-31T20:00:00")) {
            Answer edge = alert(packet("ivo://skyrota.test/alerts#edge-" + time.substring(0, 4), time, 84.0));
            assertThat(edge.status()).as(edge.body()).isEqualTo(400);
            assertThat((String) edge.json("$.parameter")).as(edge.body()).isEqualTo("ISOTime");
            assertThat((String) edge.json("$.errors[0].message")).contains("1900-01-01").contains("2200-12-31");
        }
        // A file of requests may not carry such nights either; the record and the column are named.
        String csv = "title,target,ra,dec,filter_plan,priority,program,earliest_night,latest_night\n"
                + "Year zero,NGC 2392,112.3,20.9,V:60x3,3,PA,0000-12-31,0001-01-02\n";
        Answer file = api.send("POST", "/api/requests/import", COORD, csv, "text/csv");
        assertThat(file.status()).as(file.body()).isEqualTo(400);
        assertThat(file.<List<String>>json("$.errors[*].field")).contains("record 1: earliestNight", "record 1: latestNight");
        assertThat(storedRequests()).isEqualTo(before);
        assertThat(requests.findAll()).allSatisfy(r -> {
            if (r.getEarliestNight() != null && r.getLatestNight() != null) {
                assertThat(r.getLatestNight()).as("request %d", r.getId()).isAfterOrEqualTo(r.getEarliestNight());
            }
        });
    }

    @Test
    void withoutTheProgramTheSettingNamesTheServerSaysSoAndHowToFixIt() {
        Answer program = api.get("/api/programs/" + tooProgramId, COORD);
        String renamed = program.body().replace("\"TOO-A\"", "\"TOO-RENAMED\"")
                .replace("\"Target of opportunity\"", "\"Renamed for this test\"");
        Answer away = api.put("/api/programs/" + tooProgramId, COORD, renamed);
        assertThat(away.status()).as(away.body()).isEqualTo(200);
        try {
            long before = storedRequests();
            Answer refused = alert(packet("ivo://skyrota.test/alerts#no-program-1", "2027-01-18T19:00:00", 84.0));
            assertThat(refused.status()).as(refused.body()).isEqualTo(409);
            assertThat(refused.contentType()).startsWith("application/problem+json");
            assertThat((String) refused.json("$.detail")).contains("skyrota.voevent.program")
                    .contains("\"Target of opportunity\"").contains("code or title");
            // The packet was fine: no field of it, and none the sender never sent, is blamed.
            assertThat(refused.body()).doesNotContain("\"parameter\"").doesNotContain("\"errors\"");
            assertThat(storedRequests()).isEqualTo(before);
        } finally {
            Answer now = api.get("/api/programs/" + tooProgramId, COORD);
            Answer back = api.put("/api/programs/" + tooProgramId, COORD, now.body().replace("\"TOO-RENAMED\"", "\"TOO-A\"")
                    .replace("\"Renamed for this test\"", "\"Target of opportunity\""));
            assertThat(back.status()).as(back.body()).isEqualTo(200);
        }
    }

    @Test
    void whyNoReplanStartedIsSaidInPlainWords() {
        // Another run over overlapping nights holds them: the test network's nights, whose requests keep it busy.
        Answer busy = api.post("/api/planner/runs", COORD,
                "{\"firstNight\":\"2027-01-10\",\"lastNight\":\"2027-01-12\",\"seconds\":120}");
        assertThat(busy.status()).as(busy.body()).isEqualTo(202);
        long busyRun = busy.id("$.id");
        try {
            Answer alert = alert(packet("ivo://skyrota.test/alerts#busy-1", "2027-01-11T19:00:00", 84.0));
            assertThat(alert.status()).as(alert.body()).isEqualTo(201);
            assertThat(alert.<Object>json("$.run")).isNull();
            assertThat((String) alert.json("$.runProblem")).as(alert.body())
                    .isEqualTo("No re-plan was started: run " + busyRun + " is already planning the nights 2027-01-10 to"
                            + " 2027-01-12, which overlap this alert's nights (2027-01-11 to 2027-01-13). The request is"
                            + " stored and accepted; the next run over its nights will plan it.");
        } finally {
            api.delete("/api/planner/runs/" + busyRun, COORD);
        }

        // An event whose nights are over everywhere (the server's clock reads 2026-12-01) is stored, as it was
        // reported, but not planned: the past is not planned.
        Answer old = alert(packet("ivo://skyrota.test/alerts#old-1", "2026-06-01T22:00:00", 84.0));
        assertThat(old.status()).as(old.body()).isEqualTo(201);
        assertThat(old.<Object>json("$.run")).isNull();
        assertThat((String) old.json("$.runProblem")).isEqualTo("No re-plan was started: this alert's nights"
                + " (2026-06-01 to 2026-06-03) are over at every site.");
    }
}
