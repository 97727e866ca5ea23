package org.spectralsieve.web;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.zip.ZipEntry;
import java.util.zip.ZipOutputStream;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.openqa.selenium.By;
import org.openqa.selenium.JavascriptExecutor;
import org.openqa.selenium.WebDriver;
import org.openqa.selenium.WebElement;
import org.openqa.selenium.support.ui.Select;
import org.openqa.selenium.support.ui.WebDriverWait;
import org.spectralsieve.testsupport.ReadsSharedFolder;
import org.spectralsieve.testsupport.SharedFolder;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.test.context.TestPropertySource;

/**
 * The curve import panel (web/import.js, docs/curve-import-page.md) in a real headless Chromium against the whole
 * application: a real measured file from ../shared/reference-data is previewed, stored and found in the library; a
 * refused file says on which line, next to that file; the panel fits a 390 px window. What the server reads from
 * each file is the importer's business (ReferenceFileOutcomesTest); here the page shows it. Skipped (not failed)
 * without Chromium, and the shared-file test without the shared folder.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = "spring.datasource.url=jdbc:h2:mem:browser-import;DB_CLOSE_DELAY=-1")
class ImportPageBrowserTest {

    /**
     * A measured 2 mm long-pass filter glass (reference-data SOURCES.md §8). ReferenceFileOutcomesTest lists it as
     * stored with warnings, among them the instrument floor at 0.01 %T, which the preview must show before storing.
     */
    private static final String MEASURED_SHEET = "longpass-filter-glass-295nm-2mm.csv";

    private static PageBrowser page;
    private static WebDriver driver;
    private static WebDriverWait wait;

    @LocalServerPort
    private int port;

    @TempDir
    Path temp;

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

    @BeforeEach
    void wideWindow() {
        page.resize(1280, 1300);
    }

    @AfterEach
    void noPageWideMessage() {
        page.assertNoPageMessage();
    }

    @Test
    @ReadsSharedFolder
    void aMeasuredFileIsPreviewedThenStoredAndFoundInTheLibrary() throws Exception {
        Path sheet = SharedFolder.measuredSheet(MEASURED_SHEET);
        openPage();
        WebElement card = addFile(sheet);

        // Previewed, nothing stored: the curve drawn, what was detected, and the importer's warnings.
        wait.withMessage(() -> "waiting for the preview; card says: " + card.getText());
        wait.until(d -> card.findElement(By.cssSelector(".import-preview")).isDisplayed());
        assertThat(card.findElements(By.cssSelector(".import-chart canvas"))).isNotEmpty();
        assertThat(fact(card, "Format")).isEqualTo("delimited");
        assertThat(fact(card, "Wavelength unit")).isEqualTo("nm");
        assertThat(fact(card, "Quantity")).contains("transmittance");
        assertThat(card.findElement(By.cssSelector(".import-warnings")).getText()).contains("instrument floor");
        assertThat(card.findElement(By.cssSelector(".import-state")).getText()).contains("Nothing is stored yet");
        screenshot("import-1-preview", card);

        // The form: a new material of our invented workshop, the thickness the file name states.
        String name = "Fernhollow long-pass check glass (illustrative label for a shared file)";
        card.findElement(By.name("materialName")).sendKeys(name);
        card.findElement(By.name("materialClass")).sendKeys("optical glass");
        new Select(card.findElement(By.name("scaling"))).selectByValue("bulk");
        card.findElement(By.name("thicknessMm")).sendKeys("2");
        card.findElement(By.cssSelector("button[type=submit]")).click();
        wait.withMessage(() -> "waiting for the stored sample; card says: " + card.getText());
        wait.until(d -> card.findElement(By.cssSelector(".import-state")).getText().startsWith("Stored as sample"));
        assertThat(card.findElement(By.cssSelector(".import-state")).getText()).contains("new material");

        // In the library panel at once: the words box finds the new material.
        driver.findElement(By.id("filter-text")).sendKeys("long-pass check");
        wait.withMessage(() -> "waiting for the new material in the library list: "
                + driver.findElement(By.id("material-table")).getText());
        wait.until(d -> d.findElements(By.cssSelector("#material-table tbody td.name")).stream()
                .anyMatch(td -> td.getText().equals(name)));
        screenshot("import-2-in-library", driver.findElement(By.id("material-table")));

        // And it opens from its card.
        card.findElement(By.cssSelector("button.open-stored")).click();
        wait.until(d -> name.equals(d.findElement(By.id("detail-name")).getText()));
        assertThat(driver.findElement(By.id("sample-table")).getText()).contains("2 mm").contains("measured");
        screenshot("import-3-opened", driver.findElement(By.id("material-detail")));
    }

    @Test
    void aRefusedFileShowsItsLineNextToTheFileWithoutAStatusCode() throws Exception {
        // Line 4 holds a word where a number belongs; everything else is a plain transmittance table.
        Path broken = Files.writeString(temp.resolve("fernhollow-broken.csv"),
                "wavelength_nm,transmittance_percent\n300,12.5\n310,13.1\n320,abc\n330,14.0\n340,15.2\n");
        Path good = Files.writeString(temp.resolve("fernhollow-good.csv"), goodCsv());
        openPage();
        WebElement goodCard = addFile(good);
        WebElement brokenCard = addFile(broken);

        WebElement problem = brokenCard.findElement(By.cssSelector(".import-problem"));
        wait.withMessage(() -> "waiting for the refusal; card says: " + brokenCard.getText());
        wait.until(d -> problem.isDisplayed());
        String text = problem.getText();
        assertThat(text).startsWith("Line 4").contains("abc");
        assertThat(text).doesNotContainPattern("\\b4\\d\\d\\b");
        assertThat(brokenCard.findElement(By.cssSelector(".import-preview")).isDisplayed()).isFalse();
        assertThat(brokenCard.findElement(By.cssSelector("button[type=submit]")).isEnabled()).isFalse();
        // the other file is unaffected: previewed, no problem shown
        wait.until(d -> goodCard.findElement(By.cssSelector(".import-preview")).isDisplayed());
        assertThat(goodCard.findElement(By.cssSelector(".import-problem")).isDisplayed()).isFalse();
        screenshot("import-4-refused", brokenCard);

        // A form mistake is shown the same way, naming the form's field: a new material without a name.
        goodCard.findElement(By.cssSelector("button[type=submit]")).click();
        WebElement formProblem = goodCard.findElement(By.cssSelector(".import-problem"));
        wait.until(d -> formProblem.isDisplayed());
        assertThat(formProblem.getText()).startsWith("Field “Name”");
        assertThat(goodCard.findElement(By.name("materialName")).getDomAttribute("aria-invalid")).isEqualTo("true");

        // The server's refusal of a field names it too: a thickness of 0 mm into an existing material.
        String existing = driver.findElement(By.cssSelector("#material-table tbody td.name")).getText();
        goodCard.findElement(By.cssSelector("input[type=radio][value=existing]")).click();
        goodCard.findElement(By.name("existingName")).sendKeys(existing);
        goodCard.findElement(By.name("thicknessMm")).sendKeys("0");
        goodCard.findElement(By.cssSelector("button[type=submit]")).click();
        wait.withMessage(() -> "waiting for the thickness refusal; card says: " + goodCard.getText());
        wait.until(d -> formProblem.getText().startsWith("Field “Thickness”"));
        assertThat(formProblem.getText()).doesNotContainPattern("\\b4\\d\\d\\b");
        screenshot("import-5-form-problem", goodCard);

        // Corrected, it is stored into the existing material chosen by its name.
        WebElement thickness = goodCard.findElement(By.name("thicknessMm"));
        thickness.clear();
        thickness.sendKeys("3");
        goodCard.findElement(By.cssSelector("button[type=submit]")).click();
        wait.withMessage(() -> "waiting for the stored sample; card says: " + goodCard.getText());
        wait.until(d -> goodCard.findElement(By.cssSelector(".import-state")).getText().startsWith("Stored as sample"));
        assertThat(formProblem.isDisplayed()).isFalse();
        goodCard.findElement(By.cssSelector("button.open-stored")).click();
        wait.until(d -> existing.equals(d.findElement(By.id("detail-name")).getText()));
    }

    @Test
    void aZipWithAManifestReportsEveryRowAndItsStoredMaterialAppearsInTheLibrary() throws Exception {
        Path zip = temp.resolve("fernhollow-batch.zip");
        try (ZipOutputStream out = new ZipOutputStream(Files.newOutputStream(zip))) {
            entry(out, "manifest.csv", "file,material,class,scaling,thickness\n"
                    + "good.csv,Fernhollow batch sheet (illustrative),plastic sheet,bulk,2\n"
                    + "broken.csv,Fernhollow batch sheet (illustrative),plastic sheet,bulk,3\n");
            entry(out, "good.csv", goodCsv());
            entry(out, "broken.csv", "wavelength_nm,transmittance_percent\n300,12.5\n310,abc\n320,14.0\n");
        }
        openPage();
        WebElement card = addFile(zip);
        card.findElement(By.cssSelector(".import-actions button")).click();
        wait.withMessage(() -> "waiting for the batch report; card says: " + card.getText());
        wait.until(d -> !card.findElements(By.cssSelector(".import-batch-table tbody tr")).isEmpty());
        List<WebElement> rows = card.findElements(By.cssSelector(".import-batch-table tbody tr"));
        assertThat(rows).hasSize(2);
        assertThat(rows.get(0).getText()).contains("good.csv").contains("stored");
        assertThat(rows.get(1).getText()).contains("broken.csv").contains("refused").contains("3"); // the bad line
        assertThat(card.findElement(By.cssSelector(".import-state")).getText()).startsWith("1 of 2 files in the library");
        screenshot("import-7-batch", card);

        driver.findElement(By.id("filter-text")).sendKeys("batch sheet");
        wait.until(d -> d.findElements(By.cssSelector("#material-table tbody td.name")).stream()
                .anyMatch(td -> td.getText().equals("Fernhollow batch sheet (illustrative)")));
    }

    private static void entry(ZipOutputStream out, String name, String text) throws IOException {
        out.putNextEntry(new ZipEntry(name));
        out.write(text.getBytes(java.nio.charset.StandardCharsets.UTF_8));
        out.closeEntry();
    }

    @Test
    void atThreeHundredNinetyPixelsThePanelFitsWithoutSidewaysScrolling() throws Exception {
        page.resize(390, 1000);
        Path good = Files.writeString(temp.resolve("fernhollow-narrow.csv"), goodCsv());
        openPage();
        WebElement card = addFile(good);
        wait.until(d -> card.findElement(By.cssSelector(".import-preview")).isDisplayed());
        long overflow = (Long) ((JavascriptExecutor) driver).executeScript(
                "return document.documentElement.scrollWidth - document.documentElement.clientWidth;");
        assertThat(overflow).as("page wider than the window by").isLessThanOrEqualTo(0);
        screenshot("import-6-narrow", card);
    }

    // ---------- helpers ----------

    /** An invented, illustrative clear sheet: T rising from 2 % at 280 nm to 90 % at 420 nm. */
    private static String goodCsv() {
        StringBuilder csv = new StringBuilder("wavelength_nm,transmittance_percent\n");
        for (int nm = 280; nm <= 600; nm += 5) {
            double t = nm >= 420 ? 90 : 2 + 88 * (nm - 280) / 140.0;
            csv.append(nm).append(',').append(String.format(java.util.Locale.ROOT, "%.1f", t)).append('\n');
        }
        return csv.toString();
    }

    private void openPage() {
        driver.get("about:blank");
        page.load(port, "/");
        wait.until(d -> !d.findElement(By.id("material-count")).getText().equals("Loading…"));
    }

    /** Chooses the file in the panel's picker; answers its card. */
    private WebElement addFile(Path file) {
        int before = driver.findElements(By.cssSelector("#import-list > li")).size();
        driver.findElement(By.id("import-files-input")).sendKeys(file.toAbsolutePath().toString());
        wait.until(d -> d.findElements(By.cssSelector("#import-list > li")).size() == before + 1);
        WebElement card = driver.findElements(By.cssSelector("#import-list > li")).get(before);
        assertThat(card.getDomAttribute("data-file-name")).isEqualTo(file.getFileName().toString());
        return card;
    }

    /** The value beside a label in the card's detected-facts list. */
    private static String fact(WebElement card, String label) {
        List<WebElement> terms = card.findElements(By.cssSelector(".import-facts dt"));
        List<WebElement> values = card.findElements(By.cssSelector(".import-facts dd"));
        for (int i = 0; i < terms.size(); i++) {
            if (terms.get(i).getText().equals(label)) {
                return values.get(i).getText();
            }
        }
        throw new AssertionError("no fact '" + label + "' in " + card.getText());
    }

    /** The viewport only is captured; the element is brought into it first. */
    private void screenshot(String name, WebElement element) throws IOException {
        page.script("arguments[0].scrollIntoView({block: 'start'})", element);
        page.screenshot(name);
    }
}
