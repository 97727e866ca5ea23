package org.spectralsieve.web;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.util.List;
import java.util.function.IntPredicate;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.openqa.selenium.By;
import org.openqa.selenium.Keys;
import org.openqa.selenium.WebDriver;
import org.openqa.selenium.WebElement;
import java.util.LinkedHashMap;
import java.util.Map;
import org.openqa.selenium.support.ui.Select;
import org.openqa.selenium.support.ui.WebDriverWait;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.test.context.TestPropertySource;

/**
 * The library page in a real headless Chromium against the whole application with its demo library:
 * list, search by words, tick facet values, open a material, switch the axis to optical density, draw a rescaled curve.
 * Skipped (not failed) on machines without Chromium and its driver.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = "spring.datasource.url=jdbc:h2:mem:browser;DB_CLOSE_DELAY=-1")
class LibraryPageBrowserTest {

    /** The demo library holds more than this many materials; fewer means seeding did not happen. */
    private static final int MIN_DEMO_MATERIALS = 40;

    @LocalServerPort
    private int port;

    private PageBrowser page;
    private WebDriver driver;
    private WebDriverWait wait;

    @BeforeAll
    static void needsABrowser() {
        // Checked before Spring starts, so a machine without a browser pays nothing.
        HeadlessChromium.assumeInstalled();
    }

    @BeforeEach
    void startBrowser() throws IOException {
        page = PageBrowser.startOrSkip();
        driver = page.driver();
        wait = page.waiting();
    }

    @AfterEach
    void stopBrowser() {
        if (page != null) {
            page.close();
        }
    }

    @Test
    void libraryPageFiltersOpensAMaterialSwitchesToOpticalDensityAndDrawsARescaledCurve() throws IOException {
        page.load(port, "/");

        int all = waitForRowCount(n -> n >= MIN_DEMO_MATERIALS, "at least " + MIN_DEMO_MATERIALS + " materials");
        assertThat(all).isGreaterThanOrEqualTo(MIN_DEMO_MATERIALS);
        assertThat(driver.findElement(By.tagName("footer")).getText())
                .contains("UV sources harm eyes and skin.");
        page.screenshot("1-library", "curve-chart");

        // Ticking one class leaves fewer rows, all of that class.
        List<WebElement> classBoxes = facetBoxes("class");
        assertThat(classBoxes).as("class group filled from the data").hasSizeGreaterThan(1);
        String chosenClass = classBoxes.get(0).getDomAttribute("value");
        classBoxes.get(0).click();
        int filtered = waitForRowCount(n -> n > 0 && n < all && allRowsHaveClass(chosenClass),
                "fewer rows, all of class '" + chosenClass + "'");
        assertThat(filtered).isLessThan(all);

        // Back to the whole library, then open a bulk material (one that can be rescaled).
        facetBox("class", chosenClass).click();
        waitForRowCount(n -> n == all, "all " + all + " rows again");
        WebElement row = driver.findElement(By.cssSelector("#material-table tr[data-material-id][data-scaling='bulk']"));
        String materialName = row.findElement(By.cssSelector("td")).getText();
        row.click();

        WebElement detail = driver.findElement(By.id("material-detail"));
        wait.until(d -> detail.isDisplayed() && materialName.equals(d.findElement(By.id("detail-name")).getText()));
        assertThat(detail.findElements(By.cssSelector("#sample-table tbody tr"))).isNotEmpty();
        assertThat(detail.findElements(By.cssSelector("#sample-table a[href$='/curve.csv']"))).isNotEmpty();
        wait.until(d -> !d.findElements(By.cssSelector("#curve-chart canvas")).isEmpty());
        int measuredSeries = page.waitForLegend(n -> n >= 1, "at least one curve in the legend").size();
        page.screenshot("2-detail-linear", "curve-chart");

        // Optical density axis: the chart is drawn anew on the other scale.
        new Select(driver.findElement(By.id("axis-mode"))).selectByValue("od");
        wait.until(d -> "od".equals(d.findElement(By.id("curve-chart")).getDomAttribute("data-axis-mode")));
        assertThat(driver.findElements(By.cssSelector("#curve-chart canvas"))).isNotEmpty();
        page.screenshot("3-detail-od", "curve-chart");

        // Rescale: a further series appears, named for the new thickness, still on the OD axis.
        WebElement thickness = driver.findElement(By.id("rescale-mm"));
        assertThat(thickness.isEnabled()).as("rescale box enabled for a bulk material").isTrue();
        thickness.sendKeys("5", Keys.ENTER);
        List<String> legend = page.waitForLegend(n -> n > measuredSeries, "a rescaled series added to the legend");
        assertThat(legend).anyMatch(label -> label.startsWith("rescaled to 5 mm"));
        assertThat(driver.findElement(By.id("curve-chart")).getDomAttribute("data-axis-mode")).isEqualTo("od");
        page.screenshot("4-rescaled-od", "curve-chart");

        WebElement message = driver.findElement(By.id("message"));
        assertThat(message.isDisplayed()).as("error area stays hidden, but shows: %s", message.getText()).isFalse();
    }

    @Test
    void typedWordsNarrowTheListAndTickedValuesCountDrillSideways() throws IOException {
        page.load(port, "/");
        int all = waitForRowCount(n -> n >= MIN_DEMO_MATERIALS, "at least " + MIN_DEMO_MATERIALS + " materials");

        // A word still being typed finds what it begins (docs/library-search.md): acryl -> acrylic.
        driver.findElement(By.id("filter-text")).sendKeys("acryl");
        int hits = waitForRowCount(n -> n > 0 && n < all, "fewer rows for 'acryl'");
        wait.until(d -> countLine().startsWith(hits + " material"));
        assertThat(rows()).anyMatch(r -> r.findElement(By.cssSelector("td.name")).getText().toLowerCase().contains("acrylic"));

        // Nothing ticked: each material has one class, so the class counts add up to the hits.
        Map<String, Integer> classCounts = facetCounts("class");
        assertThat(classCounts.values().stream().mapToInt(Integer::intValue).sum()).isEqualTo(hits);
        assertThat(driver.findElement(By.cssSelector(".facet[data-dimension='class'] .facet-value")).getText())
                .as("count shown beside the value").matches(".+ \\(\\d+\\)");
        page.screenshot("6-words-acryl", "curve-chart");

        // Tick the class with the most hits: the list holds exactly its count, its own group keeps its
        // counts (drill sideways), and no value of another group counts more than the list holds.
        String biggest = classCounts.entrySet().stream().max(Map.Entry.comparingByValue()).orElseThrow().getKey();
        int expected = classCounts.get(biggest);
        facetBox("class", biggest).click();
        waitForRowCount(n -> n == expected && allRowsHaveClass(biggest), expected + " rows of class '" + biggest + "'");
        wait.until(d -> facetCounts("class").equals(classCounts));
        for (String other : List.of("geometry", "provenance", "thickness")) {
            assertThat(facetCounts(other).values()).as(other + " counts under the ticked class")
                    .allMatch(count -> count <= expected);
        }
        assertThat(facetCounts("provenance").values()).as("some provenance counted").anyMatch(count -> count > 0);
        // the spectral-summary groups, read from the samples' curves, are counted beside the others
        for (String spectral : List.of("edge", "luminous", "at254", "at365", "at405")) {
            assertThat(facetCounts(spectral).values()).as(spectral + " counts under the ticked class")
                    .isNotEmpty().allMatch(count -> count <= expected).anyMatch(count -> count > 0);
        }
        assertThat(facetBox("class", biggest).isSelected()).isTrue();
        page.screenshot("7-class-ticked", "curve-chart");

        WebElement message = driver.findElement(By.id("message"));
        assertThat(message.isDisplayed()).as("error area stays hidden, but shows: %s", message.getText()).isFalse();
    }

    @Test
    void unknownMaterialShowsTheServersProblemDetailInTheMessageArea() throws IOException {
        page.load(port, "/#material=987654321");

        WebElement message = driver.findElement(By.id("message"));
        wait.withMessage("waiting for the 404 problem detail to be shown");
        wait.until(d -> message.isDisplayed());
        // The page quotes the problem's detail, which names the missing id; no HTTP status code.
        assertThat(message.getText()).contains("987654321").doesNotContain("(404)");
        assertThat(driver.findElement(By.id("material-detail")).isDisplayed()).isFalse();
        page.screenshot("5-unknown-material", "curve-chart");
    }

    private List<WebElement> facetBoxes(String dimension) {
        return driver.findElements(By.cssSelector(".facet[data-dimension='" + dimension + "'] input[type='checkbox']"));
    }

    private WebElement facetBox(String dimension, String value) {
        return facetBoxes(dimension).stream().filter(b -> value.equals(b.getDomAttribute("value"))).findFirst()
                .orElseThrow(() -> new AssertionError("no " + dimension + " box for '" + value + "'"));
    }

    /** Value -> the count shown beside it, as the user reads it: "plastic sheet (7)". */
    private Map<String, Integer> facetCounts(String dimension) {
        Map<String, Integer> counts = new LinkedHashMap<>();
        for (WebElement label : driver.findElements(By.cssSelector(".facet[data-dimension='" + dimension + "'] .facet-value"))) {
            String count = label.findElement(By.cssSelector(".facet-count")).getText();
            counts.put(label.getDomAttribute("data-value"), Integer.parseInt(count.replaceAll("[()]", "")));
        }
        return counts;
    }

    private String countLine() {
        return driver.findElement(By.id("material-count")).getText();
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
}
