package org.spectralsieve.web;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.util.List;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.openqa.selenium.By;
import org.openqa.selenium.Keys;
import org.openqa.selenium.WebDriver;
import org.openqa.selenium.WebElement;
import org.openqa.selenium.support.ui.WebDriverWait;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.test.context.TestPropertySource;

/**
 * The requirement search on the page, in a real headless Chromium against the whole application with
 * its demo library: the clauses are shown as the server read them while typing, a search ranks the
 * library, a misspelt word is located and fixed by one click. One browser session for all checks keeps
 * the run short. Skipped (not failed) on machines without Chromium and its driver.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = "spring.datasource.url=jdbc:h2:mem:browser-search;DB_CLOSE_DELAY=-1")
class RequirementSearchBrowserTest {

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
    void searchShowsUnderstoodClausesRanksFusedSilicaFirstAtTwoFiftyFourAndFixesAMisspeltWordByOneClick()
            throws IOException {
        page.load(port, "/");
        WebElement text = driver.findElement(By.id("requirement-text"));
        assertThat(driver.findElements(By.cssSelector("#requirement-examples button.chip")))
                .as("example requirements offered").isNotEmpty();

        // While typing, the server's reading appears: one transmittance clause and the thickness setting.
        text.sendKeys("passes over 80% at 254 nm, at 3 mm");
        List<String> clauses = waitForClauses(2);
        assertThat(clauses).containsExactly("T ≥ 80 % at 254 nm", "thickness: 3 mm (bulk curves rescaled)");

        // Enter searches. A UV-grade fused silica passes 254 nm at 3 mm (common practice, no source).
        text.sendKeys(Keys.ENTER);
        WebElement first = waitForResultsFor("passes over 80% at 254 nm, at 3 mm");
        List<WebElement> cells = first.findElements(By.tagName("td"));
        assertThat(cells.get(1).getText()).containsIgnoringCase("UV-grade").containsIgnoringCase("fused silica");
        assertThat(first.getDomAttribute("data-verdict")).isEqualTo("meets");
        assertThat(cells.get(2).getText()).contains("meets");
        // the thickness judged, then the sample behind it: fused silica is measured at 3 mm (seed catalogue)
        assertThat(cells.get(3).getText()).isEqualTo("3 mm\nmeasured at 3 mm");
        assertThat(cells.get(4).getText()).as("how the sample was measured").isEqualTo("regular");
        assertThat(cells.get(5).getText()).as("worst margin written with its sign").startsWith("+");
        // rows come in groups under headings, the meets first (the same words as the command line's)
        List<WebElement> groups = driver.findElements(By.cssSelector("#results-table tr.result-group"));
        assertThat(groups.get(0).getText()).isEqualTo("Meets: the data prove every clause");
        assertThat(groups).extracting(g -> g.getDomAttribute("data-group")).doesNotHaveDuplicates();
        assertThat(driver.findElement(By.id("search-summary")).getText()).matches("Evaluated \\d+ samples in .* ms.*");
        assertThat(driver.findElement(By.id("search-caution")).isDisplayed())
                .as("no caution for a requirement that only passes light").isFalse();

        // A row opens to every clause's value, margin, verdict and explanation.
        first.findElement(By.cssSelector("button.toggle")).click();
        WebElement explained = driver.findElement(By.cssSelector("#results-table tr.result-clauses"));
        wait.until(d -> explained.isDisplayed());
        assertThat(explained.getText()).contains("T at 254 nm is").contains("%");
        // beside each clause verdict its confidence: the demo curves carry no measurement uncertainty
        assertThat(explained.findElement(By.cssSelector(".verdict-confidence")).getText()).isEqualTo("· confidence unknown");
        page.screenshotOfTop("search-1-fused-silica");

        // Opening a result shows the existing material detail; the row's sample was measured at the thickness
        // searched, so the chart shows that measurement and no curve rescaled onto it (docs/result-rows.md).
        String silica = cells.get(1).getText();
        first.findElement(By.cssSelector("button.material-link")).click();
        wait.until(d -> silica.equals(d.findElement(By.id("detail-name")).getText()));
        wait.withMessage("waiting for the curve measured at the searched thickness");
        wait.until(d -> d.findElements(By.cssSelector("#curve-chart .u-legend .u-label")).stream()
                .anyMatch(label -> label.getDomProperty("textContent").startsWith("3 mm regular")));
        assertThat(driver.findElement(By.id("rescale-mm")).getDomProperty("value")).isEmpty();
        assertThat(driver.findElements(By.cssSelector("#curve-chart .u-legend .u-label")))
                .noneMatch(label -> label.getDomProperty("textContent").startsWith("rescaled to"));

        // A misspelt word: the server's detail is shown, the word is marked and its fix offered.
        text.sendKeys(Keys.chord(Keys.CONTROL, "a"), Keys.DELETE);
        text.sendKeys("blocks undr 1% at 405 nm");
        WebElement error = driver.findElement(By.id("requirement-error"));
        wait.withMessage("waiting for the parse error to be shown");
        wait.until(d -> error.isDisplayed());
        assertThat(error.getText()).contains("undr");
        assertThat(error.findElement(By.cssSelector(".marked-text mark")).getText()).isEqualTo("undr");
        WebElement fix = error.findElement(By.cssSelector("button.suggestion"));
        assertThat(fix.getText()).isEqualTo("under");
        page.screenshotOfTop("search-2-misspelt");

        fix.click();
        assertThat(text.getDomProperty("value")).isEqualTo("blocks under 1% at 405 nm");
        waitForResultsFor("blocks under 1% at 405 nm");
        assertThat(error.isDisplayed()).as("error cleared once the text reads").isFalse();
        assertThat(waitForClauses(2)).containsExactly("T ≤ 1 % at 405 nm", "thickness: as measured");
        assertThat(driver.findElement(By.id("search-caution")).getText())
                .contains("Screening estimate from stored curves, not a certification");
        page.screenshotOfTop("search-3-fixed-and-blocking");

        // An example written in optical density: its clause values are shown as OD, as it was written.
        String odExample = "blocks to OD 3 or more from 350 to 420 nm";
        driver.findElement(By.cssSelector("#requirement-examples button[data-example='" + odExample + "']")).click();
        WebElement odFirst = waitForResultsFor(odExample);
        assertThat(waitForClauses(2).get(0)).isEqualTo("OD ≥ 3 (T ≤ 0.1 %) over 350–420 nm");
        odFirst.findElement(By.cssSelector("button.toggle")).click();
        WebElement odClause = driver.findElement(By.cssSelector("#results-table tr.result-clauses:not([hidden]) tbody td.num"));
        assertThat(odClause.getText()).startsWith("OD ");
        page.screenshotOfTop("search-4-optical-density");

        WebElement message = driver.findElement(By.id("message"));
        assertThat(message.isDisplayed()).as("error area stays hidden, but shows: %s", message.getText()).isFalse();
    }

    @Test
    void aStackExampleShowsItsLayerAndAMisspeltLedNameIsReplacedWhole() throws IOException {
        page.load(port, "/");
        WebElement text = driver.findElement(By.id("requirement-text"));

        // The example for a film on a window: its clauses, the layer as a setting, the glass sample in the summary.
        String stack = "blocks under 1% at 405 nm and luminous over 70%, behind 4 mm clear float glass";
        driver.findElement(By.cssSelector("#requirement-examples button[data-example='" + stack + "']")).click();
        WebElement first = waitForResultsFor(stack);
        assertThat(waitForClauses(4)).containsExactly("T ≤ 1 % at 405 nm", "luminous τv ≥ 70 % (380–780 nm)",
                "thickness: as measured", "light path: behind 4 mm clear float glass");
        assertThat(first.getDomAttribute("data-verdict")).isEqualTo("meets");
        assertThat(driver.findElement(By.id("search-summary")).getText())
                .contains("judged as a stack, behind 4 mm Clear float glass").contains("clear-float-glass, sample");
        assertThat(driver.findElement(By.id("search-caution")).isDisplayed())
                .as("luminous transmittance is an eye-safety figure").isTrue();
        page.screenshotOfTop("search-5-stack");

        // A misspelt LED: both words are marked and the stored name replaces them in one click.
        text.sendKeys(Keys.chord(Keys.CONTROL, "a"), Keys.DELETE);
        text.sendKeys("passes over 85% of led 356");
        WebElement error = driver.findElement(By.id("requirement-error"));
        wait.withMessage("waiting for the parse error to be shown");
        wait.until(d -> error.isDisplayed());
        assertThat(error.findElement(By.cssSelector(".marked-text mark")).getText()).isEqualTo("led 356");
        WebElement fix = error.findElement(By.cssSelector("button.suggestion"));
        assertThat(fix.getText()).isEqualTo("led-365");
        fix.click();
        assertThat(text.getDomProperty("value")).isEqualTo("passes over 85% of led-365");
        waitForResultsFor("passes over 85% of led-365");
        assertThat(waitForClauses(2).get(0)).isEqualTo("T of led-365 ≥ 85 % (329–401 nm)");
        page.screenshotOfTop("search-6-led-fixed");
    }

    @Test
    void aBlockedShareIsShownAsItsCeilingAndAnAmbiguousOneOffersBothReadings() throws IOException {
        page.load(port, "/");
        WebElement text = driver.findElement(By.id("requirement-text"));

        // "blocks 99 %" keeps 99 % out (common practice, no source): the page shows the reading, T ≤ 1 %.
        text.sendKeys("blocks 99% at 405 nm");
        assertThat(waitForClauses(2)).containsExactly("T ≤ 1 % at 405 nm", "thickness: as measured");

        // "blocks 1 %" reads two ways: the span is marked and each reading offered as a fix.
        text.sendKeys(Keys.chord(Keys.CONTROL, "a"), Keys.DELETE);
        text.sendKeys("blocks 1% at 405 nm");
        WebElement error = driver.findElement(By.id("requirement-error"));
        wait.withMessage("waiting for the two readings to be shown");
        wait.until(d -> error.isDisplayed());
        assertThat(error.getText()).contains("transmits under 99%").contains("blocks under 1%");
        assertThat(error.findElement(By.cssSelector(".marked-text mark")).getText()).isEqualTo("blocks 1%");
        List<WebElement> fixes = error.findElements(By.cssSelector("button.suggestion"));
        assertThat(fixes).extracting(WebElement::getText).containsExactly("blocks under 1%", "transmits under 99%");
        page.screenshotOfTop("search-7-two-readings");

        fixes.get(0).click();
        assertThat(text.getDomProperty("value")).isEqualTo("blocks under 1% at 405 nm");
        waitForResultsFor("blocks under 1% at 405 nm");
        assertThat(waitForClauses(2)).containsExactly("T ≤ 1 % at 405 nm", "thickness: as measured");
    }

    @Test
    void wordsBeforeTheClausesAreShownAndTheSummarySaysHowManyMaterialsTheyAdmitted() throws IOException {
        page.load(port, "/");
        WebElement text = driver.findElement(By.id("requirement-text"));

        String requirement = "acrylic passes over 80% at 400 nm";
        text.sendKeys(requirement);
        assertThat(waitForClauses(3)).contains("T ≥ 80 % at 400 nm", "words: “acrylic”");

        text.sendKeys(Keys.ENTER);
        WebElement first = waitForResultsFor(requirement);
        assertThat(first.findElements(By.tagName("td")).get(1).getText()).containsIgnoringCase("acrylic");
        assertThat(driver.findElement(By.id("search-summary")).getText())
                .matches("Evaluated \\d+ samples in .* ms.* · words “acrylic” admitted \\d+ materials");
        assertThat(driver.findElement(By.id("search-results")).getDomAttribute("class")).as("results not marked stale")
                .doesNotContain("stale");
        page.screenshotOfTop("search-words-acrylic");
    }

    private List<String> waitForClauses(int count) {
        wait.withMessage(() -> "waiting for " + count + " understood clauses; now: " + clauseTexts()
                + "; error: " + driver.findElement(By.id("requirement-error")).getText());
        wait.until(d -> clauseTexts().size() == count);
        return clauseTexts();
    }

    private List<String> clauseTexts() {
        return driver.findElements(By.cssSelector("#requirement-clauses li")).stream().map(WebElement::getText).toList();
    }

    /** The first result row, once the table shows the answer to this requirement. */
    private WebElement waitForResultsFor(String requirement) {
        wait.withMessage(() -> "waiting for results of '" + requirement + "'; summary: "
                + driver.findElement(By.id("search-summary")).getText()
                + "; message: " + driver.findElement(By.id("message")).getText());
        wait.until(d -> requirement.equals(d.findElement(By.id("results-table")).getDomAttribute("data-requirement"))
                && !d.findElements(By.cssSelector("#results-table tr[data-result-material-id]")).isEmpty());
        return driver.findElement(By.cssSelector("#results-table tr[data-result-material-id]"));
    }
}
