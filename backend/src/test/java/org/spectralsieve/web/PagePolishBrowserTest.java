package org.spectralsieve.web;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.file.Files;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.openqa.selenium.By;
import org.openqa.selenium.JavascriptExecutor;
import org.openqa.selenium.Keys;
import org.openqa.selenium.OutputType;
import org.openqa.selenium.StaleElementReferenceException;
import org.openqa.selenium.TakesScreenshot;
import org.openqa.selenium.WebDriver;
import org.openqa.selenium.WebElement;
import org.openqa.selenium.support.ui.Select;
import org.openqa.selenium.support.ui.WebDriverWait;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.test.context.TestPropertySource;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * The page's finish (docs/page-polish.md) in headless Chromium against the whole application and its
 * illustrative demo library: the figures' defaults and pickers, problems shown once beside their cause and
 * gone after a success, no HTTP status codes in the page, the favicon. Skipped without Chromium.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = "spring.datasource.url=jdbc:h2:mem:browser-polish;DB_CLOSE_DELAY=-1")
class PagePolishBrowserTest {

    private static final Duration PATIENCE = Duration.ofSeconds(30);
    private static final HttpClient HTTP = HttpClient.newHttpClient();
    private static final JsonMapper JSON = JsonMapper.builder().build();
    /** A bulk plastic of the demo library: it can be rescaled. */
    private static final String ACRYLIC = "UV-transmitting cast acrylic, lamp-cover grade";

    private static WebDriver driver;
    private static WebDriverWait wait;

    @LocalServerPort
    private int port;

    @BeforeAll
    static void startBrowser() throws IOException {
        HeadlessChromium.assumeInstalled();
        driver = HeadlessChromium.start();
        wait = new WebDriverWait(driver, PATIENCE);
        wait.ignoring(StaleElementReferenceException.class);
    }

    @AfterAll
    static void stopBrowser() {
        if (driver != null) {
            driver.quit();
        }
    }

    @Test
    void figuresAreUnweightedByDefaultAndTheSolarListHoldsOnlySunlight() throws Exception {
        loadPage();
        openMaterial(ACRYLIC);
        WebElement status = driver.findElement(By.id("figures-status"));
        wait.until(d -> status.getText().contains("led-365 × flat"));
        assertThat(new Select(driver.findElement(By.id("figure-response"))).getFirstSelectedOption()
                .getDomAttribute("value")).isEqualTo("flat");
        // the chosen pair has a number: the LED lies within the stored curve
        assertThat(driver.findElement(By.cssSelector("#figures-table tr[data-figure='effectiveTransmittance'] td.value"))
                .getText()).endsWith("%");

        // The picker offers exactly the emitters the server marks as sunlight, never an LED, lamp or "flat".
        List<String> solarFromApi = new ArrayList<>();
        for (JsonNode e : getJson("/api/emitters").path("emitters")) {
            if (e.path("solar").asBoolean()) {
                solarFromApi.add(e.path("name").asString());
            }
        }
        assertThat(solarFromApi).contains("d65");
        List<String> offered = new Select(driver.findElement(By.id("figure-solar"))).getOptions().stream()
                .map(o -> o.getDomAttribute("value")).filter(v -> !v.isEmpty()).toList();
        assertThat(offered).containsExactlyElementsOf(solarFromApi);
        assertThat(offered).noneMatch(v -> v.startsWith("led") || v.equals("flat") || v.startsWith("mercury"));

        // Without a solar spectrum the UPF says so in words, not in API syntax.
        String figures = driver.findElement(By.id("figures-table")).getText();
        assertThat(figures).contains("reference solar spectrum must be named").doesNotContain("solar=");
        screenshot("polish-1-figures-defaults", "weighted-figures");
    }

    @Test
    void aFailedSearchShowsOneMessageBesideTheTextAndNoEarlierResults() throws Exception {
        loadPage();
        WebElement text = driver.findElement(By.id("requirement-text"));
        text.sendKeys("passes over 80% at 254 nm", Keys.ENTER);
        wait.until(d -> !d.findElements(By.cssSelector("#results-table tr[data-result-material-id]")).isEmpty());

        text.sendKeys(Keys.chord(Keys.CONTROL, "a"), Keys.DELETE);
        text.sendKeys("passes ovr 80% at 254 nm", Keys.ENTER);
        WebElement error = driver.findElement(By.id("requirement-error"));
        wait.until(d -> error.isDisplayed()
                && d.findElement(By.id("search-summary")).getText().contains("did not run"));
        // once, beside its cause: no banner repeating it, the fix offered, no long list of keywords
        assertThat(driver.findElement(By.id("message")).isDisplayed()).isFalse();
        assertThat(driver.findElements(By.cssSelector("#requirement-clauses li"))).as("no reading of an earlier text").isEmpty();
        assertThat(error.findElement(By.cssSelector(".marked-text mark")).getText()).isEqualTo("ovr");
        assertThat(error.findElement(By.cssSelector("button.suggestion")).getText()).isEqualTo("over");
        assertThat(error.findElement(By.cssSelector(".error-detail")).getText()).doesNotContain("at position")
                .doesNotContain("did you mean");
        // the rows of the earlier requirement are gone, not left standing as if they answered this one
        assertThat(driver.findElements(By.cssSelector("#results-table tr[data-result-material-id]"))).isEmpty();
        assertThat(driver.findElement(By.id("results-table")).isDisplayed()).isFalse();
        assertThat(driver.findElement(By.tagName("body")).getText()).doesNotContain("(400)");
        screenshot("polish-2-failed-search", null);
    }

    @Test
    void aRefusedRescaleIsShownBesideItsButtonAndGoesAfterASuccess() throws Exception {
        loadPage();
        openMaterial(ACRYLIC);
        WebElement mm = driver.findElement(By.id("rescale-mm"));
        WebElement error = driver.findElement(By.id("rescale-error"));
        // beyond the largest thickness the server rescales to (1000 mm): refused by the server
        mm.sendKeys("5000", Keys.ENTER);
        wait.until(d -> error.isDisplayed());
        assertThat(error.getText()).startsWith("Not rescaled:").contains("1000").doesNotContain("thicknessMm");
        assertThat(driver.findElement(By.id("message")).isDisplayed()).as("no banner far from the button").isFalse();
        assertThat(driver.findElement(By.tagName("body")).getText()).doesNotContain("(400)");
        screenshot("polish-3-rescale-refused", "material-detail");

        mm.clear();
        mm.sendKeys("5", Keys.ENTER);
        wait.until(d -> d.findElements(By.cssSelector("#curve-chart .u-legend .u-label")).stream()
                .anyMatch(label -> label.getDomProperty("textContent").startsWith("rescaled to 5 mm")));
        assertThat(error.isDisplayed()).as("the refusal goes once a rescale succeeds").isFalse();
        assertThat(error.getText()).isEmpty();
    }

    @Test
    void theChartOffersARangeAResetAndSaysHowToZoom() throws Exception {
        loadPage();
        openMaterial(ACRYLIC);
        wait.until(d -> !d.findElements(By.cssSelector("#curve-chart canvas")).isEmpty());
        assertThat(driver.findElement(By.id("zoom-hint")).getText()).contains("Drag").contains("Reset view");
        driver.findElement(By.cssSelector("[data-range-preset='0-10']")).click();
        assertThat(driver.findElement(By.id("range-to")).getDomProperty("value")).isEqualTo("10");
        // a range the wrong way round is refused beside the inputs
        WebElement to = driver.findElement(By.id("range-to"));
        to.clear();
        to.sendKeys("0", Keys.TAB);
        wait.until(d -> d.findElement(By.id("range-error")).isDisplayed());
        screenshot("polish-4-chart-range", "material-detail");
        driver.findElement(By.id("chart-reset")).click();
        assertThat(driver.findElement(By.id("range-error")).isDisplayed()).isFalse();
        assertThat(to.getDomProperty("value")).isEmpty();
        // the OD axis, with its headroom above the detection-limit bounds
        new Select(driver.findElement(By.id("axis-mode"))).selectByValue("od");
        wait.until(d -> "od".equals(d.findElement(By.id("curve-chart")).getDomAttribute("data-axis-mode")));
        assertThat(driver.findElement(By.id("linear-range")).isDisplayed()).as("range is for the linear axis").isFalse();
        screenshot("polish-5-chart-od", "material-detail");
    }

    @Test
    void longFloatsInServerMessagesAreWrittenWithFourSignificantDigits() {
        loadPage();
        Object tidy = ((JavascriptExecutor) driver).executeAsyncScript("""
                const done = arguments[arguments.length - 1];
                import('./polish.js').then((m) => done(m.tidyNumbers(
                    'step 0.9977272727272727 nm between 312.5 and 1234.56789012 nm')));""");
        // four significant digits, or as many as the whole part needs (common practice, no source)
        assertThat(tidy).isEqualTo("step 0.9977 nm between 312.5 and 1234.6 nm");
    }

    @Test
    void theFaviconIsLinkedAndServed() throws Exception {
        loadPage();
        WebElement icon = driver.findElement(By.cssSelector("link[rel='icon']"));
        String href = icon.getDomProperty("href");
        HttpResponse<String> response = HTTP.send(HttpRequest.newBuilder(URI.create(href)).GET().build(),
                HttpResponse.BodyHandlers.ofString());
        assertThat(response.statusCode()).isEqualTo(200);
        assertThat(response.headers().firstValue("content-type").orElse("")).contains("svg");
        assertThat(response.body()).contains("<svg");
    }

    // ---------- helpers ----------

    private void loadPage() {
        driver.get("http://localhost:" + port + "/");
    }

    private void openMaterial(String nameStart) {
        wait.withMessage("waiting for the library row of " + nameStart);
        WebElement row = wait.until(d -> d.findElements(By.cssSelector("#material-table tr[data-material-id]"))
                .stream().filter(r -> r.findElement(By.cssSelector("td")).getText().startsWith(nameStart))
                .findFirst().orElse(null));
        row.click();
        wait.until(d -> d.findElement(By.id("detail-name")).getText().startsWith(nameStart));
    }

    /** The element with this id (or the whole window when null), saved under target/browser-test/. */
    private void screenshot(String name, String id) throws IOException {
        byte[] png;
        if (id == null) {
            ((JavascriptExecutor) driver).executeScript("window.scrollTo(0, 0)");
            png = ((TakesScreenshot) driver).getScreenshotAs(OutputType.BYTES);
        } else {
            WebElement element = driver.findElement(By.id(id));
            ((JavascriptExecutor) driver).executeScript("arguments[0].scrollIntoView({block: 'start'})", element);
            png = element.getScreenshotAs(OutputType.BYTES);
        }
        Files.write(Files.createDirectories(HeadlessChromium.OUTPUT).resolve(name + ".png"), png);
    }

    private JsonNode getJson(String path) throws Exception {
        HttpResponse<String> response = HTTP.send(HttpRequest.newBuilder(URI.create("http://localhost:" + port + path))
                .GET().build(), HttpResponse.BodyHandlers.ofString());
        assertThat(response.statusCode()).as(path + " → " + response.body()).isEqualTo(200);
        return JSON.readTree(response.body());
    }
}
