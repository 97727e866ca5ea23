package org.spectralsieve.api;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;
import static org.spectralsieve.api.DemoMaterials.sampleAt;

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

/**
 * {@code GET /api/samples/{id}/similar} over the illustrative demo library, through a real server. The ranking
 * itself is the similarity core's (DemoIdentificationTest); here: the API names the right hits, leaves the query
 * out, and answers every bad request with a problem.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = "spring.datasource.url=jdbc:h2:mem:similar-curves-api-test;DB_CLOSE_DELAY=-1")
class SimilarCurvesApiTest {

    private static final HttpClient HTTP = HttpClient.newHttpClient();
    private static final JsonMapper JSON = JsonMapper.builder().build();
    /**
     * A bulk demo stock measured at 4 and 6 mm (invented, illustrative) whose blue-violet band sets it apart from
     * the other float glasses. By Beer–Lambert (absorbance proportional to path length, any optics handbook) its
     * two samples have one absorbance per mm, so each is the other's nearest curve.
     */
    private static final String TWO_THICKNESS_STOCK = "bronze-tint-float-glass";

    @LocalServerPort
    int port;

    @Test
    void aBulkSampleFindsItsOwnMaterialAtTheOtherThicknessFirstByEitherMetric() throws Exception {
        JsonNode material = material(TWO_THICKNESS_STOCK);
        long thin = sampleAt(material, 4);
        long thick = sampleAt(material, 6);
        for (String metric : List.of("correlation", "centred-euclidean")) {
            JsonNode answer = getJson("/api/samples/" + thin + "/similar?metric=" + metric, 200);
            assertThat(answer.path("metric").asString()).isEqualTo(metric);
            JsonNode first = answer.path("hits").get(0);
            assertThat(first.path("sampleId").asLong()).as(metric).isEqualTo(thick);
            assertThat(first.path("materialId").asLong()).isEqualTo(material.path("id").asLong());
            assertThat(first.path("materialName").asString()).isEqualTo(material.path("name").asString());
            assertThat(first.path("thicknessMm").asDouble()).isEqualTo(6.0);
            // Beer–Lambert: the 6 mm curve matches the 4 mm one best at 4 mm (within 2 %, the core's own check)
            assertThat(first.path("matchingThicknessMm").asDouble()).isCloseTo(4.0, within(0.08));
            assertThat(first.path("resolvedPointsCompared").asInt()).isPositive()
                    .isLessThanOrEqualTo(first.path("pointsCompared").asInt());
            assertThat(first.path("differingMost").path("toNm").asDouble() - first.path("differingMost").path("fromNm").asDouble())
                    .isPositive();
        }
    }

    @Test
    void theQueryIsNeverItsOwnHitAndHitsComeNearestFirstUpToTheLimit() throws Exception {
        long query = sampleAt(material(TWO_THICKNESS_STOCK), 6);
        JsonNode answer = getJson("/api/samples/" + query + "/similar?limit=50", 200);
        assertThat(answer.path("metric").asString()).isEqualTo("centred-euclidean"); // the documented default
        List<Double> distances = new ArrayList<>();
        for (JsonNode hit : answer.path("hits")) {
            assertThat(hit.path("sampleId").asLong()).isNotEqualTo(query);
            distances.add(hit.path("distance").asDouble());
        }
        assertThat(distances).hasSize(50).isSorted();
        assertThat(getJson("/api/samples/" + query + "/similar", 200).path("hits").size()).isEqualTo(10);
        assertThat(getJson("/api/samples/" + query + "/similar?limit=3", 200).path("hits").size()).isEqualTo(3);
    }

    @Test
    void aFixedConstructionNamesNoMatchingThickness() throws Exception {
        JsonNode answer = getJson("/api/samples/" + sampleAt(material(TWO_THICKNESS_STOCK), 4) + "/similar?limit=50", 200);
        boolean sawFixed = false;
        for (JsonNode material : getJson("/api/materials", 200)) {
            if (!material.path("scaling").asString().equals("fixed")) {
                continue;
            }
            for (JsonNode hit : answer.path("hits")) {
                if (hit.path("materialId").asLong() == material.path("id").asLong()) {
                    assertThat(hit.path("matchingThicknessMm").isNull()).as(hit.toString()).isTrue();
                    sawFixed = true;
                }
            }
        }
        assertThat(sawFixed).as("a fixed construction among the 50 nearest").isTrue();
    }

    /** Another two-thickness bulk stock (4 and 6 mm, invented, illustrative), retired from in this test only. */
    @Test
    void aRetiredSampleIsNoLongerAHitButCanStillBeAskedAbout() throws Exception {
        JsonNode material = material("low-iron-float-glass");
        long thin = sampleAt(material, 4);
        long thick = sampleAt(material, 6);
        assertThat(getJson("/api/samples/" + thin + "/similar", 200).path("hits").get(0).path("sampleId").asLong())
                .isEqualTo(thick); // Beer–Lambert, as above

        HttpResponse<String> retired = HTTP.send(HttpRequest.newBuilder(URI.create("http://localhost:" + port
                + "/api/samples/" + thick + "/retire")).header("Content-Type", "application/json")
                .POST(HttpRequest.BodyPublishers.ofString("")).build(), HttpResponse.BodyHandlers.ofString());
        assertThat(retired.statusCode()).as(retired.body()).isEqualTo(200);

        for (JsonNode hit : getJson("/api/samples/" + thin + "/similar?limit=50", 200).path("hits")) {
            assertThat(hit.path("sampleId").asLong()).isNotEqualTo(thick);
        }
        JsonNode fromRetired = getJson("/api/samples/" + thick + "/similar", 200);
        assertThat(fromRetired.path("hits").get(0).path("sampleId").asLong()).isEqualTo(thin);
    }

    /**
     * Narrowing by a facet keeps exactly the unnarrowed ranking's hits of that class and geometry, in its order:
     * the narrowing chooses candidates, it never changes a distance.
     */
    @Test
    void narrowingByClassAndGeometryKeepsTheWholeRankingsHitsOfThatKindInOrder() throws Exception {
        long query = sampleAt(material(TWO_THICKNESS_STOCK), 4);
        JsonNode all = getJson("/api/samples/" + query + "/similar?limit=50", 200);
        assertThat(all.path("narrowing").isNull()).isTrue();
        List<Long> wholeRanking = new ArrayList<>();
        for (JsonNode hit : all.path("hits")) {
            if (hit.path("materialClass").asString().equals("plastic sheet")) {
                wholeRanking.add(hit.path("sampleId").asLong());
            }
        }
        JsonNode narrowed = getJson("/api/samples/" + query + "/similar?limit=5&class=plastic%20sheet", 200);
        assertThat(narrowed.path("narrowing").path("classes").get(0).asString()).isEqualTo("plastic sheet");
        List<Long> narrowedIds = new ArrayList<>();
        for (JsonNode hit : narrowed.path("hits")) {
            assertThat(hit.path("materialClass").asString()).isEqualTo("plastic sheet");
            narrowedIds.add(hit.path("sampleId").asLong());
        }
        assertThat(wholeRanking).as("plastic sheets among the 50 nearest").hasSizeGreaterThanOrEqualTo(5);
        assertThat(narrowedIds).isEqualTo(wholeRanking.subList(0, 5));

        List<Long> diffuse = new ArrayList<>();
        for (JsonNode material : getJson("/api/materials", 200)) {
            for (JsonNode sample : material.path("samples")) {
                if (sample.path("geometry").asString().equals("total")) {
                    diffuse.add(sample.path("id").asLong());
                }
            }
        }
        assertThat(diffuse).as("diffuse samples in the demo library").isNotEmpty();
        JsonNode total = getJson("/api/samples/" + query + "/similar?limit=50&geometry=total", 200);
        assertThat(total.path("hits").size()).as("every other diffuse demo sample").isEqualTo(diffuse.size());
        assertThat(total.path("hits")).allSatisfy(hit -> assertThat(hit.path("sampleId").asLong()).isIn(diffuse));
        assertThat(getJson("/api/samples/" + query + "/similar?class=window%20glass&class=optical%20glass", 200)
                .path("hits")).allSatisfy(hit -> assertThat(hit.path("materialClass").asString())
                        .isIn("window glass", "optical glass"));
        assertThat(problemParameter("/api/samples/" + query + "/similar?geometry=oblique")).isEqualTo("geometry");
    }

    @Test
    void anUnknownSampleIsNotFoundAndABadParameterIsNamed() throws Exception {
        long query = sampleAt(material(TWO_THICKNESS_STOCK), 4);
        assertThat(getJson("/api/samples/987654321/similar", 404).path("status").asInt()).isEqualTo(404);
        assertThat(problemParameter("/api/samples/" + query + "/similar?limit=0")).isEqualTo("limit");
        assertThat(problemParameter("/api/samples/" + query + "/similar?limit=51")).isEqualTo("limit");
        assertThat(problemParameter("/api/samples/" + query + "/similar?limit=ten")).isEqualTo("limit");
        assertThat(problemParameter("/api/samples/" + query + "/similar?metric=cosine")).isEqualTo("metric");
    }

    private JsonNode material(String slug) throws Exception {
        return DemoMaterials.bySlug(getJson("/api/materials", 200), slug);
    }

    private String problemParameter(String path) throws Exception {
        return getJson(path, 400).path("parameter").asString();
    }

    private JsonNode getJson(String path, int expectedStatus) throws Exception {
        HttpResponse<String> response = HTTP.send(HttpRequest.newBuilder(URI.create("http://localhost:" + port + path))
                .GET().build(), HttpResponse.BodyHandlers.ofString());
        assertThat(response.statusCode()).as(path + " -> " + response.body()).isEqualTo(expectedStatus);
        if (expectedStatus >= 400) {
            assertThat(response.headers().firstValue("Content-Type").orElse("")).startsWith("application/problem+json");
        }
        return JSON.readTree(response.body());
    }
}
