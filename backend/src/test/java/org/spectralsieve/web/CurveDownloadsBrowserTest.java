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
 * The material view offers each drawn curve as CSV and JCAMP-DX, the rescaled one at its thickness, and the chart
 * as PNG (docs/page-exports.md), in headless Chromium over the illustrative demo library. Skipped without Chromium.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = "spring.datasource.url=jdbc:h2:mem:browser-downloads;DB_CLOSE_DELAY=-1")
class CurveDownloadsBrowserTest {

    /** A bulk plastic of the demo library, measured at two thicknesses: it can be rescaled. */
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
    void everyDrawnCurveDownloadsAsCsvAndJcampAndTheRescaledOneAtItsThickness() throws Exception {
        page.open(port, "/");
        page.openMaterialFromLibrary(ACRYLIC);
        int samples = wait.until(d -> {
            int n = d.findElements(By.cssSelector("#curve-downloads li")).size();
            return n > 0 ? n : null;
        });
        assertThat(samples).isGreaterThanOrEqualTo(2);

        driver.findElement(By.id("rescale-mm")).sendKeys("5");
        driver.findElement(By.id("rescale-apply")).click();
        wait.until(d -> d.findElements(By.cssSelector("#curve-downloads li")).size() == samples + 1);
        List<WebElement> rows = driver.findElements(By.cssSelector("#curve-downloads li"));
        WebElement rescaled = rows.get(rows.size() - 1);
        assertThat(rescaled.getText()).startsWith("rescaled to 5 mm");

        // each link answers the file the server writes for that curve: our CSV and JCAMP-DX 5.01 headers
        for (WebElement link : driver.findElements(By.cssSelector("#curve-downloads a"))) {
            String body = fetch(link.getDomAttribute("href"));
            if (link.getDomAttribute("data-format").equals("csv")) {
                assertThat(body).as(link.getDomAttribute("href")).startsWith("# Spectral Sieve curve");
            } else {
                assertThat(body).as(link.getDomAttribute("href")).contains("##JCAMP-DX=");
            }
        }
        String rescaledCsv = fetch(rescaled.findElement(By.cssSelector("a[data-format='csv']")).getDomAttribute("href"));
        // the file states the thickness it was rescaled to, that it was rescaled, and where the curve came from
        assertThat(rescaledCsv).contains("# thickness_mm: 5.0", "# rescaled: true", "# provenance: ");
        assertThat(rescaled.findElement(By.cssSelector("a[data-format='jdx']")).getDomAttribute("href"))
                .endsWith("curve.jdx?thicknessMm=5");

        // the PNG: the click builds a PNG data address (caught before the browser would save it)
        JavascriptExecutor js = (JavascriptExecutor) driver;
        js.executeScript("window.__saved = null; const click = HTMLAnchorElement.prototype.click;"
                + "HTMLAnchorElement.prototype.click = function () { if (this.download) { window.__saved = [this.download, this.href]; }"
                + " else { click.call(this); } };");
        driver.findElement(By.id("chart-png")).click();
        @SuppressWarnings("unchecked")
        List<String> saved = (List<String>) wait.until(d -> js.executeScript("return window.__saved"));
        assertThat(saved.get(0)).endsWith(".png").startsWith("UV-transmitting-cast-acrylic");
        assertThat(saved.get(1)).startsWith("data:image/png;base64,");
        page.screenshotOfElement("downloads-1-material", driver.findElement(By.cssSelector(".curve-downloads")));
    }

    /** The body the page's link leads to, fetched by the page itself (same origin). */
    private String fetch(String href) {
        return (String) ((JavascriptExecutor) driver).executeAsyncScript(
                "const done = arguments[arguments.length - 1]; fetch(arguments[0]).then(r => r.text()).then(done, e => done(String(e)));",
                href);
    }
}
