package org.spectralsieve.web;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.util.List;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.openqa.selenium.By;
import org.openqa.selenium.JavascriptExecutor;
import org.openqa.selenium.WebDriver;
import org.openqa.selenium.WebElement;
import org.openqa.selenium.support.ui.WebDriverWait;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.test.context.TestPropertySource;

/**
 * The Compare section in a real headless Chromium against the whole application with its demo library:
 * the shortlist's top rows overlaid at the thicknesses they were judged at, the requirement drawn over
 * them and listed as text. Skipped (not failed) on machines without Chromium and its driver.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = "spring.datasource.url=jdbc:h2:mem:browser-compare;DB_CLOSE_DELAY=-1")
class CompareChartBrowserTest {

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
    void comparingTheTopThreeDrawsThreeCurvesAtTheirThicknessesWithBothPointClausesMarked() throws IOException {
        String requirement = "passes over 80% at 365 nm and blocks under 1% at 405 nm, thickness 1 to 6 mm";
        search(requirement, 20);
        assertThat(driver.findElements(By.cssSelector("#compare-rows input[type=checkbox]")))
                .as("one tick box per shortlist row").hasSizeGreaterThanOrEqualTo(3);

        driver.findElement(By.id("compare-top3")).click();
        waitForSeries(3);
        // uPlot's own legend: the wavelength column and one row per curve
        assertThat(driver.findElements(By.cssSelector("#compare-chart .u-legend tr.u-series"))).hasSize(4);
        assertThat(driver.findElements(By.cssSelector("#compare-chart canvas"))).isNotEmpty();

        // the text legend names each curve's thickness and, for a rescaled one, the thickness it came from
        List<String> key = texts("#compare-key li");
        assertThat(key).hasSize(3).allSatisfy(line -> assertThat(line).containsPattern("\\d mm, (measured|rescaled from)"));
        assertThat(key).extracting(line -> line.replaceAll(";.*", "")).doesNotHaveDuplicates();
        // colour is never the only cue: every curve names its colour and a dash pattern of its own
        assertThat(key).extracting(line -> line.replaceAll(".*; (\\S+ ?\\S*), ([a-z -]+?)(;.*)?$", "$2")).doesNotHaveDuplicates();

        // the requirement: a marker with an arrow up at 365 nm (passes), down at 405 nm (blocks)
        List<WebElement> clauses = driver.findElements(By.cssSelector("#compare-clauses li"));
        assertThat(clauses).extracting(c -> c.getDomAttribute("data-clause-kind")).containsExactly("point", "point");
        assertThat(clauses).extracting(c -> c.getDomAttribute("data-direction")).containsExactly("pass", "block");
        assertThat(clauses.get(0).getText()).contains("365 nm").contains("arrow up");
        assertThat(clauses.get(1).getText()).contains("405 nm").contains("arrow down");
        page.screenshot("compare-1-top-three", "compare");

        // the OD axis redraws the same three curves
        new org.openqa.selenium.support.ui.Select(driver.findElement(By.id("compare-axis"))).selectByValue("od");
        wait.until(d -> "od".equals(d.findElement(By.id("compare-chart")).getDomAttribute("data-axis-mode")));
        waitForSeries(3);
        // OD rises as T falls: "passes" (T at least) now points down the page, "blocks" up
        wait.until(d -> d.findElements(By.cssSelector("#compare-clauses li")).get(0).getText().contains("arrow down"));
        assertThat(texts("#compare-clauses li").get(1)).contains("arrow up");
        page.screenshot("compare-2-top-three-od", "compare");
    }

    @Test
    void aBandClauseIsShadedAndAMaterialAddedByNameJoinsTheOverlay() throws IOException {
        search("blocks under 1% from 300 to 500 nm and passes over 20% at 600 nm", 20);
        driver.findElement(By.id("compare-top3")).click();
        waitForSeries(3);
        List<WebElement> clauses = driver.findElements(By.cssSelector("#compare-clauses li"));
        assertThat(clauses).extracting(c -> c.getDomAttribute("data-clause-kind")).containsExactly("band", "point");
        assertThat(clauses.get(0).getText()).contains("300–500 nm").contains("shaded");

        String name = (String) ((JavascriptExecutor) driver).executeScript(
                "return fetch('api/materials').then(r => r.json()).then(m => (Array.isArray(m) ? m : m.materials)"
                        + ".map(x => x.name).find(n => /fused silica/i.test(n)))");
        WebElement pick = driver.findElement(By.id("compare-pick"));
        pick.sendKeys(name);
        driver.findElement(By.id("compare-add")).click();
        waitForSeries(4);
        assertThat(texts("#compare-key li").get(3)).startsWith("4. " + name).contains("added");
        page.screenshot("compare-3-band-and-added", "compare");
    }

    @Test
    void aWeightedClauseIsDrawnAsItsEmittersBand() throws IOException {
        search("passes over 85% of led 395, thickness 1 to 6 mm", 10);
        driver.findElement(By.id("compare-top3")).click();
        waitForSeries(3);
        List<WebElement> clauses = driver.findElements(By.cssSelector("#compare-clauses li"));
        assertThat(clauses).extracting(c -> c.getDomAttribute("data-clause-kind")).containsExactly("weighted");
        assertThat(clauses.get(0).getText()).contains("led-395").containsPattern("emitter band \\d+–\\d+ nm");
        page.screenshot("compare-5-weighted", "compare");
    }

    @Test
    void twentyCurvesOverlaidStillDraw() throws IOException {
        search("passes over 1% at 600 nm", 20);
        // tick every row at once, then ask for one redraw (as a user's last tick would)
        ((JavascriptExecutor) driver).executeScript(
                "const boxes = [...document.querySelectorAll('#compare-rows input[type=checkbox]')];"
                        + "boxes.forEach(b => { b.checked = true; });"
                        + "boxes[boxes.length - 1].dispatchEvent(new Event('change'));");
        int rows = driver.findElements(By.cssSelector("#compare-rows input[type=checkbox]")).size();
        assertThat(rows).as("the search offers twenty rows").isEqualTo(20);
        waitForSeries(20);
        assertThat(driver.findElements(By.cssSelector("#compare-chart .u-legend tr.u-series"))).hasSize(21);
        assertThat(texts("#compare-key li")).hasSize(20);
        page.screenshot("compare-4-twenty-curves", "compare");
    }

    private void search(String requirement, int limit) {
        page.load(port, "/");
        WebElement text = driver.findElement(By.id("requirement-text"));
        WebElement limitBox = driver.findElement(By.id("search-limit"));
        limitBox.clear();
        limitBox.sendKeys(String.valueOf(limit));
        text.sendKeys(requirement);
        driver.findElement(By.id("search-button")).click();
        wait.withMessage(() -> "waiting for results of '" + requirement + "'; message: "
                + driver.findElement(By.id("message")).getText());
        wait.until(d -> requirement.equals(d.findElement(By.id("results-table")).getDomAttribute("data-requirement"))
                && d.findElement(By.id("compare")).isDisplayed());
    }

    private void waitForSeries(int count) {
        wait.withMessage(() -> "waiting for " + count + " compared curves; status: "
                + driver.findElement(By.id("compare-status")).getText());
        wait.until(d -> String.valueOf(count).equals(d.findElement(By.id("compare-chart")).getDomAttribute("data-series"))
                && d.findElement(By.id("compare-status")).getText().endsWith("compared"));
    }

    private List<String> texts(String css) {
        return driver.findElements(By.cssSelector(css)).stream().map(WebElement::getText).toList();
    }
}
