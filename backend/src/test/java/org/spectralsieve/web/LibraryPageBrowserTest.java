package org.spectralsieve.web;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.List;
import java.util.function.IntPredicate;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.BeforeEach;
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

/**
 * The library page in a real headless Chromium against the whole application with its demo library:
 * list, filter, open a material, switch the axis to optical density, draw a rescaled curve.
 * Skipped (not failed) on machines without Chromium and its driver.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = "spring.datasource.url=jdbc:h2:mem:browser;DB_CLOSE_DELAY=-1")
class LibraryPageBrowserTest {

    private static final Path OUTPUT = HeadlessChromium.OUTPUT;

    /** The demo library holds more than this many materials; fewer means seeding did not happen. */
    private static final int MIN_DEMO_MATERIALS = 40;
    private static final Duration PATIENCE = Duration.ofSeconds(30);

    @LocalServerPort
    private int port;

    private WebDriver driver;
    private WebDriverWait wait;

    @BeforeAll
    static void needsABrowser() {
        // Checked before Spring starts, so a machine without a browser pays nothing.
        HeadlessChromium.assumeInstalled();
    }

    @BeforeEach
    void startBrowser() throws IOException {
        driver = HeadlessChromium.start();
        wait = new WebDriverWait(driver, PATIENCE);
        // The page replaces table rows and the chart as answers arrive; a stale element means "look again".
        wait.ignoring(StaleElementReferenceException.class);
    }

    @AfterEach
    void stopBrowser() {
        if (driver != null) {
            driver.quit();
        }
    }

    @Test
    void libraryPageFiltersOpensAMaterialSwitchesToOpticalDensityAndDrawsARescaledCurve() throws IOException {
        driver.get("http://localhost:" + port + "/");

        int all = waitForRowCount(n -> n >= MIN_DEMO_MATERIALS, "at least " + MIN_DEMO_MATERIALS + " materials");
        assertThat(all).isGreaterThanOrEqualTo(MIN_DEMO_MATERIALS);
        assertThat(driver.findElement(By.tagName("footer")).getText())
                .contains("UV sources harm eyes and skin.");
        screenshot("1-library");

        // Filtering by one class leaves fewer rows, all of that class.
        Select classes = new Select(driver.findElement(By.id("filter-class")));
        assertThat(classes.getOptions()).as("class drop-down filled from the data").hasSizeGreaterThan(2);
        String chosenClass = classes.getOptions().get(1).getDomAttribute("value");
        classes.selectByValue(chosenClass);
        int filtered = waitForRowCount(n -> n > 0 && n < all && allRowsHaveClass(chosenClass),
                "fewer rows, all of class '" + chosenClass + "'");
        assertThat(filtered).isLessThan(all);

        // Back to the whole library, then open a bulk material (one that can be rescaled).
        classes.selectByValue("");
        waitForRowCount(n -> n == all, "all " + all + " rows again");
        WebElement row = driver.findElement(By.cssSelector("#material-table tr[data-material-id][data-scaling='bulk']"));
        String materialName = row.findElement(By.cssSelector("td")).getText();
        row.click();

        WebElement detail = driver.findElement(By.id("material-detail"));
        wait.until(d -> detail.isDisplayed() && materialName.equals(d.findElement(By.id("detail-name")).getText()));
        assertThat(detail.findElements(By.cssSelector("#sample-table tbody tr"))).isNotEmpty();
        assertThat(detail.findElements(By.cssSelector("#sample-table a[href$='/curve.csv']"))).isNotEmpty();
        wait.until(d -> !d.findElements(By.cssSelector("#curve-chart canvas")).isEmpty());
        int measuredSeries = waitForLegend(n -> n >= 1, "at least one curve in the legend").size();
        screenshot("2-detail-linear");

        // Optical density axis: the chart is drawn anew on the other scale.
        new Select(driver.findElement(By.id("axis-mode"))).selectByValue("od");
        wait.until(d -> "od".equals(d.findElement(By.id("curve-chart")).getDomAttribute("data-axis-mode")));
        assertThat(driver.findElements(By.cssSelector("#curve-chart canvas"))).isNotEmpty();
        screenshot("3-detail-od");

        // Rescale: a further series appears, named for the new thickness, still on the OD axis.
        WebElement thickness = driver.findElement(By.id("rescale-mm"));
        assertThat(thickness.isEnabled()).as("rescale box enabled for a bulk material").isTrue();
        thickness.sendKeys("5", Keys.ENTER);
        List<String> legend = waitForLegend(n -> n > measuredSeries, "a rescaled series added to the legend");
        assertThat(legend).anyMatch(label -> label.startsWith("rescaled to 5 mm"));
        assertThat(driver.findElement(By.id("curve-chart")).getDomAttribute("data-axis-mode")).isEqualTo("od");
        screenshot("4-rescaled-od");

        WebElement message = driver.findElement(By.id("message"));
        assertThat(message.isDisplayed()).as("error area stays hidden, but shows: %s", message.getText()).isFalse();
    }

    @Test
    void unknownMaterialShowsTheServersProblemDetailInTheMessageArea() throws IOException {
        driver.get("http://localhost:" + port + "/#material=987654321");

        WebElement message = driver.findElement(By.id("message"));
        wait.withMessage("waiting for the 404 problem detail to be shown");
        wait.until(d -> message.isDisplayed());
        // The page quotes the problem's status and its detail, which names the missing id.
        assertThat(message.getText()).contains("404").contains("987654321");
        assertThat(driver.findElement(By.id("material-detail")).isDisplayed()).isFalse();
        screenshot("5-unknown-material");
    }

    private int waitForRowCount(IntPredicate condition, String what) {
        wait.withMessage(() -> "waiting for " + what + "; rows now: " + rows().size()
                + "; message: " + driver.findElement(By.id("message")).getText());
        wait.until(d -> condition.test(rows().size()));
        return rows().size();
    }

    private List<WebElement> rows() {
        return driver.findElements(By.cssSelector("#material-table tr[data-material-id]"));
    }

    private boolean allRowsHaveClass(String materialClass) {
        return rows().stream().allMatch(r -> materialClass.equals(r.findElements(By.tagName("td")).get(1).getText()));
    }

    /** Labels of the chart's data series (the wavelength column of the legend left out). */
    private List<String> waitForLegend(IntPredicate condition, String what) {
        wait.withMessage(() -> "waiting for " + what + "; legend now: " + legendLabels());
        wait.until(d -> condition.test(legendLabels().size()));
        return legendLabels();
    }

    private List<String> legendLabels() {
        List<String> labels = driver.findElements(By.cssSelector("#curve-chart .u-legend .u-series .u-label"))
                .stream().map(e -> e.getDomProperty("textContent")).toList();
        return labels.isEmpty() ? labels : labels.subList(1, labels.size());
    }

    private void screenshot(String name) throws IOException {
        List<WebElement> chart = driver.findElements(By.cssSelector("#curve-chart canvas"));
        if (!chart.isEmpty() && chart.get(0).isDisplayed()) {
            // Screenshots show the viewport only; bring the chart into it.
            ((JavascriptExecutor) driver).executeScript("arguments[0].scrollIntoView({block: 'center'})", chart.get(0));
        }
        byte[] png = ((TakesScreenshot) driver).getScreenshotAs(OutputType.BYTES);
        Files.write(Files.createDirectories(OUTPUT).resolve(name + ".png"), png);
    }
}
