package org.spectralsieve.web;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.util.List;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.openqa.selenium.By;
import org.openqa.selenium.WebDriver;
import org.openqa.selenium.WebElement;
import org.openqa.selenium.support.ui.Select;
import org.openqa.selenium.support.ui.WebDriverWait;
import org.spectralsieve.weighting.SafetyCaution;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.test.context.TestPropertySource;

/**
 * Presets on the page, in headless Chromium on the demo library: a built-in preset picked shows its reason and
 * source and puts its text in the requirement box, and searches; a safety preset shows the caution; the box saved as
 * one's own preset joins "My presets", and its share link opens it and runs its search. Skipped without Chromium.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = {"spring.datasource.url=jdbc:h2:mem:browser-presets;DB_CLOSE_DELAY=-1", "sieve.index.dir="})
class PresetsBrowserTest {

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

    private Select picker() {
        wait.until(d -> d.findElements(By.cssSelector("#preset-pick optgroup")).size() > 0);
        return new Select(driver.findElement(By.id("preset-pick")));
    }

    @Test
    void aPickedPresetShowsWhyAndItsSourceFillsTheBoxAndSearches() throws IOException {
        page.load(port, "/");
        Select pick = picker();
        assertThat(driver.findElement(By.cssSelector("#preset-pick optgroup")).getDomAttribute("label")).isEqualTo("Built in");
        pick.selectByValue("led-395-window");

        WebElement detail = driver.findElement(By.id("preset-detail"));
        assertThat(detail.isDisplayed()).isTrue();
        assertThat(driver.findElement(By.id("preset-reason")).getText()).startsWith("Why: An LED head spreads");
        assertThat(driver.findElement(By.id("preset-source")).getText()).startsWith("Source: [S41]");
        assertThat(driver.findElement(By.id("preset-caution")).isDisplayed()).isFalse();
        assertThat(driver.findElement(By.id("preset-form")).isDisplayed()).as("the save form waits to be asked for").isFalse();
        assertThat(driver.findElement(By.id("preset-delete")).isDisplayed()).as("a built-in preset is read-only").isFalse();
        WebElement box = driver.findElement(By.id("requirement-text"));
        assertThat(box.getDomProperty("value")).isEqualTo("passes over 85% from 380 to 410 nm");
        page.screenshot("presets-picked", "requirement-search");

        driver.findElement(By.id("preset-search")).click();
        page.waitForResults("passes over 85% from 380 to 410 nm");
        // [S41]: a UV-transmitting acrylic stays clear across 380-410 nm on the demo library (PresetCatalogueTest)
        List<String> names = page.resultRows().stream().map(r -> r.findElements(By.tagName("td")).get(1).getText()).toList();
        assertThat(names).anyMatch(n -> n.contains("UV-transmitting cast acrylic"));

        pick.selectByValue("eyewear-405");
        WebElement caution = driver.findElement(By.id("preset-caution"));
        assertThat(caution.isDisplayed()).isTrue();
        assertThat(caution.getText()).isEqualTo("Caution: " + SafetyCaution.TEXT);
        assertThat(pick.getFirstSelectedOption().getText()).as("said in words, not colour alone").endsWith("safety caution");
        page.screenshot("presets-safety", "presets");
    }

    @Test
    void thePresetsBoxWithASafetyPresetAndTheSaveFormOpenMeetsWcagAA() throws IOException {
        AxeCore axe = AxeCore.loadOrSkip();
        page.load(port, "/");
        picker().selectByValue("blue-curing-eye-protector");
        driver.findElement(By.id("preset-save-open")).click();
        assertThat(driver.findElement(By.id("preset-form")).isDisplayed()).isTrue();
        page.screenshot("a11y-presets", "presets");
        List<String> found = axe.violations(driver);
        assertThat(found).withFailMessage("axe-core %s found on the presets box:%n  %s", axe.version(driver),
                String.join("\n  ", found)).isEmpty();
    }

    @Test
    void theBoxSavedAsMyPresetIsListedAndItsLinkOpensItAndSearches() throws IOException {
        page.load(port, "/");
        picker();
        WebElement box = driver.findElement(By.id("requirement-text"));
        box.clear();
        box.sendKeys("passes over 80% at 254 nm");
        driver.findElement(By.id("preset-save-open")).click();
        driver.findElement(By.id("preset-form-name")).sendKeys("Fernhollow sleeve");
        driver.findElement(By.id("preset-form-note")).sendKeys("illustrative");
        driver.findElement(By.id("preset-form-submit")).click();

        wait.until(d -> d.findElement(By.id("preset-status")).getText().startsWith("Saved"));
        assertThat(driver.findElement(By.id("preset-form")).isDisplayed()).as("closed once saved").isFalse();
        WebElement mine = driver.findElement(By.cssSelector("#preset-pick optgroup[label='My presets'] option"));
        assertThat(mine.getText()).isEqualTo("Fernhollow sleeve");
        String key = mine.getDomAttribute("value");
        assertThat(driver.findElement(By.id("preset-delete")).isDisplayed()).as("one's own may be deleted").isTrue();

        driver.findElement(By.id("preset-link")).click();
        wait.until(d -> d.findElement(By.id("preset-status")).getText().contains("/?preset=" + key));
        page.screenshot("presets-saved", "presets");

        page.load(port, "/?preset=" + key);
        page.waitForResults("passes over 80% at 254 nm");
        assertThat(driver.findElement(By.id("preset-title")).getText()).startsWith("Fernhollow sleeve");
        assertThat(driver.findElement(By.id("requirement-text")).getDomProperty("value")).isEqualTo("passes over 80% at 254 nm");

        page.load(port, "/?preset=987654");
        wait.until(d -> d.findElement(By.id("preset-status")).getText().contains("cannot be opened"));
    }
}
