package org.spectralsieve.web;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.net.URI;
import java.net.URLDecoder;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.List;
import java.util.function.IntPredicate;
import org.openqa.selenium.By;
import org.openqa.selenium.Dimension;
import org.openqa.selenium.JavascriptExecutor;
import org.openqa.selenium.OutputType;
import org.openqa.selenium.StaleElementReferenceException;
import org.openqa.selenium.TakesScreenshot;
import org.openqa.selenium.WebDriver;
import org.openqa.selenium.WebElement;
import org.openqa.selenium.support.ui.WebDriverWait;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * One headless Chromium for a page test class, with the steps every page test takes: open the page, wait for the
 * library, open a material, run a requirement, wait for the chart, check for sideways scrolling, save a screenshot.
 * A test class starts it in {@code @BeforeAll} with {@link #startOrSkip()} (which skips the class on a machine
 * without Chromium) and closes it in {@code @AfterAll}; the server's port is given per call since Spring injects it
 * into the test instance, after {@code @BeforeAll} has run.
 */
final class PageBrowser implements AutoCloseable {

    /** Long enough for a cold server on a loaded two-core machine; a passing step returns at once. */
    static final Duration PATIENCE = Duration.ofSeconds(30);
    private static final HttpClient HTTP = HttpClient.newHttpClient();
    private static final JsonMapper JSON = JsonMapper.builder().build();

    private final WebDriver driver;
    private final WebDriverWait wait;

    private PageBrowser(WebDriver driver) {
        this.driver = driver;
        this.wait = patient(driver);
    }

    /** A fresh browser with its own profile; the calling test class is skipped (not failed) without Chromium. */
    static PageBrowser startOrSkip() throws IOException {
        HeadlessChromium.assumeInstalled();
        return new PageBrowser(HeadlessChromium.start());
    }

    WebDriver driver() {
        return driver;
    }

    /** A wait that treats a stale element as "look again": rows and the chart are replaced as answers arrive. */
    WebDriverWait waiting() {
        return wait;
    }

    static WebDriverWait patient(WebDriver browser) {
        WebDriverWait waiting = new WebDriverWait(browser, PATIENCE);
        waiting.ignoring(StaleElementReferenceException.class);
        return waiting;
    }

    Object script(String javascript, Object... arguments) {
        return ((JavascriptExecutor) driver).executeScript(javascript, arguments);
    }

    /** Opens {@code pathAndQuery} (e.g. "/" or "/?q=…") on the test server and waits for the library list. */
    void open(int port, String pathAndQuery) {
        driver.get("http://localhost:" + port + pathAndQuery);
        waitForLibrary();
    }

    void waitForLibrary() {
        wait.withMessage("waiting for the library list")
                .until(d -> !d.findElements(By.cssSelector("#material-table tbody tr[data-material-id]")).isEmpty());
    }

    /** Clicks the library row whose name starts with {@code name} and waits for its detail to open. */
    void openMaterialFromLibrary(String name) {
        WebElement row = wait.withMessage("waiting for " + name + " in the library list")
                .until(d -> d.findElements(By.cssSelector("#material-table tr[data-material-id]")).stream()
                        .filter(r -> r.findElement(By.cssSelector("td")).getText().startsWith(name))
                        .findFirst().orElse(null));
        row.click();
        waitForMaterial(name);
    }

    /** Waits until the material detail shows a name starting with {@code name}. */
    void waitForMaterial(String name) {
        wait.withMessage("waiting for " + name + " to open")
                .until(d -> d.findElement(By.id("material-detail")).isDisplayed()
                        && d.findElement(By.id("detail-name")).getText().startsWith(name));
    }

    /** Types {@code requirement} into the Find box, searches, and returns the result rows' material ids in order. */
    List<String> search(String requirement) {
        WebElement text = driver.findElement(By.id("requirement-text"));
        text.clear();
        text.sendKeys(requirement);
        driver.findElement(By.id("search-button")).click();
        return waitForResults(requirement);
    }

    /** Waits for the shortlist of {@code requirement} and returns its rows' material ids in order. */
    List<String> waitForResults(String requirement) {
        wait.withMessage("waiting for the results of: " + requirement)
                .until(d -> requirement.equals(d.findElement(By.id("results-table")).getDomAttribute("data-requirement"))
                        && !resultRows().isEmpty());
        return resultRows().stream().map(r -> r.getDomAttribute("data-result-material-id")).toList();
    }

    List<WebElement> resultRows() {
        return driver.findElements(By.cssSelector("#results-table tbody tr[data-result-material-id]"));
    }

    /** Waits for a legend entry of the material chart whose text starts with {@code start}. */
    void waitForLegend(String start) {
        wait.withMessage("waiting for a legend entry starting " + start)
                .until(d -> d.findElements(By.cssSelector("#curve-chart .u-legend .u-series .u-label")).stream()
                        .anyMatch(e -> e.getDomProperty("textContent").startsWith(start)));
    }

    /** The (first) value of a query parameter of the browser's address, decoded; null when absent. */
    String addressParameter(String key) {
        String raw = URI.create(driver.getCurrentUrl()).getRawQuery();
        if (raw == null) {
            return null;
        }
        for (String pair : raw.split("&")) {
            String[] kv = pair.split("=", 2);
            if (URLDecoder.decode(kv[0], StandardCharsets.UTF_8).equals(key)) {
                return kv.length < 2 ? "" : URLDecoder.decode(kv[1], StandardCharsets.UTF_8);
            }
        }
        return null;
    }

    /** Sets the outer window size; the inner width is a little less (see {@link #innerWidth()}). */
    void resize(int width, int height) {
        driver.manage().window().setSize(new Dimension(width, height));
    }

    long innerWidth() {
        return ((Number) script("return window.innerWidth")).longValue();
    }

    /** The page is no wider than the window; else the elements sticking out (outside any scrolling box) are named. */
    void assertNoSidewaysScrolling(String view) {
        long overflow = ((Number) script("return document.scrollingElement.scrollWidth - window.innerWidth")).longValue();
        Object culprits = script("""
                const scrolls = (e) => { for (let p = e.parentElement; p; p = p.parentElement) {
                  const o = getComputedStyle(p).overflowX; if (o === 'auto' || o === 'scroll' || o === 'hidden') return true; }
                  return false; };
                return [...document.querySelectorAll('body *')]
                  .filter((e) => e.getBoundingClientRect().right > window.innerWidth + 1 && !scrolls(e))
                  .slice(0, 8).map((e) => e.tagName + '#' + e.id + '.' + e.className + ' right='
                    + Math.round(e.getBoundingClientRect().right)).join('; ');""");
        assertThat(overflow).as("%s: page wider than the %s px window by; sticking out: %s", view, innerWidth(), culprits)
                .isLessThanOrEqualTo(0);
    }

    /**
     * Saves the viewport as {@code target/browser-test/<name>.png} for review, after bringing the element with id
     * {@code elementId} (if any, and shown) to the top.
     */
    Path screenshot(String name, String elementId) throws IOException {
        List<WebElement> target = elementId == null ? List.of() : driver.findElements(By.id(elementId));
        if (!target.isEmpty() && target.get(0).isDisplayed()) {
            script("arguments[0].scrollIntoView({block: 'start'})", target.get(0));
        }
        byte[] png = ((TakesScreenshot) driver).getScreenshotAs(OutputType.BYTES);
        return Files.write(Files.createDirectories(HeadlessChromium.OUTPUT).resolve(name + ".png"), png);
    }

    Path screenshot(String name) throws IOException {
        return screenshot(name, null);
    }

    /** GETs {@code path} from the test server (outside the browser) and returns the answer, whatever its status. */
    static HttpResponse<String> get(int port, String path) throws IOException, InterruptedException {
        return HTTP.send(HttpRequest.newBuilder(URI.create("http://localhost:" + port + path)).GET().build(),
                HttpResponse.BodyHandlers.ofString());
    }

    @Override
    public void close() {
        driver.quit();
    }

    // ---------- steps several page tests share (moved here from the test classes) ----------

    /** Goes to {@code pathAndQuery} on the test server and waits for nothing (the test waits for what it needs). */
    void load(int port, String pathAndQuery) {
        driver.get("http://localhost:" + port + pathAndQuery);
    }

    /** Labels of the material chart's data series (the legend's wavelength column left out). */
    List<String> legendLabels() {
        List<String> labels = driver.findElements(By.cssSelector("#curve-chart .u-legend .u-series .u-label"))
                .stream().map(e -> e.getDomProperty("textContent")).toList();
        return labels.isEmpty() ? labels : labels.subList(1, labels.size());
    }

    /** Waits until the number of the chart's data series satisfies {@code condition}; answers their labels. */
    List<String> waitForLegend(IntPredicate condition, String what) {
        wait.withMessage(() -> "waiting for " + what + "; legend now: " + legendLabels());
        wait.until(d -> condition.test(legendLabels().size()));
        return legendLabels();
    }

    /** The page-wide message area stays hidden; nothing to check when no page was opened (a skipped test). */
    void assertNoPageMessage() {
        List<WebElement> messages = driver.findElements(By.id("message"));
        if (!messages.isEmpty()) {
            assertThat(messages.get(0).isDisplayed()).as("page message stays hidden, but shows: %s",
                    messages.get(0).getText()).isFalse();
        }
    }

    /** Saves the viewport, scrolled to the top of the page, as {@code target/browser-test/<name>.png}. */
    Path screenshotOfTop(String name) throws IOException {
        script("window.scrollTo(0, 0)");
        return screenshot(name);
    }

    /** Saves only {@code element} (brought into view first) as {@code target/browser-test/<name>.png}. */
    Path screenshotOfElement(String name, WebElement element) throws IOException {
        script("arguments[0].scrollIntoView({block: 'start'})", element);
        byte[] png = element.getScreenshotAs(OutputType.BYTES);
        return Files.write(Files.createDirectories(HeadlessChromium.OUTPUT).resolve(name + ".png"), png);
    }

    /** GETs {@code path} from the test server, which must answer 200 (else the failure shows the answer). */
    static HttpResponse<String> getOk(int port, String path) throws IOException, InterruptedException {
        HttpResponse<String> answer = get(port, path);
        assertThat(answer.statusCode()).as(path + " -> " + answer.body()).isEqualTo(200);
        return answer;
    }

    /** GETs {@code path} from the test server, which must answer 200, and reads the answer as JSON. */
    static JsonNode getJson(int port, String path) throws IOException, InterruptedException {
        return JSON.readTree(getOk(port, path).body());
    }
}
