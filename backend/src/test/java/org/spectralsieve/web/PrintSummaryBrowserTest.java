package org.spectralsieve.web;

import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Base64;
import java.util.List;
import java.util.Map;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.openqa.selenium.By;
import org.openqa.selenium.PrintsPage;
import org.openqa.selenium.WebElement;
import org.openqa.selenium.chromium.HasCdp;
import org.openqa.selenium.print.PrintOptions;
import org.spectralsieve.weighting.SafetyCaution;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.test.context.TestPropertySource;

/**
 * The printable summary of a shortlist and of a material (docs/print-summary.md), in headless Chromium over the
 * illustrative demo library: under print media only the summary shows, carrying the page's address, provenance,
 * verdict words and the illustrative and screening notes; a real PDF is printed, saved under
 * target/browser-test/ and, where poppler's tools are installed, read back as text and turned into PNG pages for
 * review. Skipped without Chromium; the PDF reading steps skip without pdftotext.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = "spring.datasource.url=jdbc:h2:mem:browser-print;DB_CLOSE_DELAY=-1")
class PrintSummaryBrowserTest {

    /** Blocks violet and asks for a luminous (eye) figure: the API answers with its screening caution. */
    private static final String REQUIREMENT = "blocks under 1% at 405 nm and luminous over 70%";
    /** A bulk plastic of the demo library, measured at two thicknesses: it can be rescaled. */
    private static final String ACRYLIC = "UV-transmitting cast acrylic, lamp-cover grade";
    /** Screen parts that never belong on paper. */
    private static final List<String> SCREEN_ONLY = List.of("search-form", "requirement-examples", "requirement-guide",
            "filters", "material-table", "message", "rescale-form", "figure-controls", "print-shortlist");

    private static PageBrowser browser;

    @LocalServerPort
    private int port;

    @BeforeAll
    static void startBrowser() throws IOException {
        browser = PageBrowser.startOrSkip();
    }

    @AfterAll
    static void stopBrowser() {
        if (browser != null) {
            browser.close();
        }
    }

    @AfterEach
    void backToScreen() {
        emulateMedia("");
    }

    @Test
    void onPaperAShortlistShowsOnlyItsSummaryWithAddressVerdictWordsProvenanceAndNotes() throws IOException {
        List<String> ids = shortlistSummary();
        assertThat(browser.driver().findElement(By.id("print-summary")).isDisplayed()).as("not on screen").isFalse();
        browser.screenshot("print-shortlist-button", "search-summary");

        emulateMedia("print");
        WebElement summary = browser.driver().findElement(By.id("print-summary"));
        assertThat(summary.isDisplayed()).as("the summary shows on paper").isTrue();
        for (String id : SCREEN_ONLY) {
            for (WebElement e : browser.driver().findElements(By.id(id))) {
                assertThat(e.isDisplayed()).as("#%s is a screen control, hidden on paper", id).isFalse();
            }
        }
        assertThat(browser.driver().findElement(By.cssSelector(".site-header")).isDisplayed()).isFalse();
        assertThat(browser.driver().findElement(By.cssSelector("main.layout")).isDisplayed()).isFalse();

        String text = summary.getText();
        // traceable to the shareable link (docs/shareable-address.md): the address with the requirement searched
        assertThat(text).contains(browser.driver().getCurrentUrl()).contains("Printed ");
        assertThat(browser.addressParameter("q")).isEqualTo(REQUIREMENT);
        assertThat(text).contains("Requirement as written: “" + REQUIREMENT + "”").contains("Understood as:");
        // the API's own caution for an eye figure, word for word
        assertThat(text).contains("Caution: " + SafetyCaution.TEXT);
        // demo stock is modelled: provenance in the rows and the illustrative note
        assertThat(text).contains("modelled").contains("Illustrative:").doesNotContain("not known");
        // every row of the page, each verdict in words (never colour alone), each with its clause explanations
        List<WebElement> rows = summary.findElements(By.cssSelector(".print-results tbody tr[data-verdict]"));
        assertThat(rows).hasSize(ids.size());
        for (WebElement row : rows) {
            String verdict = row.getDomAttribute("data-verdict");
            assertThat(row.getText()).contains(verdict);
            WebElement explanations = row.findElement(By.xpath("following-sibling::tr[1]"));
            assertThat(explanations.getText()).contains("405 nm").contains("margin").contains("decades");
        }
        assertThat(summary.findElements(By.cssSelector("button, input, select, a"))).as("no controls on paper").isEmpty();
        browser.screenshot("print-shortlist-emulated");
    }

    @Test
    void onPaperAMaterialShowsItsSamplesProvenanceChartFiguresAndTheRescalingNote() throws IOException {
        materialSummary();
        browser.screenshot("print-material-button", "material-detail");

        emulateMedia("print");
        WebElement summary = browser.driver().findElement(By.id("print-summary"));
        assertThat(summary.isDisplayed()).isTrue();
        assertThat(browser.driver().findElement(By.id("material-detail")).isDisplayed()).isFalse();
        assertThat(browser.driver().findElement(By.id("print-material")).isDisplayed()).isFalse();
        String text = summary.getText();
        assertThat(text).contains(ACRYLIC).contains(browser.driver().getCurrentUrl());
        assertThat(text).contains("Provenance").contains("modelled").contains("Illustrative:")
                .contains("illustrative — not for design decisions"); // the demo samples' own notes
        assertThat(summary.findElements(By.cssSelector(".print-samples tbody tr"))).hasSizeGreaterThanOrEqualTo(2);
        assertThat(text).contains("Rescaled curve: 5 mm").contains("not a measurement").contains("rescaled to 5 mm");
        // the figures shown, and the caution because some of them concern eyes or skin
        assertThat(summary.findElements(By.cssSelector(".print-figures tbody tr"))).isNotEmpty();
        assertThat(text).contains("Caution: " + SafetyCaution.TEXT);
        // the chart fits the paper's width
        WebElement chart = summary.findElement(By.cssSelector(".print-chart img"));
        long chartWidth = ((Number) browser.script("return arguments[0].getBoundingClientRect().width", chart)).longValue();
        long summaryWidth = ((Number) browser.script("return arguments[0].getBoundingClientRect().width", summary)).longValue();
        assertThat(chartWidth).isPositive().isLessThanOrEqualTo(summaryWidth);
        assertThat((Boolean) browser.script("return arguments[0].complete && arguments[0].naturalWidth > 0", chart)).isTrue();
        browser.screenshot("print-material-emulated");
    }

    @Test
    void aPrintedShortlistPdfCarriesProvenanceAndTheNotes() throws Exception {
        shortlistSummary();
        Path pdf = printPdf("print-shortlist");
        String text = pdfText(pdf);
        assertThat(text).contains(REQUIREMENT).contains("Provenance").contains("modelled").contains("Illustrative")
                .contains("Caution").contains("meets").contains("q=blocks+under");
        pages(pdf);
    }

    @Test
    void aPrintedMaterialPdfCarriesProvenanceTheRescalingNoteAndTheChart() throws Exception {
        materialSummary();
        Path pdf = printPdf("print-material");
        String text = pdfText(pdf);
        assertThat(text).contains("UV-transmitting cast acrylic").contains("Provenance").contains("modelled")
                .contains("Illustrative").contains("Rescaled curve").contains("material=");
        pages(pdf);
    }

    // ---------- steps ----------

    /** Searches and presses "Print summary" (the print dialog itself stubbed: headless has none). */
    private List<String> shortlistSummary() {
        browser.open(port, "/");
        List<String> ids = browser.search(REQUIREMENT);
        pressPrint("print-shortlist", "Shortlist");
        return ids;
    }

    private void materialSummary() {
        browser.open(port, "/");
        browser.openMaterialFromLibrary(ACRYLIC);
        browser.waiting().withMessage("waiting for the chart")
                .until(d -> !d.findElements(By.cssSelector("#curve-chart canvas")).isEmpty());
        browser.driver().findElement(By.id("rescale-mm")).sendKeys("5");
        browser.driver().findElement(By.id("rescale-apply")).click();
        browser.waitForLegend("rescaled to 5 mm");
        browser.waiting().withMessage("waiting for the weighted figures")
                .until(d -> !d.findElements(By.cssSelector("#figures-table tbody tr")).isEmpty());
        pressPrint("print-material", "Rescaled curve");
    }

    private void pressPrint(String buttonId, String expected) {
        browser.script("window.print = () => { window.printAsked = (window.printAsked || 0) + 1; };");
        browser.driver().findElement(By.id(buttonId)).click();
        assertThat(((Number) browser.script("return window.printAsked")).intValue()).isEqualTo(1);
        // provenance may arrive a moment after the search; the summary is filled again with it
        browser.waiting().withMessage("waiting for the printable summary")
                .until(d -> {
                    String t = (String) browser.script("return document.getElementById('print-summary').textContent");
                    return t.contains(expected) && t.contains("modelled") && !t.contains("not known");
                });
    }

    private void emulateMedia(String media) {
        if (browser != null) {
            ((HasCdp) browser.driver()).executeCdpCommand("Emulation.setEmulatedMedia", Map.of("media", media));
        }
    }

    private Path printPdf(String name) throws IOException {
        String base64 = ((PrintsPage) browser.driver()).print(new PrintOptions()).getContent();
        byte[] bytes = Base64.getDecoder().decode(base64);
        assertThat(new String(bytes, 0, 5, StandardCharsets.US_ASCII)).isEqualTo("%PDF-");
        return Files.write(Files.createDirectories(HeadlessChromium.OUTPUT).resolve(name + ".pdf"), bytes);
    }

    /** The PDF's text by poppler's pdftotext; the test is skipped (not failed) where it is not installed. */
    private static String pdfText(Path pdf) throws Exception {
        assumeTrue(onPath("pdftotext"), "PDF text check skipped: no pdftotext (apt-get install poppler-utils); "
                + "the PDF is at " + pdf.toAbsolutePath());
        Path out = pdf.resolveSibling(pdf.getFileName().toString().replace(".pdf", ".txt"));
        run("pdftotext", "-enc", "UTF-8", pdf.toString(), out.toString());
        // pdftotext breaks lines where the paper does: compare with single spaces
        return Files.readString(out).replaceAll("\\s+", " ");
    }

    /** Page images for review (target/browser-test/<name>-1.png …), where pdftoppm is installed. */
    private static void pages(Path pdf) throws Exception {
        if (onPath("pdftoppm")) {
            run("pdftoppm", "-png", "-r", "70", pdf.toString(), pdf.toString().replace(".pdf", ""));
        }
    }

    private static boolean onPath(String tool) {
        for (String dir : System.getenv().getOrDefault("PATH", "").split(java.io.File.pathSeparator)) {
            if (Files.isExecutable(Path.of(dir, tool))) {
                return true;
            }
        }
        return false;
    }

    private static void run(String... command) throws Exception {
        Process process = new ProcessBuilder(command).redirectErrorStream(true).start();
        String output = new String(process.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
        assertThat(process.waitFor(60, TimeUnit.SECONDS)).as("%s finished", command[0]).isTrue();
        assertThat(process.exitValue()).as("%s: %s", command[0], output).isZero();
    }
}
