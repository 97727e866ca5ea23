package org.spectralsieve.web;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.net.URLEncoder;
import java.nio.charset.StandardCharsets;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.openqa.selenium.By;
import org.openqa.selenium.Keys;
import org.openqa.selenium.WebDriver;
import org.openqa.selenium.WebElement;
import org.openqa.selenium.support.ui.Select;
import org.openqa.selenium.support.ui.WebDriverWait;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.test.context.TestPropertySource;
import tools.jackson.databind.JsonNode;

/**
 * Light at an angle on the page, in a real headless Chromium against the whole application with its (illustrative)
 * demo library: the weighted figures' light choice (numbers as the API gives them for that light, the light named
 * in the status line), the material view's "T against angle" chart, and the light the search answer assumes.
 * Skipped (not failed) on machines without Chromium and its driver.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = "spring.datasource.url=jdbc:h2:mem:browser-light-at-angle;DB_CLOSE_DELAY=-1")
class LightAtAnglePageBrowserTest {

    /** Bulk and clear in the UV-A: it has figures at an angle and a sweep at 365 nm. */
    private static final String BULK = "UV-transmitting cast acrylic, lamp-cover grade";
    private static final String COATED = "Clear float glass with UV-blocking lacquer";

    private static PageBrowser page;
    private static WebDriver driver;
    private static WebDriverWait wait;

    @LocalServerPort
    private int port;

    @BeforeAll
    static void startBrowser() throws IOException {
        page = PageBrowser.startOrSkip();
        driver = page.driver();
        wait = page.waiting();
    }

    @AfterAll
    static void stopBrowser() {
        if (page != null) {
            page.close();
        }
    }

    @Test
    void theFiguresFollowTheChosenLightAndNameItAndTheAngleChartAppears() throws Exception {
        long sampleId = material(BULK).path("samples").get(0).path("id").asLong();
        page.load(port, "/");
        page.openMaterialFromLibrary(BULK);
        waitForFiguresStatus("light: normal incidence");

        // a choice from the list: the API's number for that light, and the light named in the status line
        new Select(driver.findElement(By.id("figure-light"))).selectByValue("at 45° incidence");
        waitForFiguresStatus("light: collimated light at 45° incidence");
        JsonNode oblique = figures(sampleId, "emitter=led-365&response=flat&light=" + encode("at 45° incidence"));
        assertThat(shownValue("effectiveTransmittance"))
                .isEqualTo(WeightedFiguresBrowserTest.fractionAsShown(oblique.path("effectiveTransmittance")));
        assertThat(page.addressParameter("fig.light")).isEqualTo("at 45° incidence");

        // a phrase typed in words
        new Select(driver.findElement(By.id("figure-light"))).selectByValue("in-words");
        WebElement words = driver.findElement(By.id("figure-light-text"));
        wait.until(d -> words.isDisplayed());
        words.sendKeys("at 20° incidence", Keys.TAB);
        waitForFiguresStatus("20° incidence");

        // the sweep at the default 365 nm: chart drawn, three spread sources listed, Brewster's angle named
        JsonNode sweep = PageBrowser.getJson(port, "/api/samples/" + sampleId + "/angles?nm=365");
        WebElement section = driver.findElement(By.id("angle-sweep"));
        wait.withMessage(() -> "waiting for the angle chart; status: " + driver.findElement(By.id("angle-status")).getText())
                .until(d -> "shown".equals(section.getDomAttribute("data-state")));
        assertThat(driver.findElements(By.cssSelector("#angle-chart canvas"))).isNotEmpty();
        assertThat(driver.findElement(By.id("angle-chart")).getDomAttribute("aria-label")).contains("365 nm");
        assertThat(driver.findElements(By.cssSelector("#angle-references dd"))).hasSize(3);
        assertThat(driver.findElement(By.id("angle-references")).getText())
                .contains(capitalised(sweep.path("references").get(2).path("light").path("description").asString()));
        assertThat(driver.findElement(By.id("angle-brewster")).getText()).startsWith("Brewster angle")
                .contains(String.valueOf(Math.round(sweep.path("brewsterDeg").asDouble())));
        assertThat(driver.findElement(By.id("angle-status")).getText()).contains("365 nm").contains("square on");
        page.screenshotOfElement("light-at-angle-sweep", section);

        // another wavelength outside the curve: the server's reason beside the controls, no chart
        WebElement nm = driver.findElement(By.id("angle-nm"));
        nm.clear();
        nm.sendKeys("5000", Keys.TAB);
        wait.until(d -> "error".equals(section.getDomAttribute("data-state")));
        assertThat(driver.findElement(By.id("angle-status")).getText()).startsWith("No sweep:").contains("measured range");
        page.assertNoPageMessage();
    }

    @Test
    void aCoatedSampleAtAnAngleIsExplainedBesideThePickersAndHasNoSweep() throws Exception {
        page.load(port, "/");
        page.openMaterialFromLibrary(COATED);
        waitForFiguresStatus("light: normal incidence");
        new Select(driver.findElement(By.id("figure-light"))).selectByValue("over a 60° beam");
        WebElement status = driver.findElement(By.id("figures-status"));
        wait.until(d -> status.getText().startsWith("No figures:"));
        assertThat(status.getText()).contains("coated");
        WebElement section = driver.findElement(By.id("angle-sweep"));
        wait.until(d -> "error".equals(section.getDomAttribute("data-state")));
        assertThat(driver.findElement(By.id("angle-status")).getText()).contains("coated");
        page.assertNoPageMessage();
    }

    @Test
    void theSearchAnswerNamesTheLightItAssumes() {
        page.load(port, "/");
        page.waitForLibrary();
        page.search("passes over 80% at 365 nm");
        WebElement light = driver.findElement(By.id("search-light"));
        assertThat(light.isDisplayed()).isTrue();
        assertThat(light.getText()).isEqualTo("Light: normal incidence (light square to the surface)");
        assertThat(driver.findElement(By.id("requirement-clauses")).getText()).doesNotContain("light:");
        page.search("passes over 80% at 365 nm, at 30° incidence");
        wait.until(d -> light.getText().contains("30° incidence"));
        // and the requirement as understood says it beside the thickness
        assertThat(driver.findElement(By.id("requirement-clauses")).getText())
                .contains("light: collimated light at 30° incidence");
    }

    private static String capitalised(String text) {
        return text.isEmpty() ? text : Character.toUpperCase(text.charAt(0)) + text.substring(1);
    }

    private void waitForFiguresStatus(String part) {
        WebElement status = driver.findElement(By.id("figures-status"));
        wait.withMessage(() -> "waiting for the figures status to mention '" + part + "'; now: '" + status.getText() + "'");
        wait.until(d -> status.getText().contains(part)
                && "shown".equals(d.findElement(By.id("weighted-figures")).getDomAttribute("data-state")));
    }

    private String shownValue(String figureKey) {
        return driver.findElement(By.cssSelector("#figures-table tr[data-figure='" + figureKey + "'] td.value")).getText();
    }

    private JsonNode material(String nameStart) throws Exception {
        JsonNode materials = PageBrowser.getJson(port, "/api/materials?q=" + encode(nameStart));
        for (JsonNode m : materials) {
            if (m.path("name").asString().startsWith(nameStart)) {
                return m;
            }
        }
        throw new AssertionError("demo library has no material named " + nameStart + "…");
    }

    private JsonNode figures(long sampleId, String query) throws Exception {
        return PageBrowser.getJson(port, "/api/samples/" + sampleId + "/figures?" + query);
    }

    private static String encode(String text) {
        return URLEncoder.encode(text, StandardCharsets.UTF_8);
    }
}
