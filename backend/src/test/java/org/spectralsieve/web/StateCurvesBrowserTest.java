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
    void materialWithoutStatesShowsNoStateList() {
        page.open(port, "/");
        page.openMaterialFromLibrary("Clear float glass");
        assertThat(driver.findElement(By.id("state-curves")).isDisplayed()).isFalse();
    }
}
