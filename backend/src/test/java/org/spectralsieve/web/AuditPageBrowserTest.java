package org.spectralsieve.web;

import static org.assertj.core.api.Assertions.assertThat;
import static org.spectralsieve.library.db.Tables.MATERIAL;
import static org.spectralsieve.library.db.Tables.SAMPLE;

import java.io.IOException;
import java.util.List;
import org.jooq.DSLContext;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.openqa.selenium.By;
import org.openqa.selenium.WebDriver;
import org.openqa.selenium.WebElement;
import org.openqa.selenium.support.ui.WebDriverWait;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.test.context.TestPropertySource;

/**
 * The change-log page (docs/audit.md) in a real headless Chromium: a sample corrected through the API shows on
 * {@code audit.html?sampleId=…} as the newest entry, by the embedded user, with its old and new thickness and the
 * changed value marked; the main page links to it. Skipped (not failed) on machines without Chromium and its driver.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = "spring.datasource.url=jdbc:h2:mem:audit-browser;DB_CLOSE_DELAY=-1")
class AuditPageBrowserTest {

    @LocalServerPort
    private int port;

    @Autowired
    private DSLContext db;

    private PageBrowser page;
    private WebDriver driver;
    private WebDriverWait wait;

    @BeforeAll
    static void needsABrowser() {
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
    void aCorrectedSampleShowsItsChangeWithTheOldAndNewValues() throws Exception {
        long materialId = db.select(MATERIAL.ID).from(MATERIAL).where(MATERIAL.SLUG.eq("resin-lid-amber"))
                .fetchSingle(MATERIAL.ID);
        long sampleId = db.select(SAMPLE.ID).from(SAMPLE).where(SAMPLE.MATERIAL_ID.eq(materialId)).fetchSingle(SAMPLE.ID);
        var response = java.net.http.HttpClient.newHttpClient().send(java.net.http.HttpRequest.newBuilder(
                        java.net.URI.create("http://localhost:" + port + "/api/samples/" + sampleId + "/revisions"))
                        .header("Content-Type", "application/json")
                        .POST(java.net.http.HttpRequest.BodyPublishers.ofString(
                                "{\"thicknessMm\": 3.3, \"reason\": \"caliper read again\"}")).build(),
                java.net.http.HttpResponse.BodyHandlers.ofString());
        assertThat(response.statusCode()).as(response.body()).isEqualTo(201);

        page.open(port, "/");
        assertThat(driver.findElement(By.id("audit-link")).getDomAttribute("href")).isEqualTo("audit.html");
        page.load(port, "/audit.html?sampleId=" + sampleId);
        wait.until(d -> rows().size() >= 2);

        WebElement newest = rows().get(0);
        assertThat(newest.getDomAttribute("data-action")).isEqualTo("correct");
        assertThat(newest.getText()).contains("local").contains("sample " + sampleId).contains("caliper read again");
        assertThat(rows().get(1).getDomAttribute("data-action")).isEqualTo("import");
        newest.findElement(By.cssSelector("details summary")).click();
        List<String> changed = newest.findElements(By.cssSelector(".audit-changed")).stream()
                .map(WebElement::getText).toList();
        assertThat(changed).anyMatch(t -> t.startsWith("thicknessMm: 3")).anyMatch(t -> t.equals("thicknessMm: 3.3"));
        assertThat(driver.findElement(By.id("audit-summary")).getText()).contains("newest first");
        page.screenshot("audit-1-corrected-sample");
    }

    private List<WebElement> rows() {
        return driver.findElements(By.cssSelector("#audit-rows tr[data-entry-id]"));
    }
}
