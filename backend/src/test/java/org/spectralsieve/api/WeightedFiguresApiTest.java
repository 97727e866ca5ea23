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
        assertThat(body.path("emitters").size()).isEqualTo(8);
        JsonNode led = body.path("emitters").get(0);
        assertThat(led.path("name").asString()).isEqualTo("led-365");
        assertThat(led.path("kind").asString()).isEqualTo("led");
        assertThat(led.path("parameters").path("peakNm").asDouble()).isEqualTo(365.0);
        assertThat(led.path("rangeNm").size()).isEqualTo(2);
    }

    /**
     * A clear UV-grade silica window loses about 4 % at each face and absorbs almost nothing over
     * 250-400 nm, so its erythemal factor is near 1/0.92 (lossless slab n = 1.5: T = 0.923, W. J. Smith,
     * Modern Optical Engineering, Fresnel reflection at normal incidence; reference sheet §7).
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
        assertThat(f.path("bandMeans").get(1).path("name").asString()).isEqualTo("meanTransmittanceUVB");
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

    @Test
    void badParametersAreNamedInA400() throws Exception {
        long id = sampleId("UV-grade synthetic fused silica");
        assertThat(getJson("/api/samples/" + id + "/figures?emitter=led-999", 400).path("parameter").asString())
                .isEqualTo("emitter");
        assertThat(getJson("/api/samples/" + id + "/figures?response=tan", 400).path("parameter").asString())
                .isEqualTo("response");
        assertThat(getJson("/api/samples/" + id + "/figures?thicknessMm=-1", 400).path("parameter").asString())
                .isEqualTo("thicknessMm");
        assertThat(getJson("/api/samples/999999/figures", 404).path("status").asInt()).isEqualTo(404);
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
