package org.spectralsieve.web;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.net.URI;
import java.net.http.HttpResponse;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.openqa.selenium.By;
import org.openqa.selenium.JavascriptExecutor;
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
 * The page's finish (docs/page-polish.md) in headless Chromium against the whole application and its
 * illustrative demo library: the figures' defaults and pickers, problems shown once beside their cause and
 * gone after a success, no HTTP status codes in the page, the favicon. Skipped without Chromium.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = "spring.datasource.url=jdbc:h2:mem:browser-polish;DB_CLOSE_DELAY=-1")
class PagePolishBrowserTest {

    /** A bulk plastic of the demo library: it can be rescaled. */
    private static final String ACRYLIC = "UV-transmitting cast acrylic, lamp-cover grade";

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
    void figuresAreUnweightedByDefaultAndTheSolarListHoldsOnlySunlight() throws Exception {
        page.load(port, "/");
        page.openMaterialFromLibrary(ACRYLIC);
        WebElement status = driver.findElement(By.id("figures-status"));
        wait.until(d -> status.getText().contains("led-365 × flat"));
        assertThat(new Select(driver.findElement(By.id("figure-response"))).getFirstSelectedOption()
                .getDomAttribute("value")).isEqualTo("flat");
        // the chosen pair has a number: the LED lies within the stored curve
        assertThat(driver.findElement(By.cssSelector("#figures-table tr[data-figure='effectiveTransmittance'] td.value"))
                .getText()).endsWith("%");

        // The picker offers exactly the emitters the server marks as sunlight, never an LED, lamp or "flat".
        List<String> solarFromApi = new ArrayList<>();
        for (JsonNode e : PageBrowser.getJson(port, "/api/emitters").path("emitters")) {
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
        page.screenshotOfElement("polish-1-figures-defaults", driver.findElement(By.id("weighted-figures")));
    }

    @Test
    void aFailedSearchShowsOneMessageBesideTheTextAndNoEarlierResults() throws Exception {
        page.load(port, "/");
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
        // nor offered for comparison: the compare section listed the earlier shortlist's rows
        assertThat(driver.findElement(By.id("compare")).isDisplayed()).as("compare section after a failed search").isFalse();
        assertThat(driver.findElements(By.cssSelector("#compare input[type=checkbox]"))).isEmpty();
        assertThat(driver.findElement(By.tagName("body")).getText()).doesNotContain("(400)");
        page.screenshotOfTop("polish-2-failed-search");
    }

    @Test
    void aRefusedRescaleIsShownBesideItsButtonAndGoesAfterASuccess() throws Exception {
        page.load(port, "/");
        page.openMaterialFromLibrary(ACRYLIC);
        WebElement mm = driver.findElement(By.id("rescale-mm"));
        WebElement error = driver.findElement(By.id("rescale-error"));
        // beyond the largest thickness the server rescales to (1000 mm): refused by the server
        mm.sendKeys("5000", Keys.ENTER);
        wait.until(d -> error.isDisplayed());
        assertThat(error.getText()).startsWith("Not rescaled:").contains("1000").doesNotContain("thicknessMm");
        assertThat(driver.findElement(By.id("message")).isDisplayed()).as("no banner far from the button").isFalse();
        assertThat(driver.findElement(By.tagName("body")).getText()).doesNotContain("(400)");
        page.screenshotOfElement("polish-3-rescale-refused", driver.findElement(By.id("material-detail")));

        mm.clear();
        mm.sendKeys("5", Keys.ENTER);
        wait.until(d -> d.findElements(By.cssSelector("#curve-chart .u-legend .u-label")).stream()
                .anyMatch(label -> label.getDomProperty("textContent").startsWith("rescaled to 5 mm")));
        assertThat(error.isDisplayed()).as("the refusal goes once a rescale succeeds").isFalse();
        assertThat(error.getText()).isEmpty();
    }

    @Test
    void theChartOffersARangeAResetAndSaysHowToZoom() throws Exception {
        page.load(port, "/");
        page.openMaterialFromLibrary(ACRYLIC);
        wait.until(d -> !d.findElements(By.cssSelector("#curve-chart canvas")).isEmpty());
        assertThat(driver.findElement(By.id("zoom-hint")).getText()).contains("Drag").contains("Reset view");
        driver.findElement(By.cssSelector("[data-range-preset='0-10']")).click();
        assertThat(driver.findElement(By.id("range-to")).getDomProperty("value")).isEqualTo("10");
        // a range the wrong way round is refused beside the inputs
        WebElement to = driver.findElement(By.id("range-to"));
        to.clear();
        to.sendKeys("0", Keys.TAB);
        wait.until(d -> d.findElement(By.id("range-error")).isDisplayed());
        page.screenshotOfElement("polish-4-chart-range", driver.findElement(By.id("material-detail")));
        driver.findElement(By.id("chart-reset")).click();
        assertThat(driver.findElement(By.id("range-error")).isDisplayed()).isFalse();
        assertThat(to.getDomProperty("value")).isEmpty();
        // the OD axis, with its headroom above the detection-limit bounds
        new Select(driver.findElement(By.id("axis-mode"))).selectByValue("od");
        wait.until(d -> "od".equals(d.findElement(By.id("curve-chart")).getDomAttribute("data-axis-mode")));
        assertThat(driver.findElement(By.id("linear-range")).isDisplayed()).as("range is for the linear axis").isFalse();
        page.screenshotOfElement("polish-5-chart-od", driver.findElement(By.id("material-detail")));
    }

    @Test
    void longFloatsInServerMessagesAreWrittenWithFourSignificantDigits() {
        page.load(port, "/");
        Object tidy = ((JavascriptExecutor) driver).executeAsyncScript("""
                const done = arguments[arguments.length - 1];
                import('./polish.js').then((m) => done(m.tidyNumbers(
                    'step 0.9977272727272727 nm between 312.5 and 1234.56789012 nm')));""");
        // four significant digits, or as many as the whole part needs (common practice, no source)
        assertThat(tidy).isEqualTo("step 0.9977 nm between 312.5 and 1234.6 nm");
    }

    @Test
    void theFaviconIsLinkedAndServed() throws Exception {
        page.load(port, "/");
        WebElement icon = driver.findElement(By.cssSelector("link[rel='icon']"));
        String href = icon.getDomProperty("href");
        HttpResponse<String> response = PageBrowser.get(port, URI.create(href).getRawPath());
        assertThat(response.statusCode()).isEqualTo(200);
        assertThat(response.headers().firstValue("content-type").orElse("")).contains("svg");
        assertThat(response.body()).contains("<svg");
    }
}
