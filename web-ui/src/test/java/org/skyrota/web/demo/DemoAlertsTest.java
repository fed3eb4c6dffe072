package org.skyrota.web.demo;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.Clock;
import java.time.Duration;
import java.time.LocalDate;
import java.util.List;

import org.junit.jupiter.api.Test;
import org.skyrota.web.program.Grant;
import org.skyrota.web.program.Program;
import org.skyrota.web.program.ProgramRepository;
import org.skyrota.web.support.ApiClient;
import org.skyrota.web.support.ApiClient.Answer;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.transaction.PlatformTransactionManager;
import org.springframework.transaction.support.TransactionTemplate;

/**
 * The demo takes alerts as it is: its target-of-opportunity program is the one the setting {@code skyrota.voevent.program}
 * names by default, with telescope time over the demo's term, so a packet becomes an accepted request and a re-plan.
 * The packet is invented, written to the VOEvent 2.0 schema (IVOA Recommendation, 2011).
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT, args = "--demo",
        properties = {"skyrota.test.context=demo-alerts", "skyrota.alerts.replan-seconds=2"})
class DemoAlertsTest {

    static final String COORD = ApiClient.basic("coordinator", DemoData.PASSWORD);

    @LocalServerPort int port;
    @Autowired ProgramRepository programs;
    @Autowired Clock clock;
    @Autowired PlatformTransactionManager transactions;

    @Test
    void anAlertBecomesAnAcceptedRequestOfTheDemosTargetOfOpportunityProgram() {
        LocalDate today = LocalDate.now(clock);
        Program too = new TransactionTemplate(transactions).execute(status -> {
            Program p = programs.findAll().stream().filter(x -> x.getCode().equals(DemoData.TOO_CODE)).findFirst().orElseThrow();
            p.getGrants().size(); // read inside the transaction
            return p;
        });
        assertThat(too.getTitle()).isEqualTo("Target of opportunity");
        // Some hours on more than one telescope, over the whole of the demo's term (30 nights back, 150 ahead).
        List<Grant> grants = too.getGrants();
        assertThat(grants).hasSizeGreaterThan(1).allSatisfy(g -> {
            assertThat(g.getHours()).isBetween(1.0, 24.0);
            assertThat(g.getFirstNight()).isBeforeOrEqualTo(today.minusDays(30));
            assertThat(g.getLastNight()).isAfterOrEqualTo(today.plusDays(150));
        });

        // An event this evening (UTC) at an approximate position well up from the southern site in December.
        String packet = """
                <?xml version="1.0" encoding="UTF-8"?>
                <voe:VOEvent xmlns:voe="http://www.ivoa.net/xml/VOEvent/v2.0" version="2.0" role="observation"
                             ivorn="ivo://skyrota.test/demo-alerts#1">
                  <Who><AuthorIVORN>ivo://skyrota.test/demo-alerts</AuthorIVORN><Date>%1$sT20:05:00</Date></Who>
                  <WhereWhen><ObsDataLocation><ObservatoryLocation id="GEOLUN"/><ObservationLocation>
                    <AstroCoordSystem id="UTC-ICRS-GEO"/>
                    <AstroCoords coord_system_id="UTC-ICRS-GEO">
                      <Time unit="s"><TimeInstant><ISOTime>%1$sT20:00:00</ISOTime></TimeInstant></Time>
                      <Position2D unit="deg"><Name1>RA</Name1><Name2>Dec</Name2>
                        <Value2><C1>84.7</C1><C2>-60.1</C2></Value2><Error2Radius>0.02</Error2Radius></Position2D>
                    </AstroCoords>
                  </ObservationLocation></ObsDataLocation></WhereWhen>
                  <Why importance="0.7"><Inference probability="0.9"><Name>SKY-T demo 1</Name></Inference></Why>
                </voe:VOEvent>
                """.formatted(today);
        ApiClient api = new ApiClient(port);
        Answer alert = api.send("POST", "/api/alerts", COORD, packet, "application/xml");
        assertThat(alert.status()).as(alert.body()).isEqualTo(201);
        assertThat(alert.id("$.request.programId")).isEqualTo(too.getId());
        assertThat((String) alert.json("$.request.state")).isEqualTo("accepted");
        assertThat((String) alert.json("$.request.earliestNight")).isEqualTo(today.toString());
        assertThat(alert.<Object>json("$.run")).as(alert.body()).isNotNull();
        Answer run = api.awaitRunEnd(alert.id("$.run.id"), COORD, Duration.ofSeconds(240));
        assertThat((String) run.json("$.state")).as(run.body()).isEqualTo("finished");
    }
}
