package org.spectralsieve.web;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.net.URLEncoder;
import java.nio.charset.StandardCharsets;
import java.time.Duration;
import java.util.List;
import java.util.Set;
import java.util.stream.Collectors;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.openqa.selenium.By;
import org.openqa.selenium.JavascriptExecutor;
import org.openqa.selenium.WebDriver;
import org.openqa.selenium.WebElement;
import org.openqa.selenium.support.ui.Select;
import org.openqa.selenium.support.ui.WebDriverWait;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.test.context.TestPropertySource;
import tools.jackson.databind.JsonNode;

/**
 * The page's whole view in its address (web/address.js, docs/shareable-address.md) and its layout in a narrow
 * window, in a real headless Chromium against the whole application with its illustrative demo library: a copied
 * address opens the same view in a fresh browser, Back and Forward step between views, an older `#material=ID`
 * link still opens, and a 390 px window never scrolls sideways. Skipped (not failed) without Chromium.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = "spring.datasource.url=jdbc:h2:mem:browser-address;DB_CLOSE_DELAY=-1")
class AddressStateBrowserTest {

    /** A requirement of the trade (PRACTICE.md §5: a 365 nm exposure kept free of violet), with a thickness range. */
    private static final String REQUIREMENT = "passes over 80% at 365 nm and blocks under 1% at 405 nm, thickness 1 to 6 mm";
    /** A phone held upright (CSS pixels); the issue's narrowest width to serve is 360. */
    private static final int NARROW = 390;
    private static final int NARROWEST = 360;

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

    @BeforeEach
    void wideWindow() {
        page.resize(1280, 1300);
    }

    @AfterEach
    void noUnexplainedPageMessage() {
        page.assertNoPageMessage();
    }

    @Test
    void aCopiedAddressOpensTheSameViewInAFreshBrowserAndBackAndForwardStepBetweenViews() throws Exception {
        driver.get("about:blank");
        page.open(port, "/");
        WebElement text = driver.findElement(By.id("requirement-text"));
        text.sendKeys(REQUIREMENT);
        driver.findElement(By.id("search-button")).click();
        List<String> resultIds = page.waitForResults(REQUIREMENT);
        assertThat(page.addressParameter("q")).isEqualTo(REQUIREMENT);

        // Open a bulk material among the results, rescale it, switch the axis, a figures choice and the library's words.
        JsonNode material = firstBulk(resultIds);
        String name = material.path("name").asString();
        driver.findElements(By.cssSelector("#results-table tbody tr[data-result-material-id] button.material-link")).stream()
                .filter(b -> b.getText().equals(name)).findFirst().orElseThrow().click();
        page.waitForMaterial(name);
        wait.withMessage(() -> "waiting for the material in the address: " + driver.getCurrentUrl());
        wait.until(d -> String.valueOf(material.path("id").asLong()).equals(page.addressParameter("material")));
        WebElement mm = driver.findElement(By.id("rescale-mm"));
        mm.clear();
        mm.sendKeys("2.5");
        driver.findElement(By.id("rescale-apply")).click();
        page.waitForLegend("rescaled to 2.5 mm");
        new Select(driver.findElement(By.id("axis-mode"))).selectByValue("od");
        new Select(driver.findElement(By.id("figure-convention"))).selectByValue("dermatology");
        driver.findElement(By.id("filter-text")).sendKeys("glass");
        wait.withMessage(() -> "waiting for the whole view in the address: " + driver.getCurrentUrl());
        wait.until(d -> "2.5".equals(page.addressParameter("mm")) && "od".equals(page.addressParameter("axis"))
                && "dermatology".equals(page.addressParameter("fig.convention"))
                && "glass".equals(page.addressParameter("words")));
        String link = driver.getCurrentUrl();
        Set<String> rowsShown = resultRows(driver);
        page.screenshot("address-1-view-to-share", "material-detail");

        // The link in a fresh browser session (own profile, no history): the same requirement, results, material,
        // thickness, axis, figures choice and words.
        try (PageBrowser fresh = PageBrowser.startOrSkip()) {
            fresh.resize(1280, 1300);
            fresh.driver().get(link);
            fresh.waitForMaterial(name);
            fresh.waitForLegend("rescaled to 2.5 mm");
            assertThat(fresh.waitForResults(REQUIREMENT)).isNotEmpty();
            assertThat(resultRows(fresh.driver())).isEqualTo(rowsShown);
            assertThat(fresh.driver().findElement(By.id("requirement-text")).getDomProperty("value")).isEqualTo(REQUIREMENT);
            assertThat(fresh.driver().findElement(By.id("curve-chart")).getDomAttribute("data-axis-mode")).isEqualTo("od");
            assertThat(fresh.driver().findElement(By.id("rescale-mm")).getDomProperty("value")).isEqualTo("2.5");
            assertThat(fresh.driver().findElement(By.id("figure-convention")).getDomProperty("value")).isEqualTo("dermatology");
            assertThat(fresh.driver().findElement(By.id("filter-text")).getDomProperty("value")).isEqualTo("glass");
            fresh.screenshot("address-2-opened-in-fresh-browser", "material-detail");
        }

        // Back: the search as it was before the material was opened; Forward: the material view again.
        driver.navigate().back();
        wait.withMessage("waiting for Back to close the material");
        wait.until(d -> !d.findElement(By.id("material-detail")).isDisplayed());
        assertThat(page.addressParameter("material")).isNull();
        assertThat(page.addressParameter("q")).isEqualTo(REQUIREMENT);
        assertThat(resultRows(driver)).isEqualTo(rowsShown);
        page.screenshot("address-3-back-to-results", "requirement-search");
        driver.navigate().forward();
        page.waitForMaterial(name);
        page.waitForLegend("rescaled to 2.5 mm");
        wait.until(d -> "od".equals(d.findElement(By.id("curve-chart")).getDomAttribute("data-axis-mode")));
        assertThat(page.addressParameter("mm")).isEqualTo("2.5");

        // Back twice: the empty page it started from.
        driver.navigate().back();
        driver.navigate().back();
        wait.withMessage("waiting for Back to the empty page");
        wait.until(d -> !d.findElement(By.id("search-results")).isDisplayed()
                && d.findElement(By.id("requirement-text")).getDomProperty("value").isEmpty());
        assertThat(driver.findElement(By.id("material-detail")).isDisplayed()).isFalse();
    }

    @Test
    void anOlderMaterialLinkStillOpensAndIsRewrittenToTheNewAddress() throws Exception {
        JsonNode material = PageBrowser.getJson(port, "/api/materials").get(0);
        String id = String.valueOf(material.path("id").asLong());
        driver.get("about:blank");
        page.load(port, "/#material=" + id);
        page.waitForMaterial(material.path("name").asString());
        wait.withMessage(() -> "waiting for the address to be rewritten: " + driver.getCurrentUrl());
        wait.until(d -> id.equals(page.addressParameter("material")) && !d.getCurrentUrl().contains("#"));
    }

    @Test
    void aPhoneWideWindowNeverScrollsSideways() throws Exception {
        page.resize(NARROW, 900);
        driver.get("about:blank");
        page.open(port, "/");
        assertThat(page.innerWidth()).as("the window's inner width").isLessThanOrEqualTo(NARROW);
        page.assertNoSidewaysScrolling("the empty page");
        page.screenshot("address-narrow-1-empty", "requirement-search");

        page.load(port, "/?q=" + URLEncoder.encode(REQUIREMENT, StandardCharsets.UTF_8)); // a link to a search
        List<String> resultIds = page.waitForResults(REQUIREMENT);
        page.assertNoSidewaysScrolling("search results");
        page.screenshot("address-narrow-2-results", "search-results");

        JsonNode material = firstBulk(resultIds);
        driver.findElements(By.cssSelector("#results-table tbody tr[data-result-material-id] button.material-link")).stream()
                .filter(b -> b.getText().equals(material.path("name").asString())).findFirst().orElseThrow().click();
        page.waitForMaterial(material.path("name").asString());
        page.waitForLegend("rescaled to");
        wait.until(d -> !"loading".equals(d.findElement(By.id("weighted-figures")).getDomAttribute("data-state")));
        page.assertNoSidewaysScrolling("an opened material");
        page.screenshot("address-narrow-3-material", "material-detail");
        page.screenshot("address-narrow-4-samples", "sample-table");
        page.screenshot("address-narrow-5-chart", "curve-chart");

        page.assertNoSidewaysScrolling("the figures section");
        page.screenshot("address-narrow-6-figures", "weighted-figures");

        // The narrowest width the page serves: the chart follows its container as the window narrows.
        page.resize(NARROWEST, 900);
        try {
            new WebDriverWait(driver, Duration.ofSeconds(5)).until(d -> ((Number) ((JavascriptExecutor) d).executeScript(
                    "return document.scrollingElement.scrollWidth - window.innerWidth")).longValue() <= 0);
        } catch (org.openqa.selenium.TimeoutException stillTooWide) {
            // the assertion below says by how much and which elements stick out
        }
        assertThat(page.innerWidth()).as("the window's inner width").isLessThanOrEqualTo(NARROWEST);
        page.assertNoSidewaysScrolling("an opened material at " + NARROWEST + " px");
        page.screenshot("address-narrow-7-chart-360", "curve-chart");
    }

    // ---------- helpers ----------

    private static Set<String> resultRows(WebDriver browser) {
        return browser.findElements(By.cssSelector("#results-table tbody tr[data-result-material-id]")).stream()
                .map(r -> r.getDomAttribute("data-result-material-id") + "/" + r.getDomAttribute("data-sample-id"))
                .collect(Collectors.toCollection(java.util.LinkedHashSet::new));
    }

    /** The first result whose material scales with thickness (bulk), so the rescale box is offered. */
    private JsonNode firstBulk(List<String> resultIds) throws Exception {
        JsonNode materials = PageBrowser.getJson(port, "/api/materials");
        for (String id : resultIds) {
            for (JsonNode m : materials) {
                if (String.valueOf(m.path("id").asLong()).equals(id) && "bulk".equals(m.path("scaling").asString())) {
                    return m;
                }
            }
        }
        throw new AssertionError("no bulk material among the results " + resultIds);
    }
}
