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
 * The page's undo controls (docs/undo.md) in a real headless Chromium: retire a sample and restore it from
 * the material view, then correct its thickness, first with a value the server refuses (the page shows the
 * problem naming the field), then with a good one (the sample shows its new revision). Skipped (not failed)
 * on machines without Chromium and its driver.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = "spring.datasource.url=jdbc:h2:mem:undo-browser;DB_CLOSE_DELAY=-1")
class UndoPageBrowserTest {

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
    void aSampleIsRetiredAndRestoredFromTheMaterialViewAndABadCorrectionShowsTheFieldToChange() throws IOException {
        long materialId = db.select(MATERIAL.ID).from(MATERIAL).where(MATERIAL.SLUG.eq("resin-lid-orange"))
                .fetchSingle(MATERIAL.ID);
        int samples = db.fetchCount(SAMPLE, SAMPLE.MATERIAL_ID.eq(materialId));
        page.load(port, "/#material=" + materialId);
        wait.until(d -> sampleRows().size() == samples);
        assertThat(driver.findElement(By.id("detail-record")).getText()).contains("In use").contains("revision 1");

        sampleRows().get(0).findElement(By.xpath(".//button[text()='Retire']")).click();
        wait.until(d -> sampleRows().size() == samples - 1 && driver.findElement(By.id("retired-samples")).isDisplayed());
        assertThat(driver.findElement(By.id("retired-samples")).getText()).contains("3 mm").contains("retired");
        page.screenshot("undo-1-retired-sample", "material-detail");

        driver.findElement(By.cssSelector("#retired-samples button")).click();
        wait.until(d -> sampleRows().size() == samples && !driver.findElement(By.id("retired-samples")).isDisplayed());

        WebElement first = sampleRows().get(0);
        first.findElement(By.xpath(".//button[starts-with(text(),'Correct')]")).click();
        WebElement form = driver.findElement(By.cssSelector("#sample-table tr.sample-correction:not([hidden]) form"));
        form.findElement(By.name("thicknessMm")).sendKeys("-2");
        form.findElement(By.name("reason")).sendKeys("thickness was typed wrongly");
        form.findElement(By.cssSelector("button[type=submit]")).click();
        wait.until(d -> driver.findElement(By.id("message")).isDisplayed());
        assertThat(driver.findElement(By.id("message")).getText()).contains("thicknessMm").contains("above 0");
        page.screenshot("undo-2-refused-correction", "message");

        form.findElement(By.name("thicknessMm")).clear();
        form.findElement(By.name("thicknessMm")).sendKeys("3.1");
        form.findElement(By.cssSelector("button[type=submit]")).click();
        wait.until(d -> driver.findElement(By.id("sample-table")).getText().contains("rev. 2"));
        assertThat(driver.findElement(By.id("sample-table")).getText()).contains("3.1 mm");
        page.screenshot("undo-3-corrected", "material-detail");
    }

    private List<WebElement> sampleRows() {
        return driver.findElements(By.cssSelector("#sample-table tbody tr[data-sample-id]"));
    }
}
