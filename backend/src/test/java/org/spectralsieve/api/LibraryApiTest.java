package org.spectralsieve.api;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.StringReader;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import org.junit.jupiter.api.Test;
import org.spectralsieve.importers.DelimitedTextReader;
import org.spectralsieve.importers.ParsedSpectrum;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.test.context.TestPropertySource;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/** The HTTP API over the demo library, through a real server on a random port. */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = "spring.datasource.url=jdbc:h2:mem:api-test;DB_CLOSE_DELAY=-1")
class LibraryApiTest {

    private static final HttpClient HTTP = HttpClient.newHttpClient();
    private static final JsonMapper JSON = JsonMapper.builder().build();

    @LocalServerPort
    int port;

    @Test
    void listsTheDemoLibraryWithSamples() throws Exception {
        JsonNode materials = getJson("/api/materials", 200);

        assertThat(materials.size()).isGreaterThanOrEqualTo(40);
        for (JsonNode m : materials) {
            assertThat(m.path("samples").size()).as(m.path("slug").asString()).isBetween(1, 3);
            assertThat(m.path("samples").get(0).path("thicknessMm").asDouble()).isPositive();
        }
    }

    @Test
    void filtersByClassAndText() throws Exception {
        JsonNode glass = getJson("/api/materials?class=window%20glass", 200);
        assertThat(glass.size()).isPositive();
        glass.forEach(m -> assertThat(m.path("materialClass").asString()).isEqualTo("window glass"));

        JsonNode acrylic = getJson("/api/materials?q=acrylic", 200);
        assertThat(acrylic.size()).isPositive().isLessThan(getJson("/api/materials", 200).size());
    }

    @Test
    void materialDetailCarriesIndexModelCutoffsAndKeyLines() throws Exception {
        long id = firstMaterialId("fused silica");
        JsonNode m = getJson("/api/materials/" + id, 200);

        assertThat(m.path("refractiveIndex").path("kind").asString()).isIn("constant", "sellmeier", "table");
        JsonNode sample = m.path("samples").get(0);
        assertThat(sample.path("transmittanceAt").has("365")).isTrue();
        assertThat(sample.path("transmittanceAt").has("254")).isTrue();
        assertThat(sample.path("cutoffsNm").has("50")).isTrue();
        assertThat(sample.path("rangeNm").size()).isEqualTo(2);
    }

    @Test
    void rescalesABulkSampleToAThickerSheetAndItPassesLess() throws Exception {
        JsonNode sample = firstSampleOf(firstMaterialId("plastic sheet"));
        long sampleId = sample.path("id").asLong();
        double thickness = sample.path("thicknessMm").asDouble();

        JsonNode measured = getJson("/api/samples/" + sampleId + "/curve", 200);
        JsonNode thicker = getJson("/api/samples/" + sampleId + "/curve?thicknessMm=" + (thickness * 2), 200);

        assertThat(measured.path("rescaled").asBoolean()).isFalse();
        assertThat(thicker.path("rescaled").asBoolean()).isTrue();
        assertThat(thicker.path("thicknessMm").asDouble()).isEqualTo(thickness * 2);
        double sumMeasured = 0;
        double sumThicker = 0;
        for (int i = 0; i < measured.path("transmittance").size(); i++) {
            double a = measured.path("transmittance").get(i).asDouble();
            double b = thicker.path("transmittance").get(i).asDouble();
            assertThat(b).isLessThanOrEqualTo(a + 1e-12); // more absorber never passes more
            sumMeasured += a;
            sumThicker += b;
        }
        assertThat(sumThicker).isLessThan(sumMeasured);
    }

    @Test
    void resamplesOntoTheRequestedGrid() throws Exception {
        long sampleId = firstSampleOf(firstMaterialId("fused silica")).path("id").asLong();
        JsonNode curve = getJson("/api/samples/" + sampleId + "/curve?from=360&to=410&step=5", 200);

        assertThat(curve.path("wavelengthsNm").size()).isEqualTo(11);
        assertThat(curve.path("wavelengthsNm").get(0).asDouble()).isEqualTo(360.0);
        assertThat(curve.path("wavelengthsNm").get(10).asDouble()).isEqualTo(410.0);
    }

    @Test
    void csvExportReadsBackToTheSameNumbers() throws Exception {
        long sampleId = firstSampleOf(firstMaterialId("plastic sheet")).path("id").asLong();
        JsonNode json = getJson("/api/samples/" + sampleId + "/curve", 200);
        HttpResponse<String> csv = get("/api/samples/" + sampleId + "/curve.csv");

        assertThat(csv.statusCode()).isEqualTo(200);
        assertThat(csv.headers().firstValue("Content-Type").orElse("")).startsWith("text/csv");
        ParsedSpectrum back = new DelimitedTextReader().read("export.csv", new StringReader(csv.body()));
        double[] t = back.transmittanceFractions();
        assertThat(t.length).isEqualTo(json.path("transmittance").size());
        for (int i = 0; i < t.length; i++) {
            assertThat(t[i]).isEqualTo(json.path("transmittance").get(i).asDouble());
            assertThat(back.upperBounds()[i]).isEqualTo(json.path("belowDetection").get(i).asBoolean());
        }
        assertThat(back.metadata()).containsKey("thickness_mm");
    }

    @Test
    void csvExportOfAThickRescaleNeverWritesNumbersBeneathOd12() throws Exception {
        // a plastic sheet rescaled to 1000 mm: its UV transmittance and detection limit fall far beneath
        // 1e-12 (to 1e-236 and below); files and curve JSON state them as "< 1e-12" (OD 12, our own floor)
        long sampleId = firstSampleOf(firstMaterialId("plastic sheet")).path("id").asLong();
        HttpResponse<String> csv = get("/api/samples/" + sampleId + "/curve.csv?thicknessMm=1000");
        JsonNode json = getJson("/api/samples/" + sampleId + "/curve?thicknessMm=1000", 200);

        assertThat(csv.statusCode()).isEqualTo(200);
        ParsedSpectrum back = new DelimitedTextReader().read("export.csv", new StringReader(csv.body()));
        assertThat(java.util.Arrays.stream(back.transmittanceFractions()).min().orElseThrow()).isGreaterThanOrEqualTo(1e-12);
        assertThat(back.upperBounds()).contains(true);
        assertThat(csv.body()).doesNotContainPattern("E-(1[3-9]|[2-9]\\d|\\d{3})");
        assertThat(Double.parseDouble(back.metadata().get("detection_limit"))).isGreaterThanOrEqualTo(1e-12);
        json.path("transmittance").forEach(t -> assertThat(t.asDouble()).isGreaterThanOrEqualTo(1e-12));
        assertThat(json.path("detectionLimit").asDouble()).isGreaterThanOrEqualTo(1e-12);
    }

    @Test
    void unknownIdsAreNotFoundProblems() throws Exception {
        JsonNode material = getJson("/api/materials/999999", 404);
        JsonNode curve = getJson("/api/samples/999999/curve", 404);

        assertThat(material.path("detail").asString()).contains("999999");
        assertThat(curve.path("status").asInt()).isEqualTo(404);
    }

    @Test
    void badParametersAreNamedInA400() throws Exception {
        long sampleId = firstSampleOf(firstMaterialId("plastic sheet")).path("id").asLong();

        assertThat(getJson("/api/samples/" + sampleId + "/curve?thicknessMm=abc", 400).path("parameter").asString())
                .isEqualTo("thicknessMm");
        assertThat(getJson("/api/samples/" + sampleId + "/curve?thicknessMm=-2", 400).path("parameter").asString())
                .isEqualTo("thicknessMm");
        assertThat(getJson("/api/samples/" + sampleId + "/curve?from=300", 400).path("parameter").asString())
                .isEqualTo("to");
        assertThat(getJson("/api/samples/" + sampleId + "/curve?from=300&to=400&step=0", 400).path("parameter").asString())
                .isEqualTo("step");
        assertThat(getJson("/api/samples/" + sampleId + "/curve?from=100&to=400", 400).path("detail").asString())
                .contains("100");
        assertThat(getJson("/api/materials/notanumber", 400).path("parameter").asString()).isEqualTo("id");
    }

    @Test
    void fixedLayerRefusesRescalingWithAReason() throws Exception {
        JsonNode fixed = null;
        for (JsonNode m : getJson("/api/materials", 200)) {
            if (m.path("scaling").asString().equals("fixed")) {
                fixed = m;
                break;
            }
        }
        assertThat(fixed).as("the demo library has a fixed layer (coating or laminate)").isNotNull();
        long sampleId = fixed.path("samples").get(0).path("id").asLong();

        JsonNode problem = getJson("/api/samples/" + sampleId + "/curve?thicknessMm=9.5", 400);

        assertThat(problem.path("detail").asString()).contains("fixed layer");
        assertThat(problem.path("parameter").asString()).isEqualTo("thicknessMm");
    }

    private long firstMaterialId(String materialClass) throws Exception {
        JsonNode list = getJson("/api/materials?class=" + materialClass.replace(" ", "%20"), 200);
        assertThat(list.size()).as("materials of class " + materialClass).isPositive();
        return list.get(0).path("id").asLong();
    }

    private JsonNode firstSampleOf(long materialId) throws Exception {
        return getJson("/api/materials/" + materialId, 200).path("samples").get(0);
    }

    private JsonNode getJson(String path, int expectedStatus) throws Exception {
        HttpResponse<String> response = get(path);
        assertThat(response.statusCode()).as(path + " -> " + response.body()).isEqualTo(expectedStatus);
        if (expectedStatus >= 400) {
            assertThat(response.headers().firstValue("Content-Type").orElse("")).startsWith("application/problem+json");
        }
        return JSON.readTree(response.body());
    }

    private HttpResponse<String> get(String path) throws Exception {
        return HTTP.send(HttpRequest.newBuilder(URI.create("http://localhost:" + port + path)).GET().build(),
                HttpResponse.BodyHandlers.ofString());
    }
}
