package org.spectralsieve.web;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.openqa.selenium.By;
import org.openqa.selenium.WebDriver;
import org.openqa.selenium.WebElement;
import org.openqa.selenium.support.ui.Select;
import org.openqa.selenium.support.ui.WebDriverWait;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.test.context.TestPropertySource;

/**
 * The material view lists a sample's curves in other states and plots one beside the sample's own, told apart by its
 * dash pattern and its description in the legend (docs/material-states.md), in headless Chromium over the
 * illustrative demo library. Skipped without Chromium.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = "spring.datasource.url=jdbc:h2:mem:browser-states;DB_CLOSE_DELAY=-1")
class StateCurvesBrowserTest {

    /** The demo's lamp cover: its 6 mm sample has a modelled curve after 2,000 h under a lamp bank. */
    private static final String LAMP_COVER = "UV-transmitting cast acrylic, lamp-cover grade";

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
    void agedCurveIsListedWithItsDescriptionAndPlottedBesideTheOwnCurveWithALabelledDashedLine() throws IOException {
        page.open(port, "/");
        page.openMaterialFromLibrary(LAMP_COVER);
        List<WebElement> items = wait.withMessage("waiting for the state list").until(d -> {
            List<WebElement> found = d.findElements(By.cssSelector("#state-curves li.state-item"));
            return found.isEmpty() ? null : found;
        });
        assertThat(items).hasSize(1);
        WebElement item = items.get(0);
        assertThat(item.getText()).contains("6 mm").contains("aged 2000 h under Fernhollow curing-tunnel lamp bank A");
        int before = page.legendLabels().size();

        WebElement plot = item.findElement(By.cssSelector("button.state-plot"));
        assertThat(plot.getDomAttribute("aria-pressed")).isEqualTo("false");
        plot.click();

        page.waitForLegend("6 mm regular: aged 2000 h under");
        assertThat(plot.getDomAttribute("aria-pressed")).isEqualTo("true");
        assertThat(page.legendLabels().size()).isGreaterThan(before);
        page.screenshotOfElement("states-1-plotted", driver.findElement(By.id("material-detail")));

        plot.click();
        wait.until(d -> page.legendLabels().stream().noneMatch(l -> l.contains("aged 2000 h")));
        assertThat(plot.getDomAttribute("aria-pressed")).isEqualTo("false");
    }

    @Test
    void importPageStoresAFileAsAStateOfSampleNAndNamesAMissingFieldNextToIt(@TempDir Path temp) throws Exception {
        long materialId = PageBrowser.getJson(port, "/api/materials?q=fep").findValues("id").get(0).asLong();
        long sampleId = PageBrowser.getJson(port, "/api/materials/" + materialId).path("samples").get(0).path("id").asLong();
        Path file = Files.writeString(temp.resolve("vat-film-after-use.csv"),
                "wavelength_nm,transmittance\n300,0.60\n350,0.70\n405,0.75\n450,0.78\n600,0.82\n");
        page.load(port, "/");
        wait.until(d -> !d.findElement(By.id("material-count")).getText().equals("Loading…"));
        driver.findElement(By.id("import-files-input")).sendKeys(file.toAbsolutePath().toString());
        WebElement card = wait.until(d -> d.findElements(By.cssSelector("#import-list > li")).stream().findFirst().orElse(null));
        wait.until(d -> card.findElement(By.cssSelector(".import-state")).getText().contains("Nothing is stored yet"));

        card.findElement(By.cssSelector("input[type=radio][value=state]")).click();
        assertThat(card.findElement(By.name("geometry")).isDisplayed()).isFalse(); // the sample's own, not the state's
        card.findElement(By.name("stateSample")).sendKeys(String.valueOf(sampleId));
        new Select(card.findElement(By.name("state"))).selectByValue("printed");
        card.findElement(By.cssSelector("button[type=submit]")).click();
        WebElement problem = wait.until(d -> {
            WebElement p = card.findElement(By.cssSelector(".import-problem"));
            return p.isDisplayed() ? p : null;
        });
        assertThat(problem.getText()).contains("Ink load (%)");
        assertThat(card.findElement(By.name("inkLoadPercent")).getDomAttribute("aria-invalid")).isEqualTo("true");

        new Select(card.findElement(By.name("state"))).selectByValue("aged");
        card.findElement(By.name("hours")).sendKeys("600");
        card.findElement(By.name("source")).sendKeys("bench resin printer (illustrative)");
        card.findElement(By.cssSelector("button[type=submit]")).click();
        wait.withMessage(() -> "waiting for the stored state; card says: " + card.getText())
                .until(d -> card.findElement(By.cssSelector(".import-state")).getText().startsWith("Stored as state curve"));
        assertThat(card.findElement(By.cssSelector(".import-state")).getText())
                .contains("of sample " + sampleId).contains("aged 600 h under bench resin printer (illustrative)");
        page.screenshotOfElement("states-2-imported", card);
        assertThat(PageBrowser.getJson(port, "/api/samples/" + sampleId).path("states").toString())
                .contains("aged 600 h under bench resin printer");
    }

    @Test
    void materialViewWithAStatePlottedMeetsWcagAA() throws IOException {
        AxeCore axe = AxeCore.loadOrSkip();
        page.open(port, "/");
        page.openMaterialFromLibrary(LAMP_COVER);
        wait.until(d -> !d.findElements(By.cssSelector("#state-curves button.state-plot")).isEmpty());
        driver.findElement(By.cssSelector("#state-curves button.state-plot")).click();
        page.waitForLegend("6 mm regular: aged 2000 h under");

        List<String> found = axe.violations(driver);
        assertThat(found).withFailMessage("axe-core, WCAG rules %s:%n  %s", AxeCore.TAGS, String.join("\n  ", found))
                .isEmpty();
    }

    @Test
    void materialWithoutStatesShowsNoStateList() {
        page.open(port, "/");
        page.openMaterialFromLibrary("Clear float glass");
        assertThat(driver.findElement(By.id("state-curves")).isDisplayed()).isFalse();
    }
}
