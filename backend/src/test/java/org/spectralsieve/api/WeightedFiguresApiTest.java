package org.spectralsieve.api;

import static org.assertj.core.api.Assertions.assertThat;

import java.net.URI;
import java.net.URLEncoder;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import org.junit.jupiter.api.Test;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.test.context.TestPropertySource;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/** The emitter catalogue and a sample's weighted figures over the (illustrative) demo library. */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = "spring.datasource.url=jdbc:h2:mem:weighting-api-test;DB_CLOSE_DELAY=-1")
class WeightedFiguresApiTest {

    private static final HttpClient HTTP = HttpClient.newHttpClient();
    private static final JsonMapper JSON = JsonMapper.builder().build();

    @LocalServerPort
    int port;

    @Test
    void emitterCatalogueListsTheSeededSourcesWithTheCaution() throws Exception {
        JsonNode body = getJson("/api/emitters", 200);
        assertThat(body.path("caution").asString()).contains("not a certification of protective equipment");
        assertThat(body.path("emitters").size()).isEqualTo(9);
        JsonNode led = body.path("emitters").get(0);
        assertThat(led.path("name").asString()).isEqualTo("led-365");
        assertThat(led.path("kind").asString()).isEqualTo("led");
        assertThat(led.path("parameters").path("peakNm").asDouble()).isEqualTo(365.0);
        assertThat(led.path("rangeNm").size()).isEqualTo(2);
    }

    /**
     * A clear UV-grade silica window loses about 4 % at each face and absorbs almost nothing over
     * 250-400 nm, so its erythemal factor is near 1/0.92 (lossless slab n = 1.5: T = 0.923, Modern Optical Engineering,
     * Fresnel reflection at normal incidence; reference sheet §7).
     */
    @Test
    void fusedSilicaErythemalProtectionFactorIsNearOneOverPointNineTwo() throws Exception {
        JsonNode f = figures(sampleId("UV-grade synthetic fused silica"), "");
        double pf = f.path("protectionFactor").path("value").asDouble();
        assertThat(pf).isBetween(1 / 0.95, 1 / 0.89);
        assertThat(f.path("emitter").asString()).isEqualTo("flat");
        assertThat(f.path("response").asString()).isEqualTo("erythema");
        assertThat(f.path("effectiveTransmittance").path("value").asDouble()).isCloseTo(1 / pf,
                org.assertj.core.api.Assertions.within(1e-12));
        assertThat(f.path("caution").asString()).contains("qualified safety professional");
    }

    /** Common practice, no source: a UV-blocking window film stops nearly all erythemally weighted UV. */
    @Test
    void uvBlockingFilmHasALargeErythemalProtectionFactor() throws Exception {
        JsonNode f = figures(sampleId("UV-blocking clear window film"), "");
        assertThat(f.path("erythemalProtectionFactor").path("value").asDouble()).isGreaterThan(50);
        assertThat(f.path("criticalWavelength").path("value").asDouble()).isGreaterThan(370);
        assertThat(f.path("actinicUvProtectionFactor").path("value").asDouble()).isGreaterThan(50);
        assertThat(f.path("bandMeans").get(1).path("name").asString()).isEqualTo("meanTransmittanceUVB(280-315 nm)");
        assertThat(f.path("bandMeans").get(0).path("note").asString()).contains("covered part");
    }

    /** Beer–Lambert: more of an absorbing material can only pass less, so the factor grows with thickness. */
    @Test
    void thickerSheetHasTheLargerProtectionFactor() throws Exception {
        long id = sampleId("Clear cast acrylic sheet");
        JsonNode thin = figures(id, "&emitter=led-365&response=flat");
        JsonNode thick = figures(id, "&emitter=led-365&response=flat&thicknessMm=20");
        assertThat(thick.path("rescaled").asBoolean()).isTrue();
        assertThat(thick.path("protectionFactor").path("value").asDouble())
                .isGreaterThan(thin.path("protectionFactor").path("value").asDouble());
    }

    /**
     * The silica window again: it absorbs nothing in the visible, so τv is its Fresnel transmittance,
     * about 0.93 (n = 1.46, two faces: Modern Optical Engineering; reference sheet §7), which
     * ISO 12312-1:2013 puts in category 0 (> 80 % to 100 %, reference sheet §5). Under any named solar
     * spectrum a nearly flat T gives UPF near 1/T (sheet §2).
     */
    @Test
    void clearWindowHasLuminousTransmittanceNearItsFresnelValueAndCategoryZero() throws Exception {
        JsonNode f = figures(sampleId("UV-grade synthetic fused silica"), "&solar=d65");
        double tv = f.path("luminousTransmittance").path("value").asDouble();
        assertThat(tv).isBetween(0.91, 0.95);
        assertThat(f.path("luminousTransmittance").path("note").asString()).contains("81 rows");
        JsonNode category = f.path("sunglassCategory");
        assertThat(category.path("category").asInt()).isZero();
        assertThat(category.path("range").asString()).isEqualTo("ISO 12312-1:2013 category 0 (clear or very light"
                + " tint): τv > 80 % to 100 %");
        assertThat(f.path("solar").asString()).isEqualTo("d65");
        assertThat(f.path("upf").path("value").asDouble()).isBetween(1 / 0.95, 1 / 0.89);
        assertThat(f.path("upf").path("note").asString()).contains("solar spectrum d65");
        assertThat(f.path("caution").asString()).contains("not a certification");
    }

    /** Common practice, no source: a smoked grey sheet passes less daylight than the clear sheet. */
    @Test
    void smokedGreySheetIsDarkerThanClearSheet() throws Exception {
        double grey = figures(sampleId("Smoked grey acrylic"), "").path("luminousTransmittance").path("value")
                .asDouble();
        JsonNode clear = figures(sampleId("Clear cast acrylic sheet"), "");
        assertThat(grey).isLessThan(clear.path("luminousTransmittance").path("value").asDouble());
        assertThat(clear.path("upf").path("available").asBoolean()).isFalse();
        assertThat(clear.path("upf").path("note").asString()).contains("reference solar spectrum must be named");
    }

    /** Reference sheet §10: the dermatology convention's bands are 290-320 and 320-400 nm. */
    @Test
    void dermatologyConventionNamesItsNumericBands() throws Exception {
        JsonNode f = figures(sampleId("UV-blocking clear window film"), "&convention=dermatology");
        assertThat(f.path("bandConvention").asString()).startsWith("dermatology: UVC 200-290 nm, UVB 290-320 nm");
        assertThat(f.path("bandMeans").get(1).path("name").asString()).isEqualTo("meanTransmittanceUVB(290-320 nm)");
        assertThat(f.path("bandMeans").get(2).path("name").asString()).isEqualTo("meanTransmittanceUVA(320-400 nm)");
        assertThat(figures(sampleId("UV-blocking clear window film"), "").path("bandConvention").asString())
                .startsWith("cie: UVC 100-280 nm");
    }

    @Test
    void aDescribedLedIsComputedAndAnUnknownNameListsTheDescribedForms() throws Exception {
        long id = sampleId("UV-grade synthetic fused silica");
        JsonNode described = figures(id, "&emitter=led-372-15&response=flat");
        assertThat(described.path("emitter").asString()).isEqualTo("led-372-15");
        // only the name's reading is under test here: availability and the integration range
        JsonNode t = described.path("effectiveTransmittance");
        assertThat(t.path("available").asBoolean()).isTrue();
        // the LED model is cut at peak ± 3 FWHM (327-417 nm), and unweighted means flat over all of it
        assertThat(t.path("note").asString()).contains("327.0-417.0 nm");
        assertThat(getJson("/api/samples/" + id + "/figures?emitter=lamp-9", 400).path("detail").asString())
                .contains("led-<peak nm>-<FWHM nm>").contains("blackbody-<K>k");
    }

    @Test
    void aSampleBehindAWindowGetsTheFiguresOfTheStackWithinThePhysicalBounds() throws Exception {
        long sheet = sampleId("UV-transmitting cast acrylic, lamp-cover grade");
        long glass = sampleId("Clear float glass, glazier offcuts");
        JsonNode alone = figures(sheet, "");
        JsonNode stacked = figures(sheet, "&behind=float%20glass&behindMm=4");
        JsonNode glassAlone = getJson("/api/samples/" + glass + "/figures?thicknessMm=4", 200);

        assertThat(stacked.path("layer").asString()).contains("clear-float-glass").contains("air gap");
        assertThat(alone.path("layer").isNull()).isTrue();
        // Two parts across an air gap, per wavelength: T1·T2 ≤ T ≤ T1·T2 / (1 − R1·R2) with each part's
        // R ≤ 1 − T (energy conservation; the incoherent two-element sum, e.g. Born & Wolf's pile of plates,
        // from memory). Checked on T = 10^-OD at the lamp lines where all three are unbounded values.
        int compared = 0;
        for (int i = 0; i < stacked.path("opticalDensities").size(); i++) {
            JsonNode s = stacked.path("opticalDensities").get(i);
            JsonNode a = alone.path("opticalDensities").get(i);
            JsonNode g = glassAlone.path("opticalDensities").get(i);
            if (!"value".equals(s.path("bound").asString()) || !"value".equals(a.path("bound").asString())
                    || !"value".equals(g.path("bound").asString())) {
                continue;
            }
            double t = Math.pow(10, -s.path("value").asDouble());
            double t1 = Math.pow(10, -a.path("value").asDouble());
            double t2 = Math.pow(10, -g.path("value").asDouble());
            assertThat(t).as(s.path("name").asString()).isBetween(t1 * t2 * (1 - 1e-9),
                    t1 * t2 / (1 - (1 - t1) * (1 - t2)) * (1 + 1e-9));
            compared++;
        }
        assertThat(compared).as("lamp lines with plain values in all three answers").isPositive();
        assertThat(stacked.path("luminousTransmittance").path("value").asDouble())
                .isLessThan(alone.path("luminousTransmittance").path("value").asDouble());
        // the stack is a safety figure like any other: the caution stays
        assertThat(stacked.path("caution").asString()).contains("not a certification");
    }

    @Test
    void aStackWithoutItsThicknessOrWithAnUnknownPartIsA400NamingTheParameter() throws Exception {
        long id = sampleId("Yellow resin-printer lid sheet");
        assertThat(getJson("/api/samples/" + id + "/figures?behind=float%20glass", 400).path("parameter").asString())
                .isEqualTo("behindMm");
        assertThat(getJson("/api/samples/" + id + "/figures?behindMm=4", 400).path("parameter").asString())
                .isEqualTo("behind");
        JsonNode unknown = getJson("/api/samples/" + id + "/figures?behind=purple%20unicorn&behindMm=4", 400);
        assertThat(unknown.path("parameter").asString()).isEqualTo("behind");
        assertThat(unknown.path("detail").asString()).contains("purple unicorn");
        assertThat(getJson("/api/samples/" + id + "/figures?behind=glass&behindMm=4", 400).path("detail").asString())
                .contains("write the slug");
    }

    @Test
    void badParametersAreNamedInA400() throws Exception {
        long id = sampleId("UV-grade synthetic fused silica");
        assertThat(getJson("/api/samples/" + id + "/figures?emitter=led-999", 400).path("parameter").asString())
                .isEqualTo("emitter");
        assertThat(getJson("/api/samples/" + id + "/figures?response=tan", 400).path("parameter").asString())
                .isEqualTo("response");
        assertThat(getJson("/api/samples/" + id + "/figures?thicknessMm=-1", 400).path("parameter").asString())
                .isEqualTo("thicknessMm");
        assertThat(getJson("/api/samples/" + id + "/figures?convention=iso", 400).path("parameter").asString())
                .isEqualTo("convention");
        assertThat(getJson("/api/samples/" + id + "/figures?solar=sunny", 400).path("parameter").asString())
                .isEqualTo("solar");
        assertThat(getJson("/api/samples/999999/figures", 404).path("status").asInt()).isEqualTo(404);
    }

    /**
     * Unweighted means flat over the whole emitter, on both paths: the figures endpoint's led-405 × flat
     * and the requirement's "of led 405" (and "… weighted by flat") integrate the same LED over its whole
     * range (peak ± 3 FWHM, 369-441 nm, by the LED model's definition) and give the same number to 1e-9.
     * The old flat response stopped at 400 nm and dropped 84 % of this LED's power.
     */
    @Test
    void theFiguresEndpointAndTheRequirementAgreeOnAnUnweightedLed() throws Exception {
        String material = "UV-filtering acrylic, framing grade";
        for (String requirement : new String[] {"passes over 99.9% of led 405",
                "passes over 99.9% of led 405 weighted by flat"}) {
            JsonNode row = searchRow(requirement, material);
            JsonNode clause = row.path("clauses").get(0);
            JsonNode figure = figures(row.path("sampleId").asLong(), "&emitter=led-405&response=flat")
                    .path("effectiveTransmittance");
            assertThat(figure.path("note").asString()).contains("369.0-441.0 nm");
            assertThat(clause.path("verdict").asString()).isEqualTo("misses");
            // a missed pass is judged on the upper end, which is the figure's value (bounded or not)
            assertThat(clause.path("value").asDouble()).as(requirement)
                    .isCloseTo(figure.path("value").asDouble(), org.assertj.core.api.Assertions.within(1e-9));
        }
    }

    /**
     * Bounds keep their sign everywhere: a sample with points below the detection limit behind 4 mm clear
     * float glass. The search's explanation of "luminous over 70%" and the figures answer's τv state the
     * same ends (points below the limit at 0 and at their limit), never "at least" in one and "≤" in the other.
     */
    @Test
    void theSearchAndTheFiguresStateABoundedStackedFigureAlike() throws Exception {
        int compared = 0;
        for (String material : new String[] {"Yellow resin-printer lid sheet", "UV-filtering acrylic, framing grade"}) {
            JsonNode row = searchRow("luminous over 70%, behind 4 mm clear float glass", material);
            String explanation = row.path("clauses").get(0).path("explanation").asString();
            JsonNode tv = figures(row.path("sampleId").asLong(), "&behind=clear-float-glass&behindMm=4")
                    .path("luminousTransmittance");
            if (!"at-most".equals(tv.path("bound").asString())) {
                continue;
            }
            String stated = tv.path("stated").asString();
            assertThat(stated).isNotBlank().doesNotContain("≤");
            assertThat(explanation).as(material).contains(" is " + stated + " (points below the detection limit")
                    .doesNotContain("at least");
            compared++;
        }
        assertThat(compared).as("demo stacks with a bounded τv").isPositive();
    }

    private JsonNode searchRow(String requirement, String materialName) throws Exception {
        String body = JSON.writeValueAsString(java.util.Map.of("requirement", requirement, "limit", 200));
        HttpResponse<String> response = HTTP.send(HttpRequest.newBuilder(URI.create("http://localhost:" + port
                + "/api/search")).header("Content-Type", "application/json")
                .POST(HttpRequest.BodyPublishers.ofString(body)).build(), HttpResponse.BodyHandlers.ofString());
        assertThat(response.statusCode()).as(response.body()).isEqualTo(200);
        for (JsonNode row : JSON.readTree(response.body()).path("results")) {
            if (row.path("materialName").asString().startsWith(materialName)) {
                return row;
            }
        }
        throw new AssertionError("no row for " + materialName + " in the answer to " + requirement);
    }

    private JsonNode figures(long sampleId, String query) throws Exception {
        return getJson("/api/samples/" + sampleId + "/figures?x=1" + query, 200);
    }

    private long sampleId(String nameStart) throws Exception {
        JsonNode materials = getJson("/api/materials?q=" + URLEncoder.encode(nameStart, StandardCharsets.UTF_8), 200);
        for (JsonNode m : materials) {
            if (m.path("name").asString().startsWith(nameStart)) {
                return m.path("samples").get(0).path("id").asLong();
            }
        }
        throw new AssertionError("demo library has no material named " + nameStart + "…");
    }

    private JsonNode getJson(String path, int expectedStatus) throws Exception {
        HttpResponse<String> response = HTTP.send(HttpRequest.newBuilder(URI.create("http://localhost:" + port + path))
                .GET().build(), HttpResponse.BodyHandlers.ofString());
        assertThat(response.statusCode()).as(path + " → " + response.body()).isEqualTo(expectedStatus);
        return JSON.readTree(response.body());
    }
}
