package org.spectralsieve.api;

import static org.assertj.core.api.Assertions.assertThat;

import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.test.context.TestPropertySource;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;
import tools.jackson.databind.node.ObjectNode;

/**
 * Each shortlist row names the sample behind it: the thickness it was measured at ({@code measuredMm}) and
 * whether the row's curve is that measurement or rescaled from it ({@code rescaled}); and the binding clause's
 * confidence (docs/result-rows.md). Expected values are read from the library itself ({@code GET
 * /api/materials/{id}}), never written here.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = "spring.datasource.url=jdbc:h2:mem:result-rows-api-test;DB_CLOSE_DELAY=-1")
class ResultRowsApiTest {

    private static final HttpClient HTTP = HttpClient.newHttpClient();
    private static final JsonMapper JSON = JsonMapper.builder().build();
    /** A demo material measured at two thicknesses (seed-materials/catalogue.json, illustrative). */
    private static final String TWO_THICKNESSES = "UV-transmitting cast acrylic, lamp-cover grade";

    @LocalServerPort
    int port;

    @Test
    void everyRowNamesTheThicknessItsSampleWasMeasuredAt() throws Exception {
        JsonNode answer = search("passes over 50% at 365 nm, at 4 mm", 30);

        assertThat(answer.path("results").size()).isPositive();
        for (JsonNode row : answer.path("results")) {
            JsonNode sample = sampleOf(row);
            assertThat(row.path("measuredMm").asDouble()).as(row.toString())
                    .isEqualTo(sample.path("thicknessMm").asDouble());
        }
    }

    @Test
    void asMeasuredNoRowIsRescaled() throws Exception {
        JsonNode answer = search("passes over 50% at 365 nm", 30);

        assertThat(answer.path("results").size()).isPositive();
        for (JsonNode row : answer.path("results")) {
            // a row with no clause judged has no curve behind it to call measured or rescaled
            boolean judged = !row.path("group").asString().equals("not-judged");
            assertThat(row.path("rescaled").toString()).as(row.toString()).isEqualTo(judged ? "false" : "null");
            assertThat(row.path("thicknessMm").asDouble()).isEqualTo(row.path("measuredMm").asDouble());
        }
    }

    @Test
    void aSampleMeasuredAtTheAskedThicknessIsTheRowsCurveNotAnotherRescaledOntoIt() throws Exception {
        List<Double> measured = measuredThicknesses(TWO_THICKNESSES);
        assertThat(measured).as("the demo material is measured at two thicknesses").hasSizeGreaterThanOrEqualTo(2);
        for (double asked : measured) {
            JsonNode row = rowOf(search("passes over 1% at 400 nm, at " + asked + " mm", 500), TWO_THICKNESSES);

            assertThat(row.path("thicknessMm").asDouble()).isEqualTo(asked);
            assertThat(row.path("measuredMm").asDouble()).as("the sample measured at %s mm", asked).isEqualTo(asked);
            assertThat(sampleOf(row).path("thicknessMm").asDouble()).isEqualTo(asked);
            assertThat(row.path("rescaled").toString()).isEqualTo("false");
        }
    }

    @Test
    void aThicknessBetweenTwoMeasurementsIsRescaledFromTheNearerOne() throws Exception {
        List<Double> measured = measuredThicknesses(TWO_THICKNESSES);
        double thin = measured.get(0);
        double thick = measured.get(1);
        // nearer by thickness ratio (our own rule, docs/thickness.md): a quarter of the way up in ln d is thin's
        double asked = Math.round(thin * Math.pow(thick / thin, 0.25) * 100) / 100.0;

        JsonNode row = rowOf(search("passes over 1% at 400 nm, at " + asked + " mm", 500), TWO_THICKNESSES);

        assertThat(row.path("thicknessMm").asDouble()).isEqualTo(asked);
        assertThat(row.path("measuredMm").asDouble()).isEqualTo(thin);
        assertThat(row.path("rescaled").toString()).isEqualTo("true");
    }

    @Test
    void theRowsConfidenceIsItsBindingClausesConfidence() throws Exception {
        JsonNode answer = search("passes over 80% at 365 nm and blocks under 1% at 405 nm, thickness 1 to 6 mm", 30);

        assertThat(answer.path("results").size()).isPositive();
        for (JsonNode row : answer.path("results")) {
            assertThat(row.has("bindingClauseConfidence")).isTrue();
            JsonNode binding = null;
            for (JsonNode clause : row.path("clauses")) {
                if (!row.path("bindingClause").isNull()
                        && clause.path("text").asString().equals(row.path("bindingClause").asString())) {
                    binding = clause;
                }
            }
            JsonNode expected = binding == null ? null : binding.get("confidence");
            JsonNode actual = row.get("bindingClauseConfidence");
            assertThat(actual.isNull() ? null : actual.asDouble()).as(row.toString())
                    .isEqualTo(expected == null || expected.isNull() ? null : expected.asDouble());
        }
    }

    private List<Double> measuredThicknesses(String name) throws Exception {
        JsonNode materials = get("/api/materials");
        for (JsonNode m : materials) {
            if (m.path("name").asString().equals(name)) {
                List<Double> out = new ArrayList<>();
                m.path("samples").forEach(s -> out.add(s.path("thicknessMm").asDouble()));
                return out.stream().distinct().sorted().toList();
            }
        }
        throw new AssertionError(name + " is not in the demo library");
    }

    private static JsonNode rowOf(JsonNode answer, String name) {
        for (JsonNode row : answer.path("results")) {
            if (row.path("materialName").asString().equals(name)) {
                return row;
            }
        }
        throw new AssertionError(name + " is not in the shortlist: " + answer.path("results"));
    }

    private JsonNode sampleOf(JsonNode row) throws Exception {
        JsonNode material = get("/api/materials/" + row.path("materialId").asLong());
        for (JsonNode sample : material.path("samples")) {
            if (sample.path("id").asLong() == row.path("sampleId").asLong()) {
                return sample;
            }
        }
        throw new AssertionError("sample " + row.path("sampleId") + " is not in its material");
    }

    private JsonNode get(String path) throws Exception {
        HttpResponse<String> response = HTTP.send(HttpRequest.newBuilder(URI.create("http://localhost:" + port + path))
                .GET().build(), HttpResponse.BodyHandlers.ofString());
        assertThat(response.statusCode()).as(response.body()).isEqualTo(200);
        return JSON.readTree(response.body());
    }

    private JsonNode search(String requirement, int limit) throws Exception {
        ObjectNode body = JSON.createObjectNode();
        body.put("requirement", requirement);
        body.put("limit", limit);
        HttpResponse<String> response = HTTP.send(HttpRequest.newBuilder(URI.create("http://localhost:" + port + "/api/search"))
                .header("Content-Type", "application/json")
                .POST(HttpRequest.BodyPublishers.ofString(JSON.writeValueAsString(body))).build(),
                HttpResponse.BodyHandlers.ofString());
        assertThat(response.statusCode()).as(response.body()).isEqualTo(200);
        return JSON.readTree(response.body());
    }
}
