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
 * "How to write a requirement" under the requirement box, in headless Chromium against the whole application
 * with its (illustrative) demo library: opening it shows the server's guide as text, an example's "Try"
 * puts it into the box, and the OpenAPI document is linked. Skipped on machines without Chromium.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = "spring.datasource.url=jdbc:h2:mem:api-description-test;DB_CLOSE_DELAY=-1")
class RequirementGuideBrowserTest {

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
    void openingTheGuideShowsItsExamplesAndTryPutsOneIntoTheRequirementBox() throws IOException {
        page.load(port, "/");
        WebElement summary = wait.until(d -> d.findElement(By.cssSelector("#requirement-guide > summary")));
        summary.click();
        List<WebElement> rows = wait.until(d -> {
            List<WebElement> found = d.findElements(By.cssSelector("#requirement-guide-body .guide-forms tbody tr"));
            return found.size() > 15 ? found : null;
        });
        String example = rows.get(0).findElement(By.tagName("code")).getText();
        assertThat(example).isEqualTo("passes over 80% at 365 nm");
        assertThat(driver.findElement(By.id("requirement-guide-body")).getText()).contains("plastic sheet", "led-365",
                "erythema");
        WebElement link = driver.findElement(By.cssSelector("#requirement-guide-body .guide-api a"));
        assertThat(link.getAttribute("href")).endsWith("/api/openapi.json");
        page.screenshot("guide-1-open");

        rows.get(1).findElement(By.cssSelector("button.guide-try")).click();
        WebElement box = driver.findElement(By.id("requirement-text"));
        assertThat(box.getDomProperty("value")).isEqualTo(rows.get(1).findElement(By.tagName("code")).getText());
    }

    @Test
    void aNarrowWindowKeepsTheOpenGuideWithoutSidewaysScrolling() throws IOException {
        page.resize(390, 900);
        try {
            page.load(port, "/");
            wait.until(d -> d.findElement(By.cssSelector("#requirement-guide > summary"))).click();
            wait.until(d -> d.findElements(By.cssSelector("#requirement-guide-body .guide-forms tbody tr")).size() > 15);
            page.screenshot("guide-2-narrow");
            Object guideWidth = ((org.openqa.selenium.JavascriptExecutor) driver).executeScript(
                    "return document.getElementById('requirement-guide').scrollWidth"
                            + " - document.getElementById('requirement-guide').clientWidth");
            assertThat(((Number) guideWidth).intValue()).isLessThanOrEqualTo(0);
        } finally {
            page.resize(1400, 1300);
        }
    }
}
