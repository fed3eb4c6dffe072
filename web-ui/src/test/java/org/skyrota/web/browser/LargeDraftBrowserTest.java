package org.skyrota.web.browser;

import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneOffset;
import java.util.List;

import org.junit.jupiter.api.Test;
import org.openqa.selenium.By;
import org.openqa.selenium.JavascriptExecutor;
import org.openqa.selenium.OutputType;
import org.openqa.selenium.chrome.ChromeDriver;
import org.openqa.selenium.support.ui.ExpectedConditions;
import org.openqa.selenium.support.ui.WebDriverWait;
import org.skyrota.web.account.Account;
import org.skyrota.web.account.AccountRepository;
import org.skyrota.web.account.Role;
import org.skyrota.web.plan.PlanRevision;
import org.skyrota.web.plan.PlanRevisionRepository;
import org.skyrota.web.plan.PlanVisit;
import org.skyrota.web.plan.VisitKey;
import org.skyrota.web.support.ApiClient;
import org.skyrota.web.support.ApiClient.Answer;
import org.skyrota.web.support.HeadlessChromium;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.security.crypto.password.PasswordEncoder;
import org.springframework.test.context.TestPropertySource;

/**
 * The plan view on a draft of 3,000 visits over 30 nights on five telescopes, served by the server (stored, read
 * through {@code GET /api/plans/draft}) and drawn in headless Chromium: the time from asking to a drawn grid is
 * printed, not asserted (machines differ). Invented targets and placements.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = "skyrota.test.context=large-draft-browser")
class LargeDraftBrowserTest {

    static final LocalDate FIRST = LocalDate.of(2027, 1, 1);
    static final int NIGHTS = 30;
    static final int VISITS = 3000;
    static final int REQUESTS = 400;

    @LocalServerPort int port;
    @Autowired AccountRepository accounts;
    @Autowired PasswordEncoder encoder;
    @Autowired PlanRevisionRepository revisions;

    @Test
    void aStoredDraftOfThreeThousandVisitsOpensInThePlanView() throws Exception {
        assumeTrue(HeadlessChromium.installed(),
                "Browser test skipped: /usr/bin/chromium or /usr/bin/chromedriver is not installed (.ci/run installs them)");
        accounts.save(new Account("bigcoord", encoder.encode("password1"), Role.COORDINATOR));
        String coord = ApiClient.basic("bigcoord", "password1");
        ApiClient api = new ApiClient(port);
        long site = created(api.post("/api/sites", coord, "{\"name\":\"Big plain\",\"latitudeDeg\":45,\"longitudeDeg\":7,"
                + "\"elevationM\":300,\"timeZone\":\"Europe/Rome\",\"darkSkyZenithVMag\":21}"));
        long[] telescopes = new long[5];
        StringBuilder grants = new StringBuilder();
        for (int t = 0; t < telescopes.length; t++) {
            telescopes[t] = created(api.post("/api/telescopes", coord, "{\"siteId\":" + site + ",\"name\":\"Big T" + t
                    + "\",\"apertureMm\":300,\"minAltitudeDeg\":15,\"slewRateDegPerS\":4,\"settleSeconds\":10,\"active\":true}"));
            grants.append(t == 0 ? "" : ",").append("{\"telescopeId\":").append(telescopes[t])
                    .append(",\"hours\":200,\"firstNight\":\"2027-01-01\",\"lastNight\":\"2027-01-31\"}");
        }
        created(api.post("/api/programs", coord, "{\"code\":\"BIG\",\"title\":\"Big survey\",\"principalInvestigator\":\"Dr. Big\","
                + "\"active\":true,\"grants\":[" + grants + "]}"));
        // The requests come in through the CSV importer: one call instead of 400.
        StringBuilder csv = new StringBuilder("title,target,ra,dec,filter_plan,priority,program\n");
        for (int i = 0; i < REQUESTS; i++) {
            csv.append("Survey field ").append(i).append(",NGC ").append(1000 + i).append(',').append((i * 7) % 360)
                    .append(',').append(10 + i % 30).append(",V:60x3,").append(1 + i % 5).append(",BIG\n");
        }
        Answer imported = api.send("POST", "/api/requests/import", coord, csv.toString(), "text/csv");
        assertThat(imported.status()).as(imported.body()).isEqualTo(201);
        List<Integer> requestIds = imported.json("$.requests[*].id");

        PlanRevision draft = new PlanRevision(PlanRevision.State.DRAFT, FIRST, FIRST.plusDays(NIGHTS - 1));
        for (int i = 0; i < VISITS; i++) {
            LocalDate night = FIRST.plusDays(i % NIGHTS);
            Instant start = night.atTime(19, 0).toInstant(ZoneOffset.UTC).plusSeconds((i / NIGHTS / 5) * 600L);
            draft.getVisits().add(PlanVisit.placed(new VisitKey(requestIds.get(i % REQUESTS), i / REQUESTS + 1),
                    telescopes[i / NIGHTS % telescopes.length], night, start, start.plusSeconds(540), i % 50 == 0));
        }
        draft.setScore("0hard/0medium/0soft");
        revisions.saveAndFlush(draft);

        String range = "?from=" + FIRST + "&to=" + FIRST.plusDays(NIGHTS - 1);
        for (String path : List.of("/api/plans/draft" + range, "/api/plans/compare" + range)) {
            long best = Long.MAX_VALUE;
            for (int i = 0; i < 3; i++) {
                long t0 = System.nanoTime();
                Answer a = api.get(path, coord);
                best = Math.min(best, System.nanoTime() - t0);
                assertThat(a.status()).as(a.body()).isEqualTo(200);
            }
            System.out.println("dashboard: server answers " + path + " in " + best / 1_000_000 + " ms (best of 3, with HTTP Basic)");
        }

        try (HeadlessChromium chromium = HeadlessChromium.start(1280, 800)) {
            ChromeDriver browser = chromium.driver();
            WebDriverWait wait = new WebDriverWait(browser, Duration.ofSeconds(60));
            browser.get("http://localhost:" + port + "/#/plan");
            wait.until(ExpectedConditions.visibilityOfElementLocated(By.name("username"))).sendKeys("bigcoord");
            browser.findElement(By.name("password")).sendKeys("password1");
            browser.findElement(By.cssSelector("#signin-form button")).click();
            wait.until(ExpectedConditions.textToBePresentInElementLocated(By.id("who"), "bigcoord"));
            ((JavascriptExecutor) browser).executeScript("location.hash = '#/plan'");
            wait.until(ExpectedConditions.presenceOfElementLocated(By.name("nights")));
            JavascriptExecutor js = browser;
            js.executeScript("""
                    const set = (name, v) => { const i = document.querySelector(`input[name=${name}]`); i.value = v;
                      i.dispatchEvent(new Event('change')); };
                    set('from', arguments[0]); set('nights', arguments[1]);
                    window.__askedAt = performance.now();
                    document.querySelector('#plan-grid-box').dataset.ready = '';
                    document.querySelector('input[name=nights]').form.requestSubmit();
                    """, FIRST.toString(), String.valueOf(NIGHTS));
            wait.until(d -> String.valueOf(VISITS).equals(js.executeScript("return document.getElementById('plan-grid-box').dataset.ready")));
            Object timing = js.executeAsyncScript("""
                    const done = arguments[arguments.length - 1];
                    requestAnimationFrame(() => requestAnimationFrame(() => done(
                      Math.round(performance.now() - window.__askedAt) + ' ms to drawn, ' + Math.round(window.__planRenderMs)
                      + ' ms fetch and draw, ' + document.querySelectorAll('#plan-grid .cell-visit').length + ' visit buttons')));
                    """);
            System.out.println("dashboard: server-served draft of " + VISITS + " visits over " + NIGHTS + " nights: " + timing);
            assertThat(String.valueOf(timing)).endsWith(VISITS + " visit buttons");
            Path screenshots = Path.of("target", "screenshots");
            Files.createDirectories(screenshots);
            Files.copy(browser.getScreenshotAs(OutputType.FILE).toPath(), screenshots.resolve("30-plan-review-3000-stored-visits.png"),
                    StandardCopyOption.REPLACE_EXISTING);
        }
    }

    private static long created(Answer a) {
        assertThat(a.status()).as(a.body()).isEqualTo(201);
        return a.id("$.id");
    }
}
