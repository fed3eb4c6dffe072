package org.skyrota.web.support;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Comparator;

import org.openqa.selenium.Dimension;
import org.openqa.selenium.chrome.ChromeDriver;
import org.openqa.selenium.chrome.ChromeDriverService;
import org.openqa.selenium.chrome.ChromeOptions;

/**
 * Debian's headless Chromium driven through Debian's chromedriver at fixed paths, so that Selenium Manager never
 * downloads a browser or a driver. Closing it quits the browser and removes its profile.
 */
public final class HeadlessChromium implements AutoCloseable {

    public static final Path CHROMIUM = Path.of("/usr/bin/chromium");
    public static final Path CHROMEDRIVER = Path.of("/usr/bin/chromedriver");

    private final ChromeDriver driver;
    private final Path profile;

    private HeadlessChromium(ChromeDriver driver, Path profile) {
        this.driver = driver;
        this.profile = profile;
    }

    /** Whether both programs are installed ({@code .ci/run} installs them with apt-get). */
    public static boolean installed() {
        return Files.isExecutable(CHROMIUM) && Files.isExecutable(CHROMEDRIVER);
    }

    public static HeadlessChromium start(int width, int height) throws IOException {
        System.setProperty("webdriver.chrome.driver", CHROMEDRIVER.toString());
        Path profile = Files.createTempDirectory("skyrota-chromium-");
        ChromeOptions options = new ChromeOptions();
        options.setBinary(CHROMIUM.toFile());
        options.addArguments("--headless", "--no-sandbox", "--disable-gpu", "--disable-background-networking",
                "--disable-component-update", "--disable-sync", "--no-first-run", "--disable-dev-shm-usage",
                "--user-data-dir=" + profile, "--window-size=" + width + "," + height);
        ChromeDriverService service = new ChromeDriverService.Builder()
                .usingDriverExecutable(CHROMEDRIVER.toFile()).usingAnyFreePort().build();
        ChromeDriver driver = new ChromeDriver(service, options);
        driver.manage().window().setSize(new Dimension(width, height));
        return new HeadlessChromium(driver, profile);
    }

    public ChromeDriver driver() {
        return driver;
    }

    @Override
    public void close() throws IOException {
        driver.quit();
        try (var walk = Files.walk(profile)) {
            walk.sorted(Comparator.reverseOrder()).forEach(p -> p.toFile().delete());
        }
    }
}
