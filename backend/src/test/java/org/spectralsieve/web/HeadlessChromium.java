package org.spectralsieve.web;

import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Map;
import java.util.UUID;
import org.openqa.selenium.WebDriver;
import org.openqa.selenium.chrome.ChromeDriver;
import org.openqa.selenium.chrome.ChromeDriverService;
import org.openqa.selenium.chrome.ChromeOptions;

/** Debian's Chromium and driver, headless, offline, with its profile and screenshots under target/. */
final class HeadlessChromium {

    // Debian's packages put them here; -Dbrowser.chromium / -Dbrowser.chromedriver point elsewhere.
    static final Path CHROMIUM = Path.of(System.getProperty("browser.chromium", "/usr/bin/chromium"));
    static final Path CHROMEDRIVER = Path.of(System.getProperty("browser.chromedriver", "/usr/bin/chromedriver"));
    // Relative to the module directory surefire runs in, so the profile and screenshots stay under target/.
    static final Path OUTPUT = Path.of("target", "browser-test");

    private HeadlessChromium() {
    }

    /** Skips (not fails) the calling test class on a machine without Chromium and its driver. */
    static void assumeInstalled() {
        assumeTrue(Files.isExecutable(CHROMIUM),
                "Browser test skipped: no Chromium at " + CHROMIUM + " (apt-get install chromium chromium-driver,"
                        + " or set -Dbrowser.chromium)");
        assumeTrue(Files.isExecutable(CHROMEDRIVER),
                "Browser test skipped: no chromedriver at " + CHROMEDRIVER + " (apt-get install chromium-driver,"
                        + " or set -Dbrowser.chromedriver)");
    }

    static WebDriver start() throws IOException {
        Path profile = Files.createDirectories(OUTPUT.resolve("profile-" + UUID.randomUUID())).toAbsolutePath();
        // Naming the driver executable skips Selenium Manager (no download, no network).
        ChromeDriverService service = new ChromeDriverService.Builder()
                .usingDriverExecutable(CHROMEDRIVER.toFile())
                .usingAnyFreePort()
                // Chromium writes a dconf cache under $HOME even with its own profile; keep it in target/.
                .withEnvironment(Map.of(
                        "XDG_CACHE_HOME", profile.resolve("cache").toString(),
                        "XDG_CONFIG_HOME", profile.resolve("config").toString()))
                .build();
        ChromeOptions options = new ChromeOptions();
        options.setBinary(CHROMIUM.toFile());
        options.addArguments("--headless", "--no-sandbox", "--disable-gpu", "--disable-dev-shm-usage",
                "--window-size=1400,1300", "--user-data-dir=" + profile);
        return new ChromeDriver(service, options);
    }
}
