package org.spectralsieve.web;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.net.URI;
import java.net.URLEncoder;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeSet;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.openqa.selenium.By;
import org.openqa.selenium.Keys;
import org.openqa.selenium.WebElement;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.test.context.TestPropertySource;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * The compare overlay kept in the address (cmp=), its downloads, and the charts' values tables
 * (docs/compare-chart.md, docs/shareable-address.md, docs/chart-values-table.md), in headless Chromium over the
 * illustrative demo library. Every expected number is asked of the API, never written here. Skipped without Chromium.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = "spring.datasource.url=jdbc:h2:mem:browser-compare-link;DB_CLOSE_DELAY=-1")
class CompareLinkAndChartValuesBrowserTest {

    private static final JsonMapper JSON = JsonMapper.builder().build();
    /** Rows judged at several thicknesses, so the overlay holds rescaled curves. */
    private static final String REQUIREMENT = "passes over 80% at 365 nm and blocks under 1% at 405 nm, thickness 1 to 6 mm";
    /** A bulk plastic of the demo library, measured at two thicknesses. */
    private static final String ACRYLIC = "UV-transmitting cast acrylic, lamp-cover grade";

    private static PageBrowser page;

    @LocalServerPort
    private int port;

    @BeforeAll
    static void startBrowser() throws Exception {
        page = PageBrowser.startOrSkip();
    }

    @AfterAll
    static void stopBrowser() {
        if (page != null) {
            page.close();
        }
    }

    @Test
    void aSharedCompareLinkDrawsTheSameCurvesInAFreshBrowserAndBackLeavesTheOverlay() throws Exception {
        page.open(port, "/");
        page.search(REQUIREMENT);
        page.driver().findElement(By.id("compare-top3")).click();
        waitForSeries(page, 3);
        List<String> topThree = texts(page, "#compare-key li");
        String cmp = page.addressParameter("cmp");
        assertThat(cmp).as("the address names the three compared materials").matches("\\d+,\\d+,\\d+");
        // a material added by name is kept apart: it is drawn as added (as measured), not as its shortlist row
        WebElement pick = page.driver().findElement(By.id("compare-pick"));
        pick.sendKeys(ACRYLIC);
        page.driver().findElement(By.id("compare-add")).click();
        waitForSeries(page, 4);
        List<String> key = texts(page, "#compare-key li");
        assertThat(key.get(3)).contains(ACRYLIC).contains("added");
        assertThat(page.addressParameter("cmp")).isEqualTo(cmp);
        assertThat(page.addressParameter("cmp.add")).matches("\\d+");
        String link = URI.create(page.driver().getCurrentUrl()).getRawPath() + "?"
                + URI.create(page.driver().getCurrentUrl()).getRawQuery();

        try (PageBrowser fresh = PageBrowser.startOrSkip()) {
            fresh.open(port, link);
            waitForSeries(fresh, 4);
            fresh.waiting().until(d -> texts(fresh, "#compare-key li").equals(key));
            assertThat(texts(fresh, "#compare-key li")).as("same curves, same thicknesses, same order").isEqualTo(key);
            assertThat(fresh.addressParameter("cmp")).isEqualTo(cmp);
            assertThat(fresh.addressParameter("cmp.add")).isEqualTo(page.addressParameter("cmp.add"));
            fresh.screenshot("compare-link-1-fresh-browser", "compare");
        }

        // Back steps out of the added material, then out of the overlay
        page.driver().navigate().back();
        waitForSeries(page, 3);
        page.waiting().until(d -> texts(page, "#compare-key li").equals(topThree));
        assertThat(page.addressParameter("cmp.add")).isNull();
        page.driver().navigate().back();
        page.waiting().withMessage("Back leaves the overlay").until(d -> page.addressParameter("cmp") == null
                && "0".equals(d.findElement(By.id("compare-chart")).getDomAttribute("data-series")));
        assertThat(page.addressParameter("q")).as("the search stays").isEqualTo(REQUIREMENT);
        assertThat(page.resultRows()).isNotEmpty();

        page.driver().navigate().forward();
        waitForSeries(page, 3);
        page.waiting().until(d -> texts(page, "#compare-key li").equals(topThree));
        assertThat(page.addressParameter("cmp")).isEqualTo(cmp);
    }

    @Test
    void aLinkNamingMaterialsTheLibraryLacksSaysSoBesideTheChartAndDrawsTheRest() throws Exception {
        page.open(port, "/");
        String first = page.search(REQUIREMENT).get(0);
        page.open(port, "/?q=" + encode(REQUIREMENT) + "&cmp=" + first + ",987654321,abc");
        waitForSeries(page, 1);
        WebElement note = page.waiting().until(d -> {
            WebElement n = d.findElement(By.id("compare-address-note"));
            return n.isDisplayed() ? n : null;
        });
        assertThat(note.getText()).contains("987654321", "abc").contains("the other one is drawn");
        assertThat(page.driver().findElements(By.id("message")).get(0).isDisplayed())
                .as("said once, beside the chart, not again in the page's message area").isFalse();
        page.waiting().until(d -> first.equals(page.addressParameter("cmp")));
        page.screenshot("compare-link-2-unknown-ids", "compare");
    }

    @Test
    void eachComparedCurveDownloadsAtTheThicknessItIsDrawnAtAndTheChartAsPng() throws Exception {
        page.open(port, "/");
        page.search(REQUIREMENT);
        page.driver().findElement(By.id("compare-top3")).click();
        waitForSeries(page, 3);
        List<WebElement> rows = page.waiting().until(d -> {
            List<WebElement> r = d.findElements(By.cssSelector("#compare-downloads li"));
            return r.size() == 3 ? r : null;
        });
        boolean anyRescaled = false;
        for (WebElement row : rows) {
            String drawnMm = row.getDomAttribute("data-thickness-mm");
            for (WebElement link : row.findElements(By.cssSelector("a"))) {
                String href = link.getDomAttribute("href");
                String body = fetch(href);
                if ("csv".equals(link.getDomAttribute("data-format"))) {
                    assertThat(body).as(href).startsWith("# Spectral Sieve curve");
                    // the file is the curve at the thickness the chart draws it at
                    double fileMm = Double.parseDouble(body.replaceAll("(?s).*# thickness_mm: ([0-9.]+).*", "$1"));
                    assertThat(fileMm).as(href).isCloseTo(Double.parseDouble(drawnMm), within(1e-9));
                    anyRescaled |= body.contains("# rescaled: true");
                } else {
                    assertThat(body).as(href).contains("##JCAMP-DX=");
                }
            }
        }
        assertThat(anyRescaled).as("a thickness range rescales some rows; their files say so").isTrue();

        page.script("window.__saved = null; const click = HTMLAnchorElement.prototype.click;"
                + "HTMLAnchorElement.prototype.click = function () { if (this.download) { window.__saved = [this.download, this.href]; }"
                + " else { click.call(this); } };");
        page.driver().findElement(By.id("compare-png")).click();
        @SuppressWarnings("unchecked")
        List<String> saved = (List<String>) page.waiting().until(d -> page.script("return window.__saved"));
        assertThat(saved.get(0)).isEqualTo("compared-3-curves.png");
        assertThat(saved.get(1)).startsWith("data:image/png;base64,");
        page.screenshot("compare-link-3-downloads", "compare-clauses");

        // the values table lists each compared curve at the thickness drawn: the API's curve at that thickness
        List<JsonNode> curves = new ArrayList<>();
        for (WebElement row : rows) {
            String csv = row.findElement(By.cssSelector("a[data-format='csv']")).getDomAttribute("href");
            curves.add(json("/" + csv.replace("curve.csv", "curve")));
        }
        page.driver().findElement(By.cssSelector("#compare-values summary")).click();
        WebElement table = page.waiting().until(d -> {
            List<WebElement> t = d.findElements(By.cssSelector("#compare-values table.values-table"));
            return t.isEmpty() ? null : t.get(0);
        });
        assertTableMatches(table, curves, false);
        assertThat(page.driver().findElement(By.id("compare-chart")).getDomAttribute("aria-label"))
                .startsWith("Chart of 3 curves").contains("Show values as a table");
        page.screenshot("compare-link-4-values-table", "compare-values");
    }

    @Test
    void theMaterialChartsValuesTableHasAColumnPerDrawnCurveWithUnitsAndTheApisValues() throws Exception {
        page.open(port, "/");
        page.openMaterialFromLibrary(ACRYLIC);
        String materialId = page.driver().findElement(By.cssSelector("#material-table tr[aria-selected='true']"))
                .getDomAttribute("data-material-id");
        JsonNode material = json("/api/materials/" + materialId);
        List<JsonNode> curves = new ArrayList<>();
        for (JsonNode sample : material.get("samples")) {
            curves.add(json("/api/samples/" + sample.get("id").asLong() + "/curve"));
        }
        page.waiting().until(d -> d.findElement(By.id("curve-values")).isDisplayed());
        String label = page.driver().findElement(By.cssSelector("#curve-chart canvas")).getDomAttribute("aria-label");
        assertThat(label).contains(curves.size() + " curves").contains("Show values as a table");

        // opened from the keyboard: the summary takes focus and Enter opens it
        WebElement summary = page.driver().findElement(By.cssSelector("#curve-values summary"));
        summary.sendKeys(Keys.ENTER);
        WebElement table = page.waiting().until(d -> {
            List<WebElement> t = d.findElements(By.cssSelector("#curve-values table.values-table"));
            return t.isEmpty() ? null : t.get(0);
        });
        assertTableMatches(table, curves, false);
        page.screenshot("chart-values-1-material-linear", "curve-values");

        // on the OD axis the same table reads optical density
        page.script("const s = document.getElementById('axis-mode'); s.value = 'od';"
                + "s.dispatchEvent(new Event('change'));");
        WebElement odTable = page.waiting().until(d -> {
            List<WebElement> t = d.findElements(By.cssSelector("#curve-values table.values-table[data-axis-mode='od']"));
            return t.isEmpty() ? null : t.get(0);
        });
        assertTableMatches(odTable, curves, true);
        page.screenshot("chart-values-2-material-od", "curve-values");
        page.assertNoSidewaysScrolling("values table open");
    }

    @Test
    void aPhoneWideWindowKeepsTheOpenValuesTablesAndCompareDownloadsInside() throws Exception {
        page.resize(390, 844);
        try {
            page.open(port, "/");
            page.search(REQUIREMENT);
            page.driver().findElement(By.id("compare-top3")).click();
            waitForSeries(page, 3);
            page.driver().findElement(By.cssSelector("#compare-values summary")).click();
            page.waiting().until(d -> !d.findElements(By.cssSelector("#compare-values table.values-table")).isEmpty());
            page.assertNoSidewaysScrolling("compare values table open at 390 px");
            page.screenshot("compare-link-5-narrow", "compare-values");
            page.openMaterialFromLibrary(ACRYLIC);
            page.waiting().until(d -> d.findElement(By.id("curve-values")).isDisplayed());
            page.driver().findElement(By.cssSelector("#curve-values summary")).click();
            page.waiting().until(d -> !d.findElements(By.cssSelector("#curve-values table.values-table")).isEmpty());
            page.assertNoSidewaysScrolling("material values table open at 390 px");
        } finally {
            page.resize(1400, 1300);
        }
    }

    /** Headers name the unit of every drawn curve; each shown row holds the API's value (or bound) at that wavelength. */
    private static void assertTableMatches(WebElement table, List<JsonNode> curves, boolean od) {
        List<String> headers = table.findElements(By.cssSelector("thead th")).stream().map(WebElement::getText).toList();
        assertThat(headers).hasSize(curves.size() + 1);
        assertThat(headers.get(0)).isEqualTo("Wavelength (nm)");
        assertThat(headers.subList(1, headers.size())).allSatisfy(h -> assertThat(h).endsWith(od ? "— OD" : "— T (%)"));

        TreeSet<Double> wavelengths = new TreeSet<>();
        List<Map<Double, Integer>> indexes = new ArrayList<>();
        for (JsonNode curve : curves) {
            Map<Double, Integer> index = new HashMap<>();
            JsonNode xs = curve.get("wavelengthsNm");
            for (int i = 0; i < xs.size(); i++) {
                wavelengths.add(xs.get(i).asDouble());
                index.put(xs.get(i).asDouble(), i);
            }
            indexes.add(index);
        }
        List<WebElement> rows = table.findElements(By.cssSelector("tbody tr"));
        // at most 200 rows: every wavelength when the curves have no more, else every k-th with the last kept
        assertThat(rows).as("rows of %s wavelengths", wavelengths.size()).hasSize(shownRows(wavelengths.size()));
        assertThat(Double.parseDouble(rows.get(rows.size() - 1).findElement(By.cssSelector("th")).getText()))
                .as("the last wavelength is always listed").isEqualTo(wavelengths.last());

        for (WebElement row : rows) {
            double nm = Double.parseDouble(row.findElement(By.cssSelector("th")).getText());
            List<WebElement> cells = row.findElements(By.cssSelector("td"));
            for (int c = 0; c < curves.size(); c++) {
                String text = cells.get(c).getText();
                Integer i = indexes.get(c).get(nm);
                if (i == null) {
                    assertThat(text).isEqualTo("—");
                    continue;
                }
                JsonNode curve = curves.get(c);
                boolean below = curve.has("belowDetection") && curve.get("belowDetection").get(i).asBoolean(false);
                double t = below && curve.path("detectionLimit").asDouble(0) > 0
                        ? curve.get("detectionLimit").asDouble() : curve.get("transmittance").get(i).asDouble();
                if (below) {
                    assertThat(text).as("a bound at %s nm", nm).startsWith(od ? "> " : "< ");
                    text = text.substring(2);
                }
                if (od) {
                    if (t > 0) {
                        assertThat(Double.parseDouble(text)).as("OD at %s nm", nm).isCloseTo(-Math.log10(t), within(0.0006));
                    }
                } else {
                    // four significant figures shown
                    assertThat(Double.parseDouble(text)).as("T %% at %s nm", nm)
                            .isCloseTo(t * 100, within(Math.max(1e-12, Math.abs(t * 100) * 6e-4)));
                }
            }
        }
        assertThat(rows).isNotEmpty();
    }

    /** docs/chart-values-table.md: step k = ceil(n / 200); rows 0, k, 2k, … and the last (the 200th at most). */
    private static int shownRows(int n) {
        int step = Math.max(1, (n + 199) / 200);
        int rows = (n + step - 1) / step;
        boolean lastIncluded = (n - 1) % step == 0;
        return lastIncluded ? rows : Math.min(200, rows + 1);
    }

    private void waitForSeries(PageBrowser browser, int n) {
        browser.waiting().withMessage("waiting for " + n + " compared curves").until(d ->
                String.valueOf(n).equals(d.findElement(By.id("compare-chart")).getDomAttribute("data-series"))
                        && d.findElements(By.cssSelector("#compare-key li")).size() == n);
    }

    private static List<String> texts(PageBrowser browser, String css) {
        return browser.driver().findElements(By.cssSelector(css)).stream()
                .map(e -> e.getDomProperty("textContent")).toList();
    }

    private JsonNode json(String path) throws Exception {
        var answer = PageBrowser.get(port, path);
        assertThat(answer.statusCode()).as(path).isEqualTo(200);
        return JSON.readTree(answer.body());
    }

    private static String encode(String text) {
        return URLEncoder.encode(text, StandardCharsets.UTF_8).replace("+", "%20");
    }

    /** The body the page's link leads to, fetched by the page itself (same origin). */
    private static String fetch(String href) {
        return (String) ((org.openqa.selenium.JavascriptExecutor) page.driver()).executeAsyncScript(
                "const done = arguments[arguments.length - 1]; fetch(arguments[0]).then(r => r.text()).then(done, e => done(String(e)));",
                href);
    }
}
