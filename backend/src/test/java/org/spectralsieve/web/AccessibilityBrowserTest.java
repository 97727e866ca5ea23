package org.spectralsieve.web;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.openqa.selenium.By;
import org.openqa.selenium.WebElement;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.test.context.TestPropertySource;

/**
 * Each view of the page, checked by axe-core (npm registry, version pinned in .ci/run) against the WCAG 2.0/2.1
 * level A and AA rules, text contrast among them (docs/accessibility.md). Skipped without Chromium, and without the
 * axe-core file (a fresh clone before .ci/run has fetched it).
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = "spring.datasource.url=jdbc:h2:mem:browser-a11y;DB_CLOSE_DELAY=-1")
class AccessibilityBrowserTest {

    private static final String REQUIREMENT =
            "passes over 80% at 365 nm and blocks under 1% at 405 nm, thickness 1 to 6 mm";
    private static final String ACRYLIC = "UV-transmitting cast acrylic, lamp-cover grade";

    private static PageBrowser page;
    private static AxeCore axe;

    @LocalServerPort
    private int port;

    @BeforeAll
    static void start() throws IOException {
        page = PageBrowser.startOrSkip();
    }

    @AfterAll
    static void stop() {
        if (page != null) {
            page.close();
        }
    }

    /** Each test (not the class) is skipped without axe-core, so that the report lists them with the reason. */
    @BeforeEach
    void freshPage() throws IOException {
        if (axe == null) {
            axe = AxeCore.loadOrSkip();
        }
        page.driver().get("about:blank");
    }

    @Test
    void theFindViewWithResultsAndAnExplanationOpenMeetsWcagAA() throws IOException {
        page.open(port, "/");
        page.search(REQUIREMENT);
        page.driver().findElement(By.cssSelector("#results-table tbody tr[data-result-material-id] button.toggle")).click();
        assertNoViolations("find-results", "requirement-search");
    }

    @Test
    void theMaterialViewWithItsChartMeetsWcagAA() throws IOException {
        page.open(port, "/");
        page.openMaterialFromLibrary(ACRYLIC);
        page.waiting().withMessage("waiting for the material chart")
                .until(d -> !d.findElements(By.cssSelector("#curve-chart .u-legend .u-series")).isEmpty());
        assertNoViolations("material-chart", "material-detail");
    }

    @Test
    void theImportViewWithAPreviewMeetsWcagAA() throws IOException {
        page.open(port, "/");
        Path file = Files.createDirectories(HeadlessChromium.OUTPUT).resolve("fernhollow-a11y-sheet.csv");
        Files.writeString(file, illustrativeCurve());
        page.driver().findElement(By.id("import-files-input")).sendKeys(file.toAbsolutePath().toString());
        WebElement card = page.waiting().withMessage("waiting for the import preview")
                .until(d -> d.findElements(By.cssSelector("#import-list > li .import-preview")).stream()
                        .filter(WebElement::isDisplayed).findFirst().orElse(null));
        assertThat(card.findElements(By.cssSelector("canvas"))).isNotEmpty();
        assertNoViolations("import-preview", "curve-import");
    }

    @Test
    void theCompareViewWithThreeCurvesMeetsWcagAA() throws IOException {
        page.open(port, "/");
        page.search(REQUIREMENT);
        page.driver().findElement(By.id("compare-top3")).click();
        page.waiting().withMessage("waiting for three compared curves")
                .until(d -> "3".equals(d.findElement(By.id("compare-chart")).getDomAttribute("data-series")));
        assertNoViolations("compare-three", "compare");
    }

    @Test
    void theOpenRequirementGuideMeetsWcagAA() throws IOException {
        page.open(port, "/");
        page.driver().findElement(By.cssSelector("#requirement-guide > summary")).click();
        page.waiting().withMessage("waiting for the guide")
                .until(d -> !d.findElements(By.cssSelector("#requirement-guide-body table")).isEmpty());
        assertNoViolations("guide-open", "requirement-guide");
    }

    private void assertNoViolations(String view, String elementId) throws IOException {
        page.screenshot("a11y-" + view, elementId);
        List<String> found = axe.violations(page.driver());
        assertThat(found).withFailMessage("axe-core %s, WCAG rules %s, found on the %s view:%n  %s",
                axe.version(page.driver()), AxeCore.TAGS, view, String.join("\n  ", found)).isEmpty();
    }

    /** An invented, illustrative clear sheet of the Fernhollow workshop: T rising from 2 % at 280 nm to 90 %. */
    private static String illustrativeCurve() {
        StringBuilder csv = new StringBuilder("wavelength_nm,transmittance_percent\n");
        for (int nm = 280; nm <= 600; nm += 5) {
            double t = nm >= 420 ? 90 : 2 + 88 * (nm - 280) / 140.0;
            csv.append(nm).append(',').append(String.format(Locale.ROOT, "%.1f", t)).append('\n');
        }
        return csv.toString();
    }
}
