package org.spectralsieve.web;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.openqa.selenium.By;
import org.openqa.selenium.WebElement;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.test.context.TestPropertySource;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * The shortlist's rows say which sample stands behind them, measured or rescaled and from which thickness, and
 * opening a row whose sample was measured at the row's thickness shows that measurement, not a curve rescaled
 * onto it (docs/result-rows.md). The demo material measured at two thicknesses is illustrative
 * (seed-materials/catalogue.json); its thicknesses are read from {@code GET /api/materials}, never written here.
 * Screenshots under target/browser-test/rows-*.png.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = "spring.datasource.url=jdbc:h2:mem:browser-rows;DB_CLOSE_DELAY=-1")
class ResultRowsBrowserTest {

    private static final String TWO_THICKNESSES = "UV-transmitting cast acrylic, lamp-cover grade";
    private static final JsonMapper JSON = JsonMapper.builder().build();

    private static PageBrowser page;

    @LocalServerPort
    private int port;

    @BeforeAll
    static void startBrowser() throws IOException {
        page = PageBrowser.startOrSkip();
    }

    @AfterAll
    static void stopBrowser() {
        if (page != null) {
            page.close();
        }
    }

    @Test
    void aRowAtAMeasuredThicknessSaysSoAndOpensOnTheMeasurementWithNoRescaledCurve() throws Exception {
        double measured = measuredThicknesses().get(1);
        String mm = mm(measured);
        page.open(port, "/");
        setLimit(100);
        String requirement = "passes over 50% at 365 nm, at " + mm + " mm";
        page.search(requirement);

        WebElement row = rowOf(TWO_THICKNESSES);
        WebElement used = row.findElement(By.cssSelector(".sample-used"));
        assertThat(used.getText()).isEqualTo("measured at " + mm + " mm");
        assertThat(used.getDomAttribute("data-rescaled")).isEqualTo("false");
        page.screenshot("rows-1-measured-at-row-thickness", "search-results");

        String sampleId = row.getDomAttribute("data-sample-id");
        row.findElement(By.cssSelector("button.material-link")).click();
        page.waitForMaterial(TWO_THICKNESSES);
        page.waitForLegend(mm + " mm regular");
        assertThat(page.driver().findElement(By.id("figure-sample")).getDomProperty("value"))
                .as("the weighted figures are of the row's own sample").isEqualTo(sampleId);
        assertThat(legendLabels()).as("no curve rescaled onto a thickness that was measured")
                .noneMatch(label -> label.startsWith("rescaled to"));
        assertThat(page.driver().findElement(By.id("rescale-mm")).getDomProperty("value")).isEmpty();
        assertThat(page.addressParameter("mm")).as("the address asks for no rescaling").isNull();
        page.screenshot("rows-2-opened-measured", "material-detail");
    }

    @Test
    void aRowBetweenMeasurementsSaysWhichItIsRescaledFromAndOpensOnThatRescaling() throws Exception {
        List<Double> measured = measuredThicknesses();
        // nearer the thinner one by thickness ratio, the rule that picks the sample (docs/thickness.md)
        double asked = Math.round(measured.get(0) * Math.pow(measured.get(1) / measured.get(0), 0.25) * 100) / 100.0;
        page.open(port, "/");
        setLimit(100);
        page.search("passes over 50% at 365 nm, at " + mm(asked) + " mm");

        WebElement row = rowOf(TWO_THICKNESSES);
        WebElement used = row.findElement(By.cssSelector(".sample-used"));
        assertThat(used.getText()).isEqualTo("rescaled from " + mm(measured.get(0)) + " mm");
        assertThat(used.getDomAttribute("data-rescaled")).isEqualTo("true");

        row.findElement(By.cssSelector("button.material-link")).click();
        page.waitForMaterial(TWO_THICKNESSES);
        page.waitForLegend("rescaled to " + mm(asked) + " mm (from " + mm(measured.get(0)) + " mm)");
        page.screenshot("rows-3-opened-rescaled", "material-detail");
    }

    @Test
    void theRowsStayUsableInANarrowWindowAndTheLibraryListNamesTheMeasuredThicknesses() throws Exception {
        page.resize(390, 900);
        try {
            page.open(port, "/");
            List<Double> measured = measuredThicknesses();
            WebElement listed = page.waiting().until(d -> d.findElements(By.cssSelector("#material-table tr[data-material-id]"))
                    .stream().filter(r -> r.findElement(By.cssSelector("td")).getText().equals(TWO_THICKNESSES))
                    .findFirst().orElse(null));
            String thicknesses = String.join(" · ", measured.stream().map(ResultRowsBrowserTest::mm).toList()) + "\u00a0mm";
            assertThat(listed.findElements(By.tagName("td")).get(2).getDomProperty("textContent")).isEqualTo(thicknesses);

            page.search("passes over 80% at 365 nm and blocks under 1% at 405 nm, thickness 1 to 6 mm");
            assertThat(page.driver().findElements(By.cssSelector("#results-table .sample-used"))).isNotEmpty();
            page.assertNoSidewaysScrolling("shortlist at 390 px");
            page.screenshot("rows-4-narrow", "search-results");
        } finally {
            page.resize(1280, 1000);
        }
    }

    private void setLimit(int limit) {
        WebElement field = page.driver().findElement(By.id("search-limit"));
        field.clear();
        field.sendKeys(String.valueOf(limit));
    }

    private WebElement rowOf(String name) {
        return page.resultRows().stream()
                .filter(r -> r.findElement(By.cssSelector("button.material-link")).getText().equals(name))
                .findFirst().orElseThrow(() -> new AssertionError(name + " is not in the shortlist"));
    }

    private List<String> legendLabels() {
        return page.driver().findElements(By.cssSelector("#curve-chart .u-legend .u-series .u-label")).stream()
                .map(e -> e.getDomProperty("textContent")).toList();
    }

    /** The distinct thicknesses the demo material was measured at, thinnest first, as the API states them. */
    private List<Double> measuredThicknesses() throws Exception {
        for (JsonNode m : JSON.readTree(PageBrowser.get(port, "/api/materials").body())) {
            if (m.path("name").asString().equals(TWO_THICKNESSES)) {
                List<Double> out = new ArrayList<>();
                m.path("samples").forEach(s -> out.add(s.path("thicknessMm").asDouble()));
                List<Double> distinct = out.stream().distinct().sorted().toList();
                assertThat(distinct).as("measured at two thicknesses").hasSizeGreaterThanOrEqualTo(2);
                return distinct;
            }
        }
        throw new AssertionError(TWO_THICKNESSES + " is not in the demo library");
    }

    /** A thickness as the page writes it: "6", "3.3". */
    private static String mm(double value) {
        return BigDecimal.valueOf(value).stripTrailingZeros().toPlainString();
    }
}
