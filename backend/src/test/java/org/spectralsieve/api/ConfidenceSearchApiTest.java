package org.spectralsieve.api;

import static org.assertj.core.api.Assertions.assertThat;

import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import org.junit.jupiter.api.Test;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.test.context.TestPropertySource;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;
import tools.jackson.databind.node.ObjectNode;

/**
 * "… with N% confidence" through the HTTP API, over the demo library (the same context as
 * {@link SearchApiTest}, so it is built once). The demo curves carry no measurement uncertainty.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = "spring.datasource.url=jdbc:h2:mem:search-api-test;DB_CLOSE_DELAY=-1")
class ConfidenceSearchApiTest {

    private static final HttpClient HTTP = HttpClient.newHttpClient();
    private static final JsonMapper JSON = JsonMapper.builder().build();

    @LocalServerPort
    int port;

    @Test
    void aConfidenceOutOfRangeIsAProblemPointingAtItsNumber() throws Exception {
        String text = "passes over 80% at 365 nm with 40% confidence";
        HttpResponse<String> response = send(text);
        JsonNode problem = JSON.readTree(response.body());

        assertThat(response.statusCode()).isEqualTo(400);
        assertThat(response.headers().firstValue("Content-Type").orElse("")).startsWith("application/problem+json");
        assertThat(problem.path("position").asInt()).isEqualTo(text.indexOf("40%"));
        assertThat(problem.path("detail").asString()).contains("a confidence from 50% to 99.9%");
    }

    @Test
    void withoutStoredUncertaintiesAConfidenceDemandLeavesNothingProvenAndSaysWhy() throws Exception {
        // common practice, no source: clear sheets pass well over 50 % at 400 nm, so some rows meet on their values
        HttpResponse<String> response = send("passes over 50% at 400 nm with 95% confidence");
        JsonNode answer = JSON.readTree(response.body());

        assertThat(response.statusCode()).as(response.body()).isEqualTo(200);
        assertThat(answer.path("requirement").path("clauses").get(0).path("confidencePercent").asDouble()).isEqualTo(95);
        assertThat(answer.path("results").size()).isPositive();
        boolean someMetOnTheValue = false;
        for (JsonNode row : answer.path("results")) {
            JsonNode clause = row.path("clauses").get(0);
            assertThat(row.path("verdict").asString()).isNotEqualTo("meets");
            assertThat(clause.path("confidence").isNull()).isTrue();
            someMetOnTheValue |= clause.path("explanation").asString().contains("so the confidence is unknown");
        }
        assertThat(someMetOnTheValue).isTrue();
    }

    private HttpResponse<String> send(String text) throws Exception {
        ObjectNode body = JSON.createObjectNode();
        body.put("requirement", text);
        body.put("limit", 10);
        return HTTP.send(HttpRequest.newBuilder(URI.create("http://localhost:" + port + "/api/search"))
                        .header("Content-Type", "application/json").POST(HttpRequest.BodyPublishers.ofString(body.toString())).build(),
                HttpResponse.BodyHandlers.ofString());
    }
}
