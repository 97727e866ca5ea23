package org.spectralsieve.api;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.io.StringReader;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import org.junit.jupiter.api.Test;
import org.spectralsieve.importers.ParsedSpectrum;
import org.spectralsieve.importers.jcamp.JcampReader;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.test.context.TestPropertySource;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * A measurement uncertainty through the HTTP API: read at preview, stored at import, returned by the curve
 * endpoint (as measured and rescaled), exported as CSV and JCAMP-DX, and read back from the exported CSV.
 * Hand-worked: σ_A = σ_T/(T·ln 10) (first-order propagation, GUM JCGM 100:2008, 5.1.2). Files illustrative.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = "spring.datasource.url=jdbc:h2:mem:uncertainty-api-test;DB_CLOSE_DELAY=-1")
class UncertaintyApiTest {

    private static final HttpClient HTTP = HttpClient.newHttpClient();
    private static final JsonMapper JSON = JsonMapper.builder().build();
    /** 400 nm: 40 %T, 500 nm: 80 %T; 300 nm under the stated detection limit. */
    private static final String SHEET = "# detection_limit: 0.001\nwavelength,transmittance (%)\n300,0.05\n400,40\n500,80\n";

    @LocalServerPort
    int port;

    private JsonNode post(Multipart form, String path, int status) throws Exception {
        return form.postExpecting(port, path, status);
    }

    private HttpResponse<String> get(String path) throws Exception {
        return HTTP.send(HttpRequest.newBuilder(URI.create("http://localhost:" + port + path)).build(),
                HttpResponse.BodyHandlers.ofString());
    }

    @Test
    void thePreviewSaysWhereTheUncertaintyCameFromAndGivesItPerPoint() throws Exception {
        JsonNode p = post(Multipart.file("sheet.csv", "Wavelength (nm),Transmittance(%),Std.Dev.\n400,40,0.5\n500,80,0.5\n"),
                "/api/imports/preview", 200);

        assertThat(p.path("uncertaintySource").asString()).contains("Std.Dev.");
        // 0.005/(0.40 · 2.302585) = 0.0054287; the band 0.40 · 10^(∓0.0054287) = 0.40 · e^(∓0.0125) =
        // 0.40 · 0.987578 … 0.40 · 1.012578 = 0.395031 … 0.405031 (to first order the ±0.5 %T the file states)
        JsonNode u = p.path("curve").path("uncertainty");
        assertThat(u.path("absorbance").get(0).asDouble()).isCloseTo(0.0054287, within(1e-7));
        assertThat(u.path("transmittanceLow").get(0).asDouble()).isCloseTo(0.395031, within(1e-6));
        assertThat(u.path("transmittanceHigh").get(0).asDouble()).isCloseTo(0.405031, within(1e-6));
    }

    @Test
    void aPreviewWithoutUncertaintyHasNone() throws Exception {
        JsonNode p = post(Multipart.file("sheet.csv", "wavelength,transmittance\n400,0.4\n500,0.8\n"), "/api/imports/preview", 200);

        assertThat(p.path("uncertaintySource").isNull()).isTrue();
        assertThat(p.path("curve").path("uncertainty").isNull()).isTrue();
    }

    @Test
    void aStatedUncertaintyIsStoredReturnedRescaledAndExported() throws Exception {
        Multipart form = Multipart.file("fernhollow-sheet.csv", SHEET).field("uncertainty", "0.5%T")
                .field("materialName", "Fernhollow test sheet (illustrative)").field("materialClass", "plastic sheet")
                .field("scaling", "bulk").field("indexN", 1.5).field("thicknessMm", 3);
        long sampleId = post(form, "/api/imports", 201).path("sampleId").asLong();

        JsonNode curve = JSON.readTree(get("/api/samples/" + sampleId + "/curve").body());
        JsonNode sigma = curve.path("uncertainty").path("absorbance");
        assertThat(sigma.get(0).isNull()).isTrue(); // 0.05 %T is under the limit: a bound, no standard deviation
        assertThat(sigma.get(1).asDouble()).isCloseTo(0.0054287, within(1e-7)); // 0.005/(0.40 · ln 10)
        assertThat(sigma.get(2).asDouble()).isCloseTo(0.0027143, within(1e-7)); // 0.005/(0.80 · ln 10)

        // at twice the thickness the internal absorbance, and so its standard deviation, doubles (to within
        // the slab's multiple reflections, g(K) ≤ 1.003 for R = 0.04)
        JsonNode thicker = JSON.readTree(get("/api/samples/" + sampleId + "/curve?thicknessMm=6").body());
        assertThat(thicker.path("uncertainty").path("absorbance").get(1).asDouble()).isCloseTo(2 * 0.0054287, within(2e-5));

        String csv = get("/api/samples/" + sampleId + "/curve.csv").body();
        assertThat(csv).contains("wavelength_nm,transmittance,absorbance_sd");
        JsonNode again = post(Multipart.file("exported.csv", csv), "/api/imports/preview", 200);
        assertThat(again.path("curve").path("uncertainty").path("absorbance")).isEqualTo(sigma);
        assertThat(again.path("uncertaintySource").asString()).contains("absorbance_sd");

        HttpResponse<String> jdx = get("/api/samples/" + sampleId + "/curve.jdx");
        assertThat(jdx.statusCode()).isEqualTo(200);
        ParsedSpectrum fromJcamp = new JcampReader().read("exported.jdx", new StringReader(jdx.body()));
        assertThat(fromJcamp.standardDeviations()[1]).isEqualTo(sigma.get(1).asDouble());
        assertThat(fromJcamp.standardDeviations()[0]).isNaN();
    }

    @Test
    void anUncertaintyWithoutItsUnitIsABadRequestNamingTheField() throws Exception {
        JsonNode problem = post(Multipart.file("sheet.csv", SHEET).field("uncertainty", "0.5"), "/api/imports/preview", 400);

        assertThat(problem.toString()).contains("uncertainty").contains("0.5%T");
    }
}
