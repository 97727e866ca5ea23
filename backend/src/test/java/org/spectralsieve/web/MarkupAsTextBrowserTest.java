package org.spectralsieve.web;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.util.Locale;
import java.util.Map;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.openqa.selenium.By;
import org.openqa.selenium.WebElement;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.test.context.TestPropertySource;

/**
 * Names and notes are shown as text, never read as HTML (docs/accessibility.md, "Safe"): a material stored through
 * the API with markup in its name, description and notes is shown literally in the library, the material view, the
 * search results and the compare chart's key, and none of the markup runs. Skipped without Chromium.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = "spring.datasource.url=jdbc:h2:mem:browser-markup;DB_CLOSE_DELAY=-1")
class MarkupAsTextBrowserTest {

    private static final String NAME =
            "<script>window.sieveInjected = 'name'</script> Fernhollow marked sheet (illustrative)";
    private static final String DESCRIPTION =
            "<img src=x onerror=\"window.sieveInjected = 'description'\"> invented, illustrative sheet";
    private static final String NOTES = "<img src=x onerror=\"window.sieveInjected = 'notes'\"><b>bold?</b>";
    /** Our illustrative sheet passes 90 % from 420 nm on; a limit of 500 rows lists the whole demo library. */
    private static final String REQUIREMENT = "passes over 85% at 500 nm";

    private static PageBrowser page;

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

    @Test
    void markupInANameDescriptionOrNoteIsShownAsTextAndNeverRuns() throws IOException {
        page.open(port, "/");
        storeThroughTheApi();
        page.driver().navigate().refresh();
        page.waitForLibrary();

        page.openMaterialFromLibrary(NAME);
        WebElement libraryCell = page.driver().findElement(
                By.cssSelector("#material-table tr[aria-selected='true'] td.name"));
        assertThat(libraryCell.getText()).isEqualTo(NAME);
        assertThat(page.driver().findElement(By.id("detail-name")).getText()).isEqualTo(NAME);
        assertThat(page.driver().findElement(By.id("detail-description")).getText()).isEqualTo(DESCRIPTION);
        assertThat(page.driver().findElement(By.id("sample-table")).getText()).contains(NOTES);
        assertNothingRan("the material view");
        page.screenshot("markup-1-material", "material-detail");

        WebElement limit = page.driver().findElement(By.id("search-limit"));
        limit.clear();
        limit.sendKeys("500");
        page.search(REQUIREMENT);
        WebElement link = page.waiting().withMessage("waiting for the marked sheet among the results")
                .until(d -> d.findElements(By.cssSelector("#results-table button.material-link")).stream()
                        .filter(b -> b.getText().contains("Fernhollow marked sheet")).findFirst().orElse(null));
        assertThat(link.getText()).isEqualTo(NAME);

        WebElement tick = page.driver().findElements(By.cssSelector("#compare-rows li")).stream()
                .filter(li -> li.getText().contains("Fernhollow marked sheet")).findFirst()
                .orElseThrow(() -> new AssertionError("the marked sheet has no row to compare"))
                .findElement(By.cssSelector("input[type=checkbox]"));
        page.script("arguments[0].scrollIntoView({block: 'center'})", tick);
        tick.click();
        page.waiting().withMessage("waiting for the marked sheet in the compare chart's key")
                .until(d -> d.findElement(By.id("compare-key")).getText().contains(NAME));
        assertNothingRan("the results and the compare chart");
        page.screenshot("markup-2-compare", "compare");
    }

    /** POSTs the sheet from inside the page (same origin, as the import view does) and expects it stored. */
    private void storeThroughTheApi() {
        page.driver().manage().timeouts().scriptTimeout(PageBrowser.PATIENCE);
        Object status = ((org.openqa.selenium.JavascriptExecutor) page.driver()).executeAsyncScript("""
                const [csv, name, description, notes, done] = arguments;
                const form = new FormData();
                form.append('file', new Blob([csv], { type: 'text/csv' }), 'fernhollow-marked-sheet.csv');
                form.append('materialName', name);
                form.append('materialClass', 'plastic sheet');
                form.append('scaling', 'bulk');
                form.append('thicknessMm', '2');
                form.append('description', description);
                form.append('notes', notes);
                fetch('/api/imports', { method: 'POST', body: form })
                  .then(async (r) => done(r.status + ' ' + await r.text())).catch((e) => done(String(e)));
                """, illustrativeCurve(), NAME, DESCRIPTION, NOTES);
        assertThat(String.valueOf(status)).startsWith("201");
    }

    private void assertNothingRan(String where) {
        @SuppressWarnings("unchecked")
        Map<String, Object> found = (Map<String, Object>) page.script("""
                return { injected: window.sieveInjected === undefined ? null : String(window.sieveInjected),
                  images: document.querySelectorAll('img[src="x"]').length,
                  bold: document.querySelectorAll('#sample-table b, #results-table b, #compare-key b').length,
                  scripts: [...document.scripts].filter((s) => s.textContent.includes('sieveInjected')).length };""");
        assertThat(found).as("markup from stored text turned into elements or ran, in %s", where)
                .containsEntry("injected", null).containsEntry("images", 0L).containsEntry("bold", 0L)
                .containsEntry("scripts", 0L);
    }

    /** An invented, illustrative clear sheet: T rising from 2 % at 280 nm to 90 % at 420 nm and beyond. */
    private static String illustrativeCurve() {
        StringBuilder csv = new StringBuilder("wavelength_nm,transmittance_percent\n");
        for (int nm = 280; nm <= 600; nm += 5) {
            double t = nm >= 420 ? 90 : 2 + 88 * (nm - 280) / 140.0;
            csv.append(nm).append(',').append(String.format(Locale.ROOT, "%.1f", t)).append('\n');
        }
        return csv.toString();
    }
}
