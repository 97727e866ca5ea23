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

/**
 * The guide the page shows (GET /api/requirements/guide) over the illustrative demo library: its names are
 * this library's, and every example it gives is accepted by the service's own parse endpoint.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = "spring.datasource.url=jdbc:h2:mem:api-description-test;DB_CLOSE_DELAY=-1")
class RequirementGuideApiTest {

    private static final HttpClient HTTP = HttpClient.newHttpClient();
    private static final JsonMapper JSON = JsonMapper.builder().build();

    @LocalServerPort
    int port;

    @Test
    void everyExampleInTheGuideIsAcceptedByTheParseEndpoint() throws Exception {
        JsonNode guide = guide().path("guide");
        List<String> examples = new ArrayList<>();
        guide.path("forms").forEach(f -> examples.add(f.path("example").asString()));
        guide.path("units").forEach(u -> examples.add(u.path("example").asString()));
        assertThat(examples).hasSizeGreaterThan(20).anyMatch(e -> e.contains("class "));
        for (String example : examples) {
            HttpResponse<String> parsed = post("/api/requirements/parse", JSON.writeValueAsString(
                    java.util.Map.of("requirement", example)));
            assertThat(parsed.statusCode()).as(example + " -> " + parsed.body()).isEqualTo(200);
        }
    }

    @Test
    void theGuideNamesTheLibrarysClassesAndTheCataloguesSpectra() throws Exception {
        JsonNode answer = guide();
        JsonNode guide = answer.path("guide");
        JsonNode emitters = JSON.readTree(get("/api/emitters").body()).path("emitters");
        assertThat(guide.path("emitters").size()).isEqualTo(emitters.size());
        assertThat(guide.path("emitters").get(0).asString()).isEqualTo(emitters.get(0).path("name").asString());
        assertThat(guide.path("responses").toString()).contains("erythema");
        assertThat(guide.path("materialClasses").toString()).contains("plastic sheet");
        assertThat(guide.path("provenances").toString()).contains("measured");
        assertThat(answer.path("apiDescription").asString()).isEqualTo("/api/openapi.json");
    }

    private JsonNode guide() throws Exception {
        HttpResponse<String> response = get("/api/requirements/guide");
        assertThat(response.statusCode()).isEqualTo(200);
        return JSON.readTree(response.body());
    }

    private HttpResponse<String> get(String path) throws Exception {
        return HTTP.send(HttpRequest.newBuilder(URI.create("http://localhost:" + port + path)).GET().build(),
                HttpResponse.BodyHandlers.ofString());
    }

    private HttpResponse<String> post(String path, String body) throws Exception {
        return HTTP.send(HttpRequest.newBuilder(URI.create("http://localhost:" + port + path))
                .header("Content-Type", "application/json").POST(HttpRequest.BodyPublishers.ofString(body)).build(),
                HttpResponse.BodyHandlers.ofString());
    }
}
