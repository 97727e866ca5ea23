package org.spectralsieve.web;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;
import java.net.URLEncoder;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.openqa.selenium.By;
import org.openqa.selenium.JavascriptExecutor;
import org.openqa.selenium.Keys;
import org.openqa.selenium.WebDriver;
import org.openqa.selenium.WebElement;
import org.openqa.selenium.support.ui.Select;
import org.openqa.selenium.support.ui.WebDriverWait;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.test.context.TestPropertySource;
import tools.jackson.databind.JsonNode;

/**
 * The weighted-figures section of the material view, in a real headless Chromium against the whole
 * application with its (illustrative) demo library. Every number on the page is checked against what
 * {@code GET /api/samples/{id}/figures} answers for the same sample, thickness, emitter and response, written
 * with the page's own rule for fractions. One browser session for all tests keeps the run short. Skipped
 * (not failed) on machines without Chromium and its driver.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = "spring.datasource.url=jdbc:h2:mem:browser-figures;DB_CLOSE_DELAY=-1")
class WeightedFiguresBrowserTest {


    /** Passes much of the UV-A, so erythema and the actinic S(λ) (which weights UV-B/C far more) differ. */
    private static final String UV_TRANSMITTING = "UV-transmitting cast acrylic, lamp-cover grade";
    /** Its curves start at 250 nm: the actinic table needs 180 nm, so the flat × actinic factor is refused. */
    private static final String STARTS_AT_250_NM = "Borosilicate crown optical glass windows";

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
    void figuresFollowTheChosenResponseAndTheRescaledThicknessAndMatchTheApi() throws Exception {
        JsonNode material = material(UV_TRANSMITTING);
        long sampleId = material.path("samples").get(0).path("id").asLong();
        page.load(port, "/");
        page.openMaterialFromLibrary(UV_TRANSMITTING);

        // Defaults: the first sample at its measured thickness, a 365 nm LED, unweighted (flat response).
        waitForStatus("led-365 × flat");
        assertThat(new Select(driver.findElement(By.id("figure-sample"))).getFirstSelectedOption()
                .getDomAttribute("value")).isEqualTo(String.valueOf(sampleId));
        chooseFlatSourceAndErythema();
        JsonNode erythema = figures(sampleId, "emitter=flat&response=erythema");
        String erythemaShown = shownValue("effectiveTransmittance");
        assertThat(erythemaShown).isEqualTo(fractionAsShown(erythema.path("effectiveTransmittance")));
        assertThat(row("effectiveTransmittance").getText()).contains("Effective transmittance, flat × erythema");

        // The caution is in view, in the server's words, and the erythemal figures point to it.
        WebElement caution = driver.findElement(By.id("figures-caution"));
        assertThat(caution.isDisplayed()).isTrue();
        assertThat(caution.getText()).contains(erythema.path("caution").asString());
        assertThat(row("erythemalProtectionFactor").getDomAttribute("class")).contains("hazard");
        assertThat(row("effectiveTransmittance").getDomAttribute("class")).contains("hazard");
        screenshot("figures-1-erythema");

        // Another response: fetched anew, another number, the one the API gives for that response.
        new Select(driver.findElement(By.id("figure-response"))).selectByValue("actinic-uv");
        waitForStatus("flat × actinic-uv");
        JsonNode actinic = figures(sampleId, "emitter=flat&response=actinic-uv");
        assertThat(actinic.path("effectiveTransmittance").path("value").asDouble())
                .isNotEqualTo(erythema.path("effectiveTransmittance").path("value").asDouble());
        String actinicShown = shownValue("effectiveTransmittance");
        assertThat(actinicShown).isEqualTo(fractionAsShown(actinic.path("effectiveTransmittance")))
                .isNotEqualTo(erythemaShown);

        // Rescaled in the chart: the figures follow that thickness, as the API computes it.
        driver.findElement(By.id("rescale-mm")).sendKeys("5", Keys.ENTER);
        waitForStatus("5 mm (rescaled");
        assertThat(new Select(driver.findElement(By.id("figure-sample"))).getFirstSelectedOption().getText())
                .startsWith("rescaled to 5 mm");
        JsonNode thick = figures(sampleId, "thicknessMm=5&emitter=flat&response=actinic-uv");
        assertThat(thick.path("rescaled").asBoolean()).isTrue();
        assertThat(shownValue("effectiveTransmittance"))
                .isEqualTo(fractionAsShown(thick.path("effectiveTransmittance")));
        screenshot("figures-2-actinic-rescaled");

        // Cleared: back to the measured sample.
        driver.findElement(By.id("rescale-clear")).click();
        waitForStatus("flat × actinic-uv");
        wait.until(d -> !d.findElement(By.id("figures-status")).getText().contains("rescaled"));
        assertThat(shownValue("effectiveTransmittance")).isEqualTo(actinicShown);
        page.assertNoPageMessage();
    }

    @Test
    void theBandConventionPickerSwitchesToTheDermatologyBandsAndTheFilterCategoryIsShown() throws Exception {
        JsonNode material = material(UV_TRANSMITTING);
        long sampleId = material.path("samples").get(0).path("id").asLong();
        JsonNode cie = figures(sampleId, "emitter=flat&response=erythema");
        JsonNode dermatology = figures(sampleId, "emitter=flat&response=erythema&convention=dermatology");
        page.load(port, "/");
        page.openMaterialFromLibrary(UV_TRANSMITTING);
        waitForStatus("led-365 × flat");
        assertThat(driver.findElement(By.id("figures-table")).getText()).contains("UV-B 280-315 nm");

        // The luminous transmittance and the category it falls in, as the API gives them.
        assertThat(shownValue("luminousTransmittance"))
                .isEqualTo(fractionAsShown(cie.path("luminousTransmittance")));
        WebElement category = row("sunglassCategory");
        assertThat(category.findElement(By.cssSelector("td.value")).getText())
                .isEqualTo(String.valueOf(cie.path("sunglassCategory").path("category").asInt()));
        assertThat(category.findElement(By.cssSelector("td.note")).getText())
                .contains(cie.path("sunglassCategory").path("range").asString());
        assertThat(category.getDomAttribute("class")).contains("hazard");

        new Select(driver.findElement(By.id("figure-convention"))).selectByValue("dermatology");
        wait.until(d -> d.findElement(By.id("figures-table")).getText().contains("UV-B 290-320 nm"));
        JsonNode dermatologyUvb = null;
        for (JsonNode band : dermatology.path("bandMeans")) {
            if (band.path("name").asString().contains("UVB")) {
                dermatologyUvb = band;
            }
        }
        assertThat(dermatologyUvb).as("dermatology UVB band in the API answer").isNotNull();
        String uvbName = dermatologyUvb.path("name").asString();
        WebElement uvbRow = driver.findElement(By.cssSelector("#figures-table tr[data-name='" + uvbName + "']"));
        assertThat(uvbRow.findElement(By.cssSelector("td.value")).getText()).isEqualTo(fractionAsShown(dermatologyUvb));
        page.assertNoPageMessage();
    }

    @Test
    void aResponseImportedThroughThePageIsChosenAndGivesTheApisFigureAndABadFileIsRefusedWithItsLine()
            throws Exception {
        // A flat weight over 300-400 nm (falling to 0 at 290 and 410 nm), whose effective transmittance
        // the API computes the same way for the imported name (flat-T identity, ISO/CIE 17166 form of the
        // weighted ratio; here only the page's wiring is under test, so the API is the reference).
        Path good = Files.createTempFile("flat-300-400", ".csv");
        // zero at 290 and 410 nm: the table says where it has no weight, so no emitter power lies beyond it
        StringBuilder csv = new StringBuilder("wavelength_nm,weight\n290,0\n");
        for (int nm = 300; nm <= 400; nm += 10) {
            csv.append(nm).append(",1\n");
        }
        csv.append("410,0\n");
        Files.writeString(good, csv.toString());
        Path bad = Files.createTempFile("negative-weight", ".csv");
        Files.writeString(bad, "wavelength_nm,weight\n300,1\n310,-2\n320,1\n");
        JsonNode material = material(UV_TRANSMITTING);
        long sampleId = material.path("samples").get(0).path("id").asLong();

        page.load(port, "/");
        page.openMaterialFromLibrary(UV_TRANSMITTING);
        waitForStatus("led-365 × flat");
        driver.findElement(By.cssSelector("#spectrum-import summary")).click();
        new Select(driver.findElement(By.id("spectrum-kind"))).selectByValue("responses");
        driver.findElement(By.id("spectrum-name")).sendKeys("page-flat-300-400");
        driver.findElement(By.id("spectrum-file")).sendKeys(good.toAbsolutePath().toString());
        driver.findElement(By.id("spectrum-import-button")).click();
        waitForStatus("led-365 × page-flat-300-400");
        assertThat(driver.findElement(By.id("spectrum-import-status")).getText())
                .startsWith("Imported response page-flat-300-400 (13 points");
        JsonNode answer = figures(sampleId, "emitter=led-365&response=page-flat-300-400");
        assertThat(shownValue("effectiveTransmittance")).isEqualTo(fractionAsShown(answer.path("effectiveTransmittance")));

        new Select(driver.findElement(By.id("spectrum-kind"))).selectByValue("responses");
        driver.findElement(By.id("spectrum-name")).sendKeys("page-negative");
        driver.findElement(By.id("spectrum-file")).sendKeys(bad.toAbsolutePath().toString());
        driver.findElement(By.id("spectrum-import-button")).click();
        WebElement status = driver.findElement(By.id("spectrum-import-status"));
        wait.until(d -> status.getText().startsWith("Not imported:"));
        assertThat(status.getText()).contains("3").containsIgnoringCase("negative");
        assertThat(PageBrowser.getJson(port, "/api/responses").toString()).doesNotContain("page-negative");
    }

    @Test
    void aPartNamedInFrontOfTheSampleGivesTheStacksFiguresAsTheApiDoes() throws Exception {
        JsonNode material = material(UV_TRANSMITTING);
        long sampleId = material.path("samples").get(0).path("id").asLong();
        JsonNode stacked = figures(sampleId, "emitter=led-365&response=flat&behind=clear-float-glass&behindMm=4");
        page.load(port, "/");
        page.openMaterialFromLibrary(UV_TRANSMITTING);
        waitForStatus("led-365 × flat");
        String alone = shownValue("luminousTransmittance");

        // the part by its name, as the suggestions offer it; the page sends its slug
        driver.findElement(By.id("figure-behind")).sendKeys("Clear float glass, glazier offcuts", Keys.TAB);
        WebElement mm = driver.findElement(By.id("figure-behind-mm"));
        assertThat(driver.findElement(By.id("figure-behind-problem")).isDisplayed())
                .as("no complaint while the thickness is still to be typed").isFalse();
        mm.sendKeys("4", Keys.TAB);
        waitForStatus("clear-float-glass");
        assertThat(driver.findElement(By.id("figures-status")).getText()).contains(stacked.path("layer").asString());
        assertThat(shownValue("luminousTransmittance"))
                .isEqualTo(fractionAsShown(stacked.path("luminousTransmittance"))).isNotEqualTo(alone);
        assertThat(shownValue("effectiveTransmittance")).isEqualTo(fractionAsShown(stacked.path("effectiveTransmittance")));

        // the thickness cleared and left: said beside the fields, and the figures are the sample's alone again
        mm.clear();
        mm.sendKeys(Keys.TAB);
        wait.until(d -> d.findElement(By.id("figure-behind-problem")).getText().contains("thickness"));
        wait.until(d -> !d.findElement(By.id("figures-status")).getText().contains("clear-float-glass"));
        waitForStatus("led-365 × flat");
        assertThat(shownValue("luminousTransmittance")).isEqualTo(alone);
        page.assertNoPageMessage();
    }

    @Test
    void aFigureTheCurveCannotGiveShowsTheServersReasonInsteadOfANumber() throws Exception {
        JsonNode material = material(STARTS_AT_250_NM);
        long sampleId = material.path("samples").get(0).path("id").asLong();
        JsonNode answer = figures(sampleId, "emitter=flat&response=erythema");
        JsonNode refused = answer.path("actinicUvProtectionFactor");
        assertThat(refused.path("available").asBoolean()).as("API refuses it for a curve from 250 nm").isFalse();

        page.load(port, "/");
        page.openMaterialFromLibrary(STARTS_AT_250_NM);
        waitForStatus("led-365 × flat");
        chooseFlatSourceAndErythema();
        WebElement row = row("actinicUvProtectionFactor");
        assertThat(row.getDomAttribute("class")).contains("unavailable");
        assertThat(row.findElement(By.cssSelector("td.value")).getText()).isEqualTo("not available");
        assertThat(row.findElement(By.cssSelector("td.note")).getText())
                .isEqualTo("Not available: " + refused.path("note").asString());
        // The figures the curve can give are still there, with numbers.
        assertThat(shownValue("effectiveTransmittance"))
                .isEqualTo(fractionAsShown(answer.path("effectiveTransmittance")));
        screenshot("figures-3-unavailable");
        page.assertNoPageMessage();
    }

    @Test
    void aRefusedEmitterIsExplainedOnceBesideThePickersWithoutAStatusCode() throws Exception {
        page.load(port, "/");
        page.openMaterialFromLibrary(UV_TRANSMITTING);
        waitForStatus("×");
        // No picker offers an unknown name; put one in, as a stale page would after a catalogue change.
        WebElement emitter = driver.findElement(By.id("figure-emitter"));
        ((JavascriptExecutor) driver).executeScript(
                "const o = document.createElement('option'); o.value = o.textContent = 'lamp-that-is-not-there';"
                        + " arguments[0].append(o); arguments[0].value = o.value;"
                        + " arguments[0].dispatchEvent(new Event('change'));", emitter);

        WebElement message = driver.findElement(By.id("message"));
        WebElement status = driver.findElement(By.id("figures-status"));
        wait.withMessage("waiting for the problem detail in the figures' status line");
        wait.until(d -> status.getText().startsWith("No figures:"));
        assertThat(status.getText()).contains("lamp-that-is-not-there").contains("known:");
        // told once, beside the pickers: no banner repeating it, no HTTP status code anywhere
        assertThat(message.isDisplayed()).isFalse();
        assertThat(driver.findElement(By.tagName("body")).getText()).doesNotContain("(400)");
        assertThat(driver.findElements(By.cssSelector("#figures-table tbody tr[data-figure]"))).isEmpty();
        screenshot("figures-4-refused");

        // A known emitter again: figures return and the message goes.
        new Select(emitter).selectByValue("led-365");
        waitForStatus("led-365 ×");
        assertThat(shownValue("effectiveTransmittance")).endsWith("%");
    }

    /**
     * Figures the server may add later, or members it may leave out, must not break the table: the page is
     * given an answer with two extra figures and one figure fewer (the real answer, changed on its way in).
     */
    @Test
    void figuresThePageDoesNotKnowYetAreShownByNameAndAMissingOneIsLeftOut() throws Exception {
        page.load(port, "/");
        ((JavascriptExecutor) driver).executeScript("""
                const realFetch = window.fetch.bind(window);
                window.fetch = async (url, init) => {
                  const response = await realFetch(url, init);
                  if (!String(url).includes('/figures') || !response.ok) return response;
                  const answer = await response.json();
                  delete answer.criticalWavelength;
                  answer.luminousTransmittance = { name: 'luminousTransmittance', value: 0.25, unit: 'fraction',
                      bound: 'value', available: true, note: 'added by the test' };
                  answer.laterFigures = [{ name: 'someLaterFigure', value: 2.5, unit: 'lm/W', available: true }];
                  return new Response(JSON.stringify(answer),
                      { status: 200, headers: { 'Content-Type': 'application/json' } });
                };""");
        page.openMaterialFromLibrary(UV_TRANSMITTING);
        waitForStatus("led-365 × flat");

        assertThat(driver.findElements(By.cssSelector("#figures-table tr[data-figure='criticalWavelength']"))).isEmpty();
        WebElement luminous = row("luminousTransmittance");
        assertThat(luminous.findElement(By.tagName("th")).getText()).startsWith("Luminous transmittance");
        assertThat(luminous.getDomAttribute("class")).as("luminous figures carry the caution").contains("hazard");
        assertThat(shownValue("luminousTransmittance")).isEqualTo("25.0 %");
        WebElement later = row("laterFigures");
        assertThat(later.findElement(By.tagName("th")).getText()).isEqualTo("someLaterFigure");
        assertThat(shownValue("laterFigures")).isEqualTo("2.5 lm/W");
        assertThat(later.findElement(By.xpath("ancestor::tbody")).getDomAttribute("data-group")).isEqualTo("other");
        assertThat(shownValue("effectiveTransmittance")).endsWith("%");
        page.assertNoPageMessage();
    }

    // ---------- the page's rule for fractions, mirrored (format.js percentNumber) ----------

    /**
     * A fraction as the page writes it: "≤ " for an upper bound, then percent with one decimal from 10 %,
     * two from 0.1 %, else two significant digits, then " %". JavaScript's toFixed and toPrecision round
     * the exact binary value half up, as BigDecimal of the double does.
     */
    static String fractionAsShown(JsonNode figure) {
        assertThat(figure.path("unit").asString()).isEqualTo("fraction");
        // a bounded transmittance is shown by both its ends, in the server's words (as the search states it)
        if (figure.path("stated").isString() && !figure.path("stated").asString().isBlank()) {
            return figure.path("stated").asString();
        }
        double p = figure.path("value").asDouble() * 100;
        BigDecimal exact = new BigDecimal(p);
        String text;
        if (p >= 10) {
            text = exact.setScale(1, RoundingMode.HALF_UP).toPlainString();
        } else if (p >= 0.1) {
            text = exact.setScale(2, RoundingMode.HALF_UP).toPlainString();
        } else if (p == 0) {
            text = "0";
        } else {
            text = exact.round(new MathContext(2, RoundingMode.HALF_UP)).stripTrailingZeros().toPlainString();
        }
        String bound = switch (figure.path("bound").asString()) {
            case "at-most" -> "≤ ";
            case "at-least" -> "≥ ";
            default -> "";
        };
        return bound + text + " %";
    }

    // ---------- page helpers ----------

    /** From the page's defaults to the pair the API answers without parameters (flat × erythema). */
    private void chooseFlatSourceAndErythema() {
        new Select(driver.findElement(By.id("figure-emitter"))).selectByValue("flat");
        waitForStatus("flat × flat");
        new Select(driver.findElement(By.id("figure-response"))).selectByValue("erythema");
        waitForStatus("flat × erythema");
    }

    private void waitForStatus(String part) {
        WebElement status = driver.findElement(By.id("figures-status"));
        wait.withMessage(() -> "waiting for the figures status to mention '" + part + "'; now: '"
                + status.getText() + "'; message: " + driver.findElement(By.id("message")).getText());
        wait.until(d -> status.getText().contains(part)
                && "shown".equals(d.findElement(By.id("weighted-figures")).getDomAttribute("data-state")));
    }

    private WebElement row(String figureKey) {
        return driver.findElement(By.cssSelector("#figures-table tr[data-figure='" + figureKey + "']"));
    }

    private String shownValue(String figureKey) {
        return row(figureKey).findElement(By.cssSelector("td.value")).getText();
    }

    private void screenshot(String name) throws IOException {
        page.screenshotOfElement(name, driver.findElement(By.id("weighted-figures")));
    }

    // ---------- API helpers ----------

    private JsonNode material(String nameStart) throws Exception {
        JsonNode materials = PageBrowser.getJson(port, "/api/materials?q=" + URLEncoder.encode(nameStart, StandardCharsets.UTF_8));
        for (JsonNode m : materials) {
            if (m.path("name").asString().startsWith(nameStart)) {
                return m;
            }
        }
        throw new AssertionError("demo library has no material named " + nameStart + "…");
    }

    private JsonNode figures(long sampleId, String query) throws Exception {
        return PageBrowser.getJson(port, "/api/samples/" + sampleId + "/figures?" + query);
    }
}
