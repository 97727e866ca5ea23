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
import tools.jackson.databind.node.ObjectNode;

/**
 * Diffuse samples through the HTTP API (docs/geometry-and-edges.md), and the named edges of band-pass
 * materials, on the demo library. Same settings as SearchApiTest, so the two share one application.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = "spring.datasource.url=jdbc:h2:mem:search-api-test;DB_CLOSE_DELAY=-1")
class GeometryAndEdgesApiTest {

    private static final HttpClient HTTP = HttpClient.newHttpClient();
    private static final JsonMapper JSON = JsonMapper.builder().build();
    /** The example: a clear sheet that stops the 405 nm exposure light and that one can see through. */
    private static final String SEE_THROUGH = "blocks under 1% at 405 nm and luminous over 70%, class plastic sheet";

    @LocalServerPort
    int port;

    @Test
    void diffuserAndPtfeDoNotRankFirstForASheetToSeeThrough() throws Exception {
        JsonNode results = search(SEE_THROUGH, 30).path("results");

        assertThat(results.size()).isPositive();
        String first = results.get(0).path("materialName").asString().toLowerCase();
        assertThat(first).doesNotContain("opal").doesNotContain("ptfe");
        int diffuse = 0;
        for (JsonNode row : results) {
            assertThat(row.path("geometry").asString()).isIn("regular", "total");
            if (row.path("geometry").asString().equals("total")) {
                diffuse++;
                // luminous transmittance rates seeing through (ISO 8980-3 judges lenses in the direct beam):
                // total transmittance of a diffuser cannot meet it
                assertThat(row.path("verdict").asString()).isNotEqualTo("meets");
                JsonNode luminous = row.path("clauses").get(1);
                assertThat(luminous.path("verdict").asString()).isEqualTo("unverified");
                assertThat(luminous.path("explanation").asString()).contains("total transmittance");
            }
        }
        assertThat(diffuse).as("the opal diffuser and PTFE are plastic sheets measured in total geometry").isPositive();
    }

    @Test
    void geometryAnyAcceptsTotalTransmittanceForSeeingThrough() throws Exception {
        JsonNode results = search(SEE_THROUGH + ", geometry any", 30).path("results");

        boolean sawTotal = false;
        for (JsonNode row : results) {
            if (row.path("geometry").asString().equals("total")) {
                sawTotal = true;
                assertThat(row.path("clauses").get(1).path("explanation").asString()).doesNotContain("see-through");
            }
        }
        assertThat(sawTotal).isTrue();
    }

    @Test
    void geometryAnyAdmitsBothGeometriesInTheStoresOwnSearch() throws Exception {
        // a plain requirement goes through the in-memory store: "any" must not filter like "total" or "regular"
        String plain = "passes over 20% at 254 nm";
        int regularOnly = search(plain + ", geometry regular", 200).path("evaluatedSamples").asInt();
        int totalOnly = search(plain + ", geometry total", 200).path("evaluatedSamples").asInt();

        int any = search(plain + ", geometry any", 200).path("evaluatedSamples").asInt();

        assertThat(totalOnly).isPositive();
        assertThat(any).isEqualTo(regularOnly + totalOnly).isEqualTo(search(plain, 200).path("evaluatedSamples").asInt());
    }

    @Test
    void aDiffuseSampleIsJudgedOnlyAtItsMeasuredThicknessWithTheReason() throws Exception {
        // PTFE sheet is stored at 0.5 and 1 mm in total geometry; 2 mm would need Beer–Lambert on scatter ([S47])
        JsonNode results = search("passes over 20% at 254 nm, at 2 mm, geometry total", 30).path("results");

        JsonNode ptfe = row(results, "ptfe");
        assertThat(ptfe.path("verdict").asString()).isEqualTo("unverified");
        assertThat(ptfe.path("clauses").get(0).path("explanation").asString())
                .contains("diffuse sample (total transmittance): scatter is not absorption, so it is not rescaled");
        for (JsonNode row : results) {
            assertThat(row.path("verdict").asString()).as(row.path("materialName").asString()).isNotEqualTo("meets");
        }
    }

    @Test
    void aThicknessRangeNeverSolvesForADiffuseSample() throws Exception {
        JsonNode results = search("passes over 20% at 254 nm, thickness 2 to 4 mm, geometry total", 30).path("results");

        JsonNode ptfe = row(results, "ptfe");
        assertThat(ptfe.path("verdict").asString()).isEqualTo("unverified");
        assertThat(ptfe.path("thicknessRangeMm").isNull()).isTrue();
    }

    @Test
    void curveAndFiguresEndpointsRefuseToRescaleADiffuseSampleWithTheReason() throws Exception {
        long sample = firstSample("ptfe-sheet");

        for (String path : new String[] {"/api/samples/" + sample + "/curve?thicknessMm=3",
                "/api/samples/" + sample + "/figures?thicknessMm=3"}) {
            HttpResponse<String> response = send(path);
            assertThat(response.statusCode()).as(path).isEqualTo(400);
            JsonNode problem = JSON.readTree(response.body());
            assertThat(problem.path("detail").asString()).contains("scatter is not absorption");
            assertThat(problem.path("parameter").asString()).isEqualTo("thicknessMm");
        }
    }

    @Test
    void aFilmFoggedByUseIsNotRescaledEither() throws Exception {
        // stored in regular geometry, but its loss is haze ([S40]: vat FEP fogs with use), not absorption
        long sample = firstSample("fep-film-fogged");

        HttpResponse<String> response = send("/api/samples/" + sample + "/curve?thicknessMm=0.25");

        assertThat(response.statusCode()).isEqualTo(400);
        assertThat(JSON.readTree(response.body()).path("detail").asString()).contains("scattering material");
    }

    @Test
    void materialDetailNamesTheEdgesOfABandPassGlass() throws Exception {
        // UV-pass black glass passes the 365 nm mercury line and blocks the visible, then opens again in the
        // near infrared (common practice, no source): its cutoff is the UV edge, not the infrared one
        JsonNode sample = material("uv-pass-black-glass").path("samples").get(0);

        double edge = sample.path("cutoffsNm").path("50").asDouble();
        double end = sample.path("passBandEndsNm").path("50").asDouble();
        assertThat(edge).isBetween(280.0, 340.0);
        assertThat(end).isBetween(370.0, 420.0);
        assertThat(365.0).isBetween(edge, end);
    }

    @Test
    void materialDetailGivesALongPassSheetNoPassBandEndAndSaysWhichSamplesRescale() throws Exception {
        JsonNode clear = material("cast-acrylic-clear").path("samples").get(0);
        assertThat(clear.path("passBandEndsNm").path("50").isNull()).isTrue();
        assertThat(clear.path("rescalable").asBoolean()).isTrue();

        JsonNode opal = material("opal-acrylic-diffuser").path("samples").get(0);
        assertThat(opal.path("rescalable").asBoolean()).isFalse();
        assertThat(opal.path("notRescaledReason").asString()).contains("scatter is not absorption");
    }

    private static JsonNode row(JsonNode results, String nameHolds) {
        for (JsonNode row : results) {
            if (row.path("materialName").asString().toLowerCase().contains(nameHolds)) {
                return row;
            }
        }
        throw new AssertionError("no row for " + nameHolds + " in " + results);
    }

    private JsonNode material(String slug) throws Exception {
        JsonNode list = get("/api/materials?q=" + URLEncoder.encode(slug.replace('-', ' '), StandardCharsets.UTF_8));
        for (JsonNode m : list) {
            if (m.path("slug").asString().equals(slug)) {
                return get("/api/materials/" + m.path("id").asLong());
            }
        }
        for (JsonNode m : get("/api/materials")) {
            if (m.path("slug").asString().equals(slug)) {
                return get("/api/materials/" + m.path("id").asLong());
            }
        }
        throw new AssertionError("demo library has no " + slug);
    }

    private long firstSample(String slug) throws Exception {
        return material(slug).path("samples").get(0).path("id").asLong();
    }

    private JsonNode search(String text, int limit) throws Exception {
        ObjectNode body = JSON.createObjectNode();
        body.put("requirement", text);
        body.put("limit", limit);
        HttpResponse<String> response = HTTP.send(HttpRequest.newBuilder(URI.create("http://localhost:" + port + "/api/search"))
                .header("Content-Type", "application/json").POST(HttpRequest.BodyPublishers.ofString(body.toString())).build(),
                HttpResponse.BodyHandlers.ofString());
        assertThat(response.statusCode()).as(text + " -> " + response.body()).isEqualTo(200);
        return JSON.readTree(response.body());
    }

    private HttpResponse<String> send(String path) throws Exception {
        return HTTP.send(HttpRequest.newBuilder(URI.create("http://localhost:" + port + path)).GET().build(),
                HttpResponse.BodyHandlers.ofString());
    }

    private JsonNode get(String path) throws Exception {
        HttpResponse<String> response = send(path);
        assertThat(response.statusCode()).as(path + " -> " + response.body()).isEqualTo(200);
        return JSON.readTree(response.body());
    }
}
